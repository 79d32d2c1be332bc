import { Injectable, Logger, type INestApplicationContext } from '@nestjs/common';
import { OnEvent } from '@nestjs/event-emitter';
import { Test } from '@nestjs/testing';
import { DOMAIN_EVENTS, type ReadingsStored } from './domain-events';
import { DomainEventsPublisher } from './domain-events.publisher';
import { EventsModule } from './events.module';

const heard: string[] = [];

@Injectable()
class FailingListener {
  @OnEvent(DOMAIN_EVENTS.readingsStored)
  onStored(): void {
    heard.push('failing');
    throw new Error('listener broke');
  }
}

@Injectable()
class CountingListener {
  @OnEvent(DOMAIN_EVENTS.readingsStored)
  onStored(event: ReadingsStored): void {
    heard.push(`counting ${event.zones.length}`);
  }
}

describe('domain events', () => {
  let app: INestApplicationContext;

  beforeAll(async () => {
    const moduleRef = await Test.createTestingModule({ imports: [EventsModule], providers: [FailingListener, CountingListener] }).compile();
    app = await moduleRef.init();
  });
  afterAll(() => app.close());

  it('reaches every listener before publish returns; a listener that throws is logged, not thrown at the publisher', () => {
    const logged = jest.spyOn(Logger.prototype, 'error').mockImplementation(() => undefined);
    const stored: ReadingsStored = { zones: [{ zoneId: 1, zone: 'MILLRACE', hours: ['2026-03-02T07:00:00.000Z'], mw: [41.5] }], receivedAt: '2026-03-02T07:59:00.000Z' };
    expect(() => app.get(DomainEventsPublisher).publish(DOMAIN_EVENTS.readingsStored, stored)).not.toThrow();
    expect(heard).toEqual(['failing', 'counting 1']);
    expect(logged).toHaveBeenCalledWith('listener broke', expect.any(String));
    logged.mockRestore();
  });

  it('carries only plain JSON: a payload survives a round trip through JSON unchanged', () => {
    const stored: ReadingsStored = { zones: [{ zoneId: 2, zone: 'TALLOW-N', hours: ['2026-03-02T07:00:00.000Z'], mw: [120.25] }], receivedAt: '2026-03-02T07:59:00.000Z' };
    expect(JSON.parse(JSON.stringify(stored))).toEqual(stored);
  });
});
