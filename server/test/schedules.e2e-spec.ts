import { spawn, type ChildProcess } from 'node:child_process';
import { mkdtempSync, readdirSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { EntityManager } from '@mikro-orm/mariadb';
import type { NestExpressApplication } from '@nestjs/platform-express';
import request from 'supertest';
import { DEMO_USERS, SCHEDULE_CAUTION, type DayScheduleDto, type ForecastDiffDto, type ForecastRunSummaryDto, type ScheduleRevisionDto } from '@morrowline/shared';
import { AuditEntry } from '../src/audit/entities/audit-entry.entity';
import { ForecastRun } from '../src/forecasts/entities/forecast-run.entity';
import { Zone } from '../src/zones/entities/zone.entity';
import { startTestApp, tokenFor } from './support/test-app';

jest.setTimeout(120_000);

const ZONE = 'SKEDTEST';
const DAY = '2030-06-12'; // gate open (closes 2030-06-11 10:00 Denver)
const PAST_DAY = '2020-06-12'; // gate long closed
const HOUR_MS = 3_600_000;

async function signIn(app: NestExpressApplication, email: string): Promise<string> {
  const user = DEMO_USERS.find((u) => u.email === email)!;
  const response = await request(app.getHttpServer()).post('/api/auth/login').send({ email, password: user.password }).expect(200);
  return response.body.accessToken as string;
}

/** The SMTP fake: the one scripts/test.sh started (MAIL_FAKE_DIR), or one of our own on a free port. */
async function smtpFake(): Promise<{ dir: string; child: ChildProcess | null }> {
  if (process.env.MAIL_FAKE_DIR && process.env.SMTP_PORT) return { dir: process.env.MAIL_FAKE_DIR, child: null };
  const dir = mkdtempSync(join(tmpdir(), 'morrowline-mail-'));
  const child = spawn(process.execPath, [resolve(__dirname, '../../scripts/smtp-fake.mjs'), '--port', '0', '--dir', dir], { stdio: ['ignore', 'pipe', 'inherit'] });
  const port = await new Promise<number>((ok, fail) => {
    child.stdout!.on('data', (chunk: Buffer) => {
      const m = /listening on (\d+)/.exec(chunk.toString());
      if (m) ok(Number(m[1]));
    });
    child.on('exit', () => fail(new Error('the SMTP fake did not start')));
  });
  process.env.SMTP_PORT = String(port);
  return { dir, child };
}

interface StoredMail { receivedAt: string; envelope: { to: string[] }; subject: string; text: string }
async function mailsAbout(dir: string, subject: string): Promise<StoredMail[]> {
  for (let i = 0; i < 50; i++) {
    const mails = readdirSync(dir).filter((f) => f.endsWith('.json')).map((f) => JSON.parse(readFileSync(join(dir, f), 'utf8')) as StoredMail).filter((m) => m.subject.includes(subject));
    if (mails.length) return mails;
    await new Promise((r) => setTimeout(r, 100));
  }
  return [];
}

describe('day-ahead schedules (real MariaDB, SMTP fake)', () => {
  let app: NestExpressApplication;
  let fake: { dir: string; child: ChildProcess | null };
  let viewer: string, ines: string, hal: string, nora: string, admin: string;
  const started = new Date().toISOString();
  const api = () => request(app.getHttpServer());
  const as = (token: string) => ({ Authorization: `Bearer ${token}` });

  beforeAll(async () => {
    fake = await smtpFake();
    app = await startTestApp();
    const em = app.get(EntityManager).fork();
    let zone = await em.findOne(Zone, { code: ZONE });
    if (!zone) {
      zone = em.create(Zone, { code: ZONE, name: 'Schedule Test Zone', timeZone: 'America/Denver', alertThresholdPct: 5, alertConsecutiveHours: 2, gateClosure: '10:00', minPlausibleMw: 0, maxPlausibleMw: 1000, active: true, createdAt: new Date(), updatedAt: new Date() });
      await em.flush();
    }
    // A stored forecast run covering the operating day DAY: 100, 101, … 123 MW.
    const first = Date.parse('2030-06-12T06:00:00Z');
    const mean = Array.from({ length: 24 }, (_, i) => 100 + i);
    em.create(ForecastRun, { zone, issuedAt: new Date(), basedOnHour: new Date(first - HOUR_MS), method: 'arima', fallbackReason: null, modelVersionId: null, firstHour: new Date(first), mean, lower80: mean.map((m) => m - 5), upper80: mean.map((m) => m + 5), lower95: mean.map((m) => m - 9), upper95: mean.map((m) => m + 9) });
    await em.flush();
    viewer = await tokenFor(app, 'viewer');
    admin = await tokenFor(app, 'admin');
    ines = await signIn(app, 'ines.marlow@tallowmere.example');
    hal = await signIn(app, 'hal.brennick@tallowmere.example');
    nora = await signIn(app, 'nora.vance@tallowmere.example');
  });
  afterAll(async () => {
    await app.close();
    fake.child?.kill();
  });

  it('shows the day with its hours, gate closure and the model forecast before any draft; admin takes no part', async () => {
    const day = (await api().get(`/api/schedules/${DAY}?zone=${ZONE}`).set(as(viewer)).expect(200)).body as DayScheduleDto;
    expect(day.caution).toBe(SCHEDULE_CAUTION);
    const z = day.zones[0];
    expect(z.slots).toHaveLength(24);
    expect(z.gateClosureAt).toBe('2030-06-11T16:00:00.000Z');
    expect(z.gateClosed).toBe(false);
    expect(z.secondsToGateClosure).toBeGreaterThan(0);
    expect(z.forecast?.hours[0].modelMw).toBe(100);
    expect(z.working).toBeNull();
    await api().get(`/api/schedules/${DAY}?zone=${ZONE}`).set(as(admin)).expect(403);
    await api().post(`/api/schedules/${DAY}/${ZONE}/draft`).set(as(viewer)).expect(403);
    await api().get(`/api/schedules/2030-02-30?zone=${ZONE}`).set(as(viewer)).expect(400);
  });

  it('labels the 25-hour autumn day HE01..HE25 and the 23-hour spring day without HE02', async () => {
    const autumn = (await api().get(`/api/schedules/2030-11-03?zone=${ZONE}`).set(as(viewer)).expect(200)).body as DayScheduleDto;
    expect(autumn.zones[0].slots.map((s) => s.hourEnding).at(-1)).toBe('HE25');
    const spring = (await api().get(`/api/schedules/2030-03-10?zone=${ZONE}`).set(as(viewer)).expect(200)).body as DayScheduleDto;
    expect(spring.zones[0].slots).toHaveLength(23);
    expect(spring.zones[0].slots.map((s) => s.hourEnding)).not.toContain('HE02');
  });

  let rev1: ScheduleRevisionDto;

  it('drafts from the forecast, adjusts with reasons, refuses negative MW, and undoes', async () => {
    rev1 = (await api().post(`/api/schedules/${DAY}/${ZONE}/draft`).set(as(ines)).expect(201)).body;
    expect(rev1).toMatchObject({ revision: 1, state: 'draft', zone: ZONE, operatingDay: DAY });
    expect(rev1.hours.map((h) => h.adjustedMw).slice(0, 3)).toEqual([100, 101, 102]);
    // The same request again answers the same draft.
    const again = (await api().post(`/api/schedules/${DAY}/${ZONE}/draft`).set(as(ines)).expect(201)).body as ScheduleRevisionDto;
    expect(again.id).toBe(rev1.id);

    const base = { zones: [ZONE], fromHour: 0, toHour: 2 };
    await api().post(`/api/schedules/${DAY}/adjustments`).set(as(ines)).send({ ...base, kind: 'add', value: 10 }).expect(400); // no reason
    await api().post(`/api/schedules/${DAY}/adjustments`).set(as(viewer)).send({ ...base, kind: 'add', value: 10, reason: 'festival' }).expect(403);
    const add = (await api().post(`/api/schedules/${DAY}/adjustments`).set(as(ines)).send({ ...base, kind: 'add', value: 10, reason: 'Harvest festival' }).expect(201)).body;
    expect(add.revisions[0].hours.map((h: { adjustedMw: number }) => h.adjustedMw).slice(0, 4)).toEqual([110, 111, 112, 103]);
    const scale = (await api().post(`/api/schedules/${DAY}/adjustments`).set(as(ines)).send({ zones: [ZONE], fromHour: 1, toHour: 1, kind: 'scale', value: 50, reason: 'Smelter second shift' }).expect(201)).body;
    expect(scale.revisions[0].hours[1].adjustedMw).toBe(166.5);
    const negative = await api().post(`/api/schedules/${DAY}/adjustments`).set(as(ines)).send({ ...base, kind: 'add', value: -500, reason: 'typo' }).expect(400);
    expect(negative.body.message).toContain('never below 0 MW');
    await api().post(`/api/schedules/${DAY}/adjustments`).set(as(ines)).send({ ...base, toHour: 24, kind: 'set', value: 1, reason: 'beyond the day' }).expect(400);

    // Undo the add: replayed from the model, the scale now applies to 101.
    const undone = (await api().delete(`/api/schedules/adjustments/${add.adjustments[0].id}`).set(as(ines)).expect(200)).body as ScheduleRevisionDto;
    expect(undone.hours.map((h) => h.adjustedMw).slice(0, 3)).toEqual([100, 151.5, 102]);
    expect(undone.adjustments.map((a) => a.undoneAt !== null)).toEqual([true, false]);
  });

  it('an operator submits; nobody adjusts a submitted revision; an operator cannot approve; a supervisor returns it', async () => {
    const submitted = (await api().post(`/api/schedules/revisions/${rev1.id}/submit`).set(as(ines)).send({ comment: 'ready' }).expect(201)).body as ScheduleRevisionDto;
    expect(submitted).toMatchObject({ state: 'submitted', late: false, submittedBy: { name: 'Ines Marlow' } });
    await api().post(`/api/schedules/${DAY}/adjustments`).set(as(ines)).send({ zones: [ZONE], fromHour: 0, toHour: 0, kind: 'set', value: 90, reason: 'late idea' }).expect(409);
    await api().post(`/api/schedules/revisions/${rev1.id}/approve`).set(as(ines)).expect(403);
    await api().post(`/api/schedules/revisions/${rev1.id}/return`).set(as(hal)).send({}).expect(400);
    const returned = (await api().post(`/api/schedules/revisions/${rev1.id}/return`).set(as(hal)).send({ comment: 'HE02 looks too high' }).expect(201)).body;
    expect(returned).toMatchObject({ state: 'returned', returnComment: 'HE02 looks too high', returnedBy: { name: 'Hal Brennick' } });
    await api().post(`/api/schedules/${DAY}/adjustments`).set(as(ines)).send({ zones: [ZONE], fromHour: 1, toHour: 1, kind: 'set', value: 140, reason: 'Supervisor asked for less in HE02' }).expect(201);
  });

  it('a supervisor cannot approve their own submission; another approves, which publishes and e-mails the subscribers', async () => {
    await api().post('/api/schedules/subscribers').set(as(ines)).send({ email: 'x@tallowmere.example', name: 'X' }).expect(403);
    await api().post('/api/schedules/subscribers').set(as(hal)).send({ email: 'trading.desk@tallowmere.example', name: 'Trading desk', zones: [ZONE] }).expect(201);
    await api().post('/api/schedules/subscribers').set(as(hal)).send({ email: 'other.zone@tallowmere.example', name: 'Other zone', zones: ['MILLRACE'] }).expect(201);
    await api().post('/api/schedules/subscribers').set(as(hal)).send({ email: 'bad', name: 'Bad' }).expect(400);

    await api().post(`/api/schedules/revisions/${rev1.id}/submit`).set(as(hal)).send({}).expect(201);
    const own = await api().post(`/api/schedules/revisions/${rev1.id}/approve`).set(as(hal)).expect(403);
    expect(own.body.message).toContain('they submitted');
    const published = (await api().post(`/api/schedules/revisions/${rev1.id}/approve`).set(as(nora)).expect(201)).body as ScheduleRevisionDto;
    expect(published).toMatchObject({ state: 'published', publishedBy: { name: 'Nora Vance' } });
    expect(published.mail).toMatchObject({ sent: ['trading.desk@tallowmere.example'], error: null });

    const mails = (await mailsAbout(fake.dir, `${ZONE} ${DAY} revision 1`)).filter((m) => m.receivedAt >= started);
    expect(mails).toHaveLength(1);
    const [mail] = mails;
    expect(mail.envelope.to).toEqual(['trading.desk@tallowmere.example']);
    expect(mail.subject).toBe(`Day-ahead schedule ${ZONE} ${DAY} revision 1 published`);
    expect(mail.text).toMatch(/^HE01\s+100\.0$/m);
    expect(mail.text).toMatch(/^HE02\s+140\.0$/m);
    expect(mail.text).toMatch(/^HE24\s+123\.0$/m);
    expect(mail.text).toContain('Nora Vance');
    // the desk's clock rule: local time with the zone's abbreviation, UTC only labelled, no raw ISO
    expect(mail.text).toMatch(/at \d{4}-\d{2}-\d{2} \d{2}:\d{2} M[SD]T \(\d{4}-\d{2}-\d{2} \d{2}:\d{2} UTC\)\./);
    expect(mail.text).not.toMatch(/\d{4}-\d{2}-\d{2}T\d{2}:\d{2}/);
    expect(mail.text.replace(/\s+/g, ' ')).toContain(SCHEDULE_CAUTION);
  });

  it('a published revision cannot be altered', async () => {
    await api().post(`/api/schedules/${DAY}/adjustments`).set(as(ines)).send({ zones: [ZONE], fromHour: 0, toHour: 0, kind: 'set', value: 1, reason: 'after publication' }).expect(409);
    await api().post(`/api/schedules/revisions/${rev1.id}/submit`).set(as(ines)).send({}).expect(409);
    await api().post(`/api/schedules/revisions/${rev1.id}/approve`).set(as(hal)).expect(409);
    await api().post(`/api/schedules/revisions/${rev1.id}/return`).set(as(hal)).send({ comment: 'too late' }).expect(409);
    const adjustment = ((await api().get(`/api/schedules/revisions/${rev1.id}`).set(as(viewer)).expect(200)).body as ScheduleRevisionDto).adjustments.at(-1)!;
    await api().delete(`/api/schedules/adjustments/${adjustment.id}`).set(as(ines)).expect(409);
    await api().post(`/api/schedules/${DAY}/${ZONE}/draft`).set(as(ines)).expect(409);
  });

  it('a viewer downloads the published revision as CSV and JSON with the documented columns, but changes nothing', async () => {
    const csv = await api().get(`/api/schedules/revisions/${rev1.id}/export?format=csv`).set(as(viewer)).expect(200);
    expect(csv.headers['content-type']).toContain('text/csv');
    expect(csv.headers['content-disposition']).toContain(`schedule-${ZONE}-${DAY}-r1.csv`);
    const lines = csv.text.trim().split(/\r\n/);
    expect(lines[0]).toBe('operating_day,zone,hour_ending,interval_start_utc,mw,revision,published_at,published_by');
    expect(lines).toHaveLength(25);
    expect(lines[2]).toMatch(new RegExp(`^${DAY},${ZONE},HE02,2030-06-12T07:00:00.000Z,140,1,[^,]+,nora.vance@tallowmere.example$`));
    const json = (await api().get(`/api/schedules/revisions/${rev1.id}/export?format=json`).set(as(viewer)).expect(200)).body;
    expect(json.notice).toBe(SCHEDULE_CAUTION);
    expect(json.rows).toHaveLength(24);
    expect(json.rows[0]).toMatchObject({ operating_day: DAY, zone: ZONE, hour_ending: 'HE01', mw: 100, revision: 1, published_by: 'nora.vance@tallowmere.example' });
    await api().post(`/api/schedules/${DAY}/${ZONE}/corrections`).set(as(viewer)).send({ reason: 'viewer' }).expect(403);
    await api().post(`/api/schedules/revisions/${rev1.id}/return`).set(as(viewer)).send({ comment: 'viewer' }).expect(403);
  });

  it('a correction is revision 2 with the published values, carrying revision 1\'s adjustments and reasons forward, and its publication supersedes revision 1', async () => {
    await api().post(`/api/schedules/${DAY}/${ZONE}/corrections`).set(as(ines)).send({}).expect(400);
    const rev2 = (await api().post(`/api/schedules/${DAY}/${ZONE}/corrections`).set(as(ines)).send({ reason: 'Storm restoration moved to the afternoon' }).expect(201)).body as ScheduleRevisionDto;
    expect(rev2).toMatchObject({ revision: 2, state: 'draft', correctionReason: 'Storm restoration moved to the afternoon' });
    // the values start as published: the model value with revision 1's adjustments, each carried with its reason
    expect(rev2.hours[1]).toMatchObject({ modelMw: 101, startMw: 101, adjustedMw: 140 });
    expect(rev2.adjustments.map((a) => [a.kind, a.value, a.reason, a.carriedFromRevision, a.by.name, a.undoneAt])).toEqual([
      ['scale', 50, 'Smelter second shift', 1, expect.any(String), null],
      ['set', 140, 'Supervisor asked for less in HE02', 1, expect.any(String), null],
    ]);
    // a carried adjustment can be undone like any other
    const undoneCarried = (await api().delete(`/api/schedules/adjustments/${rev2.adjustments[1].id}`).set(as(ines)).expect(200)).body as ScheduleRevisionDto;
    expect(undoneCarried.hours[1].adjustedMw).toBe(151.5);
    // back to the model: every adjustment in force undone, kept in the list, the hours the model's
    await api().post(`/api/schedules/revisions/${rev2.id}/back-to-model`).set(as(viewer)).expect(403);
    const atModel = (await api().post(`/api/schedules/revisions/${rev2.id}/back-to-model`).set(as(ines)).expect(201)).body as ScheduleRevisionDto;
    expect(atModel.hours.slice(0, 3).map((h) => h.adjustedMw)).toEqual([100, 101, 102]);
    expect(atModel.adjustments.map((a) => a.undoneAt !== null)).toEqual([true, true]);
    await api().post(`/api/schedules/revisions/${rev2.id}/back-to-model`).set(as(ines)).expect(409);
    await api().post(`/api/schedules/${DAY}/${ZONE}/corrections`).set(as(ines)).send({ reason: 'twice' }).expect(409);
    await api().get(`/api/schedules/revisions/${rev2.id}/export`).set(as(viewer)).expect(409);
    await api().post(`/api/schedules/${DAY}/adjustments`).set(as(ines)).send({ zones: [ZONE], fromHour: 12, toHour: 15, kind: 'add', value: -20, reason: 'Restoration crews' }).expect(201);
    await api().post(`/api/schedules/revisions/${rev2.id}/submit`).set(as(ines)).send({}).expect(201);
    const published = (await api().post(`/api/schedules/revisions/${rev2.id}/approve`).set(as(hal)).expect(201)).body as ScheduleRevisionDto;
    expect(published.hours[12].adjustedMw).toBe(92);

    const history = (await api().get(`/api/schedules/${DAY}/${ZONE}/revisions`).set(as(viewer)).expect(200)).body as ScheduleRevisionDto[];
    expect(history.map((r) => [r.revision, r.state])).toEqual([[2, 'published'], [1, 'superseded']]);
    expect(history[1].supersededAt).not.toBeNull();
    const day = (await api().get(`/api/schedules/${DAY}?zone=${ZONE}`).set(as(viewer)).expect(200)).body as DayScheduleDto;
    expect(day.zones[0].published?.revision).toBe(2);
    expect(day.zones[0].working).toBeNull();
    // The superseded revision can still be downloaded, as what was published then.
    await api().get(`/api/schedules/revisions/${rev1.id}/export?format=csv`).set(as(viewer)).expect(200);
  });

  it('after gate closure an operator cannot submit; a supervisor can, and it is marked late', async () => {
    const draft = (await api().post(`/api/schedules/${PAST_DAY}/${ZONE}/draft`).set(as(ines)).expect(201)).body as ScheduleRevisionDto;
    expect(draft.hours.every((h) => h.modelMw === null)).toBe(true);
    // Hours without a forecast must be set before submitting; add cannot work on them.
    await api().post(`/api/schedules/${PAST_DAY}/adjustments`).set(as(ines)).send({ zones: [ZONE], fromHour: 0, toHour: 23, kind: 'add', value: 5, reason: 'no base' }).expect(400);
    await api().post(`/api/schedules/revisions/${draft.id}/submit`).set(as(hal)).send({}).expect(400);
    await api().post(`/api/schedules/${PAST_DAY}/adjustments`).set(as(ines)).send({ zones: [ZONE], fromHour: 0, toHour: 23, kind: 'set', value: 80, reason: 'Flat estimate, no forecast' }).expect(201);
    const refused = await api().post(`/api/schedules/revisions/${draft.id}/submit`).set(as(ines)).send({}).expect(403);
    expect(refused.body.message).toContain('only a supervisor');
    const late = (await api().post(`/api/schedules/revisions/${draft.id}/submit`).set(as(hal)).send({ comment: 'after the gate' }).expect(201)).body as ScheduleRevisionDto;
    expect(late).toMatchObject({ state: 'submitted', late: true });
  });

  it('writes every step to the audit trail under schedule.*', async () => {
    const em = app.get(EntityManager).fork();
    const actions = (await em.find(AuditEntry, { action: { $like: 'schedule.%' }, at: { $gte: new Date(started) } })).map((e) => e.action);
    for (const action of ['schedule.draft', 'schedule.adjust', 'schedule.adjust-undo', 'schedule.submit', 'schedule.return', 'schedule.approve', 'schedule.publish', 'schedule.correction', 'schedule.back-to-model', 'schedule.subscriber-add']) {
      expect(actions).toContain(action);
    }
  });

  it('keeps subscribers: supervisors list and remove them', async () => {
    const list = (await api().get('/api/schedules/subscribers').set(as(hal)).expect(200)).body as { id: number; email: string }[];
    const other = list.find((s) => s.email === 'other.zone@tallowmere.example')!;
    await api().get('/api/schedules/subscribers').set(as(viewer)).expect(403);
    const removed = (await api().delete(`/api/schedules/subscribers/${other.id}`).set(as(nora)).expect(200)).body;
    expect(removed.active).toBe(false);
  });

  it('keeps each run with its issue time: a draft shows the run it started from, a newer run is flagged with the hour-by-hour change, and the draft can start again from it', async () => {
    const DAY2 = '2030-06-13';
    const em = app.get(EntityManager).fork();
    const zone = await em.findOneOrFail(Zone, { code: ZONE });
    const first = Date.parse('2030-06-12T06:00:00Z');
    const run = (issuedAt: Date, level: number) => {
      const mean = Array.from({ length: 48 }, (_, i) => level + i);
      return em.create(ForecastRun, { zone, issuedAt, basedOnHour: new Date(first - HOUR_MS), method: 'arima', fallbackReason: null, modelVersionId: null, firstHour: new Date(first), mean, lower80: mean.map((m) => m - 5), upper80: mean.map((m) => m + 5), lower95: mean.map((m) => m - 9), upper95: mean.map((m) => m + 9) });
    };
    const older = run(new Date(), 200);
    await em.flush();
    const draft = (await api().post(`/api/schedules/${DAY2}/${ZONE}/draft`).set(as(ines)).expect(201)).body as ScheduleRevisionDto;
    expect(draft).toMatchObject({ forecastRunId: older.id, forecastIssuedAt: older.issuedAt.toISOString() });
    expect(draft.hours[0].modelMw).toBe(224);
    await api().post(`/api/schedules/${DAY2}/adjustments`).set(as(ines)).send({ zones: [ZONE], fromHour: 0, toHour: 1, kind: 'add', value: 10, reason: 'County fair opening night' }).expect(201);
    let day = (await api().get(`/api/schedules/${DAY2}?zone=${ZONE}`).set(as(ines)).expect(200)).body as DayScheduleDto;
    expect(day.zones[0].newerForecast).toBeNull();

    const newer = run(new Date(older.issuedAt.getTime() + 1000), 190);
    await em.flush();
    day = (await api().get(`/api/schedules/${DAY2}?zone=${ZONE}`).set(as(ines)).expect(200)).body as DayScheduleDto;
    expect(day.zones[0].working?.forecastRunId).toBe(older.id);
    expect(day.zones[0].newerForecast).toEqual({ runId: newer.id, issuedAt: newer.issuedAt.toISOString(), revisionRunId: older.id, revisionIssuedAt: older.issuedAt.toISOString() });

    // the runs with their issue times, and the change hour by hour over the operating day
    const runs = (await api().get(`/api/forecasts/runs?zone=${ZONE}`).set(as(viewer)).expect(200)).body as ForecastRunSummaryDto[];
    expect(runs.slice(0, 2).map((r) => [r.id, r.issuedAt, r.hours])).toEqual([[newer.id, newer.issuedAt.toISOString(), 48], [older.id, older.issuedAt.toISOString(), 48]]);
    const diff = (await api().get(`/api/forecasts/runs/${older.id}/diff?against=${newer.id}&from=2030-06-13T06:00:00Z&to=2030-06-14T06:00:00Z`).set(as(viewer)).expect(200)).body as ForecastDiffDto;
    expect(diff.hours).toHaveLength(24);
    expect(diff.hours[0]).toEqual({ hour: '2030-06-13T06:00:00.000Z', fromMw: 224, toMw: 214, changeMw: -10 });
    expect(diff.largestChangeMw).toBe(-10);
    await api().get(`/api/forecasts/runs/${older.id}/diff?against=abc`).set(as(viewer)).expect(400);
    await api().get(`/api/forecasts/runs/${older.id}/diff?against=99999999`).set(as(viewer)).expect(404);
    await api().get(`/api/forecasts/runs?zone=${ZONE}&limit=0`).set(as(viewer)).expect(400);

    // start again from the latest run: its model values, the adjustments in force applied again
    await api().post(`/api/schedules/revisions/${draft.id}/restart`).set(as(viewer)).expect(403);
    const restarted = (await api().post(`/api/schedules/revisions/${draft.id}/restart`).set(as(ines)).expect(201)).body as ScheduleRevisionDto;
    expect(restarted).toMatchObject({ forecastRunId: newer.id, forecastIssuedAt: newer.issuedAt.toISOString() });
    expect(restarted.hours.slice(0, 3).map((h) => [h.modelMw, h.startMw, h.adjustedMw])).toEqual([[214, 214, 224], [215, 215, 225], [216, 216, 216]]);
    await api().post(`/api/schedules/revisions/${draft.id}/restart`).set(as(ines)).expect(409);
    day = (await api().get(`/api/schedules/${DAY2}?zone=${ZONE}`).set(as(viewer)).expect(200)).body as DayScheduleDto;
    expect(day.zones[0].newerForecast).toBeNull();
    const audit = await em.fork().find(AuditEntry, { action: 'schedule.restart', subjectId: String(draft.id) });
    expect(audit).toHaveLength(1);
  });

  it('shows the day of a zone added a moment ago, though the zone list the forecasts read was cached just before', async () => {
    // this read fills the server's short-lived list of active zones (ReadingsService.zones)
    await api().get(`/api/schedules/${DAY}?zone=${ZONE}`).set(as(viewer)).expect(200);
    const code = `FRESH${Date.now() % 100000}`;
    const zone = { code, name: `Fresh Meadow ${code.slice(5)}`, timeZone: 'America/Denver', alertThresholdPct: 5, alertConsecutiveHours: 2, gateClosure: '10:00', minPlausibleMw: 0, maxPlausibleMw: 400 };
    await api().post('/api/zones').set(as(admin)).send(zone).expect(201);
    // at once, well inside the cache's lifetime: the zone exists, so its day is shown (not a 400 "no active zone")
    const day = (await api().get(`/api/schedules/${DAY}?zone=${code}`).set(as(ines)).expect(200)).body as DayScheduleDto;
    expect(day.zones.map((z) => [z.zone, z.slots.length, z.forecast, z.working])).toEqual([[code, 24, null, null]]);
    expect(((await api().get(`/api/forecasts/runs?zone=${code}`).set(as(viewer)).expect(200)).body as ForecastRunSummaryDto[])).toEqual([]);
    // a code that names no zone is still refused, after the list is read afresh
    const unknown = await api().get(`/api/schedules/${DAY}?zone=NOSUCH${code.slice(5)}`).set(as(ines)).expect(400);
    expect(unknown.body.message).toBe(`No active zone with code NOSUCH${code.slice(5)}`);
  });
});
