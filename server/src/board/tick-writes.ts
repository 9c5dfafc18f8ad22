import type { Server } from 'socket.io';

/** What this uses of Engine.IO's WebSocket transport: `writable` and `ready` are its own send gate. */
interface WebSocketTransport {
  name: string;
  writable: boolean;
  emit(event: 'ready'): boolean;
  /** The `ws` socket, and its TCP socket. */
  socket?: { _socket?: { cork(): void; uncork(): void } | null };
}

/**
 * Holds what Socket.IO sends to some rooms' WebSocket connections until the end of the tick, then
 * writes each connection's frames in one system call. One change of the floor sends a board two or
 * three messages in the same tick (the punch, its bay, the floor); written one by one, the calls to
 * twenty boards were the largest single cost of a punch on a busy shop.
 */
export class TickWrites {
  private readonly held: WebSocketTransport[] = [];

  hold(server: Server, rooms: readonly string[]): void {
    const namespace = server.of('/');
    for (const room of rooms)
      for (const socketId of namespace.adapter.rooms.get(room) ?? []) {
        const transport = namespace.sockets.get(socketId)?.conn.transport as WebSocketTransport | undefined;
        // A connection still writing earlier frames, or on long polling, is left to Engine.IO.
        if (transport?.name !== 'websocket' || !transport.writable) continue;
        // Engine.IO keeps what is sent meanwhile in its buffer, in order, until the transport is ready.
        transport.writable = false;
        if (this.held.push(transport) === 1) setImmediate(() => this.release());
      }
  }

  private release(): void {
    for (const transport of this.held.splice(0)) {
      const tcp = transport.socket?._socket;
      tcp?.cork();
      transport.writable = true;
      transport.emit('ready');
      tcp?.uncork();
    }
  }
}
