import { useEffect, useState } from 'react';

/** The time now in epoch milliseconds, renewed every `everyMs`: what live countdowns read. */
export function useNow(everyMs = 1000): number {
  const [now, setNow] = useState(() => Date.now());
  useEffect(() => {
    const timer = setInterval(() => setNow(Date.now()), everyMs);
    return () => clearInterval(timer);
  }, [everyMs]);
  return now;
}

/** "2 h 05 min", "4 min 09 s", "12 s": what is left until `endMs`, or null once it has passed. */
export function timeLeft(endMs: number, nowMs: number): string | null {
  const s = Math.ceil((endMs - nowMs) / 1000);
  if (s <= 0) return null;
  const d = Math.floor(s / 86_400);
  const h = Math.floor((s % 86_400) / 3600);
  const m = Math.floor((s % 3600) / 60);
  const sec = s % 60;
  const pad = (n: number) => String(n).padStart(2, '0');
  if (d > 0) return `${d} d ${h} h`;
  if (h > 0) return `${h} h ${pad(m)} min`;
  if (m > 0) return `${m} min ${pad(sec)} s`;
  return `${sec} s`;
}
