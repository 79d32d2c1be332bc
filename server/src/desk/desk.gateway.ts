import { Logger } from '@nestjs/common';
import { type OnGatewayConnection, WebSocketGateway, WebSocketServer } from '@nestjs/websockets';
import { ROLES, DESK_NAMESPACE, DESK_EVENTS, type DeskHello } from '@morrowline/shared';
import type { Namespace, Socket } from 'socket.io';
import { SocketAuthService } from '../auth/socket-auth.service';
import type { AuthUser } from '../auth/auth-user';

/**
 * The desks' live channel. Every connection must present a valid access token
 * (`auth: { token }`); others are refused before any event reaches them.
 */
@WebSocketGateway({ namespace: DESK_NAMESPACE, cors: { origin: false } })
export class DeskGateway implements OnGatewayConnection {
  private readonly logger = new Logger(DeskGateway.name);

  @WebSocketServer()
  server!: Namespace;

  constructor(private readonly socketAuth: SocketAuthService) {}

  afterInit(namespace: Namespace): void {
    namespace.use((socket, next) => {
      this.socketAuth
        .authenticate((socket.handshake.auth as { token?: unknown }).token, ROLES)
        .then((user) => {
          (socket.data as { user: AuthUser }).user = user;
          next();
        })
        .catch((error: Error) => next(new Error(error.message)));
    });
  }

  handleConnection(socket: Socket): void {
    const user = (socket.data as { user: AuthUser }).user;
    socket.join(`role:${user.role}`);
    const hello: DeskHello = { user: { id: user.id, name: user.name, role: user.role }, serverTime: new Date().toISOString() };
    socket.emit(DESK_EVENTS.hello, hello);
    this.logger.debug(`desk connected: ${user.email}`);
  }

  /** Sends an event to every connected desk. */
  broadcast<T>(event: string, payload: T): void {
    this.server.emit(event, payload);
  }
}
