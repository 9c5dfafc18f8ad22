import { useCallback, useEffect, useMemo, useSyncExternalStore } from 'react';
import type { LiveLink } from '@baytime/shared/client';
import { createLiveBoard, type LiveBoardState } from '../live-board';

const IDLE: LiveBoardState = { board: null, link: 'connecting', downSince: null, refusal: null };

/** The live board over a link (the wall's own, or the office's): the state from the pure store. */
export function useLiveBoard(link: LiveLink | null): LiveBoardState {
  const live = useMemo(() => (link ? createLiveBoard({ link }) : null), [link]);

  useEffect(() => {
    if (!live) return;
    live.start();
    return () => live.stop();
  }, [live]);

  const subscribe = useCallback(
    (listener: () => void) => (live ? live.subscribe(listener) : () => {}),
    [live],
  );
  const getState = useCallback(() => (live ? live.getState() : IDLE), [live]);
  return useSyncExternalStore(subscribe, getState, getState);
}
