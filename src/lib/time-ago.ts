const MINUTE_MS = 60_000;
const HOUR_MS = 60 * MINUTE_MS;
const DAY_MS = 24 * HOUR_MS;

/**
 * How long ago an instant was, compact for a queue ("12 min", "5 h", "3 days").
 * `now` is a parameter so a list renders with one clock.
 */
export function durationSince(iso: string, now: Date = new Date()): string {
  const ms = Math.max(0, now.getTime() - new Date(iso).getTime());
  if (ms < MINUTE_MS) return '< 1 min';
  if (ms < HOUR_MS) return `${Math.floor(ms / MINUTE_MS)} min`;
  if (ms < DAY_MS) return `${Math.floor(ms / HOUR_MS)} h`;
  const days = Math.floor(ms / DAY_MS);
  return days === 1 ? '1 day' : `${days} days`;
}

/** A date and time as people read it on a list, in their own locale. */
export const dateTime = (iso: string) => new Date(iso).toLocaleString([], { dateStyle: 'medium', timeStyle: 'short' });

export const dateOnly = (iso: string) => new Date(iso).toLocaleDateString([], { dateStyle: 'medium' });
