import { useEffect, useEffectEvent, useRef, useState } from 'react';
import { idleHoldSeconds } from '@/lib/idle-hold';

const ACTIVITY_EVENTS = ['pointerdown', 'keydown', 'wheel', 'touchstart'] as const;
/** The last seconds before a sign-out are counted down on screen, so a tech can tap to stay. */
export const IDLE_WARNING_SECONDS = 10;

/**
 * Calls `onIdle` after `seconds` (or longer, while a screen holds it with `holdIdle`) without a
 * touch or key. Returns the seconds left while the
 * warning shows, otherwise null.
 */
export function useIdleSignOut(seconds: number, onIdle: () => void): number | null {
  const lastActivity = useRef(0);
  const [left, setLeft] = useState<number | null>(null);
  const fire = useEffectEvent(onIdle);

  useEffect(() => {
    lastActivity.current = Date.now();
    const touched = () => {
      lastActivity.current = Date.now();
      setLeft(null);
    };
    for (const name of ACTIVITY_EVENTS)
      window.addEventListener(name, touched, { passive: true, capture: true });
    const timer = setInterval(() => {
      // A screen with work in progress (photos from the camera) may ask for longer.
      const limit = Math.max(seconds, idleHoldSeconds());
      const remaining = Math.ceil(limit - (Date.now() - lastActivity.current) / 1000);
      if (remaining <= 0) {
        setLeft(null);
        fire();
      } else setLeft(remaining <= IDLE_WARNING_SECONDS ? remaining : null);
    }, 250);
    return () => {
      clearInterval(timer);
      for (const name of ACTIVITY_EVENTS) window.removeEventListener(name, touched, { capture: true });
    };
  }, [seconds]);

  return left;
}
