// Stored times (ISO, UTC) as the pharmacist's clock shows them.

/** "2026-12-01 09:12" in local time; the raw text when it is not a time. */
export function showTime(iso: string): string {
  const d = new Date(iso);
  if (Number.isNaN(d.getTime())) return iso;
  const pad = (n: number) => String(n).padStart(2, '0');
  return `${d.getFullYear()}-${pad(d.getMonth() + 1)}-${pad(d.getDate())} ${pad(d.getHours())}:${pad(d.getMinutes())}`;
}

/** Today's local date, YYYY-MM-DD (the default measurement date). */
export function today(): string {
  return showTime(new Date().toISOString()).slice(0, 10);
}
