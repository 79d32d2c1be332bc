import { EntityManager } from '@mikro-orm/mariadb';
import type { NestExpressApplication } from '@nestjs/platform-express';
import { io } from 'socket.io-client';
import request from 'supertest';
import { DESK_EVENTS, DESK_NAMESPACE, operatingDayBounds, type AuditEntryDto, type LatestForecastsDto, type ModelCompareDto, type ModelVersionDto, type OutageDto, type Page, type RefitJobDto } from '@morrowline/shared';
import { ComputeService } from '../src/compute/compute.service';
import { ForecastRun } from '../src/forecasts/entities/forecast-run.entity';
import { ModelVersion } from '../src/models/entities/model-version.entity';
import { RefitJob } from '../src/models/entities/refit-job.entity';
import { INTERRUPTED, RefitsService } from '../src/models/refits.service';
import { ReadingsRepository } from '../src/readings/readings.repository';
import { ReadingsService } from '../src/readings/readings.service';
import { Zone } from '../src/zones/entities/zone.entity';
import { createZone } from './support/feeds';
import { baseUrl, startTestApp, tokenFor } from './support/test-app';

jest.setTimeout(240_000);

const HOUR = 3_600_000;
const WEEK_HOURS = 168;
const HISTORY_HOURS = 8 * WEEK_HOURS;

/** The normal load of hour t (UTC ms): daily and weekly cycles of a small test zone. */
function normalLoad(t: number): number {
  const hourOfWeek = Math.floor(t / HOUR) % WEEK_HOURS;
  const hourOfDay = hourOfWeek % 24;
  const day = Math.floor(hourOfWeek / 24);
  return 300 + 80 * Math.sin((2 * Math.PI * (hourOfDay - 9)) / 24) + (day === 2 || day === 3 ? -60 : 0) + 15 * Math.cos((2 * Math.PI * day) / 7);
}

