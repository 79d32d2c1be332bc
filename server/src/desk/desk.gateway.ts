import { Logger } from '@nestjs/common';
import { OnEvent } from '@nestjs/event-emitter';
import { type OnGatewayConnection, WebSocketGateway, WebSocketServer } from '@nestjs/websockets';
import { ROLES, DESK_NAMESPACE, DESK_EVENTS, type AlertDto, type DeskHello, type DeskReadings, type DeskScheduleEvent, type ForecastRunDto, type RefitJobDto } from '@morrowline/shared';
import type { Namespace, Socket } from 'socket.io';
import { SocketAuthService } from '../auth/socket-auth.service';
import type { AuthUser } from '../common/auth-user';
import { DOMAIN_EVENTS, type ReadingsStored } from '../events/domain-events';

/**
 * The desks' live channel. Every connection must present a valid access token
 * (`auth: { token }`); others are refused before any event reaches them. The gateway listens to
 * the domain events (../events/domain-events) and passes each on to every desk as its DESK_EVENTS
 * message; no service talks to it directly.
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

  @OnEvent(DOMAIN_EVENTS.readingsStored)
  onReadingsStored(event: ReadingsStored): void {
    // desks know zones by code: the zone ids stay on the server
    const message: DeskReadings = { zones: event.zones.map(({ zone, hours, mw }) => ({ zone, hours, mw })), receivedAt: event.receivedAt };
    this.broadcast(DESK_EVENTS.readings, message);
  }

  @OnEvent(DOMAIN_EVENTS.refitProgress)
  onRefitProgress(job: RefitJobDto): void {
    this.broadcast(DESK_EVENTS.refitProgress, job);
  }

  @OnEvent(DOMAIN_EVENTS.forecastIssued)
  onForecastIssued(run: ForecastRunDto): void {
    this.broadcast(DESK_EVENTS.forecast, run);
  }

  @OnEvent(DOMAIN_EVENTS.scheduleChanged)
  onScheduleChanged(change: DeskScheduleEvent): void {
    this.broadcast(DESK_EVENTS.schedule, change);
  }

  @OnEvent(DOMAIN_EVENTS.alertRaised)
  onAlertRaised(alert: AlertDto): void {
    this.broadcast(DESK_EVENTS.alertRaised, alert);
  }

  @OnEvent(DOMAIN_EVENTS.alertAcknowledged)
  onAlertAcknowledged(alert: AlertDto): void {
    this.broadcast(DESK_EVENTS.alertAcknowledged, alert);
  }

  /** Sends a message to every connected desk. */
  private broadcast<T>(event: string, payload: T): void {
    this.server.emit(event, payload);
  }
}
