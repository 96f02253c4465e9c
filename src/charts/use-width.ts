import { useLayoutEffect, useRef, useState } from 'react';

/**
 * The content width of an element, measured before the first paint and kept current with a ResizeObserver
 * (for charts laid out in fixed-width cells). 0 until measured, so callers can wait for it.
 */
export function useWidth<T extends HTMLElement>() {
  const ref = useRef<T>(null);
  const [width, setWidth] = useState(0);
  useLayoutEffect(() => {
    const el = ref.current;
    if (!el) return;
    setWidth(Math.round(el.getBoundingClientRect().width));
    const observer = new ResizeObserver(([entry]) => {
      if (entry) setWidth(Math.round(entry.contentRect.width));
    });
    observer.observe(el);
    return () => observer.disconnect();
  }, []);
  return { ref, width };
}
