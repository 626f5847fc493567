import type { Result } from '../../core/problems.ts';

const ISO = /^(\d{4})-(\d{2})-(\d{2})[T ](\d{2}):(\d{2})(?::(\d{2}))?(Z|[+-]\d{2}:\d{2})?$/;

/** Minutes the zone is ahead of UTC at an instant (e.g. +60 for London in summer). */
function zoneOffsetMinutes(instant: number, timeZone: string): number {
  const parts = new Intl.DateTimeFormat('en-GB', {
    timeZone, year: 'numeric', month: 'numeric', day: 'numeric', hour: 'numeric', minute: 'numeric', second: 'numeric', hourCycle: 'h23',
  }).formatToParts(instant);
  const n = (t: Intl.DateTimeFormatPartTypes) => Number(parts.find((p) => p.type === t)?.value ?? 0);
  const asUtc = Date.UTC(n('year'), n('month') - 1, n('day'), n('hour'), n('minute'), n('second'));
  return Math.round((asUtc - Math.floor(instant / 1000) * 1000) / 60000);
}

/**
 * Read a date and time: ISO 8601 with an offset or Z ("2026-12-02T14:30Z"), or a wall-clock time
 * ("2026-12-02T14:30") taken in the pharmacy's time zone (a wall time that a clock change skips is
 * read with one of the two offsets; give an offset to be exact). Impossible dates (30 February) are
 * problems, not silently rolled over.
 */
export function parseDateTime(text: string, timeZone: string, path: string): Result<Date> {
  const m = ISO.exec(text.trim());
  const bad = (message: string): Result<Date> => ({ ok: false, problems: [{ path, message }] });
  if (!m) return bad(`must be a date and time like 2026-12-02T14:30 or 2026-12-02T14:30Z (got "${text}")`);
  const [y, mo, d, h, mi, s] = [1, 2, 3, 4, 5, 6].map((i) => Number(m[i] ?? 0)) as [number, number, number, number, number, number];
  const wall = Date.UTC(y, mo - 1, d, h, mi, s);
  const check = new Date(wall);
  if (check.getUTCFullYear() !== y || check.getUTCMonth() !== mo - 1 || check.getUTCDate() !== d || h > 23 || mi > 59 || s > 59) {
    return bad(`is not a real date and time (got "${text}")`);
  }
  if (y < 2000 || y > 2200) return bad('must be a year between 2000 and 2200');
  const zone = m[7];
  if (zone === 'Z') return { ok: true, value: check };
  if (zone) {
    const sign = zone.startsWith('-') ? -1 : 1;
    const minutes = sign * (Number(zone.slice(1, 3)) * 60 + Number(zone.slice(4, 6)));
    return { ok: true, value: new Date(wall - minutes * 60000) };
  }
  // Wall-clock time in the zone: guess with the offset at the wall time, then correct once.
  const first = wall - zoneOffsetMinutes(wall, timeZone) * 60000;
  const second = wall - zoneOffsetMinutes(first, timeZone) * 60000;
  return { ok: true, value: new Date(zoneOffsetMinutes(second, timeZone) === zoneOffsetMinutes(first, timeZone) ? second : first) };
}
