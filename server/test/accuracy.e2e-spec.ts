import { EntityManager } from '@mikro-orm/mariadb';
import type { NestExpressApplication } from '@nestjs/platform-express';
import request from 'supertest';
import type { AccuracyReportDto } from '@morrowline/shared';
import { ForecastRun } from '../src/forecasts/entities/forecast-run.entity';
import { ReadingsRepository } from '../src/readings/readings.repository';
import { ScheduleRevision } from '../src/schedules/entities/schedule-revision.entity';
import { User } from '../src/users/entities/user.entity';
import { Zone } from '../src/zones/entities/zone.entity';
import { createZone } from './support/feeds';
import { demoUser, startTestApp, tokenFor } from './support/test-app';

jest.setTimeout(120_000);

const HOUR = 3_600_000;
/** Local midnights in America/Denver (MST −7 before 8 March 2026, MDT −6 after). */
const DAY_START: Record<string, number> = {
  '2026-03-07': Date.parse('2026-03-07T07:00:00Z'),
  '2026-03-08': Date.parse('2026-03-08T07:00:00Z'),
  '2026-03-09': Date.parse('2026-03-09T06:00:00Z'),
  '2026-03-10': Date.parse('2026-03-10T06:00:00Z'),
  '2026-03-11': Date.parse('2026-03-11T06:00:00Z'),
};
/** A daily swing, to 0.1 MW. */
const load = (t: number) => Math.round((250 + 90 * Math.sin((2 * Math.PI * ((t / HOUR) % 24)) / 24)) * 10) / 10;
const hoursOf = (from: number, to: number) => Array.from({ length: (to - from) / HOUR }, (_, i) => from + i * HOUR);

