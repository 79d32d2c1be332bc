import { EntityManager } from '@mikro-orm/mariadb';
import type { NestExpressApplication } from '@nestjs/platform-express';
import { io } from 'socket.io-client';
import request from 'supertest';
import { DESK_EVENTS, DESK_NAMESPACE, READINGS_EVENT, type CsvUploadReport, type DeskReadings, type FeedStatusDto, type ReadingBatchAck, type ReadingSeriesDto } from '@morrowline/shared';
import { connectFeed, connected, createFeedKey, createZone, hourIso, send, unique } from './support/feeds';
import { baseUrl, startTestApp, tokenFor } from './support/test-app';

jest.setTimeout(120_000);

const HOUR = 3_600_000;
const currentHour = () => Math.floor(Date.now() / HOUR) * HOUR;

describe('readings: feed ingest, CSV history, revisions (real MariaDB)', () => {
  let app: NestExpressApplication;
  let admin: string;
  let operator: string;
  let viewer: string;
  let apiKey: string;
  beforeAll(async () => {
    app = await startTestApp();
    admin = await tokenFor(app, 'admin');
    operator = await tokenFor(app, 'operator');
    viewer = await tokenFor(app, 'viewer');
    apiKey = (await createFeedKey(app, admin)).apiKey;
  });
  afterAll(async () => {
    await app.close();
  });
  const api = () => request(app.getHttpServer());
  const db = () => app.get(EntityManager).getKnex();

  async function storedRows(zone: string): Promise<{ hour: string; mw: number }[]> {
    const [rows] = (await db().raw(
      'select r.hour_start, r.mw from readings r join zones z on z.id = r.zone_id where z.code = ? order by r.hour_start',
      [zone],
    )) as unknown as [{ hour_start: string; mw: number }[]];
    return rows.map((r) => ({ hour: `${r.hour_start.replace(' ', 'T')}.000Z`, mw: Number(r.mw) }));
  }

  it('streams 100,000 readings with repeats, reordering and a dropped connection, and stores each (zone, hour) exactly once', async () => {
    const zones = await Promise.all([1, 2, 3, 4].map(() => createZone(app, admin)));
    const hoursPerZone = 20_000;
    const end = currentHour() - 100 * HOUR;
    const expected = new Map<string, number>();
    const all: { zone: string; hour: string; mw: number }[] = [];
    zones.forEach((zone, z) => {
      for (let h = 0; h < hoursPerZone; h++) {
        const hour = hourIso(end - h * HOUR);
        const mw = Math.round((200 + 80 * Math.sin(h / 3.8) + z * 10) * 1000) / 1000;
        expected.set(`${zone}|${hour}`, mw);
        all.push({ zone, hour, mw });
      }
    });
    // 80,000 distinct readings + 20,000 repeats = 100,000 sent, shuffled with a fixed seed.
    let seed = 42;
    const random = () => ((seed = (seed * 1103515245 + 12345) % 2 ** 31) / 2 ** 31);
    const stream = [...all, ...Array.from({ length: 20_000 }, () => all[Math.floor(random() * all.length)])];
    for (let i = stream.length - 1; i > 0; i--) {
      const j = Math.floor(random() * (i + 1));
      [stream[i], stream[j]] = [stream[j], stream[i]];
    }
    expect(stream).toHaveLength(100_000);

    const socket = connectFeed(app, apiKey, true);
    await connected(socket);
    const unacked = new Map<string, unknown[]>();
    const acks = new Map<string, ReadingBatchAck>();
    let settle: () => void = () => undefined;
    const done = new Promise<void>((resolve) => (settle = resolve));
    const emit = (batchId: string) =>
      socket.emit(READINGS_EVENT, { batchId, readings: unacked.get(batchId) }, (ack: ReadingBatchAck) => {
        if (!unacked.has(batchId) || ack.error) return;
        unacked.delete(batchId);
        acks.set(batchId, ack);
        if (acks.size === 100) settle();
      });
    let reconnects = 0;
    socket.io.on('reconnect', () => {
      reconnects++;
      for (const batchId of unacked.keys()) emit(batchId); // resend whatever was not acknowledged
    });
    for (let b = 0; b < 100; b++) {
      const batchId = `stream-${b}`;
      unacked.set(batchId, stream.slice(b * 1000, (b + 1) * 1000));
      emit(batchId);
      if (b === 50) socket.io.engine.close(); // the network drops mid-stream
    }
    await done;
    socket.close();

    expect(reconnects).toBeGreaterThanOrEqual(1);
    expect([...acks.values()].reduce((sum, a) => sum + a.stored, 0)).toBe(100_000);
    expect([...acks.values()].flatMap((a) => a.rejected)).toEqual([]);
    for (const zone of zones) {
      const rows = await storedRows(zone);
      expect(rows).toHaveLength(hoursPerZone);
      expect(new Set(rows.map((r) => r.hour)).size).toBe(hoursPerZone);
      const wrong = rows.filter((r) => expected.get(`${zone}|${r.hour}`) !== r.mw);
      expect(wrong).toEqual([]);
    }
    // Repeats of the same value leave no revisions.
    const [[{ n }]] = (await db().raw(
      `select count(*) n from reading_revisions v join zones z on z.id = v.zone_id where z.code in (${zones.map(() => '?').join(',')})`,
      zones,
    )) as unknown as [[{ n: number }]];
    expect(Number(n)).toBe(0);
  });

  it('rejects each kind of bad reading with its index and reason, storing the good ones', async () => {
    const zone = await createZone(app, admin, { maxPlausibleMw: 500 });
    const socket = connectFeed(app, apiKey);
    await connected(socket);
    const hour = hourIso(currentHour() - 5 * HOUR);
    const ack = await send(socket, [
      { zone, hour, mw: 120 },
      { zone: 'NO-SUCH-ZONE', hour, mw: 120 },
      { zone, hour: hourIso(currentHour() - 5 * HOUR + 15 * 60_000), mw: 120 },
      { zone, hour, mw: 'a lot' },
      { zone, hour, mw: -4 },
      { zone, hour, mw: 5000 },
      { zone, hour: hourIso(currentHour() + 5 * HOUR), mw: 120 },
      { zone, when: hour, mw: 120 },
      'not even an object',
      { zone, hour: hourIso(currentHour() - 6 * HOUR), mw: 130, quality: 'estimated' },
    ]);
    socket.close();
    expect(ack.stored).toBe(2);
    expect(ack.rejected.map((r) => [r.index, r.reason])).toEqual([
      [1, 'unknown-zone'],
      [2, 'not-on-the-hour'],
      [3, 'not-a-number'],
      [4, 'negative'],
      [5, 'implausible'],
      [6, 'too-far-in-future'],
      [7, 'malformed'],
      [8, 'malformed'],
    ]);
    for (const r of ack.rejected) expect(r.message.length).toBeGreaterThan(5);
    expect(await storedRows(zone)).toEqual([
      { hour: hourIso(currentHour() - 6 * HOUR), mw: 130 },
      { hour, mw: 120 },
    ]);
  });

  it('refuses readings for another zone from a key limited to one zone', async () => {
    const mine = await createZone(app, admin);
    const other = await createZone(app, admin);
    const scoped = await createFeedKey(app, admin, mine);
    const socket = connectFeed(app, scoped.apiKey);
    await connected(socket);
    const hour = hourIso(currentHour() - 3 * HOUR);
    const ack = await send(socket, [
      { zone: mine, hour, mw: 50 },
      { zone: other, hour, mw: 50 },
    ]);
    socket.close();
    expect(ack.stored).toBe(1);
    expect(ack.rejected).toEqual([expect.objectContaining({ index: 1, reason: 'zone-not-allowed' })]);
  });

  it('answers a batch that is not a batch with an error and stores nothing', async () => {
    const socket = connectFeed(app, apiKey);
    await connected(socket);
    const ack = await new Promise<ReadingBatchAck>((resolve) => socket.emit(READINGS_EVENT, { batchId: 'x', readings: 'none' }, resolve));
    socket.close();
    expect(ack).toMatchObject({ batchId: 'x', stored: 0, error: expect.stringMatching(/batchId, readings/) });
  });

  it('keeps the earlier value as a revision when a later, different value arrives, and broadcasts stored readings to desks', async () => {
    const zone = await createZone(app, admin);
    const desk = io(`${baseUrl(app)}${DESK_NAMESPACE}`, { auth: { token: viewer }, transports: ['websocket'], reconnection: false });
    await new Promise((resolve) => desk.once(DESK_EVENTS.hello, resolve));
    const heard: DeskReadings[] = [];
    const marker = hourIso(currentHour() - 9 * HOUR);
    const markerHeard = new Promise<void>((resolve) =>
      desk.on(DESK_EVENTS.readings, (event: DeskReadings) => {
        heard.push(event);
        if (event.zones.some((z) => z.zone === zone && z.hours.includes(marker))) resolve();
      }),
    );

    const socket = connectFeed(app, apiKey);
    await connected(socket);
    const hour = hourIso(currentHour() - 4 * HOUR);
    expect((await send(socket, [{ zone, hour, mw: 100 }])).stored).toBe(1);
    expect((await send(socket, [{ zone, hour, mw: 100 }])).stored).toBe(1);
    expect((await send(socket, [{ zone, hour, mw: 104.5 }])).stored).toBe(1);
    // One last new reading: broadcasts reach a desk in order, so once it is heard all earlier ones are.
    expect((await send(socket, [{ zone, hour: marker, mw: 90 }])).stored).toBe(1);
    socket.close();
    await markerHeard;
    desk.close();

    const [revisions] = (await db().raw(
      'select v.mw, v.source, v.replaced_by from reading_revisions v join zones z on z.id = v.zone_id where z.code = ?',
      [zone],
    )) as unknown as [{ mw: number; source: string; replaced_by: string }[]];
    expect(revisions.map((r) => Number(r.mw))).toEqual([100]);
    expect(revisions[0].source).toMatch(/^feed:/);
    expect(await storedRows(zone)).toEqual([{ hour: marker, mw: 90 }, { hour, mw: 104.5 }]);
    // Two changes (new, then different) and the marker; the repeat was not news.
    const mine = heard.flatMap((e) => e.zones.filter((z) => z.zone === zone));
    expect(mine.map((z) => z.mw)).toEqual([[100], [104.5], [90]]);
    expect(mine[0].hours).toEqual([hour]);
  });

  it('stores the good rows of a CSV with bad ones and reports the bad ones by line', async () => {
    const zone = await createZone(app, admin);
    const h = (n: number) => hourIso(currentHour() - n * HOUR);
    const csv = [
      'timestamp,load_mw',
      `${h(30)},101.5`,
      `${h(29)},abc`,
      `${h(28)},-2`,
      '',
      `not-a-time,100`,
      `${h(27)},102`,
      `${h(26)},103,${zone},extra`,
      `${h(25)},104`,
    ].join('\n');
    await api().post(`/api/readings/upload?zone=${zone}`).set('Authorization', `Bearer ${viewer}`).attach('file', Buffer.from(csv), 'history.csv').expect(403);
    const response = await api()
      .post(`/api/readings/upload?zone=${zone}`)
      .set('Authorization', `Bearer ${operator}`)
      .attach('file', Buffer.from(csv), 'history.csv')
      .expect(201);
    const report = response.body as CsvUploadReport;
    expect(report).toMatchObject({ fileName: 'history.csv', rows: 7, accepted: 3, rejectedCount: 4 });
    expect(report.rejected.map((r) => [r.line, r.reason])).toEqual([
      [3, 'not-a-number'],
      [4, 'negative'],
      [6, 'malformed'],
      [8, 'malformed'],
    ]);
    expect((await storedRows(zone)).map((r) => r.mw)).toEqual([101.5, 102, 104]);

    // The series for the live view: null for the missing hours, and the latest hour.
    const series = await api()
      .get(`/api/readings?zone=${zone}&from=${h(30)}&to=${h(24)}`)
      .set('Authorization', `Bearer ${viewer}`)
      .expect(200);
    const body = series.body as ReadingSeriesDto;
    expect(body.hours).toHaveLength(6);
    expect(body.zones[0]).toMatchObject({ zone, mw: [101.5, null, null, 102, null, 104], lastHour: h(25) });

    const exported = await api().get(`/api/readings/export?zone=${zone}&from=${h(30)}&to=${h(24)}`).set('Authorization', `Bearer ${viewer}`).expect(200);
    expect(exported.headers['content-type']).toMatch(/text\/csv/);
    expect(exported.text.trim().split('\n')).toEqual(['timestamp,load_mw,zone,quality', `${h(30)},101.5,${zone},good`, `${h(27)},102,${zone},good`, `${h(25)},104,${zone},good`]);

    const status = await api().get('/api/readings/status').set('Authorization', `Bearer ${viewer}`).expect(200);
    expect((status.body as FeedStatusDto[]).find((s) => s.zone === zone)).toMatchObject({ lastHour: h(25), stale: true, hoursBehind: 24 });
  });

  it('takes the zone from a zone column when there is one', async () => {
    const zone = await createZone(app, admin);
    const csv = `timestamp,load_mw,zone\n${hourIso(currentHour() - 2 * HOUR)},77,${zone}\n${hourIso(currentHour() - HOUR)},78,\n`;
    const response = await api().post('/api/readings/upload').set('Authorization', `Bearer ${operator}`).attach('file', Buffer.from(csv), 'z.csv').expect(201);
    expect(response.body).toMatchObject({ accepted: 1, rejected: [{ line: 3, reason: 'unknown-zone' }] });
    const status = await api().get('/api/readings/status').set('Authorization', `Bearer ${viewer}`).expect(200);
    expect((status.body as FeedStatusDto[]).find((s) => s.zone === zone)).toMatchObject({ stale: false });
  });

  it('changes nothing for a file that cannot be read as CSV', async () => {
    const zone = await createZone(app, admin);
    const unreadable = `timestamp,load_mw\n${hourIso(currentHour() - 2 * HOUR)},55\n${hourIso(currentHour() - HOUR)},"56\n`;
    const response = await api()
      .post(`/api/readings/upload?zone=${zone}`)
      .set('Authorization', `Bearer ${operator}`)
      .attach('file', Buffer.from(unreadable), 'broken.csv')
      .expect(400);
    expect(response.body.message).toMatch(/could not be read as CSV.*nothing was stored/);
    await api()
      .post(`/api/readings/upload?zone=${zone}`)
      .set('Authorization', `Bearer ${operator}`)
      .attach('file', Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x00, 0x01]), 'picture.csv')
      .expect(400);
    expect(await storedRows(zone)).toEqual([]);
    const missing = await api().post('/api/readings/upload').set('Authorization', `Bearer ${operator}`).expect(400);
    expect(missing.body.message).toMatch(/multipart field "file"/);
  });

  it('validates the series query at the edge', async () => {
    const bad = await api().get('/api/readings?zone=lower&from=yesterday').set('Authorization', `Bearer ${viewer}`).expect(400);
    expect(bad.body.details).toEqual(expect.arrayContaining(['zone must be zone codes such as MILLRACE', 'from must be an ISO 8601 date and time']));
    await api().get(`/api/readings?zone=NOPE${unique()}`).set('Authorization', `Bearer ${viewer}`).expect(400);
    await api().get('/api/readings').expect(401);
  });
});
