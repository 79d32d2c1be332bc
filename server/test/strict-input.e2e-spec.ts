import { EntityManager } from '@mikro-orm/mariadb';
import type { NestExpressApplication } from '@nestjs/platform-express';
import request from 'supertest';
import type { CsvUploadReport, ReadingBatchAck } from '@morrowline/shared';
import { connectFeed, connected, createFeedKey, createZone, send } from './support/feeds';
import { startTestApp, tokenFor } from './support/test-app';

jest.setTimeout(120_000);

/** The defects a penetration run found at the edge, each replayed against the real server and MariaDB. */
describe('strict input at every edge (real MariaDB)', () => {
  let app: NestExpressApplication;
  let admin: string;
  let operator: string;
  beforeAll(async () => {
    app = await startTestApp();
    admin = await tokenFor(app, 'admin');
    operator = await tokenFor(app, 'operator');
  });
  afterAll(async () => {
    await app.close();
  });
  const api = () => request(app.getHttpServer());
  const db = () => app.get(EntityManager).getKnex();
  const as = (token: string) => ({ Authorization: `Bearer ${token}` });

  async function storedHours(zone: string): Promise<{ hour: string; mw: number }[]> {
    const [rows] = (await db().raw('select r.hour_start, r.mw from readings r join zones z on z.id = r.zone_id where z.code = ? order by r.hour_start', [zone])) as unknown as [
      { hour_start: string; mw: number }[],
    ];
    return rows.map((r) => ({ hour: `${String(r.hour_start).replace(' ', 'T')}Z`, mw: Number(r.mw) }));
  }

  async function upload(zone: string, csv: string, status = 201) {
    return api().post(`/api/readings/upload?zone=${zone}`).set(as(operator)).attach('file', Buffer.from(csv), 'history.csv').expect(status);
  }

  describe('path ids', () => {
    it('does not read " 1", "0x10" or "1e3" as ids: a PATCH to /api/users/%20%31 changes nobody', async () => {
      const before = (await api().get('/api/users').set(as(admin)).expect(200)).body as { id: number; name: string }[];
      for (const id of ['%20%31', '0x10', '1e3', '1%20', '+1']) {
        const response = await api().patch(`/api/users/${id}`).set(as(admin)).send({ name: 'Changed through a loose id', reason: 'test' }).expect(400);
        expect(response.body).toMatchObject({ statusCode: 400, error: 'Bad Request', message: expect.stringMatching(/^id ".*" is not an id: a whole number from 1, in plain digits$/) });
      }
      const after = (await api().get('/api/users').set(as(admin)).expect(200)).body as { id: number; name: string }[];
      expect(after).toEqual(before);
    });
  });

  describe('query numbers', () => {
    it('reads "0x10" and "1e3" in a query as text that is not a whole number', async () => {
      for (const limit of ['0x10', '1e3', '%2016']) {
        const response = await api().get(`/api/audit?limit=${limit}`).set(as(admin)).expect(400);
        expect(response.body.details).toEqual(expect.arrayContaining(['limit must be an integer number']));
      }
      await api().get('/api/audit?limit=16').set(as(admin)).expect(200);
    });
  });

  describe('null for a field that may only be left out', () => {
    it('answers 400 with a message for users, zones and outages, and changes nothing', async () => {
      const role = await api().patch('/api/users/1').set(as(admin)).send({ role: null, reason: 'test' }).expect(400);
      expect(role.body.details).toEqual(expect.arrayContaining(['role may be left out but not sent as null']));
      const zone = await createZone(app, admin);
      const zones = (await api().get('/api/zones').set(as(admin)).expect(200)).body as { id: number; code: string; name: string }[];
      const made = zones.find((z) => z.code === zone)!;
      const name = await api().patch(`/api/zones/${made.id}`).set(as(admin)).send({ name: null, reason: 'test' }).expect(400);
      expect(name.body.details).toEqual(expect.arrayContaining([expect.stringMatching(/^name /)]));
      const outage = (await api().post('/api/outages').set(as(operator)).send({ zone, kind: 'outage', start: '2026-11-01T10:00:00Z', note: 'Feeder trip' }).expect(201)).body as { id: number };
      const note = await api().patch(`/api/outages/${outage.id}`).set(as(operator)).send({ note: null, kind: null, start: null, reason: 'test' }).expect(400);
      expect(note.body.details).toEqual(expect.arrayContaining(['note may be left out but not sent as null', 'kind may be left out but not sent as null', 'start may be left out but not sent as null']));
      // null stays allowed where it means something: reopening a window.
      await api().patch(`/api/outages/${outage.id}`).set(as(operator)).send({ end: null, reason: 'still out' }).expect(200);
    });
  });

  describe('times and days', () => {
    it('refuses outage times without an offset, impossible dates and years outside 2000–2100', async () => {
      const zone = await createZone(app, admin);
      const cases: [string, RegExp][] = [
        ['2026-11-01T10:00:00', /start "2026-11-01T10:00:00" has no offset: add Z or ±hh:mm/],
        ['2023-02-30T10:00:00Z', /start "2023-02-30T10:00:00Z" is not a real date: 2023-02 has no day 30/],
        ['2024-02-29T24:00:00Z', /hours run 00 to 23/],
        ['0999-01-01T00:00:00Z', /outside the accepted years 2000 to 2100/],
      ];
      for (const [start, message] of cases) {
        const response = await api().post('/api/outages').set(as(operator)).send({ zone, kind: 'outage', start, note: 'x' }).expect(400);
        expect(response.body.details).toEqual([expect.stringMatching(message)]);
      }
      const list = (await api().get(`/api/outages?zone=${zone}`).set(as(operator)).expect(200)).body as unknown[];
      expect(list).toEqual([]);
    });

    it('refuses operating days that are not real or lie outside the window, in paths and queries', async () => {
      for (const day of ['0000-01-01', '9999-12-31', '2023-02-30']) {
        const schedule = await api().get(`/api/schedules/${day}`).set(as(operator)).expect(400);
        expect(schedule.body.message).toMatch(/^day must be an operating day, YYYY-MM-DD: /);
        const accuracy = await api().get(`/api/accuracy?zone=MILLRACE&from=${day}&to=2026-03-07`).set(as(operator)).expect(400);
        expect(accuracy.body.message).toMatch(/^from must be an operating day, YYYY-MM-DD: /);
      }
    });

    it('refuses 30 February over the feed instead of storing it on 2 March', async () => {
      const zone = await createZone(app, admin);
      const socket = connectFeed(app, (await createFeedKey(app, admin)).apiKey);
      try {
        await connected(socket);
        const ack: ReadingBatchAck = await send(socket, [
          { zone, hour: '2023-02-30T00:00:00Z', mw: 100 },
          { zone, hour: '2023-03-02T00:00:00Z', mw: 200 },
        ]);
        expect(ack.stored).toBe(1);
        expect(ack.rejected).toEqual([{ index: 0, reason: 'malformed', message: 'hour "2023-02-30T00:00:00Z" is not a real date: 2023-02 has no day 30' }]);
        expect(await storedHours(zone)).toEqual([{ hour: '2023-03-02T00:00:00Z', mw: 200 }]);
      } finally {
        socket.disconnect();
      }
    });
  });

  describe('bodies', () => {
    it('answers 413 for a body over 100 KiB, 400 for 3,000 levels of nesting and for prototype keys, in the error shape', async () => {
      const big = await api().post('/api/outages').set(as(operator)).send({ zone: 'MILLRACE', kind: 'outage', start: '2026-11-01T10:00:00Z', note: 'x'.repeat(150 * 1024) }).expect(413);
      expect(big.body).toMatchObject({ statusCode: 413, error: 'Payload Too Large', message: 'The request body is larger than the 100 KiB limit', path: '/api/outages' });
      const deep = await api()
        .post('/api/handover')
        .set(as(operator))
        .set('Content-Type', 'application/json')
        .send(`{"items":${'['.repeat(3000)}${']'.repeat(3000)}}`)
        .expect(400);
      expect(deep.body).toMatchObject({ statusCode: 400, message: 'The body is nested more than 32 levels deep', path: '/api/handover' });
      const polluted = await api().patch('/api/users/1').set(as(admin)).set('Content-Type', 'application/json').send('{"reason":"x","constructor":{"prototype":{"role":"admin"}}}').expect(400);
      expect(polluted.body).toMatchObject({ statusCode: 400, message: 'body has a key "constructor", which no request may carry' });
      const broken = await api().patch('/api/users/1').set(as(admin)).set('Content-Type', 'application/json').send('{"reason":').expect(400);
      expect(broken.body).toMatchObject({ statusCode: 400, error: 'Bad Request', message: 'The request body is not valid JSON', path: '/api/users/1' });
    });
  });

  describe('CSV uploads', () => {
    it('refuses a semicolon- or tab-separated file whole, saying so, and stores nothing', async () => {
      const zone = await createZone(app, admin);
      const semicolons = await upload(zone, 'timestamp;load_mw\n2024-01-10T00:00:00Z;12,5\n2024-01-10T01:00:00Z;13,0\n', 400);
      expect(semicolons.body.message).toMatch(/^The file's columns are separated by semicolons; Morrowline reads comma-separated files only/);
      const tabs = await upload(zone, '2024-01-10T00:00:00Z\t12.5\n', 400);
      expect(tabs.body.message).toMatch(/separated by tabs/);
      expect(await storedHours(zone)).toEqual([]);
    });

    it('refuses hex, binary, exponent and empty loads, and 24:00 or 30 February hours, by line', async () => {
      const zone = await createZone(app, admin);
      const csv = ['timestamp,load_mw', '2024-01-10T00:00:00Z,0x10', '2024-01-10T01:00:00Z,0b101', '2024-01-10T02:00:00Z,1e2', '2024-01-10T03:00:00Z,', '2024-02-29T24:00:00Z,50', '2023-02-30T00:00:00Z,50', '2024-01-10T04:00:00Z,42.5'].join('\n');
      const report = (await upload(zone, csv)).body as CsvUploadReport;
      expect(report).toMatchObject({ rows: 7, accepted: 1, rejectedCount: 6 });
      expect(report.rejected.map((r) => [r.line, r.reason])).toEqual([
        [2, 'not-a-number'],
        [3, 'not-a-number'],
        [4, 'not-a-number'],
        [5, 'empty-load'],
        [6, 'malformed'],
        [7, 'malformed'],
      ]);
      expect(report.rejected[0].message).toBe('load_mw "0x10" is not a plain decimal number (digits, one optional point, no exponent, hex or spaces)');
      expect(await storedHours(zone)).toEqual([{ hour: '2024-01-10T04:00:00Z', mw: 42.5 }]);
    });

    it('reports two rows for one DST-gap instant as duplicates by line, stores neither, and counts hours stored', async () => {
      const zone = await createZone(app, admin);
      // 2024-03-10 02:00 does not exist in Denver; 02:00-06:00 and 01:00-07:00 are both 08:00 UTC.
      const csv = ['timestamp,load_mw', '2024-03-10T00:00:00-07:00,300', '2024-03-10T01:00:00-07:00,310', '2024-03-10T02:00:00-06:00,320', '2024-03-10T03:00:00-06:00,330'].join('\n');
      const report = (await upload(zone, csv)).body as CsvUploadReport;
      expect(report).toMatchObject({ rows: 4, accepted: 2, rejectedCount: 2 });
      expect(report.rejected).toEqual([
        { line: 3, reason: 'duplicate', message: `${zone} 2024-03-10T08:00:00Z is also on line 4; one hour may appear once per file, so none of these rows was stored` },
        { line: 4, reason: 'duplicate', message: `${zone} 2024-03-10T08:00:00Z is also on line 3; one hour may appear once per file, so none of these rows was stored` },
      ]);
      const stored = await storedHours(zone);
      expect(stored).toEqual([
        { hour: '2024-03-10T07:00:00Z', mw: 300 },
        { hour: '2024-03-10T09:00:00Z', mw: 330 },
      ]);
      expect(report.accepted).toBe(stored.length);
    });
  });
});
