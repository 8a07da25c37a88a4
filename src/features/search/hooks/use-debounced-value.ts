import { useEffect, useState } from 'react';

/** `value` once it has stopped changing for `delayMs`: search as you type without a request per keystroke. */
export function useDebouncedValue<T>(value: T, delayMs = 200): T {
  const [settled, setSettled] = useState(value);
  useEffect(() => {
    const t = setTimeout(() => setSettled(value), delayMs);
    return () => clearTimeout(t);
  }, [value, delayMs]);
  return settled;
}
