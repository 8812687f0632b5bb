import { useCallback, useRef } from 'react';

/**
 * A box that scrolls inside itself must be reachable from the keyboard, or its hidden part is out of reach without a
 * mouse (WCAG 2.1.1). The returned ref puts the box in the tab order only while its content overflows, so wide tables
 * on a phone get a tab stop and tables that fit do not.
 */
export function useFocusableWhenScrolling<T extends HTMLElement>() {
  const observer = useRef<ResizeObserver | null>(null);
  return useCallback((el: T | null) => {
    observer.current?.disconnect();
    observer.current = null;
    if (!el) return;
    const update = () => {
      const scrolls = el.scrollWidth > el.clientWidth + 1 || el.scrollHeight > el.clientHeight + 1;
      if (scrolls) el.setAttribute('tabindex', '0');
      else el.removeAttribute('tabindex');
    };
    update();
    if (typeof ResizeObserver === 'undefined') return;
    observer.current = new ResizeObserver(update);
    observer.current.observe(el);
    for (const child of Array.from(el.children)) observer.current.observe(child);
  }, []);
}
