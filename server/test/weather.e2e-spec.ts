import type { NestExpressApplication } from '@nestjs/platform-express';
import type { Socket } from 'socket.io-client';
import request from 'supertest';
import {
  gateClosureAt,
  operatingDayBounds,
  operatingDayOf,
  WEATHER_EVENT,
  type AccuracyReportDto,
  type AuditEntryDto,
  type Page,
  type WeatherBatch,
  type WeatherBatchAck,
  type WeatherCsvReport,
  type ZoneWeatherSeriesDto,
} from '@morrowline/shared';
import { connectFeed, connected, createFeedKey, createZone, send, unique } from './support/feeds';
import { startTestApp, tokenFor } from './support/test-app';

jest.setTimeout(120_000);

const H = 3_600_000;
const iso = (ms: number) => new Date(ms).toISOString();

function sendWeather(socket: Socket, batch: Omit<WeatherBatch, 'batchId'>): Promise<WeatherBatchAck> {
  return new Promise((resolve) => socket.emit(WEATHER_EVENT, { batchId: unique(), ...batch }, resolve));
}

describe('weather: stations, ingest, vintages (real MariaDB)', () => {
  let app: NestExpressApplication;
  let admin: string;
  let operator: string;
  let viewer: string;
  const api = () => request(app.getHttpServer());
  const now = Date.now();
  const hour = Math.floor(now / H) * H;

  beforeAll(async () => {
    app = await startTestApp();
    [admin, operator, viewer] = await Promise.all([tokenFor(app, 'admin'), tokenFor(app, 'operator'), tokenFor(app, 'viewer')]);
  });
  afterAll(async () => {
    await app.close();
  });

  async function station(): Promise<string> {
    const code = `S${unique()}`.slice(0, 32);
    await api().post('/api/weather/stations').set('Authorization', `Bearer ${admin}`).send({ code, name: `Station ${code}`, timeZone: 'America/Denver', elevationM: 1600 }).expect(201);
    return code;
  }

  /** A zone whose temperature is the given stations' weighted average. */
  async function zoneOf(weights: { station: string; weight: number }[]): Promise<string> {
    const zone = await createZone(app, admin);
    await api().put(`/api/weather/zone-stations/${zone}`).set('Authorization', `Bearer ${admin}`).send({ stations: weights }).expect(200);
    return zone;
  }

  async function series(zone: string, query: Record<string, string>): Promise<ZoneWeatherSeriesDto> {
    const response = await api().get('/api/weather/zones').query({ zone, ...query }).set('Authorization', `Bearer ${viewer}`).expect(200);
    return response.body as ZoneWeatherSeriesDto;
  }

  it('lets only an admin add stations and set a zone\'s weights, and audits the weights before and after', async () => {
    const a = await station();
    const b = await station();
    await api().post('/api/weather/stations').set('Authorization', `Bearer ${operator}`).send({ code: 'SNEAKY', name: 'x', timeZone: 'UTC' }).expect(403);
    await api().post('/api/weather/stations').set('Authorization', `Bearer ${admin}`).send({ code: a, name: 'again', timeZone: 'America/Denver' }).expect(409);
    const bad = await api().post('/api/weather/stations').set('Authorization', `Bearer ${admin}`).send({ code: 'lower case', name: 'x', timeZone: 'Mars/Olympus' }).expect(400);
    expect(bad.body.details).toEqual(expect.arrayContaining([expect.stringMatching(/code must be a station code/)]));
    const zone = await zoneOf([{ station: a, weight: 1 }]);
    await api().put(`/api/weather/zone-stations/${zone}`).set('Authorization', `Bearer ${operator}`).send({ stations: [] }).expect(403);
    await api().put(`/api/weather/zone-stations/${zone}`).set('Authorization', `Bearer ${admin}`).send({ stations: [{ station: 'NOSUCHSTATION', weight: 1 }] }).expect(400);
    await api()
      .put(`/api/weather/zone-stations/${zone}`)
      .set('Authorization', `Bearer ${admin}`)
      .send({ stations: [{ station: a, weight: 0.6 }, { station: b, weight: 0.4 }] })
      .expect(200);
    const audit = await api().get(`/api/audit?subjectType=zone&subjectId=${zone}&action=weather.zone-stations.set`).set('Authorization', `Bearer ${admin}`).expect(200);
    const last = (audit.body as Page<AuditEntryDto>).items[0];
    expect(last.before).toEqual([{ station: a, weight: 1 }]);
    expect(last.after).toEqual([{ station: a, weight: 0.6 }, { station: b, weight: 0.4 }]);
  });

  it('takes observations and forecast vintages over the feed socket with a key scoped to the station', async () => {
    const code = await station();
    const other = await station();
    const zone = await zoneOf([{ station: code, weight: 1 }]);
    const key = await createFeedKey(app, admin);
    const scoped = (await api().post('/api/feeds/keys').set('Authorization', `Bearer ${admin}`).send({ name: `weather ${unique()}`, station: code }).expect(201)).body.apiKey as string;
    await api().post('/api/feeds/keys').set('Authorization', `Bearer ${admin}`).send({ name: `both ${unique()}`, station: code, zone }).expect(400);

    const socket = connectFeed(app, scoped);
    await connected(socket);
    const issuedAt = iso(hour - 2 * H + 30 * 60_000);
    const ack = await sendWeather(socket, {
      observations: [
        { station: code, hour: iso(hour - 2 * H), tempC: -4.5 },
        { station: code, hour: iso(hour - H), tempC: 81 },
        { station: other, hour: iso(hour - H), tempC: 2 },
      ],
      forecasts: [
        { station: code, issuedAt, hour: iso(hour + H), tempC: -1.2 },
        { station: code, issuedAt, hour: iso(hour + H), tempC: -3.4, member: 'p10' },
        { station: code, issuedAt, hour: iso(hour + 17 * 24 * H), tempC: 5 },
      ],
    });
    expect(ack.error).toBeUndefined();
    expect(ack.stored).toBe(3);
    expect(ack.rejected.map((r) => `${r.list}#${r.index} ${r.reason}`)).toEqual([
      'observations#1 implausible',
      'observations#2 station-not-allowed',
      'forecasts#2 too-far-in-future',
    ]);
    // A station-scoped key sends no readings.
    const readings = await send(socket, [{ zone, hour: iso(hour - H), mw: 10 }]);
    expect(readings.rejected[0]).toMatchObject({ reason: 'zone-not-allowed' });
    socket.close();

    // The unscoped key sends weather for any station.
    const open = connectFeed(app, key.apiKey);
    await connected(open);
    expect((await sendWeather(open, { observations: [{ station: other, hour: iso(hour - H), tempC: 2 }] })).stored).toBe(1);
    open.close();

    const got = await series(zone, { from: iso(hour - 2 * H), to: iso(hour + 2 * H) });
    expect(got.zones[0].observedC).toEqual([-4.5, null, null, null]);
    expect(got.zones[0].forecastC).toEqual([null, null, null, -1.2]);
    expect(got.zones[0].forecastIssuedAt[3]).toBe(issuedAt);
  });

  it('keeps the value with the highest version of an hour whatever order batches arrive in', async () => {
    const code = await station();
    const zone = await zoneOf([{ station: code, weight: 1 }]);
    const key = await createFeedKey(app, admin);
    const socket = connectFeed(app, key.apiKey);
    await connected(socket);
    const v = now * 1000;
    await sendWeather(socket, { observations: [{ station: code, hour: iso(hour - 3 * H), tempC: 7.5, version: v + 2 }] });
    await sendWeather(socket, { observations: [{ station: code, hour: iso(hour - 3 * H), tempC: 3.5, version: v + 1 }] });
    const bad = await sendWeather(socket, { observations: [{ station: code, hour: iso(hour - 3 * H), tempC: 3.5, version: 12 }] });
    expect(bad.rejected[0]).toMatchObject({ reason: 'malformed' });
    socket.close();
    expect((await series(zone, { from: iso(hour - 3 * H), to: iso(hour - 2 * H) })).zones[0].observedC).toEqual([7.5]);
  });

  it('never overwrites a vintage, and answers forecasts as known at a time from vintages issued by then only', async () => {
    const code = await station();
    const zone = await zoneOf([{ station: code, weight: 1 }]);
    const key = await createFeedKey(app, admin);
    const socket = connectFeed(app, key.apiKey);
    await connected(socket);
    const first = hour - 30 * H;
    const second = hour - 18 * H;
    const target = [hour + 6 * H, hour + 7 * H];
    const vintage = (issued: number, base: number) => target.map((h, i) => ({ station: code, issuedAt: iso(issued), hour: iso(h), tempC: base + i }));
    expect((await sendWeather(socket, { forecasts: vintage(first, 10) })).stored).toBe(2);
    expect((await sendWeather(socket, { forecasts: vintage(second, 20) })).stored).toBe(2);
    // A resend of the same values is a repeat; a different value for a stored key is refused.
    expect(await sendWeather(socket, { forecasts: vintage(first, 10) })).toMatchObject({ stored: 2, rejected: [] });
    const overwrite = await sendWeather(socket, { forecasts: vintage(first, 30) });
    expect(overwrite.stored).toBe(0);
    expect(overwrite.rejected.map((r) => r.reason)).toEqual(['vintage-exists', 'vintage-exists']);
    socket.close();

    const range = { from: iso(target[0]), to: iso(target[1] + H) };
    expect((await series(zone, { ...range, asOf: iso(first - 1) })).zones[0].forecastC).toEqual([null, null]);
    const between = await series(zone, { ...range, asOf: iso(second - 1000) });
    expect(between.zones[0].forecastC).toEqual([10, 11]);
    expect(between.zones[0].forecastIssuedAt).toEqual([iso(first), iso(first)]);
    expect((await series(zone, { ...range, asOf: iso(second) })).zones[0].forecastC).toEqual([20, 21]);
    expect((await series(zone, range)).zones[0].latestIssuedAt).toBe(iso(second));
    // Every hour of every answer for asOf in between comes from a vintage issued by then.
    for (let asOf = first - H; asOf <= second + H; asOf += 3 * H) {
      for (const issued of (await series(zone, { ...range, asOf: iso(asOf) })).zones[0].forecastIssuedAt) {
        if (issued !== null) expect(Date.parse(issued)).toBeLessThanOrEqual(asOf);
      }
    }
  });

  it('averages a zone\'s stations by weight and leaves an hour empty when one of them has no value', async () => {
    const a = await station();
    const b = await station();
    const zone = await zoneOf([{ station: a, weight: 3 }, { station: b, weight: 1 }]);
    const key = await createFeedKey(app, admin);
    const socket = connectFeed(app, key.apiKey);
    await connected(socket);
    await sendWeather(socket, {
      observations: [
        { station: a, hour: iso(hour - 2 * H), tempC: 10 },
        { station: b, hour: iso(hour - 2 * H), tempC: 2 },
        { station: a, hour: iso(hour - H), tempC: 10 },
      ],
    });
    socket.close();
    expect((await series(zone, { from: iso(hour - 2 * H), to: iso(hour) })).zones[0].observedC).toEqual([8, null]);
  });

  it('reads a forecast CSV upload, reports each bad row by its line, and downloads what it stored', async () => {
    const code = await station();
    const issued = iso(hour - 5 * H);
    const csv = [
      'issued_at,timestamp,station,temp_c,member',
      `${issued},${iso(hour + H)},${code},4.5,`,
      `${issued},${iso(hour + 2 * H)},${code},4.0,p90`,
      `${issued},${iso(hour + 3 * H)},${code},1e3,`,
      `${issued},2026-02-30T00:00:00Z,${code},1,`,
      `${issued},${iso(hour + 4 * H)},NOSUCH,1,`,
      `${issued},${iso(hour + 5 * H)},${code},3,`,
      `${issued},${iso(hour + 5 * H)},${code},3.5,`,
      `${issued},${iso(hour + 6 * H + 1800_000)},${code},3,`,
    ].join('\n');
    await api().post('/api/weather/forecasts/upload').set('Authorization', `Bearer ${viewer}`).attach('file', Buffer.from(csv), 'f.csv').expect(403);
    const response = await api().post('/api/weather/forecasts/upload').set('Authorization', `Bearer ${operator}`).attach('file', Buffer.from(csv), 'forecast.csv').expect(201);
    const report = response.body as WeatherCsvReport;
    expect(report).toMatchObject({ fileName: 'forecast.csv', rows: 8, accepted: 2, rejectedCount: 6 });
    expect(report.rejected.map((r) => `${r.line} ${r.reason}`)).toEqual(['4 not-a-number', '5 malformed', '6 unknown-station', '7 duplicate', '8 duplicate', '9 not-on-the-hour']);

    const semicolons = await api().post('/api/weather/observed/upload').set('Authorization', `Bearer ${operator}`).attach('file', Buffer.from('timestamp;station;temp_c\n'), 'o.csv').expect(400);
    expect(semicolons.body.message).toMatch(/semicolons.*timestamp,station,temp_c/);

    const download = await api()
      .get('/api/weather/forecasts/export')
      .query({ station: code, from: iso(hour - 6 * H), to: iso(hour) })
      .set('Authorization', `Bearer ${viewer}`)
      .expect(200);
    expect(download.text).toBe(`issued_at,timestamp,station,temp_c,member\n${issued},${iso(hour + H)},${code},4.5,\n${issued},${iso(hour + 2 * H)},${code},4,p90\n`);
  });

  it('reads an observed CSV upload and downloads it in the same columns', async () => {
    const code = await station();
    const csv = `timestamp,station,temp_c\n${iso(hour - 2 * H)},${code.toLowerCase()},-0.5\n${iso(hour - H)},${code},0\n${iso(hour + 5 * H)},${code},0\n`;
    const report = (await api().post('/api/weather/observed/upload').set('Authorization', `Bearer ${operator}`).attach('file', Buffer.from(csv), 'o.csv').expect(201)).body as WeatherCsvReport;
    expect(report).toMatchObject({ rows: 3, accepted: 2, rejectedCount: 1, rejected: [{ line: 4, reason: 'too-far-in-future' }] });
    const download = await api().get('/api/weather/observed/export').query({ station: code, from: iso(hour - 3 * H), to: iso(hour) }).set('Authorization', `Bearer ${viewer}`).expect(200);
    expect(download.text).toBe(`timestamp,station,temp_c\n${iso(hour - 2 * H)},${code},-0.5\n${iso(hour - H)},${code},0\n`);
  });

  it('flags a station whose forecasts have stopped', async () => {
    const code = await station();
    const status = (await api().get('/api/weather/status').set('Authorization', `Bearer ${viewer}`).expect(200)).body as { station: string; forecastStale: boolean; observedStale: boolean }[];
    expect(status.find((s) => s.station === code)).toMatchObject({ forecastStale: true, observedStale: true });
  });

  it('sets each day\'s temperature forecast error beside the load accuracy, from the forecast known at the day\'s gate closure', async () => {
    const code = await station();
    const zone = await zoneOf([{ station: code, weight: 1 }]);
    const day = operatingDayOf(hour - 72 * H, 'America/Denver');
    const { from, to } = operatingDayBounds(day, 'America/Denver');
    const gate = gateClosureAt(day, 'America/Denver', '10:00');
    const key = await createFeedKey(app, admin);
    const socket = connectFeed(app, key.apiKey);
    await connected(socket);
    const observations = [];
    const known = [];
    const later = [];
    for (let h = from; h < to; h += H) {
      observations.push({ station: code, hour: iso(h), tempC: 5 });
      // Known at gate closure: 1.5 °C too warm. Issued after it: far off, and must not count.
      known.push({ station: code, issuedAt: iso(gate - 2 * H), hour: iso(h), tempC: 6.5 });
      later.push({ station: code, issuedAt: iso(gate + H), hour: iso(h), tempC: -20 });
    }
    expect((await sendWeather(socket, { observations, forecasts: [...known, ...later] })).rejected).toEqual([]);
    socket.close();
    const report = (await api().get('/api/accuracy').query({ zone, from: day, to: day }).set('Authorization', `Bearer ${viewer}`).expect(200)).body as AccuracyReportDto;
    expect(report.zones[0].days[0].temperature).toEqual({ asOf: iso(gate), hours: (to - from) / H, maeC: 1.5, biasC: 1.5 });
    expect(report.system.days[0].temperature ?? null).toBeNull();
  });

  it('keeps the demo stations and the zones\' weights from the seed', async () => {
    const stations = (await api().get('/api/weather/stations').set('Authorization', `Bearer ${viewer}`).expect(200)).body as { code: string; zones: { zone: string; weight: number }[] }[];
    expect(stations.find((s) => s.code === 'VALLEYFLOOR')?.zones).toEqual(expect.arrayContaining([{ zone: 'HARROW', weight: 0.6 }, { zone: 'MILLRACE', weight: 1 }]));
  });
});

