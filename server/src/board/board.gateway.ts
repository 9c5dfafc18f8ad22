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
import type { BoardSnapshot, ClientToServerEvents, ServerToClientEvents } from '@baytime/shared';
import { AuthService } from '../auth/auth.service.js';
import type { Principal } from '../auth/principal.js';
import { LiveService } from '../live/live.service.js';
import { ScreensService } from '../screens/screens.service.js';
import { BoardService } from './board.service.js';

type LiveServer = Server<ClientToServerEvents, ServerToClientEvents, object, { principal: Principal }>;
type LiveSocket = Socket<ClientToServerEvents, ServerToClientEvents, object, { principal: Principal }>;

const SHOP_ROOM = 'shop';
const FLOOR_ROOMS = ['role:owner', 'role:foreman', 'role:advisor', 'role:display'];

/** The only place that touches Socket.IO: authenticates the handshake and forwards live messages. */
@WebSocketGateway({ cors: { origin: false } })
export class BoardGateway implements OnGatewayInit, OnGatewayConnection, OnModuleDestroy {
  private readonly logger = new Logger(BoardGateway.name);
  @WebSocketServer() private server: LiveServer;
  private subscription: Subscription | null = null;

  constructor(
    private readonly auth: AuthService,
    private readonly board: BoardService,
    private readonly live: LiveService,
    private readonly screens: ScreensService,
  ) {}

  afterInit(): void {
    this.subscription = this.live.messages$.subscribe(({ event, payload, audience }) => {
      const rooms =
        audience.to === 'everyone'
          ? [SHOP_ROOM]
          : [...FLOOR_ROOMS, ...(audience.technicianId ? [`user:${audience.technicianId}`] : [])];
      (this.server.to(rooms).emit as (event: string, payload: unknown) => boolean)(event, payload);
    });
  }

  onModuleDestroy(): void {
    this.subscription?.unsubscribe();
  }

  handleConnection(socket: LiveSocket): void {
    const token: unknown = socket.handshake.auth?.token;
    const principal = typeof token === 'string' ? this.auth.verifyToken(token) : null;
    if (!principal) {
      socket.emit('auth.error', { message: 'Sign in again' });
      socket.disconnect(true);
      return;
    }
    socket.data.principal = principal;
    void socket.join([
      SHOP_ROOM,
      `role:${principal.role}`,
      `${principal.role === 'display' ? 'screen' : 'user'}:${principal.id}`,
    ]);
    if (principal.role === 'display') this.screens.seen(principal.id);
    socket.emit('board.snapshot', this.board.current());
    this.logger.debug(`${principal.role} ${principal.id} connected`);
  }

  @SubscribeMessage('board.snapshot')
  snapshot(@ConnectedSocket() socket: LiveSocket): BoardSnapshot | undefined {
    return socket.data.principal ? this.board.current() : undefined;
  }
}
