import { Logger, type OnModuleDestroy } from '@nestjs/common';
import {
  ConnectedSocket,
  type OnGatewayConnection,
  type OnGatewayInit,
  SubscribeMessage,
  WebSocketGateway,
  WebSocketServer,
} from '@nestjs/websockets';
import type { Server, Socket } from 'socket.io';
import type { Subscription } from 'rxjs';
import {
  liveRefusal,
  type BoardSnapshot,
  type ClientToServerEvents,
  type LiveRefusalReason,
  type ServerToClientEvents,
} from '@baytime/shared';
import { AuthService } from '../auth/auth.service.js';
import type { Principal } from '../auth/principal.js';
import { LiveService, type SessionsEnded } from '../live/live.service.js';
import { RequestBudget } from '../live/request-budget.js';
import { ScreensService } from '../screens/screens.service.js';
import { BoardService } from './board.service.js';

interface SocketData {
  principal: Principal;
  /** When the token runs out, in ms. */
  expiresAt: number;
  requests: RequestBudget;
}
type LiveServer = Server<ClientToServerEvents, ServerToClientEvents, object, SocketData>;
type LiveSocket = Socket<ClientToServerEvents, ServerToClientEvents, object, SocketData>;

const SHOP_ROOM = 'shop';
const FLOOR_ROOMS = ['role:owner', 'role:foreman', 'role:advisor', 'role:display'];
/** setTimeout's longest wait (about 24.8 days); a wall screen's token lasts longer. */
const LONGEST_TIMEOUT_MS = 2 ** 31 - 1;

const holderRoom = (holder: SessionsEnded['holder']) =>
  'screenId' in holder ? `screen:${holder.screenId}` : `user:${holder.userId}`;

/** A handshake refusal: the client's `connect_error` carries the reason in `data`. */
function refusalError(reason: LiveRefusalReason): Error & { data: unknown } {
  const refusal = liveRefusal(reason);
  return Object.assign(new Error(refusal.message), { data: refusal });
}

/**
 * The only place that touches Socket.IO: authenticates the handshake, forwards live messages, and
 * closes connections whose token ran out or whose screen or account changed.
 */
@WebSocketGateway({ cors: { origin: false } })
export class BoardGateway implements OnGatewayInit, OnGatewayConnection, OnModuleDestroy {
  private readonly logger = new Logger(BoardGateway.name);
  @WebSocketServer() private server: LiveServer;
  private readonly subscriptions: Subscription[] = [];
  /** Sockets connected this tick that still wait for their first snapshot, by socket id. */
  private readonly awaitingSnapshot = new Set<string>();

  constructor(
    private readonly auth: AuthService,
    private readonly board: BoardService,
    private readonly live: LiveService,
    private readonly screens: ScreensService,
  ) {}

  afterInit(server: LiveServer): void {
    // A refused handshake never becomes a connection: the client gets `connect_error` with the reason.
    server.use((socket, next) => {
      const checked = this.auth.check(socket.handshake.auth?.token);
      if ('refusal' in checked) return next(refusalError(checked.refusal));
      socket.data.principal = checked.principal;
      socket.data.expiresAt = checked.expiresAt;
      socket.data.requests = new RequestBudget();
      next();
    });
    this.subscriptions.push(
      this.live.messages$.subscribe(({ event, payload, audience }) => {
        // A new screen's snapshot goes before any message that follows it.
        this.sendSnapshots();
        const rooms =
          audience.to === 'everyone'
            ? [SHOP_ROOM]
            : [...FLOOR_ROOMS, ...(audience.technicianIds ?? []).map((id) => `user:${id}`)];
        (this.server.to(rooms).emit as (event: string, payload: unknown) => boolean)(event, payload);
      }),
      this.live.sessionsEnded$.subscribe(({ holder, reason }) => {
        const room = holderRoom(holder);
        this.server.to(room).emit('session.ended', liveRefusal(reason));
        this.server.in(room).disconnectSockets();
      }),
    );
  }

  onModuleDestroy(): void {
    for (const subscription of this.subscriptions) subscription.unsubscribe();
  }

  handleConnection(socket: LiveSocket): void {
    const { principal, expiresAt } = socket.data;
    void socket.join([
      SHOP_ROOM,
      `role:${principal.role}`,
      `${principal.role === 'display' || principal.role === 'kiosk' ? 'screen' : 'user'}:${principal.id}`,
    ]);
    this.endAtExpiry(socket, expiresAt);
    if (principal.role === 'display') this.screens.seen(principal.id);
    if (this.awaitingSnapshot.size === 0) setImmediate(() => this.sendSnapshots());
    this.awaitingSnapshot.add(socket.id);
    this.logger.debug(`${principal.role} ${principal.id} connected`);
  }

  /** Answered a few times a second at most: a client asking in a loop gets silence, not a log flood. */
  @SubscribeMessage('board.snapshot')
  snapshot(@ConnectedSocket() socket: LiveSocket): BoardSnapshot | undefined {
    return socket.data.requests.take() ? this.board.current() : undefined;
  }

  /**
   * One snapshot for every socket that connected in the same tick, sent as one broadcast: Socket.IO
   * encodes it and frames it once for all of them. After a restart, sockets come back in crowds.
   */
  private sendSnapshots(): void {
    if (this.awaitingSnapshot.size === 0) return;
    const sockets = [...this.awaitingSnapshot];
    this.awaitingSnapshot.clear();
    this.server.to(sockets).emit('board.snapshot', this.board.current());
  }

  private endAtExpiry(socket: LiveSocket, expiresAt: number): void {
    let timer: NodeJS.Timeout;
    const wait = () => {
      timer = setTimeout(
        () => {
          if (Date.now() < expiresAt) return wait();
          socket.emit('session.ended', liveRefusal('token-expired'));
          socket.disconnect();
        },
        Math.min(Math.max(0, expiresAt - Date.now()), LONGEST_TIMEOUT_MS),
      );
      timer.unref();
    };
    wait();
    socket.once('disconnect', () => clearTimeout(timer));
  }
}
