import type { INestApplicationContext } from '@nestjs/common';
import { Test } from '@nestjs/testing';
import type { AlertDto, DeskScheduleEvent, ForecastRunDto, RefitJobDto } from '@morrowline/shared';
import type { Namespace } from 'socket.io';
import { SocketAuthService } from '../auth/socket-auth.service';
import { DOMAIN_EVENTS } from '../events/domain-events';
import { DomainEventsPublisher } from '../events/domain-events.publisher';
import { EventsModule } from '../events/events.module';
import { DeskGateway } from './desk.gateway';

/** What the desks receive for each domain event (message names as the client listens for them). */
describe('desk gateway', () => {
  let app: INestApplicationContext;
  let events: DomainEventsPublisher;
  let sent: [string, unknown][] = [];
  let rooms: string[][] = [];
  let disconnected: string[] = [];

  beforeAll(async () => {
    const moduleRef = await Test.createTestingModule({
      imports: [EventsModule],
      providers: [DeskGateway, { provide: SocketAuthService, useValue: {} }],
    }).compile();
    app = await moduleRef.init();
    app.get(DeskGateway).server = {
      to: (to: string[]) => ({ emit: (event: string, payload: unknown) => rooms.push(to) > 0 && sent.push([event, payload]) > 0 }),
      in: (room: string) => ({ disconnectSockets: () => disconnected.push(room) }),
    } as unknown as Namespace;
    events = app.get(DomainEventsPublisher);
  });
  beforeEach(() => {
    sent = [];
    rooms = [];
    disconnected = [];
  });
  afterAll(() => app.close());

  it('sends stored readings as desk:readings, zones by code without the server ids', () => {
    events.publish(DOMAIN_EVENTS.readingsStored, {
      zones: [
        { zoneId: 3, zone: 'MILLRACE', hours: ['2026-03-02T07:00:00.000Z', '2026-03-02T08:00:00.000Z'], mw: [41.5, 43] },
        { zoneId: 5, zone: 'TALLOW-N', hours: ['2026-03-02T08:00:00.000Z'], mw: [120.25] },
      ],
      receivedAt: '2026-03-02T08:59:58.000Z',
    });
    expect(sent).toEqual([
      [
        'desk:readings',
        {
          zones: [
            { zone: 'MILLRACE', hours: ['2026-03-02T07:00:00.000Z', '2026-03-02T08:00:00.000Z'], mw: [41.5, 43] },
            { zone: 'TALLOW-N', hours: ['2026-03-02T08:00:00.000Z'], mw: [120.25] },
          ],
          receivedAt: '2026-03-02T08:59:58.000Z',
        },
      ],
    ]);
  });

  it('sends refit progress, issued forecasts, schedule changes and alerts as they are', () => {
    const job = { id: 12, zone: 'MILLRACE', state: 'running', progress: 20 } as RefitJobDto;
    const run = { id: 40, zone: 'MILLRACE', method: 'arima', hours: ['2026-03-02T09:00:00.000Z'], mean: [44] } as ForecastRunDto;
    const change: DeskScheduleEvent = { action: 'submit', zone: 'MILLRACE', operatingDay: '2026-03-03', revisionId: 7, revision: 1, state: 'submitted' };
    const raised = { id: 9, zone: 'MILLRACE', state: 'open' } as AlertDto;
    const acknowledged = { id: 9, zone: 'MILLRACE', state: 'acknowledged' } as AlertDto;
    events.publish(DOMAIN_EVENTS.refitProgress, job);
    events.publish(DOMAIN_EVENTS.forecastIssued, run);
    events.publish(DOMAIN_EVENTS.scheduleChanged, change);
    events.publish(DOMAIN_EVENTS.alertRaised, raised);
    events.publish(DOMAIN_EVENTS.alertAcknowledged, acknowledged);
    expect(sent).toEqual([
      ['desk:refit-progress', job],
      ['desk:forecast', run],
      ['desk:schedule', change],
      ['desk:alert-raised', raised],
      ['desk:alert-acknowledged', acknowledged],
    ]);
  });

  it('sends each message only to the roles that may read it (README role table)', () => {
    const everyone = ['role:viewer', 'role:operator', 'role:supervisor', 'role:admin'];
    const deskWork = ['role:operator', 'role:supervisor'];
    events.publish(DOMAIN_EVENTS.readingsStored, { zones: [], receivedAt: '2026-03-02T08:59:58.000Z' });
    events.publish(DOMAIN_EVENTS.refitProgress, { id: 1 } as RefitJobDto);
    events.publish(DOMAIN_EVENTS.forecastIssued, { id: 2 } as ForecastRunDto);
    events.publish(DOMAIN_EVENTS.scheduleChanged, { action: 'submit', zone: 'MILLRACE', operatingDay: '2026-03-03', revisionId: 7, revision: 1, state: 'submitted' });
    events.publish(DOMAIN_EVENTS.scheduleChanged, { action: 'publish', zone: 'MILLRACE', operatingDay: '2026-03-03', revisionId: 7, revision: 1, state: 'published' });
    events.publish(DOMAIN_EVENTS.alertRaised, { id: 9 } as AlertDto);
    expect(rooms).toEqual([everyone, deskWork, everyone, deskWork, ['role:viewer', 'role:operator', 'role:supervisor'], everyone]);
  });

  it('closes the open sockets of a user whose session ended', () => {
    events.publish(DOMAIN_EVENTS.sessionEnded, { userId: 4, reason: 'deactivated' });
    expect(disconnected).toEqual(['user:4']);
    expect(sent).toEqual([]);
  });
});
