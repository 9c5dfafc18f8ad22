import { useEffect, useState } from 'react';
import { flushSync } from 'react-dom';

/**
 * True while the browser prints, so charts can take a fixed paper width. The update is flushed inside
 * `beforeprint`: the browser lays the page out for print right after the event.
 */
export function usePrinting(): boolean {
  const [printing, setPrinting] = useState(false);
  useEffect(() => {
    const before = () => flushSync(() => setPrinting(true));
    const after = () => setPrinting(false);
    window.addEventListener('beforeprint', before);
    window.addEventListener('afterprint', after);
    return () => {
      window.removeEventListener('beforeprint', before);
      window.removeEventListener('afterprint', after);
    };
  }, []);
  return printing;
}
