import { useCallback, useEffect, useRef, useState } from 'react';

/**
 * A callback ref and the element's current content width, kept up to date as it resizes. The
 * observer is disconnected when the element changes or goes, and when the component unmounts.
 */
export function useElementWidth<T extends HTMLElement>(): [(el: T | null) => void, number] {
  const [width, setWidth] = useState(0);
  const observer = useRef<ResizeObserver | null>(null);
  const ref = useCallback((el: T | null) => {
    observer.current?.disconnect();
    observer.current = null;
    if (!el) return;
    setWidth(el.clientWidth);
    const next = new ResizeObserver(() => setWidth(el.clientWidth));
    next.observe(el);
    observer.current = next;
  }, []);
  useEffect(
    () => () => {
      observer.current?.disconnect();
      observer.current = null;
    },
    [],
  );
  return [ref, width];
}
