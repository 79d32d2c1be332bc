import type { NestExpressApplication } from '@nestjs/platform-express';
import { io } from 'socket.io-client';
import request from 'supertest';
import { DESK_EVENTS, DESK_NAMESPACE, type AlertDto, type AuditEntryDto, type Page } from '@morrowline/shared';
import { AlertsService } from '../src/alerts/alerts.service';
import { storeDayAheadRun } from './support/committed';
import { connectFeed, connected, createFeedKey, createZone, hourIso, send } from './support/feeds';
import { baseUrl, demoUser, startTestApp, tokenFor } from './support/test-app';

jest.setTimeout(120_000);

const HOUR = 3_600_000;
const WEEK = 168 * HOUR;

describe('deviation alerts (real MariaDB)', () => {
  let app: NestExpressApplication;
  let admin: string;
  let operator: string;
  let viewer: string;
  let supervisor: string;
  beforeAll(async () => {
    app = await startTestApp();
    admin = await tokenFor(app, 'admin');
    operator = await tokenFor(app, 'operator');
    viewer = await tokenFor(app, 'viewer');
    supervisor = await tokenFor(app, 'supervisor');
  });
  afterAll(async () => {
    await app.close();
  });
  const api = () => request(app.getHttpServer());

  it('raises an alert after N consecutive deviating hours, pushes it to desks, and records its acknowledgement', async () => {
    const zone = await createZone(app, admin, { alertThresholdPct: 5, alertConsecutiveHours: 3 });
    const { apiKey } = await createFeedKey(app, admin);
    const base = Math.floor(Date.now() / HOUR) * HOUR - 12 * HOUR;
    const feed = connectFeed(app, apiKey);
    await connected(feed);
    // The day-ahead forecast issued before gate closure: a flat 100 MW over the days these hours fall on.
    await storeDayAheadRun(app, zone, base - 24 * HOUR, 24 * 4, () => 100);

    const desk = io(`${baseUrl(app)}${DESK_NAMESPACE}`, { auth: { token: viewer }, transports: ['websocket'], reconnection: false });
    await new Promise((resolve) => desk.once(DESK_EVENTS.hello, resolve));
    const pushed = new Promise<AlertDto>((resolve) => desk.on(DESK_EVENTS.alertRaised, (a: AlertDto) => a.zone === zone && resolve(a)));

    // Two hours beyond 5 % (not enough for 3), back to normal, then three in a row (with one within 5 %).
    const actual = [101, 108, 109, 100, 112, 94, 120, 104, 100, 100];
    await send(feed, actual.slice(0, 4).map((mw, i) => ({ zone, hour: hourIso(base + i * HOUR), mw })));
    await app.get(AlertsService).settled();
    let open = await api().get(`/api/alerts?state=open&zone=${zone}`).set('Authorization', `Bearer ${viewer}`).expect(200);
    expect(open.body).toEqual([]);

    await send(feed, actual.slice(4).map((mw, i) => ({ zone, hour: hourIso(base + (i + 4) * HOUR), mw })));
    feed.close();
    await app.get(AlertsService).settled();
    open = await api().get(`/api/alerts?state=open&zone=${zone}`).set('Authorization', `Bearer ${viewer}`).expect(200);
    const alerts = open.body as AlertDto[];
    expect(alerts).toHaveLength(1);
    expect(alerts[0]).toMatchObject({
      zone,
      start: hourIso(base + 4 * HOUR),
      end: hourIso(base + 7 * HOUR),
      peakDeviationPct: 20,
      comparedWith: 'day-ahead',
      committedMw: 100,
      thresholdPct: 5,
      consecutiveHours: 3,
      state: 'open',
    });
    const heard = await pushed;
    expect(heard.id).toBe(alerts[0].id);
    desk.close();

    await api().post(`/api/alerts/${alerts[0].id}/acknowledge`).set('Authorization', `Bearer ${viewer}`).send({}).expect(403);
    const acked = await api()
      .post(`/api/alerts/${alerts[0].id}/acknowledge`)
      .set('Authorization', `Bearer ${operator}`)
      .send({ comment: 'Irrigation pumps started early' })
      .expect(200);
    expect(acked.body).toMatchObject({ state: 'acknowledged', comment: 'Irrigation pumps started early', acknowledgedBy: 'ines.marlow@tallowmere.example', acknowledgedByName: demoUser('operator').name });
    await api().post(`/api/alerts/${alerts[0].id}/acknowledge`).set('Authorization', `Bearer ${supervisor}`).send({}).expect(409);
    expect((await api().get(`/api/alerts?state=open&zone=${zone}`).set('Authorization', `Bearer ${viewer}`).expect(200)).body).toEqual([]);

    const audit = await api().get(`/api/audit?subjectType=alert&subjectId=${alerts[0].id}`).set('Authorization', `Bearer ${supervisor}`).expect(200);
    const entries = (audit.body as Page<AuditEntryDto>).items;
    expect(entries.map((e) => e.action).sort()).toEqual(['alert.acknowledge', 'alert.raise']);
    expect(entries.find((e) => e.action === 'alert.acknowledge')).toMatchObject({ actorEmail: 'ines.marlow@tallowmere.example', reason: 'Irrigation pumps started early' });
  });

  it('widens an open alert when the next hour deviates too, rather than raising another', async () => {
    const zone = await createZone(app, admin, { alertThresholdPct: 5, alertConsecutiveHours: 2 });
    const { apiKey } = await createFeedKey(app, admin);
    const base = Math.floor(Date.now() / HOUR) * HOUR - 10 * HOUR;
    const feed = connectFeed(app, apiKey);
    await connected(feed);
    await storeDayAheadRun(app, zone, base - 24 * HOUR, 24 * 4, () => 200);
    await send(feed, [0, 1].map((i) => ({ zone, hour: hourIso(base + i * HOUR), mw: 180 })));
    await app.get(AlertsService).settled();
    await send(feed, [{ zone, hour: hourIso(base + 2 * HOUR), mw: 170 }]);
    feed.close();
    await app.get(AlertsService).settled();
    const open = await api().get(`/api/alerts?zone=${zone}`).set('Authorization', `Bearer ${viewer}`).expect(200);
    expect(open.body).toEqual([expect.objectContaining({ start: hourIso(base), end: hourIso(base + 3 * HOUR), peakDeviationPct: -15 })]);
  });

  it('lists acknowledged alerts as the history, newest acknowledgement first, with who acknowledged them', async () => {
    const zone = await createZone(app, admin, { alertThresholdPct: 5, alertConsecutiveHours: 2 });
    const { apiKey } = await createFeedKey(app, admin);
    const base = Math.floor(Date.now() / HOUR) * HOUR - 10 * HOUR;
    await storeDayAheadRun(app, zone, base - 24 * HOUR, 24 * 4, () => 100);
    const feed = connectFeed(app, apiKey);
    await connected(feed);
    // Two alerts: hours 0-1 and 4-5 well above 100 MW, normal hours between.
    await send(feed, [130, 130, 100, 100, 70, 70].map((mw, i) => ({ zone, hour: hourIso(base + i * HOUR), mw })));
    feed.close();
    await app.get(AlertsService).settled();
    const open = (await api().get(`/api/alerts?state=open&zone=${zone}`).set('Authorization', `Bearer ${viewer}`).expect(200)).body as AlertDto[];
    expect(open.map((a) => a.peakDeviationPct)).toEqual([-30, 30]);
    await api().post(`/api/alerts/${open[1].id}/acknowledge`).set('Authorization', `Bearer ${operator}`).send({ comment: 'first' }).expect(200);
    await api().post(`/api/alerts/${open[0].id}/acknowledge`).set('Authorization', `Bearer ${supervisor}`).send({}).expect(200);
    const history = (await api().get(`/api/alerts?state=acknowledged&zone=${zone}`).set('Authorization', `Bearer ${viewer}`).expect(200)).body as AlertDto[];
    expect(history.map((a) => [a.id, a.acknowledgedByName, a.comment])).toEqual([
      [open[0].id, demoUser('supervisor').name, null],
      [open[1].id, demoUser('operator').name, 'first'],
    ]);
  });

  it('raises no alert where nothing was committed, however far the load is from last week’s', async () => {
    const zone = await createZone(app, admin, { alertThresholdPct: 5, alertConsecutiveHours: 2 });
    const { apiKey } = await createFeedKey(app, admin);
    const base = Math.floor(Date.now() / HOUR) * HOUR - 8 * HOUR;
    const feed = connectFeed(app, apiKey);
    await connected(feed);
    await send(feed, Array.from({ length: 4 }, (_, i) => ({ zone, hour: hourIso(base - WEEK + i * HOUR), mw: 100 })));
    await send(feed, [200, 210, 220, 230].map((mw, i) => ({ zone, hour: hourIso(base + i * HOUR), mw })));
    // A run issued after gate closure (an intraday update) is not the day-ahead forecast either.
    await storeDayAheadRun(app, zone, base, 24, () => 100, 2 * HOUR);
    await send(feed, [{ zone, hour: hourIso(base + 4 * HOUR), mw: 240 }]);
    feed.close();
    await app.get(AlertsService).settled();
    expect((await api().get(`/api/alerts?zone=${zone}`).set('Authorization', `Bearer ${viewer}`).expect(200)).body).toEqual([]);
  });

  it('judges hours read before their day-ahead numbers existed once those arrive (the first start’s replay), and only once', async () => {
    const zone = await createZone(app, admin, { alertThresholdPct: 5, alertConsecutiveHours: 2 });
    const { apiKey } = await createFeedKey(app, admin);
    const base = Math.floor(Date.now() / HOUR) * HOUR - 6 * HOUR;
    const feed = connectFeed(app, apiKey);
    await connected(feed);
    // read with nothing committed yet: no alert
    await send(feed, [130, 132, 131].map((mw, i) => ({ zone, hour: hourIso(base + i * HOUR), mw })));
    feed.close();
    await app.get(AlertsService).settled();
    expect((await api().get(`/api/alerts?zone=${zone}`).set('Authorization', `Bearer ${viewer}`).expect(200)).body).toEqual([]);

    // the day-ahead run arrives afterwards (as the replay stores it); a second look raises the alert
    await storeDayAheadRun(app, zone, base - 24 * HOUR, 24 * 3, () => 100);
    await app.get(AlertsService).reviewRecent([zone]);
    await app.get(AlertsService).settled();
    await app.get(AlertsService).reviewRecent([zone]);
    await app.get(AlertsService).settled();
    const alerts = (await api().get(`/api/alerts?zone=${zone}`).set('Authorization', `Bearer ${viewer}`).expect(200)).body as AlertDto[];
    expect(alerts).toHaveLength(1);
    expect(alerts[0]).toMatchObject({ start: hourIso(base), end: hourIso(base + 3 * HOUR), peakDeviationPct: 32, comparedWith: 'day-ahead', committedMw: 100 });
  });

  it('validates the alerts query', async () => {
    const bad = await api().get('/api/alerts?state=closed').set('Authorization', `Bearer ${viewer}`).expect(400);
    expect(bad.body.details).toEqual(['state must be open or acknowledged']);
  });
});
