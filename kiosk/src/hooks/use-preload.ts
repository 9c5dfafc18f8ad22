import { useEffect } from 'react';

/**
 * Fetches code that is loaded on first use as soon as the screen has painted, so a tablet that loses the
 * Wi-Fi a moment after it loaded still has it.
 */
export function usePreload(loaders: readonly (() => Promise<unknown>)[]): void {
  useEffect(() => {
    const timer = setTimeout(() => {
      for (const load of loaders) void load().catch(() => undefined);
    }, 0);
    return () => clearTimeout(timer);
  }, [loaders]);
}
