import { useCallback, useEffect, useMemo, useSyncExternalStore } from 'react';
import { ApiError, type ApiClient } from '@baytime/shared/client';
import { createBoardSocket } from '@/lib/socket';
import { createLiveBoard, type LiveBoardState } from '../live-board';
import { getBoard } from '../api/get-board';

const IDLE: LiveBoardState = { board: null, link: 'connecting', downSince: null };

/**
 * The live board for a token: one socket while the component lives, the state from the pure store.
 * `onUnauthorized` runs when the server refuses the token; pass a stable function (a new one restarts
 * the socket).
 */
export function useLiveBoard(
  token: string | null,
  api: ApiClient,
  onUnauthorized: () => void,
): LiveBoardState {
  const live = useMemo(
    () =>
      token
        ? createLiveBoard({
            socket: createBoardSocket(token),
            onUnauthorized,
            checkToken: () =>
              getBoard(api).then(
                () => true,
                (error: unknown) => !(error instanceof ApiError && error.status === 401),
              ),
          })
        : null,
    [token, api, onUnauthorized],
  );

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
