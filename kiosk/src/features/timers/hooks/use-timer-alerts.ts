import { useCallback, useEffect, useRef, useState, useSyncExternalStore } from 'react';
import { audioState, playChime } from '@/lib/chime';
import { useWatchToken } from '@/hooks/use-watch-token';
import { recentlySignedIn, useSignedInHere } from '@/lib/signed-in-here';
import {
  decideAlerts,
  liveAlerts,
  parseAnnounced,
  serializeAnnounced,
  type AlertMemory,
  type TimerAlert,
} from '../alerts';
import { finishedAt } from '../timer-status';
import { useTimers } from '../api/get-timers';
import { useBays } from '../api/get-bays';

export const ANNOUNCED_KEY = 'baytime.kiosk.timer-alerts';

function loadAnnounced() {
  try {
    return parseAnnounced(localStorage.getItem(ANNOUNCED_KEY));
  } catch {
    return new Map<number, number>();
  }
}

function saveAnnounced(memory: AlertMemory) {
  try {
    localStorage.setItem(ANNOUNCED_KEY, serializeAnnounced(memory.announced));
  } catch {
    // only a nicety: at worst a reload chimes once more
  }
}

export interface TimerAlerts {
  alerts: TimerAlert[];
  dismiss: (timerId: number) => void;
  bayName: (bayId: number | null) => string | null;
  /** Timers are running but the tablet has had no tap yet, so a chime would not be heard. */
  needsTapForSound: boolean;
}

/**
 * Watches the running timers of everyone who signed in here during the shift, and chimes once when
 * one reaches its target or a set time runs out: a technician who never used this tablet hears
 * theirs on their own. Lives as long as the page, under the routes.
 */
export function useTimerAlerts(): TimerAlerts {
  const token = useWatchToken();
  const signedIn = useSignedInHere();
  const timers = useTimers(token !== null);
  const bays = useBays(token !== null);
  const memory = useRef<AlertMemory | null>(null);
  const [alerts, setAlerts] = useState<TimerAlert[]>([]);
  const audioReady = useSyncExternalStore(audioState.subscribe, audioState.ready);

  const data = timers.data;
  const fetchedAt = timers.dataUpdatedAt;
  useEffect(() => {
    if (!data) return;
    memory.current ??= { seenRunning: new Set(), announced: loadAnnounced() };
    const tick = () => {
      const now = Date.now();
      const watching = recentlySignedIn(signedIn, now);
      const decision = decideAlerts(data, memory.current!, { now, fetchedAt, watching });
      const changed = decision.memory.announced.size !== memory.current!.announced.size;
      memory.current = decision.memory;
      if (changed) saveAnnounced(decision.memory);
      if (decision.alerts.length === 0) return;
      playChime();
      setAlerts((shown) => [...shown, ...decision.alerts]);
    };
    tick();
    // Set times end on the tablet's count too, so the chime comes on time even on a slow link.
    const hasSetTime = data.some(
      (t) => t.kind === 'set-time' && finishedAt(t, { now: Date.now(), fetchedAt }) === null,
    );
    if (!hasSetTime) return;
    const timer = setInterval(tick, 1000);
    return () => clearInterval(timer);
  }, [data, fetchedAt, signedIn]);

  const dismiss = useCallback(
    (timerId: number) => setAlerts((shown) => shown.filter((a) => a.timerId !== timerId)),
    [],
  );
  const bayList = bays.data;
  const bayName = useCallback(
    (bayId: number | null) => (bayId === null ? null : (bayList?.find((b) => b.id === bayId)?.name ?? null)),
    [bayList],
  );

  return {
    alerts: data ? liveAlerts(alerts, data) : alerts,
    dismiss,
    bayName,
    needsTapForSound: !audioReady && (data?.length ?? 0) > 0,
  };
}
