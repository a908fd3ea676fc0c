// Countdowns on the tablet: epoch milliseconds and Intl only (STACK.md); the server's clock decides.

const pad = (n: number) => String(n).padStart(2, '0');

/** Milliseconds from `nowMs` until `iso` (negative once it has passed). */
export const msUntil = (iso: string, nowMs: number) => new Date(iso).getTime() - nowMs;

/**
 * What is left, for a countdown read at arm's length: "0:42", "12:05" under an hour, "5 h 07 min"
 * under two days, then "3 days 4 h". Rounded up to the second, so it never shows "0:00" while time is left.
 */
export function formatCountdown(ms: number): string {
  if (ms <= 0) return '0:00';
  const s = Math.ceil(ms / 1000);
  const h = Math.floor(s / 3600);
  const m = Math.floor((s % 3600) / 60);
  if (h === 0) return `${m}:${pad(s % 60)}`;
  if (h < 48) return `${h} h ${pad(m)} min`;
  const d = Math.floor(h / 24);
  return `${d} days${h % 24 ? ` ${h % 24} h` : ''}`;
}

/** Whole seconds as m:ss ("0:30", "2:00"): the assembly hold. */
export function formatSeconds(seconds: number): string {
  const s = Math.max(0, Math.floor(seconds));
  return `${Math.floor(s / 60)}:${pad(s % 60)}`;
}

const CLOCK = new Intl.DateTimeFormat('en-US', { hour: 'numeric', minute: '2-digit' });
const DAY_CLOCK = new Intl.DateTimeFormat('en-US', { weekday: 'short', month: 'short', day: 'numeric', hour: 'numeric', minute: '2-digit' });

/** "2:20 PM" today, "Tue, Mar 2, 6:00 AM" on another day (in the tablet's time zone). */
export function clockTime(iso: string, nowMs: number): string {
  const d = new Date(iso);
  return d.toDateString() === new Date(nowMs).toDateString() ? CLOCK.format(d) : DAY_CLOCK.format(d);
}
