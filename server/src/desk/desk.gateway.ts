import { Logger } from '@nestjs/common';
import { OnEvent } from '@nestjs/event-emitter';
import { type OnGatewayConnection, type OnGatewayDisconnect, WebSocketGateway, WebSocketServer } from '@nestjs/websockets';
import { ROLES, DESK_NAMESPACE, DESK_EVENTS, type AlertDto, type DeskHello, type DeskReadings, type DeskScheduleEvent, type ForecastRunDto, type RefitJobDto } from '@morrowline/shared';
import type { Namespace, Socket } from 'socket.io';
import { SocketAuthService, type SocketSession } from '../auth/socket-auth.service';
import { DOMAIN_EVENTS, type ReadingsStored, type SessionEnded } from '../events/domain-events';
import { DESK_AUDIENCE, roleRoom, userRoom } from './desk-audience';

/** setTimeout cannot wait longer than 2^31-1 ms; a longer token is re-checked at that point. */
const LONGEST_TIMER_MS = 2_147_483_647;

/**
 * The desks' live channel. Every connection must present a valid access token
 * (`auth: { token }`); others are refused before any event reaches them. The gateway listens to
 * the domain events (../events/domain-events) and passes each on to the desks whose role may see
 * it (desk-audience.ts); no service talks to it directly. A socket lives no longer than its
 * session: it is closed when its token expires, and when its user signs out, is deactivated or
 * changes role (`session.ended`; the desk may reconnect if its token still holds).
 */
@WebSocketGateway({ namespace: DESK_NAMESPACE, cors: { origin: false } })
export class DeskGateway implements OnGatewayConnection, OnGatewayDisconnect {
  private readonly logger = new Logger(DeskGateway.name);
  private readonly expiryTimers = new Map<string, ReturnType<typeof setTimeout>>();

  @WebSocketServer()
  server!: Namespace;

  constructor(private readonly socketAuth: SocketAuthService) {}

  afterInit(namespace: Namespace): void {
    namespace.use((socket, next) => {
      this.socketAuth
        .authenticate((socket.handshake.auth as { token?: unknown }).token, ROLES)
        .then((session) => {
          (socket.data as { session: SocketSession }).session = session;
          next();
        })
        .catch((error: Error) => next(new Error(error.message)));
    });
    // Nothing is served on the root namespace: refuse it rather than hold idle connections.
    namespace.server.of('/').use((_socket, next) => next(new Error(`Connect to ${DESK_NAMESPACE} with a token`)));
  }

  handleConnection(socket: Socket): void {
    const { user, expiresAt } = (socket.data as { session: SocketSession }).session;
    void socket.join([roleRoom(user.role), userRoom(user.id)]);
    this.closeAt(socket, expiresAt);
    const hello: DeskHello = { user: { id: user.id, name: user.name, role: user.role }, serverTime: new Date().toISOString() };
    socket.emit(DESK_EVENTS.hello, hello);
    this.logger.debug(`desk connected: ${user.email}`);
  }

  handleDisconnect(socket: Socket): void {
    const timer = this.expiryTimers.get(socket.id);
    if (timer) clearTimeout(timer);
    this.expiryTimers.delete(socket.id);
  }

  @OnEvent(DOMAIN_EVENTS.sessionEnded)
  onSessionEnded(event: SessionEnded): void {
    this.server.in(userRoom(event.userId)).disconnectSockets(true);
  }

  @OnEvent(DOMAIN_EVENTS.readingsStored)
  onReadingsStored(event: ReadingsStored): void {
    // desks know zones by code: the zone ids stay on the server
    const message: DeskReadings = { zones: event.zones.map(({ zone, hours, mw }) => ({ zone, hours, mw })), receivedAt: event.receivedAt };
    this.send(DESK_EVENTS.readings, message);
  }

  @OnEvent(DOMAIN_EVENTS.refitProgress)
  onRefitProgress(job: RefitJobDto): void {
    this.send(DESK_EVENTS.refitProgress, job);
  }

  @OnEvent(DOMAIN_EVENTS.forecastIssued)
  onForecastIssued(run: ForecastRunDto): void {
    this.send(DESK_EVENTS.forecast, run);
  }

  @OnEvent(DOMAIN_EVENTS.scheduleChanged)
  onScheduleChanged(change: DeskScheduleEvent): void {
    this.send(DESK_EVENTS.schedule, change);
  }

  @OnEvent(DOMAIN_EVENTS.alertRaised)
  onAlertRaised(alert: AlertDto): void {
    this.send(DESK_EVENTS.alertRaised, alert);
  }

  @OnEvent(DOMAIN_EVENTS.alertAcknowledged)
  onAlertAcknowledged(alert: AlertDto): void {
    this.send(DESK_EVENTS.alertAcknowledged, alert);
  }

  /** Sends a message to the connected desks whose role may see it. */
  private send<E extends keyof typeof DESK_AUDIENCE, T>(event: E, payload: T): void {
    const roles = DESK_AUDIENCE[event](payload);
    this.server.to(roles.map(roleRoom)).emit(event, payload);
  }

  /** Closes the socket when its token runs out (in steps, for tokens longer than a timer can wait). */
  private closeAt(socket: Socket, expiresAt: number): void {
    const remaining = expiresAt - Date.now();
    if (remaining <= 0) {
      socket.disconnect(true);
      return;
    }
    const timer = setTimeout(() => this.closeAt(socket, expiresAt), Math.min(remaining, LONGEST_TIMER_MS));
    timer.unref();
    this.expiryTimers.set(socket.id, timer);
  }
}
