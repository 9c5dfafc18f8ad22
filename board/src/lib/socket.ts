import { io, type Socket } from 'socket.io-client';
import type { ClientToServerEvents, ServerToClientEvents } from '@baytime/shared';

export type BoardSocket = Socket<ServerToClientEvents, ClientToServerEvents>;

/** A socket to the shop server at this origin; it connects when the live board starts it. */
export function createBoardSocket(token: string): BoardSocket {
  return io({
    auth: { token },
    autoConnect: false,
    forceNew: true,
    // Backoff from 1 s to 15 s with jitter, so a roomful of screens does not reconnect in step.
    reconnectionDelay: 1_000,
    reconnectionDelayMax: 5_000,
    randomizationFactor: 0.5,
  });
}
