import { useEffect, useState } from 'react';

/** The time now in epoch ms, updated every `intervalMs`: for a countdown, in the one component that shows it. */
export function useNow(intervalMs = 1000): number {
  const [now, setNow] = useState(() => Date.now());
  useEffect(() => {
    const timer = setInterval(() => setNow(Date.now()), intervalMs);
    return () => clearInterval(timer);
  }, [intervalMs]);
  return now;
}
