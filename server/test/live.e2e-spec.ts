import { MikroORM } from '@mikro-orm/mariadb';
import type { NestExpressApplication } from '@nestjs/platform-express';
import request from 'supertest';
import { gateClosureAt, HOUR_MS, operatingDaySlots, operatingDayStart, type CommittedLoadDto } from '@morrowline/shared';
import { ScheduleRevision } from '../src/schedules/entities/schedule-revision.entity';
import { User } from '../src/users/entities/user.entity';
import { Zone } from '../src/zones/entities/zone.entity';
import { storeDayAheadRun } from './support/committed';
import { createZone } from './support/feeds';
import { demoUser, startTestApp, tokenFor } from './support/test-app';

jest.setTimeout(60_000);

const TZ = 'America/Denver';
const DAY = '2030-07-15';
const NEXT = '2030-07-16';

describe('committed load for the live view (real MariaDB)', () => {
  let app: NestExpressApplication;
  let viewer: string;
  let zone: string;
  beforeAll(async () => {
    app = await startTestApp();
    viewer = await tokenFor(app, 'viewer');
    zone = await createZone(app, await tokenFor(app, 'admin'));
    // Day-ahead for DAY (issued before its gate closure): 200 + hour index; for NEXT a run issued
    // after NEXT's gate closure (an intraday update, not committed).
    await storeDayAheadRun(app, zone, operatingDayStart(DAY, TZ), 24, (t) => 200 + (t - operatingDayStart(DAY, TZ)) / HOUR_MS);
    await storeDayAheadRun(app, zone, operatingDayStart(NEXT, TZ), 24, () => 999, 3 * HOUR_MS);
    // A published schedule for DAY with values for its first three hours only.
    const em = app.get(MikroORM).em.fork();
    const z = await em.findOneOrFail(Zone, { code: zone });
    const by = await em.findOneOrFail(User, { email: demoUser('supervisor').email });
    const hours = operatingDaySlots(DAY, TZ).map((slot) => {
      const mw = slot.index < 3 ? 250 + slot.index : null;
      return { ...slot, modelMw: null, lower80: null, upper80: null, lower95: null, upper95: null, startMw: mw, adjustedMw: mw };
    });
    em.create(ScheduleRevision, { zone: z, operatingDay: DAY, revision: 1, state: 'published', publishedKey: `${z.id}:${DAY}`, hours, createdBy: by, publishedBy: by, publishedAt: new Date(gateClosureAt(DAY, TZ, '10:00') - 2 * HOUR_MS), createdAt: new Date(), late: false });
    await em.flush();
  });
  afterAll(async () => {
    await app.close();
  });
  const api = () => request(app.getHttpServer());

  it('answers the schedule where published, the day-ahead forecast elsewhere, and nothing for a day without either', async () => {
    const from = new Date(operatingDayStart(DAY, TZ)).toISOString();
    const to = new Date(operatingDayStart(NEXT, TZ) + 2 * HOUR_MS).toISOString();
    const body = (await api().get(`/api/live/committed?zone=${zone}&from=${from}&to=${to}`).set('Authorization', `Bearer ${viewer}`).expect(200)).body as CommittedLoadDto;
    expect(body.hours).toHaveLength(26);
    const z = body.zones[0];
    expect(z.zone).toBe(zone);
    expect(z.committed.slice(0, 5)).toEqual([250, 251, 252, 203, 204]);
    expect(z.basis.slice(0, 5)).toEqual(['schedule', 'schedule', 'schedule', 'day-ahead', 'day-ahead']);
    expect(z.schedule.slice(0, 4)).toEqual([250, 251, 252, null]);
    expect(z.dayAhead.slice(0, 4)).toEqual([200, 201, 202, 203]);
    expect(z.committed.slice(24)).toEqual([null, null]);
    expect(z.basis.slice(24)).toEqual([null, null]);
    expect(z.days.map((d) => [d.operatingDay, d.schedule?.revision ?? null, d.dayAhead !== null])).toEqual([[DAY, 1, true], [NEXT, null, false]]);
    expect(z.days[0].gateClosureAt).toBe('2030-07-14T16:00:00.000Z');
  });

  it('refuses a reversed or too long range and an unknown zone with a 400', async () => {
    const get = (q: string) => api().get(`/api/live/committed?${q}`).set('Authorization', `Bearer ${viewer}`);
    expect((await get('from=2030-07-15T10:00:00Z&to=2030-07-15T09:00:00Z').expect(400)).body.message).toBe('from must be before to');
    expect((await get('from=2030-07-01T00:00:00Z&to=2030-07-20T00:00:00Z').expect(400)).body.message).toBe('The range may span at most 336 hours');
    await get('from=yesterday&to=2030-07-15T09:00:00Z').expect(400);
    await get(`zone=NOSUCHZONE&from=2030-07-15T00:00:00Z&to=2030-07-15T09:00:00Z`).expect(400);
    await api().get('/api/live/committed?from=2030-07-15T00:00:00Z&to=2030-07-15T09:00:00Z').expect(401);
  });
});