describe('accuracy (real MariaDB)', () => {
  let app: NestExpressApplication;
  let admin: string;
  let viewer: string;
  let zone: string;
  const api = () => request(app.getHttpServer());
  const as = (token: string) => ({ Authorization: `Bearer ${token}` });

  beforeAll(async () => {
    app = await startTestApp();
    [admin, viewer] = await Promise.all([tokenFor(app, 'admin'), tokenFor(app, 'viewer')]);
    zone = await createZone(app, admin);
    const em = app.get(EntityManager).fork();
    const z = await em.findOneOrFail(Zone, { code: zone });
    // Actuals on 7, 8 (23 hours) and 10 March; none on the 9th.
    const actualHours = [...hoursOf(DAY_START['2026-03-07'], DAY_START['2026-03-09']), ...hoursOf(DAY_START['2026-03-10'], DAY_START['2026-03-11'])];
    await app.get(ReadingsRepository).store(
      actualHours.map((t) => ({ zoneId: z.id, zone, hourStart: t, mw: load(t), quality: 'good' as const })),
      'test:accuracy',
    );
    const run = (issuedAt: string, from: number, to: number, factor: number) => {
      const mean = hoursOf(from, to).map((t) => load(t) * factor);
      return em.create(ForecastRun, { zone: z, issuedAt: new Date(issuedAt), basedOnHour: new Date(from - HOUR), method: 'arima', fallbackReason: null, modelVersionId: null, firstHour: new Date(from), mean, lower80: mean, upper80: mean, lower95: mean, upper95: mean });
    };
    // Gate closure 10:00 local the day before: 7 March's is 6 March 17:00Z, 8 March's is 7 March 17:00Z.
    run('2026-03-06T12:00:00Z', DAY_START['2026-03-07'], DAY_START['2026-03-10'], 1.1); // covers 7, 8, 9
    run('2026-03-06T18:00:00Z', DAY_START['2026-03-07'], DAY_START['2026-03-09'], 0.8); // too late for the 7th
    // Published schedules: the 7th at actual × 1.02; the 8th has a superseded revision 1 (× 1.0)
    // and the revision in force, 2, at × 0.9. The 10th has a schedule but no forecast.
    const supervisor = await em.findOneOrFail(User, { email: demoUser('supervisor').email });
    const revision = (day: string, n: number, factor: number, state: 'published' | 'superseded') => {
      const hours = hoursOf(DAY_START[day], Object.values(DAY_START).find((t) => t > DAY_START[day])!).map((t, index) => ({
        index,
        intervalStartUtc: new Date(t).toISOString(),
        hourEnding: '',
        modelMw: null,
        lower80: null,
        upper80: null,
        lower95: null,
        upper95: null,
        adjustedMw: Math.round(load(t) * factor * 10) / 10,
      }));
      const at = new Date(DAY_START[day] - 12 * HOUR + n * 60_000);
      return em.create(ScheduleRevision, { zone: z, operatingDay: day, revision: n, state, publishedKey: state === 'published' ? `${z.id}:${day}` : null, hours, createdBy: supervisor, createdAt: at, late: false, publishedBy: supervisor, publishedAt: at, supersededAt: state === 'superseded' ? at : null });
    };
    revision('2026-03-07', 1, 1.02, 'published');
    revision('2026-03-08', 1, 1.0, 'superseded');
    revision('2026-03-08', 2, 0.9, 'published');
    revision('2026-03-10', 1, 1.05, 'published');
    await em.flush();
  });
  afterAll(async () => {
    await app?.close();
  });

  const report = async (query: string, token = viewer) => (await api().get(`/api/accuracy?${query}`).set(as(token)).expect(200)).body as AccuracyReportDto;

  it('scores each day against the latest run issued before its gate closure', async () => {
    const body = await report(`zone=${zone}&from=2026-03-07&to=2026-03-10`);
    const z = body.zones[0];
    expect(z.days.map((d) => [d.operatingDay, d.hours, d.actualHours, d.actuals])).toEqual([
      ['2026-03-07', 24, 24, 'complete'],
      ['2026-03-08', 23, 23, 'complete'],
      ['2026-03-09', 24, 0, 'none'],
      ['2026-03-10', 24, 24, 'complete'],
    ]);
    const [d7, d8, d9, d10] = z.days;
    const actual7 = hoursOf(DAY_START['2026-03-07'], DAY_START['2026-03-08']).map(load);
    const mean7 = actual7.reduce((s, x) => s + x, 0) / 24;
    const peak7 = Math.max(...actual7);
    // The 1.1 run (issued before the 7th's gate closure), not the 0.8 run issued after it.
    expect(d7.model?.at).toBe('2026-03-06T12:00:00.000Z');
    expect(d7.model?.score).toMatchObject({ hours: 24, mape: 10, peakErrorPct: 10 });
    expect(d7.model?.score?.bias).toBeCloseTo(0.1 * mean7, 2);
    expect(d7.model?.score?.mae).toBeCloseTo(0.1 * mean7, 2);
    expect(d7.model?.score?.peakErrorMw).toBeCloseTo(0.1 * peak7, 2);
    // The 23-hour spring day scores its 23 hours, against the later 0.8 run: under-forecast.
    expect(d8.model?.at).toBe('2026-03-06T18:00:00.000Z');
    expect(d8.model?.score).toMatchObject({ hours: 23, mape: 20, peakErrorPct: -20 });
    expect(d8.model?.score?.bias).toBeLessThan(0);
    // No actuals: listed, a forecast is known, nothing scored. No forecast: listed as such.
    expect(d9.model).toMatchObject({ score: null });
    expect(d10.model).toBeNull();
    expect(d10.adjustmentEffect).toBeNull();
    expect(z).toMatchObject({ daysScored: 2, daysWithoutActuals: 1, daysWithoutForecast: 1 });
    // Pooled over the scored days: 24 hours at 10 % and 23 at 20 %.
    expect(z.model.hours).toBe(47);
    expect(z.model.mape).toBeCloseTo((24 * 10 + 23 * 20) / 47, 3);
    expect(z.model.peakErrorPct).toBe(-5);
    // Hour ending: HE02 exists on the 7th and 10th only, HE03 on all three scored days.
    expect(z.byHour.find((h) => h.hourEnding === 'HE02')).toMatchObject({ days: 2, model: { hours: 1, mape: 10 } });
    expect(z.byHour.find((h) => h.hourEnding === 'HE03')).toMatchObject({ days: 3, model: { hours: 2 } });
    expect(z.byHour).toHaveLength(24);
    // One zone: the system total is the same.
    expect(body.system.days[0].model?.score?.mape).toBe(10);
    expect(body.system.zone).toBe('SYSTEM');
  });

  it('scores the published revision in force and says whether the adjustments helped', async () => {
    const z = (await report(`zone=${zone}&from=2026-03-07&to=2026-03-10`)).zones[0];
    const [d7, d8, d9, d10] = z.days;
    expect(d7.schedule).toMatchObject({ revision: 1, score: { hours: 24 } });
    expect(d7.schedule?.score?.mape).toBeCloseTo(2, 1);
    expect(d7.adjustmentEffect).toBeCloseTo(-8, 1);
    // Revision 2 is in force on the 8th, not the superseded revision 1.
    expect(d8.schedule).toMatchObject({ revision: 2, score: { hours: 23 } });
    expect(d8.schedule?.score?.mape).toBeCloseTo(10, 1);
    expect(d8.adjustmentEffect).toBeCloseTo(-10, 1);
    expect(d9.schedule).toBeNull();
    // The 10th: a schedule scored on its own, but nothing to compare it with.
    expect(d10.schedule?.score?.mape).toBeCloseTo(5, 1);
    expect(d10.adjustmentEffect).toBeNull();
    expect(z.comparison).toMatchObject({ days: 2, daysHelped: 2 });
    expect(z.comparison.difference).toBeLessThan(-8);
    expect(z.schedule.hours).toBe(71);
    expect(z.daysWithoutSchedule).toBe(1);
    expect(z.byHour.find((h) => h.hourEnding === 'HE02')?.schedule.hours).toBe(2);
  });

  it('answers clear 400s and keeps admins out', async () => {
    const bad = async (query: string) => ((await api().get(`/api/accuracy?${query}`).set(as(viewer)).expect(400)).body as { message: string }).message;
    expect(await bad(`zone=${zone}&from=2026-03-10&to=2026-03-07`)).toMatch(/from \(2026-03-10\) must not be after to \(2026-03-07\)/);
    expect(await bad(`zone=${zone}&from=2026-01-01&to=2026-06-30`)).toMatch(/at most 92 days/);
    expect(await bad(`zone=${zone}&from=2026-02-30&to=2026-03-07`)).toMatch(/from must be an operating day/);
    expect(await bad('zone=NOSUCHZONE&from=2026-03-07&to=2026-03-08')).toMatch(/No active zone with code NOSUCHZONE/);
    await api().get(`/api/accuracy?zone=${zone}&from=2026-03-07&to=2026-03-08`).set(as(admin)).expect(403);
    await api().get(`/api/accuracy?zone=${zone}&from=2026-03-07&to=2026-03-08`).expect(401);
  });
});
