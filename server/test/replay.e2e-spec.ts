import { spawnSync } from 'node:child_process';
import { resolve } from 'node:path';
import { EntityManager } from '@mikro-orm/mariadb';
import type { NestExpressApplication } from '@nestjs/platform-express';
import { DateTime } from 'luxon';
import request from 'supertest';
import type { AccuracyReportDto, LatestForecastsDto, ScheduleRevisionDto } from '@morrowline/shared';
import { AuditEntry } from '../src/audit/entities/audit-entry.entity';
import { ForecastRun } from '../src/forecasts/entities/forecast-run.entity';
import { ReadingsRepository } from '../src/readings/readings.repository';
import { openDemoReplay, runDemoReplay } from '../src/database/demo-replay.command';
import type { DemoReplayOutcome } from '../src/replay/demo-replay.service';
import type { DemoScheduleStory } from '../src/replay/demo-schedule-stories';
import { Zone } from '../src/zones/entities/zone.entity';
import { createZone } from './support/feeds';
import { startTestApp, tokenFor } from './support/test-app';

jest.setTimeout(600_000);

const HOUR = 3_600_000;
const TZ = 'America/Denver';
const DAYS = 28;
const INES = 'ines.marlow@tallowmere.example';
const TOMAS = 'tomas.reedy@tallowmere.example';
const HAL = 'hal.brennick@tallowmere.example';
const NORA = 'nora.vance@tallowmere.example';

/** Four weeks of hourly load up to the last complete hour: a daily swing, quieter weekends, AR(1) noise. */
function history(): { hourStart: number; mw: number }[] {
  const last = Math.floor(Date.now() / HOUR) * HOUR - HOUR;
  let seed = 4242;
  const uniform = () => ((seed = (seed * 1103515245 + 12345) % 2 ** 31) + 1) / (2 ** 31 + 1);
  let noise = 0;
  return Array.from({ length: DAYS * 24 }, (_, i) => {
    const t = last - (DAYS * 24 - 1 - i) * HOUR;
    const local = DateTime.fromMillis(t, { zone: TZ });
    noise = 0.7 * noise + 4 * (uniform() - 0.5);
    const weekend = local.weekday >= 6 ? -30 : 0;
    return { hourStart: t, mw: Math.round((220 + 70 * Math.sin((2 * Math.PI * (local.hour - 9)) / 24) + weekend + noise) * 1000) / 1000 };
  });
}

/** 09:05 local on the day before `day`: the desk's last forecast update before the 10:00 gate closure. */
const updateBefore = (day: string) => DateTime.fromISO(day, { zone: TZ }).minus({ days: 1 }).set({ hour: 9, minute: 5 }).toMillis();
const localDay = (daysAgo: number) => DateTime.now().setZone(TZ).startOf('day').minus({ days: daysAgo }).toISODate()!;

