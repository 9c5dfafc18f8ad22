import { useEffect, useState } from 'react';

/** The time now, updated every half minute: enough for waits and "today" on office screens. */
export function useMinuteNow(): number {
  const [now, setNow] = useState(() => Date.now());
  useEffect(() => {
    const interval = setInterval(() => setNow(Date.now()), 30_000);
    return () => clearInterval(interval);
  }, []);
  return now;
}