describe('outages, refits, model versions and forecasts (real MariaDB)', () => {
  let app: NestExpressApplication;
  let admin: string;
  let operator: string;
  let supervisor: string;
  let viewer: string;
  const api = () => request(app.getHttpServer());
  const as = (token: string) => ({ Authorization: `Bearer ${token}` });

  beforeAll(async () => {
    app = await startTestApp();
    [admin, operator, supervisor, viewer] = await Promise.all([tokenFor(app, 'admin'), tokenFor(app, 'operator'), tokenFor(app, 'supervisor'), tokenFor(app, 'viewer')]);
  });
  afterAll(async () => {
    await app?.close();
  });

  /** Eight weeks of hourly load up to the last complete hour, with `dip` hours far below normal. */
  async function seedHistory(code: string, dip: (t: number) => boolean): Promise<{ last: number; zoneId: number }> {
    const zone = await app.get(EntityManager).fork().findOneOrFail(Zone, { code });
    const last = Math.floor(Date.now() / HOUR) * HOUR - HOUR;
    let seed = 11;
    const noise = () => ((seed = (seed * 1103515245 + 12345) % 2 ** 31) / 2 ** 31 - 0.5) * 8;
    const rows = Array.from({ length: HISTORY_HOURS }, (_, i) => {
      const t = last - (HISTORY_HOURS - 1 - i) * HOUR;
      return { zoneId: zone.id, zone: code, hourStart: t, mw: Math.round((dip(t) ? 25 : normalLoad(t) + noise()) * 10) / 10, quality: 'good' as const };
    });
    await app.get(ReadingsRepository).store(rows, 'test:history');
    await app.get(ReadingsService).zones(true);
    return { last, zoneId: zone.id };
  }

  async function refit(code: string, token = operator, reason = 'test refit'): Promise<RefitJobDto> {
    const res = await api().post('/api/models/refits').set(as(token)).send({ zone: code, reason }).expect(202);
    await app.get(RefitsService).settled();
    const jobs = (await api().get(`/api/models/refits?zone=${code}`).set(as(operator)).expect(200)).body as RefitJobDto[];
    return jobs.find((j) => j.id === (res.body as RefitJobDto[])[0].id)!;
  }

  let zone: string;
  let firstVersion: number;

  it('marks, edits and closes an outage window, audited, and refuses viewers and bad input', async () => {
    zone = await createZone(app, admin, { maxPlausibleMw: 2000 });
    await api().post('/api/outages').set(as(viewer)).send({ zone, kind: 'outage', start: '2026-11-01T10:00:00Z', note: 'x' }).expect(403);
    const bad = await api().post('/api/outages').set(as(operator)).send({ zone, kind: 'storm', start: 'yesterday', note: '' }).expect(400);
    expect(bad.body.details).toEqual(expect.arrayContaining(['kind must be one of outage, bad-data', 'start must be an ISO 8601 time']));
    const empty = await api().post('/api/outages').set(as(operator)).send({ zone, kind: 'outage', start: '2026-11-01T10:00:00Z', end: '2026-11-01T09:00:00Z', note: 'backwards' }).expect(400);
    expect(empty.body.message).toMatch(/end must be after its start/);

    const made = (await api().post('/api/outages').set(as(operator)).send({ zone, kind: 'bad-data', start: '2026-11-01T10:20:00Z', note: 'Meter stuck at Harrow substation' }).expect(201)).body as OutageDto;
    expect(made).toMatchObject({ zone, kind: 'bad-data', start: '2026-11-01T10:00:00.000Z', end: null, closedAt: null });
    const edited = (await api().patch(`/api/outages/${made.id}`).set(as(supervisor)).send({ kind: 'outage', reason: 'It was a feeder trip' }).expect(200)).body as OutageDto;
    expect(edited.kind).toBe('outage');
    const closed = (await api().post(`/api/outages/${made.id}/close`).set(as(operator)).send({ end: '2026-11-01T13:30:00Z', reason: 'restored' }).expect(200)).body as OutageDto;
    expect(closed).toMatchObject({ end: '2026-11-01T14:00:00.000Z', closedBy: 'ines.marlow@tallowmere.example' });
    await api().post(`/api/outages/${made.id}/close`).set(as(operator)).send({}).expect(409);

    const listed = (await api().get(`/api/outages?zone=${zone}&from=2026-11-01T00:00:00Z&to=2026-11-02T00:00:00Z`).set(as(viewer)).expect(200)).body as OutageDto[];
    expect(listed.map((o) => o.id)).toEqual([made.id]);
    const audit = (await api().get(`/api/audit?subjectType=outage&subjectId=${made.id}`).set(as(supervisor)).expect(200)).body as Page<AuditEntryDto>;
    expect(audit.items.map((e) => e.action).sort()).toEqual(['outage.close', 'outage.create', 'outage.update']);
    expect(audit.items.find((e) => e.action === 'outage.update')?.reason).toBe('It was a feeder trip');
  });

  it('an outage dip marked as excluded does not come back in the next week’s forecast', async () => {
    const last = Math.floor(Date.now() / HOUR) * HOUR - HOUR;
    // the dip: 6 hours one week before forecast hours 6..11
    const dipStart = last + 6 * HOUR - WEEK_HOURS * HOUR;
    const dipEnd = dipStart + 6 * HOUR;
    await seedHistory(zone, (t) => t >= dipStart && t < dipEnd);
    await api().post('/api/outages').set(as(operator)).send({ zone, kind: 'outage', start: new Date(dipStart).toISOString(), end: new Date(dipEnd).toISOString(), note: 'Substation transformer fault' }).expect(201);

    const desk = io(`${baseUrl(app)}${DESK_NAMESPACE}`, { auth: { token: operator }, transports: ['websocket'], reconnection: false });
    await new Promise((resolve) => desk.once(DESK_EVENTS.hello, resolve));
    const progress: RefitJobDto[] = [];
    desk.on(DESK_EVENTS.refitProgress, (j: RefitJobDto) => j.zone === zone && progress.push(j));
    const pushedForecast = new Promise((resolve) => desk.on(DESK_EVENTS.forecast, (f: { zone: string }) => f.zone === zone && resolve(f)));

    const job = await refit(zone, operator, 'outage marked');
    await pushedForecast;
    desk.close();
    expect(job).toMatchObject({ state: 'done', progress: 100, promoted: true, trigger: 'operator', mode: 'full' });
    expect(progress.map((p) => p.state)).toEqual(expect.arrayContaining(['queued', 'running', 'done']));
    expect(progress.some((p) => p.state === 'running' && p.progress > 0 && p.progress < 100)).toBe(true);

    const versions = (await api().get(`/api/models?zone=${zone}`).set(as(operator)).expect(200)).body as ModelVersionDto[];
    expect(versions).toHaveLength(1);
    // the six dip hours and the four of the window marked in the first test
    expect(versions[0]).toMatchObject({ status: 'in-service', excludedHours: 6 + 4, trainingHours: HISTORY_HOURS, createdBy: 'ines.marlow@tallowmere.example' });
    expect(versions[0].backtestMape).toBeGreaterThan(0);
    expect(versions[0].baselineMape).toBeGreaterThan(0);
    // the backtest's band coverage is stored with the version, in per cent
    expect(versions[0].backtestCoverage80).toBeGreaterThan(0);
    expect(versions[0].backtestCoverage95).toBeGreaterThanOrEqual(versions[0].backtestCoverage80!);
    expect(versions[0].backtestCoverage95).toBeLessThanOrEqual(100);
    expect(versions[0].ljungBox.map((l) => l.lag)).toEqual([24, 48]);
    firstVersion = versions[0].id;

    const latest = (await api().get(`/api/forecasts/latest?zone=${zone}`).set(as(viewer)).expect(200)).body as LatestForecastsDto;
    const run = latest.zones[0];
    expect(run).toMatchObject({ zone, method: 'arima', modelVersionId: firstVersion, basedOnHour: new Date(last).toISOString() });
    expect(run.hours[0]).toBe(new Date(last + HOUR).toISOString());
    for (const arr of [run.mean, run.lower80, run.upper80, run.lower95, run.upper95]) expect(arr.every((v) => Number.isFinite(v) && v >= 0)).toBe(true);
    // same weekday and hours, one week after the dip: the normal load, not 25 MW
    for (let k = 6; k < 12; k++) {
      const t = last + (k + 1) * HOUR;
      expect(run.hours[k]).toBe(new Date(t).toISOString());
      expect(Math.abs(run.mean[k] - normalLoad(t)) / normalLoad(t)).toBeLessThan(0.1);
    }
    // cut to a range
    const cut = (await api().get(`/api/forecasts/latest?zone=${zone}&from=${run.hours[2]}&to=${run.hours[5]}`).set(as(viewer)).expect(200)).body as LatestForecastsDto;
    expect(cut.zones[0].hours).toEqual(run.hours.slice(2, 5));
  });

  it('two refit requests for one zone make one job', async () => {
    const [a, b] = await Promise.all([
      api().post('/api/models/refits').set(as(operator)).send({ zone, reason: 'first' }).expect(202),
      api().post('/api/models/refits').set(as(supervisor)).send({ zone, reason: 'second' }).expect(202),
    ]);
    const again = await api().post('/api/models/refits').set(as(operator)).send({ zone, reason: 'third' }).expect(202);
    const ids = [a, b, again].map((r) => (r.body as RefitJobDto[])[0].id);
    expect(new Set(ids).size).toBe(1);
    await app.get(RefitsService).settled();
    const jobs = (await api().get(`/api/models/refits?zone=${zone}`).set(as(operator)).expect(200)).body as RefitJobDto[];
    expect(jobs.filter((j) => j.id >= ids[0])).toHaveLength(1);
    expect(jobs[0]).toMatchObject({ id: ids[0], state: 'done', promoted: false });
    const versions = (await api().get(`/api/models?zone=${zone}`).set(as(operator)).expect(200)).body as ModelVersionDto[];
    expect(versions.map((v) => v.status)).toEqual(['candidate', 'in-service']);
  });

  it('a worker failing mid-fit leaves the model in service unchanged and the job failed', async () => {
    const compute = app.get(ComputeService);
    const real = compute.run.bind(compute);
    // the real pool runs a task that throws in the worker thread
    const spy = jest.spyOn(compute, 'run').mockImplementationOnce(() => real('no.such.task' as 'compute.echo', { value: 0 }) as never);
    const before = (await api().get(`/api/models?zone=${zone}`).set(as(operator)).expect(200)).body as ModelVersionDto[];
    const runsBefore = (await api().get(`/api/forecasts/latest?zone=${zone}`).set(as(viewer)).expect(200)).body as LatestForecastsDto;
    const job = await refit(zone);
    spy.mockRestore();
    expect(job).toMatchObject({ state: 'failed', modelVersionId: null, forecastRunId: null });
    expect(job.message).toMatch(/No compute task named no.such.task/);
    const after = (await api().get(`/api/models?zone=${zone}`).set(as(operator)).expect(200)).body as ModelVersionDto[];
    expect(after).toEqual(before);
    const runsAfter = (await api().get(`/api/forecasts/latest?zone=${zone}`).set(as(viewer)).expect(200)).body as LatestForecastsDto;
    expect(runsAfter.zones[0].id).toBe(runsBefore.zones[0].id);
    const audit = (await api().get(`/api/audit?subjectType=refit&subjectId=${job.id}`).set(as(supervisor)).expect(200)).body as Page<AuditEntryDto>;
    expect(audit.items.map((e) => e.action).sort()).toEqual(['refit.fail', 'refit.start']);
    // the zone is free for the next job
    const next = (await api().post('/api/models/refits').set(as(operator)).send({ zone, reason: 'after the failure' }).expect(202)).body as RefitJobDto[];
    expect(next[0].id).not.toBe(job.id);
    await app.get(RefitsService).settled();
  });

  it('compares a candidate with the model in service; promotion and rollback are for operators, audited', async () => {
    const versions = (await api().get(`/api/models?zone=${zone}`).set(as(operator)).expect(200)).body as ModelVersionDto[];
    const candidate = versions.find((v) => v.status === 'candidate')!;
    const cmp = (await api().get(`/api/models/${candidate.id}/compare`).set(as(operator)).expect(200)).body as ModelCompareDto;
    expect(cmp.candidate.id).toBe(candidate.id);
    expect(cmp.inService?.id).toBe(firstVersion);
    expect(cmp.sameDays.days).toBeGreaterThan(0);
    expect(cmp.sameDays.candidateMape).toBeGreaterThan(0);
    expect(cmp.sameDays.inServiceMape).toBeGreaterThan(0);
    // both scored on the same seven whole days, each forecast at the 10:00 gate closure the day before
    expect(cmp.sameDays).toMatchObject({ days: 7, comparable: true, notComparable: null });
    expect(cmp.sameDays.candidate?.perDay.map((d) => d.issuedAt)).toEqual(cmp.sameDays.inService?.perDay.map((d) => d.issuedAt));
    expect(cmp.candidateBetter).toBe((cmp.sameDays.candidateMape as number) < (cmp.sameDays.inServiceMape as number));
    expect(cmp.candidate.warnings.some((w) => w.startsWith('residuals still correlated'))).toBe(false);

    // A version with the in-service orders and other coefficients scores differently on the same days
    // (each with its own coefficients, never both re-estimated alike), and a forecast the version in
    // service issued for a day is the one scored for that day.
    const em = app.get(EntityManager).fork();
    const served = await em.findOneOrFail(ModelVersion, { id: firstVersion }, { populate: ['zone'] });
    const { id: _id, ...fields } = served;
    void _id;
    const twin = em.create(ModelVersion, { ...fields, status: 'candidate', parameters: { ...served.parameters, ar: served.parameters.ar.map((a) => a * 0.3), ma: served.parameters.ma.map((m) => m * 0.3) } });
    const lastDay = cmp.sameDays.inService!.perDay[6];
    const { from: dayFrom } = operatingDayBounds(lastDay.day, served.zone.timeZone);
    const actual = await app.get(ReadingsRepository).range([served.zone.id], dayFrom, dayFrom + 24 * HOUR);
    expect(actual).toHaveLength(24);
    em.create(ForecastRun, {
      zone: served.zone, issuedAt: new Date(Date.parse(lastDay.issuedAt) - 30 * 60_000), origin: 'issued', basedOnHour: null, method: 'arima', fallbackReason: null, modelVersionId: firstVersion,
      firstHour: new Date(dayFrom), mean: actual.map((r) => r.mw * 1.1), lower80: actual.map((r) => r.mw * 0.9), upper80: actual.map((r) => r.mw * 1.2), lower95: actual.map((r) => r.mw * 0.8), upper95: actual.map((r) => r.mw * 1.3),
    });
    await em.flush();
    const twinCmp = (await api().get(`/api/models/${twin.id}/compare`).set(as(operator)).expect(200)).body as ModelCompareDto;
    expect(twinCmp.candidate.differencingLabel).toBe(twinCmp.inService?.differencingLabel);
    expect(twinCmp.sameDays.comparable).toBe(true);
    expect(Math.abs((twinCmp.sameDays.candidateMape as number) - (twinCmp.sameDays.inServiceMape as number))).toBeGreaterThan(0.001);
    expect(twinCmp.sameDays.inService?.issuedDays).toBe(1);
    expect(twinCmp.sameDays.inService?.perDay[6]).toMatchObject({ source: 'issued', hours: 24 });
    expect(twinCmp.sameDays.inService?.perDay[6].mape).toBeCloseTo(10, 6);
    expect(twinCmp.sameDays.candidate?.perDay[6].source).toBe('re-forecast');
    em.remove(twin);
    await em.flush();

    await api().post(`/api/models/${candidate.id}/promote`).set(as(viewer)).send({ reason: 'x' }).expect(403);
    const noReason = await api().post(`/api/models/${candidate.id}/promote`).set(as(operator)).send({}).expect(400);
    expect(noReason.body.details).toContain('a reason is needed to change the model in service');
    const promoted = (await api().post(`/api/models/${candidate.id}/promote`).set(as(operator)).send({ reason: 'cleaner residuals' }).expect(200)).body as ModelVersionDto;
    expect(promoted.status).toBe('in-service');
    await api().post(`/api/models/${candidate.id}/promote`).set(as(operator)).send({ reason: 'again' }).expect(409);
    let now = (await api().get(`/api/models?zone=${zone}`).set(as(operator)).expect(200)).body as ModelVersionDto[];
    expect(now.filter((v) => v.status === 'in-service').map((v) => v.id)).toEqual([candidate.id]);
    expect(now.find((v) => v.id === firstVersion)?.status).toBe('retired');
    const latest = (await api().get(`/api/forecasts/latest?zone=${zone}`).set(as(viewer)).expect(200)).body as LatestForecastsDto;
    expect(latest.zones[0].modelVersionId).toBe(candidate.id);

    await api().post(`/api/models/${firstVersion}/promote`).set(as(supervisor)).send({ reason: 'back to the version that served last week' }).expect(200);
    now = (await api().get(`/api/models?zone=${zone}`).set(as(operator)).expect(200)).body as ModelVersionDto[];
    expect(now.filter((v) => v.status === 'in-service').map((v) => v.id)).toEqual([firstVersion]);
    const audit = (await api().get('/api/audit?subjectType=model&limit=50').set(as(supervisor)).expect(200)).body as Page<AuditEntryDto>;
    const mine = audit.items.filter((e) => e.subjectId === String(candidate.id) || e.subjectId === String(firstVersion));
    expect(mine.find((e) => e.action === 'model.promote')).toMatchObject({ actorEmail: 'ines.marlow@tallowmere.example', reason: 'cleaner residuals' });
    expect(mine.find((e) => e.action === 'model.rollback')).toMatchObject({ subjectId: String(firstVersion), reason: 'back to the version that served last week' });
  });

  it('gives a zone without a run the seasonal-naive stand-in, and validates queries', async () => {
    const other = await createZone(app, admin);
    await app.get(ReadingsService).zones(true);
    const latest = (await api().get(`/api/forecasts/latest?zone=${other}`).set(as(viewer)).expect(200)).body as LatestForecastsDto;
    expect(latest.zones[0]).toMatchObject({ zone: other, id: null, method: 'seasonal-naive', modelVersionId: null, hours: [] });
    await api().get('/api/forecasts/latest?zone=nope').set(as(viewer)).expect(400);
    await api().get('/api/models/refits?state=paused').set(as(operator)).expect(400);
    await api().post('/api/models/refits').set(as(viewer)).send({ zone, reason: 'x' }).expect(403);
    // model internals are the forecasting roles' (README's role table)
    await api().get(`/api/models?zone=${zone}`).set(as(viewer)).expect(403);
    await api().get(`/api/models/refits?zone=${zone}`).set(as(viewer)).expect(403);
    await api().post('/api/models/refits').set(as(operator)).send({ zone }).expect(400);
    await api().post('/api/models/refits').set(as(operator)).send({ zone: 'NOSUCHZONE', reason: 'x' }).expect(404);
  });

  it('on start, marks jobs left queued or running failed, applying nothing', async () => {
    const em = app.get(EntityManager).fork();
    const z = await em.findOneOrFail(Zone, { code: zone });
    const stale = em.create(RefitJob, { zone: z, activeZoneId: z.id, trigger: 'schedule', mode: 'full', reason: 'nightly refit', state: 'running', progress: 20, stage: 'choosing the differencing and ARMA orders', createdAt: new Date(), startedAt: new Date(), promoted: false });
    await em.flush();
    const versionsBefore = (await api().get(`/api/models?zone=${zone}`).set(as(operator)).expect(200)).body as ModelVersionDto[];
    await app.close();
    app = await startTestApp();
    viewer = await tokenFor(app, 'viewer');
    const jobs = (await api().get(`/api/models/refits?zone=${zone}`).set(as(operator)).expect(200)).body as RefitJobDto[];
    expect(jobs.find((j) => j.id === stale.id)).toMatchObject({ state: 'failed', message: INTERRUPTED });
    expect((await api().get(`/api/models?zone=${zone}`).set(as(operator)).expect(200)).body).toEqual(versionsBefore);
  });
  it('gives a zone with enough history and no model its first model at the scheduled update, and leaves a zone with too little alone', async () => {
    const ready = await createZone(app, admin, { maxPlausibleMw: 2000 });
    await seedHistory(ready, () => false);
    const young = await createZone(app, admin, { maxPlausibleMw: 2000 });
    const zoneRow = await app.get(EntityManager).fork().findOneOrFail(Zone, { code: young });
    const last = Math.floor(Date.now() / HOUR) * HOUR - HOUR;
    const week = Array.from({ length: WEEK_HOURS }, (_, i) => {
      const t = last - (WEEK_HOURS - 1 - i) * HOUR;
      return { zoneId: zoneRow.id, zone: young, hourStart: t, mw: normalLoad(t), quality: 'good' as const };
    });
    await app.get(ReadingsRepository).store(week, 'test:history');

    // The scheduled tick is private; the test calls it as the cron would.
    await (app.get(RefitsService) as unknown as { scheduled(mode: 'update'): Promise<void> }).scheduled('update');
    await app.get(RefitsService).settled();

    const readyJobs = (await api().get(`/api/models/refits?zone=${ready}`).set(as(operator)).expect(200)).body as RefitJobDto[];
    expect(readyJobs).toHaveLength(1);
    expect(readyJobs[0]).toMatchObject({ trigger: 'first-model', state: 'done' });
    const versions = (await api().get(`/api/models?zone=${ready}`).set(as(operator)).expect(200)).body as ModelVersionDto[];
    expect(versions.filter((v) => v.status === 'in-service')).toHaveLength(1);
    expect(versions[0].trigger).toBe('first-model');
    expect((await api().get(`/api/models/refits?zone=${young}`).set(as(operator)).expect(200)).body).toEqual([]);

    // Two hourly updates with no reading in between: the second re-estimates the same data to the
    // same numbers and stores nothing new. (The private enqueue is what the hourly tick calls per zone.)
    const refits = app.get(RefitsService) as unknown as { enqueue(zone: Zone, actor: null, reason: string, trigger: 'update', mode: 'update'): Promise<unknown>; settled(): Promise<void> };
    const readyZone = await app.get(EntityManager).fork().findOneOrFail(Zone, { code: ready });
    await refits.enqueue(readyZone, null, 'hourly forecast update', 'update', 'update');
    await refits.settled();
    const afterFirst = (await api().get(`/api/models?zone=${ready}`).set(as(operator)).expect(200)).body as ModelVersionDto[];
    await refits.enqueue(readyZone, null, 'hourly forecast update', 'update', 'update');
    await refits.settled();
    const afterSecond = (await api().get(`/api/models?zone=${ready}`).set(as(operator)).expect(200)).body as ModelVersionDto[];
    expect(afterSecond.map((v) => v.id)).toEqual(afterFirst.map((v) => v.id));
    const unchanged = ((await api().get(`/api/models/refits?zone=${ready}`).set(as(operator)).expect(200)).body as RefitJobDto[]).find((j) => j.trigger === 'update' && j.state === 'done' && j.modelVersionId === null);
    expect(unchanged?.message).toMatch(/^nothing changed since version \d+/);
  });
});