describe('first-start replay of the desk’s daily work (real MariaDB)', () => {
  let app: NestExpressApplication;
  let zone: string;
  let viewer: string;
  let outcome: DemoReplayOutcome;
  const lines: string[] = [];
  const readings = history();
  /** the bad-data window: five hours, ten days back */
  const badFrom = Math.floor(Date.now() / HOUR) * HOUR - 10 * 24 * HOUR;
  const badTo = badFrom + 5 * HOUR;
  const api = () => request(app.getHttpServer());
  const as = (token: string) => ({ Authorization: `Bearer ${token}` });
  const replayedRuns = async () => app.get(EntityManager).fork().find(ForecastRun, { zone: { code: zone }, origin: 'replayed' }, { orderBy: { issuedAt: 'asc' } });

  const stories = (): DemoScheduleStory[] => [
    {
      zone,
      daysAgo: 2,
      operator: INES,
      approver: HAL,
      draftMinute: 5,
      adjustments: [{ minute: 10, from: 'HE17', to: 'HE20', change: { kind: 'add', mw: 12 }, reason: () => 'Town fair on the green in the evening' }],
      submit: { minute: 20, comment: 'Fair load added' },
      approveMinute: 30,
    },
    {
      zone,
      daysAgo: 1,
      operator: TOMAS,
      approver: NORA,
      draftMinute: 8,
      adjustments: [{ minute: 12, from: 'HE08', to: 'HE12', change: { kind: 'add', toward: 0.8 }, reason: (up) => (up ? 'Colder morning than forecast' : 'Milder morning than forecast') }],
      submit: { minute: 25, comment: 'Morning weather correction' },
      approveMinute: 40,
    },
  ];

  beforeAll(async () => {
    app = await startTestApp();
    const admin = await tokenFor(app, 'admin');
    viewer = await tokenFor(app, 'viewer');
    zone = await createZone(app, admin);
    const z = await app.get(EntityManager).fork().findOneOrFail(Zone, { code: zone });
    await app.get(ReadingsRepository).store(readings.map((r) => ({ zoneId: z.id, zone, hourStart: r.hourStart, mw: r.mw, quality: 'good' as const })), 'test:replay');
    // a bad-data window ten days back, which every replayed fit leaves out
    const operator = await tokenFor(app, 'operator');
    const start = new Date(badFrom).toISOString();
    await api().post('/api/outages').set(as(operator)).send({ zone, kind: 'bad-data', start, end: new Date(badTo).toISOString(), note: 'Meter stuck (replay test)' }).expect(201);
    outcome = await runDemoReplay({ zones: [zone], stories: stories(), waitSeconds: 0, log: (line) => lines.push(line) });
  });
  afterAll(async () => {
    await app?.close();
  });

  it('stores a run per day the zone had three weeks of readings for, marked replayed and issued at the last update before the gate closure', async () => {
    expect(outcome.state).toBe('done');
    const runs = await replayedRuns();
    // the days whose 09:05 update (day before) had 504 readings that had ended by then, up to now
    const now = Date.now();
    const lastEnd = readings[readings.length - 1].hourStart + HOUR;
    const expected: string[] = [];
    for (let d = DateTime.fromMillis(readings[0].hourStart, { zone: TZ }).startOf('day'); ; d = d.plus({ days: 1 })) {
      const issue = updateBefore(d.toISODate()!);
      if (issue > Math.min(now, lastEnd)) break;
      if (readings.filter((r) => r.hourStart + HOUR <= issue).length >= 21 * 24) expected.push(d.toISODate()!);
    }
    expect(expected.length).toBeGreaterThanOrEqual(6);
    expect(runs.map((r) => DateTime.fromJSDate(r.issuedAt, { zone: TZ }).plus({ days: 1 }).toISODate())).toEqual(expected);
    for (const run of runs) {
      const local = DateTime.fromJSDate(run.issuedAt, { zone: TZ });
      expect(local.toFormat('HH:mm:ss.SSS')).toBe('09:05:00.000');
      // from the reading of the hour that ended at 09:00, never a later one
      expect(run.basedOnHour?.getTime()).toBe(local.set({ hour: 8, minute: 0 }).toMillis());
      expect(run.firstHour.getTime()).toBe(run.basedOnHour!.getTime() + HOUR);
      // through the end of the operating day
      expect(run.firstHour.getTime() + run.mean.length * HOUR).toBe(local.plus({ days: 2 }).startOf('day').toMillis());
      // the model needs 504 usable hours: on the first day, when the update comes less than five
      // hours after the 504th reading, the bad-data window leaves fewer and the run says so
      const issue = run.issuedAt.getTime();
      const usable = readings.filter((r) => r.hourStart + HOUR <= issue && !(r.hourStart >= badFrom && r.hourStart < badTo)).length;
      if (usable >= 21 * 24) expect([run.method, run.fallbackReason]).toEqual(['arima', null]);
      else expect([run.method, run.fallbackReason]).toEqual(['seasonal-naive', `only ${usable} hours of usable history; the model needs at least ${21 * 24}`]);
      expect(run.modelVersionId).toBeNull();
    }
    // only the first day can fall short, by the window's five hours
    expect(runs.filter((r) => r.method === 'arima').length).toBeGreaterThanOrEqual(runs.length - 1);
    const summary = outcome.state === 'done' ? outcome.forecasts[0] : null;
    expect(summary).toMatchObject({ zone, stored: expected.length, failed: 0, kept: 0, first: expected[0], last: expected.at(-1) });
    expect(lines.some((l) => l.includes(`${zone}: ${expected.length} days replayed`))).toBe(true);
    const audit = await app.get(EntityManager).fork().find(AuditEntry, { action: 'forecast.replay', subjectId: zone });
    expect(audit).toHaveLength(1);
  });

  it('scores the model forecast of every replayed day at once, and says it is a replay', async () => {
    const runs = await replayedRuns();
    const from = DateTime.fromJSDate(runs[0].issuedAt, { zone: TZ }).plus({ days: 1 }).toISODate()!;
    const to = localDay(1);
    const report = (await api().get(`/api/accuracy?zone=${zone}&from=${from}&to=${to}`).set(as(viewer)).expect(200)).body as AccuracyReportDto;
    const z = report.zones[0];
    expect(z.days.length).toBeGreaterThanOrEqual(5);
    for (const day of z.days) {
      expect(day.model?.replayed).toBe(true);
      expect(day.model?.at).toBe(new Date(updateBefore(day.operatingDay)).toISOString());
      expect(day.model?.score?.hours).toBe(day.hours);
      expect(day.model?.score?.mape).toBeLessThan(20);
    }
    expect(z.daysScored).toBe(z.days.length);
    expect(z.daysReplayed).toBe(z.days.length);
    // the two demo schedules are scored beside the model
    const withSchedule = z.days.filter((d) => d.schedule);
    expect(withSchedule.map((d) => d.operatingDay)).toEqual([localDay(2), localDay(1)]);
    for (const d of withSchedule) {
      expect(d.schedule?.replayed).toBe(false);
      expect(d.schedule?.score?.hours).toBe(d.hours);
      expect(d.adjustmentEffect).not.toBeNull();
    }
    expect(z.comparison.days).toBe(2);
  });

  it('publishes the demo schedules through the workflow, as of their times before the gate closure, with adjustments and an audit trail', async () => {
    const runs = await replayedRuns();
    const checks = [
      { day: localDay(2), story: stories()[0], by: 'Ines Marlow', approver: 'Hal Brennick' },
      { day: localDay(1), story: stories()[1], by: 'Tomas Reedy', approver: 'Nora Vance' },
    ];
    for (const { day, story, by, approver } of checks) {
      const revisions = (await api().get(`/api/schedules/${day}/${zone}/revisions`).set(as(viewer)).expect(200)).body as ScheduleRevisionDto[];
      expect(revisions).toHaveLength(1);
      const [r] = revisions;
      const update = updateBefore(day);
      const at = (minute: number) => new Date(update + minute * 60_000).toISOString();
      expect(r).toMatchObject({ state: 'published', revision: 1, late: false, forecastReplayed: true, forecastIssuedAt: new Date(update).toISOString(), submitComment: story.submit.comment });
      expect(r.forecastRunId).toBe(runs.find((run) => run.issuedAt.getTime() === update)?.id);
      expect([r.createdAt, r.submittedAt, r.publishedAt]).toEqual([at(story.draftMinute), at(story.submit.minute), at(story.approveMinute)]);
      expect(r.createdBy.name).toBe(by);
      expect(r.publishedBy?.name).toBe(approver);
      expect(r.adjustments).toHaveLength(1);
      expect(r.adjustments[0]).toMatchObject({ by: { name: by }, at: at(story.adjustments[0].minute), undoneAt: null });
      // the adjusted hours differ from the model exactly there
      const from = r.hours.findIndex((h) => h.hourEnding === story.adjustments[0].from);
      const to = r.hours.findIndex((h) => h.hourEnding === story.adjustments[0].to);
      r.hours.forEach((h, i) => {
        expect(h.modelMw).not.toBeNull();
        if (i < from || i > to) expect(h.adjustedMw).toBe(h.modelMw);
        else expect(h.adjustedMw).not.toBe(h.modelMw);
      });
      const audit = await app.get(EntityManager).fork().find(AuditEntry, { subjectType: 'schedule', subjectId: String(r.id), action: { $like: 'schedule.%' } }, { orderBy: { id: 'asc' } });
      const trail = audit.filter((e) => e.action !== 'schedule.mail-failed');
      expect(trail.map((e) => [e.action, e.actorEmail, e.at.toISOString()])).toEqual([
        ['schedule.draft', story.operator, at(story.draftMinute)],
        ['schedule.adjust', story.operator, at(story.adjustments[0].minute)],
        ['schedule.submit', story.operator, at(story.submit.minute)],
        ['schedule.approve', story.approver, at(story.approveMinute)],
        ['schedule.publish', story.approver, at(story.approveMinute)],
      ]);
      expect(trail[1].reason).toBe(r.adjustments[0].reason);
    }
    // the fixed +12 MW evening adjustment of the first story
    const first = ((await api().get(`/api/schedules/${checks[0].day}/${zone}/revisions`).set(as(viewer)).expect(200)).body as ScheduleRevisionDto[])[0];
    const he17 = first.hours.find((h) => h.hourEnding === 'HE17')!;
    expect(he17.adjustedMw).toBeCloseTo(he17.modelMw! + 12, 6);
    expect(first.adjustments[0]).toMatchObject({ kind: 'add', value: 12, reason: 'Town fair on the green in the evening' });
  });

  it('never serves a replayed run as the live forecast', async () => {
    const latest = (await api().get(`/api/forecasts/latest?zone=${zone}`).set(as(viewer)).expect(200)).body as LatestForecastsDto;
    expect(latest.zones[0]).toMatchObject({ id: null, origin: 'issued', method: 'seasonal-naive' });
    // an issued run older than every replay still wins
    const em = app.get(EntityManager).fork();
    const z = await em.findOneOrFail(Zone, { code: zone });
    const firstHour = new Date(Math.floor(Date.now() / HOUR) * HOUR - 30 * 24 * HOUR);
    const mean = [111, 112, 113];
    const issued = em.create(ForecastRun, { zone: z, issuedAt: new Date(firstHour.getTime() - 60_000), basedOnHour: new Date(firstHour.getTime() - HOUR), method: 'arima', fallbackReason: null, modelVersionId: null, firstHour, mean, lower80: mean, upper80: mean, lower95: mean, upper95: mean });
    await em.flush();
    const after = (await api().get(`/api/forecasts/latest?zone=${zone}`).set(as(viewer)).expect(200)).body as LatestForecastsDto;
    expect(after.zones[0]).toMatchObject({ id: issued.id, origin: 'issued', mean });
  });

  it('is done once: a second call changes nothing and says so', async () => {
    const before = (await replayedRuns()).length;
    const again = await runDemoReplay({ zones: [zone], stories: stories(), waitSeconds: 0, log: () => undefined });
    expect(again.state).toBe('done-before');
    expect(await replayedRuns()).toHaveLength(before);
    const marks = await app.get(EntityManager).fork().find(AuditEntry, { action: 'system.demo-replay' });
    expect(marks).toHaveLength(1);
    // the command line: one line, exit status 0
    const cli = spawnSync('npx', ['tsx', 'src/database/manage.ts', 'demo-replay', '--wait-seconds', '0'], { cwd: resolve(__dirname, '..'), env: process.env, encoding: 'utf8' });
    expect(cli.status).toBe(0);
    expect(cli.stdout.trim()).toMatch(/^demo replay: already done \(\d{4}-\d\d-\d\dT[\d:.]+Z\); nothing to do$/);
    const bad = spawnSync('npx', ['tsx', 'src/database/manage.ts', 'demo-replay', '--wait-seconds', 'soon'], { cwd: resolve(__dirname, '..'), env: process.env, encoding: 'utf8' });
    expect(bad.status).toBe(1);
    expect(bad.stderr).toMatch(/--wait-seconds must be a whole number of seconds, got "soon"/);
  });

  it('goes on where an interrupted replay stopped, keeping the days it had stored and making the same runs for the others', async () => {
    const before = await replayedRuns();
    const cut = before.slice(-2);
    await app.get(EntityManager).fork().nativeDelete(ForecastRun, { id: { $in: cut.map((r) => r.id) } });
    const parts = await openDemoReplay();
    try {
      const z = await app.get(EntityManager).fork().findOneOrFail(Zone, { code: zone });
      const [summary] = await parts.forecasts.replay([z], Date.now(), () => undefined);
      expect(summary).toMatchObject({ stored: 2, kept: before.length - 2, failed: 0 });
      const [again] = await parts.forecasts.replay([z], Date.now(), () => undefined);
      expect(again).toMatchObject({ stored: 0, kept: before.length });
    } finally {
      await parts.close();
    }
    const after = await replayedRuns();
    expect(after.slice(0, -2).map((r) => r.id)).toEqual(before.slice(0, -2).map((r) => r.id));
    const redone = after.slice(-2).map((r) => [r.issuedAt.toISOString(), r.basedOnHour?.toISOString(), r.mean, r.upper95]);
    expect(redone).toEqual(cut.map((r) => [r.issuedAt.toISOString(), r.basedOnHour?.toISOString(), r.mean, r.upper95]));
  });
});
