import type { OnModuleDestroy } from '@nestjs/common';
import { type OnGatewayInit, WebSocketGateway, WebSocketServer } from '@nestjs/websockets';
import type { Server, Socket } from 'socket.io';
import type { Subscription } from 'rxjs';
import {
  liveRefusal,
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
import { TickWrites } from './tick-writes.js';

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
/**
 * How long a new socket's snapshot waits for others to share its broadcast: after a restart the
 * sockets come back about one a millisecond, each in its own tick.
 */
const SNAPSHOT_GATHER_MS = 20;
/** How often the sockets whose token ran out are closed: one sweep, not a timer per socket. */
const EXPIRY_SWEEP_MS = 1_000;

const holderRoom = (holder: SessionsEnded['holder']) =>
  'screenId' in holder ? `screen:${holder.screenId}` : `user:${holder.userId}`;

/** A handshake refusal: the client's `connect_error` carries the reason in `data`. */
function refusalError(reason: LiveRefusalReason): Error & { data: unknown } {
  const refusal = liveRefusal(reason);
  return Object.assign(new Error(refusal.message), { data: refusal });
}

/**
 * The only place that touches Socket.IO: authenticates the handshake, forwards live messages, and
 * closes connections whose token ran out or whose screen or account changed. Connections and the
 * one request are handled on Socket.IO itself, not through Nest's per-connection streams: after a
 * restart a thousand sockets come back at once, and each costs the server's CPU.
 */
@WebSocketGateway({ cors: { origin: false } })
export class BoardGateway implements OnGatewayInit, OnModuleDestroy {
  @WebSocketServer() private server: LiveServer;
  private readonly subscriptions: Subscription[] = [];
  private expirySweep: NodeJS.Timeout | undefined;
  /** Sockets that still wait for their first snapshot, by socket id. */
  private readonly awaitingSnapshot = new Set<string>();
  private readonly tickWrites = new TickWrites();

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
    server.on('connection', (socket) => this.welcome(socket));
    this.expirySweep = setInterval(() => this.endExpired(), EXPIRY_SWEEP_MS).unref();
    this.subscriptions.push(
      this.live.messages$.subscribe(({ event, payload, audience }) => {
        // A new screen's snapshot goes before any message that follows it.
        this.sendSnapshots();
        const rooms =
          audience.to === 'everyone'
            ? [SHOP_ROOM]
            : [...FLOOR_ROOMS, ...(audience.technicianIds ?? []).map((id) => `user:${id}`)];
        this.tickWrites.hold(this.server, rooms);
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
    clearInterval(this.expirySweep);
  }

  private welcome(socket: LiveSocket): void {
    const { principal, requests } = socket.data;
    void socket.join([
      SHOP_ROOM,
      `role:${principal.role}`,
      `${principal.role === 'display' || principal.role === 'kiosk' ? 'screen' : 'user'}:${principal.id}`,
    ]);
    if (principal.role === 'display') this.screens.seen(principal.id);
    // Answered a few times a second at most: a client asking in a loop gets silence, not a log flood.
    // The answer goes to the acknowledgement, the last argument, whatever comes before it.
    socket.on('board.snapshot', (...args: unknown[]) => {
      const answer = args.at(-1);
      if (typeof answer === 'function' && requests.take()) answer(this.board.current());
    });
    if (this.awaitingSnapshot.size === 0) setTimeout(() => this.sendSnapshots(), SNAPSHOT_GATHER_MS);
    this.awaitingSnapshot.add(socket.id);
  }

  /**
   * One snapshot for every socket that connected in the last few milliseconds, sent as one broadcast:
   * Socket.IO encodes it and frames it once for all of them.
   */
  private sendSnapshots(): void {
    if (this.awaitingSnapshot.size === 0) return;
    const sockets = [...this.awaitingSnapshot];
    this.awaitingSnapshot.clear();
    this.server.to(sockets).emit('board.snapshot', this.board.current());
  }

  private endExpired(): void {
    const now = Date.now();
    for (const socket of this.server.sockets.sockets.values()) {
      if (socket.data.expiresAt > now) continue;
      socket.emit('session.ended', liveRefusal('token-expired'));
      socket.disconnect();
    }
  }
}
