import { useEffect, useState } from 'react';

/** The value, once it has stopped changing for `ms` milliseconds (the live preview waits for a pause in typing). */
export function useDebouncedValue<T>(value: T, ms = 400): T {
  const [settled, setSettled] = useState(value);
  useEffect(() => {
    const t = setTimeout(() => setSettled(value), ms);
    return () => clearTimeout(t);
  }, [value, ms]);
  return settled;
}
