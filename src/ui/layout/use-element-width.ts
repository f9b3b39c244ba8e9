import { type RefObject, useEffect, useRef, useState } from 'react';

/** Width of an element in CSS pixels, following resizes (rounded to 10 px to avoid churn); `fallback` until measured. */
export function useElementWidth<T extends HTMLElement>(fallback: number): [RefObject<T | null>, number] {
  const ref = useRef<T>(null);
  const [width, setWidth] = useState(fallback);
  useEffect(() => {
    const element = ref.current;
    if (!element) return;
    const measure = () => {
      const w = Math.round(element.getBoundingClientRect().width / 10) * 10;
      if (w > 0) setWidth(w);
    };
    measure();
    if (typeof ResizeObserver === 'undefined') return;
    const observer = new ResizeObserver(measure);
    observer.observe(element);
    return () => observer.disconnect();
  }, []);
  return [ref, width];
}
