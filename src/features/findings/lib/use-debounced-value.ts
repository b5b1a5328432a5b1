import { useEffect, useMemo, useState } from 'react';

/**
 * The value as it was once it stopped changing for `delayMs`, compared by its JSON so a new object with the same
 * fields is no change. `settling` is true while a newer value waits its turn.
 */
export function useDebouncedValue<T>(value: T, delayMs: number): { value: T; settling: boolean } {
  const text = JSON.stringify(value) ?? 'null';
  const [settled, setSettled] = useState(text);
  useEffect(() => {
    if (text === settled) return;
    const timer = setTimeout(() => setSettled(text), delayMs);
    return () => clearTimeout(timer);
  }, [text, settled, delayMs]);
  const parsed = useMemo(() => JSON.parse(settled) as T, [settled]);
  return { value: parsed, settling: text !== settled };
}