describe('the holiday calendar (real MariaDB)', () => {
  let app: NestExpressApplication;
  let supervisor: string;
  let operator: string;
  let admin: string;
  const api = () => request(app.getHttpServer());
  beforeAll(async () => {
    app = await startTestApp();
    [supervisor, operator, admin] = await Promise.all([tokenFor(app, 'supervisor'), tokenFor(app, 'operator'), tokenFor(app, 'admin')]);
  });
  afterAll(async () => {
    await app.close();
  });

  it('holds the seeded demo holidays', async () => {
    const days = (await api().get('/api/calendar').query({ from: '2026-12-01', to: '2026-12-31' }).set('Authorization', `Bearer ${operator}`).expect(200)).body as { day: string; name: string }[];
    expect(days).toEqual(expect.arrayContaining([expect.objectContaining({ day: '2026-12-24', name: 'Winter Eve', kind: 'public-holiday', zones: [] })]));
  });

  it('lets supervisors and admins keep it, audited, and refuses an impossible day', async () => {
    const name = `Test fair ${unique()}`;
    await api().post('/api/calendar').set('Authorization', `Bearer ${operator}`).send({ day: '2031-05-02', name, kind: 'local-event' }).expect(403);
    await api().post('/api/calendar').set('Authorization', `Bearer ${supervisor}`).send({ day: '2031-02-30', name, kind: 'local-event' }).expect(400);
    await api().post('/api/calendar').set('Authorization', `Bearer ${supervisor}`).send({ day: '2031-05-02', name, kind: 'fiesta' }).expect(400);
    const created = await api().post('/api/calendar').set('Authorization', `Bearer ${supervisor}`).send({ day: '2031-05-02', name, kind: 'local-event', zones: ['LANTERN'] }).expect(201);
    expect(created.body).toMatchObject({ day: '2031-05-02', name, kind: 'local-event', zones: ['LANTERN'] });
    await api().post('/api/calendar').set('Authorization', `Bearer ${supervisor}`).send({ day: '2031-05-02', name, kind: 'local-event' }).expect(409);
    const id = created.body.id as number;
    const patched = await api().patch(`/api/calendar/${id}`).set('Authorization', `Bearer ${admin}`).send({ kind: 'bridge-day', zones: [], reason: 'whole valley off' }).expect(200);
    expect(patched.body).toMatchObject({ kind: 'bridge-day', zones: [] });
    await api().delete(`/api/calendar/${id}`).set('Authorization', `Bearer ${supervisor}`).expect(204);
    await api().delete(`/api/calendar/${id}`).set('Authorization', `Bearer ${supervisor}`).expect(404);
    const audit = await api().get(`/api/audit?subjectType=special-day&subjectId=${id}`).set('Authorization', `Bearer ${admin}`).expect(200);
    expect((audit.body as Page<AuditEntryDto>).items.map((e) => e.action).sort()).toEqual(['calendar.day.create', 'calendar.day.delete', 'calendar.day.update']);
  });
});
