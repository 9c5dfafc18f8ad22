import { useEffect, useState, type RefObject } from 'react';

export interface SidewaysScroll {
  /** Wider than the box: some columns are out of view. */
  overflows: boolean;
  /** Scrolled to the right end (or nothing to scroll). */
  atEnd: boolean;
}

/** Whether a box that scrolls sideways holds more than it shows, following resizes and scrolling. */
export function useSidewaysScroll(ref: RefObject<HTMLElement | null>): SidewaysScroll {
  const [state, setState] = useState<SidewaysScroll>({ overflows: false, atEnd: true });
  useEffect(() => {
    const element = ref.current;
    if (!element) return;
    const measure = () => {
      const overflows = element.scrollWidth > element.clientWidth + 1;
      const atEnd = element.scrollLeft + element.clientWidth >= element.scrollWidth - 1;
      setState((was) => (was.overflows === overflows && was.atEnd === atEnd ? was : { overflows, atEnd }));
    };
    measure();
    const observer = new ResizeObserver(measure);
    observer.observe(element);
    if (element.firstElementChild) observer.observe(element.firstElementChild);
    element.addEventListener('scroll', measure, { passive: true });
    return () => {
      observer.disconnect();
      element.removeEventListener('scroll', measure);
    };
  }, [ref]);
  return state;
}
