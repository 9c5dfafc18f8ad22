import { useEffect } from 'react';
import { createBoardSocket, type BoardSocket } from './socket';

/**
 * One live link for an office page: `wire` adds the page's listeners and may return a cleanup;
 * `onReconnect` runs after the link comes back, when messages may have been missed.
 * The socket is made, connected and closed here; pages only say what they listen to.
 */
export function useOfficeSocket(
  token: string | null,
  wire: (socket: BoardSocket) => (() => void) | void,
  onReconnect: () => void,
): void {
  useEffect(() => {
    if (!token) return;
    const socket = createBoardSocket(token);
    let connectedBefore = false;
    // The server sends a snapshot on every connect: the first follows the page's own load.
    socket.on('board.snapshot', () => {
      if (connectedBefore) onReconnect();
      connectedBefore = true;
    });
    const unwire = wire(socket);
    socket.connect();
    return () => {
      unwire?.();
      socket.removeAllListeners();
      socket.io.removeAllListeners();
      socket.disconnect();
    };
  }, [token, wire, onReconnect]);
}
