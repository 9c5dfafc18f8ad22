import { useEffect, useMemo } from 'react';
import type { LiveLink } from '@baytime/shared/client';
import { createBoardLink } from '@/lib/socket';
import { forgetWallToken } from '@/lib/wall-session';

/**
 * The wall screen's own live link. Only a screen the server says was revoked goes back to pairing
 * by itself; any other refusal stays on the wall, which says so.
 */
export function useWallLink(token: string): LiveLink {
  const link = useMemo(
    () =>
      createBoardLink(token, (refusal) => {
        if (refusal.reason === 'screen-revoked') forgetWallToken();
      }),
    [token],
  );
  useEffect(() => {
    link.start();
    return () => link.close();
  }, [link]);
  return link;
}
