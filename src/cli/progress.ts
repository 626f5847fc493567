/** The progress line of a long batch run (drawn only when stderr is a terminal). */
export interface Progress {
  /** Note the orders done so far and the bytes read of all inputs; redraws at most every REDRAW_MS. */
  update(orders: number, bytesDone: number): void;
  /** Wipe the line (before other output, and at the end). */
  clear(): void;
}

/** A run shorter than this shows no progress at all. */
export const QUIET_MS = 1000;
export const REDRAW_MS = 250;

const count = new Intl.NumberFormat('en-US');

function clock(seconds: number): string {
  const s = Math.max(0, Math.round(seconds));
  const h = Math.floor(s / 3600);
  const m = Math.floor((s % 3600) / 60);
  const ss = String(s % 60).padStart(2, '0');
  return h > 0 ? `${h}:${String(m).padStart(2, '0')}:${ss}` : `${m}:${ss}`;
}

/**
 * The text of the progress line: orders done, rate, share of the input bytes read, and the time
 * left estimated from the bytes (the number of orders in a stream is not known ahead).
 * Example: `12,000 orders checked · 4,000 orders/s · 25% read · about 0:09 left`.
 */
export function progressText(orders: number, elapsedMs: number, bytesDone: number, totalBytes: number): string {
  const parts = [`${count.format(orders)} orders checked`];
  if (elapsedMs > 0) parts.push(`${count.format(Math.round((orders * 1000) / elapsedMs))} orders/s`);
  if (totalBytes > 0 && bytesDone > 0) {
    const share = Math.min(1, bytesDone / totalBytes);
    parts.push(`${Math.floor(share * 100)}% read`);
    parts.push(`about ${clock(((elapsedMs / 1000) * (1 - share)) / share)} left`);
  }
  return parts.join(' · ');
}

/** A progress line written with `\r` over itself; `write` is absent when stderr is not a terminal (then nothing is drawn). */
export function progressLine(write: ((text: string) => void) | undefined, now: () => number, totalBytes: number): Progress {
  if (!write) return { update: () => {}, clear: () => {} };
  const start = now();
  let last = -Infinity;
  let drawn = false;
  return {
    update(orders, bytesDone) {
      const t = now();
      if (t - start < QUIET_MS || t - last < REDRAW_MS) return;
      last = t;
      write(`\r\x1b[K${progressText(orders, t - start, bytesDone, totalBytes)}`);
      drawn = true;
    },
    clear() {
      if (drawn) write('\r\x1b[K');
      drawn = false;
    },
  };
}
