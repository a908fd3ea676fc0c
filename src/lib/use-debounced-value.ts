import { useEffect, useState } from 'react';

/**
 * `value` once it has stopped changing for `ms`, so typing settles before a search or a server
 * check goes out. "Changing" is judged by `key` (the value itself unless given): pass a key of the
 * content for an object rebuilt on every render, or the wait would start again at each render.
 */
export function useDebouncedValue<T>(value: T, ms: number, key: unknown = value): T {
  const [settled, setSettled] = useState(value);
  useEffect(() => {
    const t = setTimeout(() => setSettled(value), ms);
    return () => clearTimeout(t);
    // eslint-disable-next-line react-hooks/exhaustive-deps -- keyed by `key`: the same key is the same content
  }, [key, ms]);
  return settled;
}
