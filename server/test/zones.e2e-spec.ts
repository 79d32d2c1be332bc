import type { NestExpressApplication } from '@nestjs/platform-express';
import request from 'supertest';
import { DEMO_ZONES } from '@morrowline/shared';
import { ReadingsService } from '../src/readings/readings.service';
import { startTestApp, tokenFor } from './support/test-app';

describe('zones (real MariaDB)', () => {
  let app: NestExpressApplication;
  let admin: string;
  let viewer: string;
  beforeAll(async () => {
    app = await startTestApp();
    admin = await tokenFor(app, 'admin');
    viewer = await tokenFor(app, 'viewer');
  });
  afterAll(async () => {
    await app.close();
  });
  const api = () => request(app.getHttpServer());

  it('lists the five seeded demo zones to any signed-in role', async () => {
    const response = await api().get('/api/zones').set('Authorization', `Bearer ${viewer}`).expect(200);
    const codes = (response.body as { code: string }[]).map((z) => z.code);
    expect(codes).toEqual(expect.arrayContaining(DEMO_ZONES.map((z) => z.code)));
    expect(response.body[0]).toMatchObject({ timeZone: 'America/Denver', gateClosure: '10:00' });
  });

  it('lets only an admin create a zone, validating every field', async () => {
    const zone = {
      code: `TEST${Date.now() % 100000}`,
      name: 'Test Siding',
      timeZone: 'America/Denver',
      alertThresholdPct: 4,
      alertConsecutiveHours: 3,
      gateClosure: '09:30',
      minPlausibleMw: 0,
      maxPlausibleMw: 90,
    };
    await api().post('/api/zones').set('Authorization', `Bearer ${viewer}`).send(zone).expect(403);
    const bad = await api()
      .post('/api/zones')
      .set('Authorization', `Bearer ${admin}`)
      .send({ ...zone, timeZone: 'Mars/Olympus', gateClosure: '25:00' })
      .expect(400);
    expect(bad.body.details).toEqual(
      expect.arrayContaining(['timeZone must be an IANA time zone such as America/Denver', 'gateClosure must be a local time HH:mm']),
    );
    const created = await api().post('/api/zones').set('Authorization', `Bearer ${admin}`).send(zone).expect(201);
    expect(created.body).toMatchObject({ code: zone.code, active: true });
    await api().post('/api/zones').set('Authorization', `Bearer ${admin}`).send(zone).expect(409);

    const empty = await api().patch(`/api/zones/${created.body.id}`).set('Authorization', `Bearer ${admin}`).send({ minPlausibleMw: 200 }).expect(400);
    expect(empty.body.message).toMatch(/plausible range is empty/);
    const updated = await api().patch(`/api/zones/${created.body.id}`).set('Authorization', `Bearer ${admin}`).send({ alertThresholdPct: 6, reason: 'Noisier feeder' }).expect(200);
    expect(updated.body.alertThresholdPct).toBe(6);
    const unchanged = await api().get('/api/zones').set('Authorization', `Bearer ${admin}`).expect(200);
    expect((unchanged.body as { code: string; minPlausibleMw: number }[]).find((z) => z.code === zone.code)?.minPlausibleMw).toBe(0);
  });

  it('applies a zone change to the very next batch of readings: a narrower range, then the zone switched off', async () => {
    const zone = { code: `SWTC${Date.now() % 100000}`, name: `Switch Hollow ${Date.now() % 100000}`, timeZone: 'America/Denver', alertThresholdPct: 4, alertConsecutiveHours: 3, gateClosure: '09:30', minPlausibleMw: 0, maxPlausibleMw: 90 };
    const created = await api().post('/api/zones').set('Authorization', `Bearer ${admin}`).send(zone).expect(201);
    const readings = app.get(ReadingsService);
    const hour = (h: number) => new Date(Date.UTC(2026, 0, 5, h)).toISOString();
    const send = (h: number, mw: number) => readings.ingest([{ zone: zone.code, hour: hour(h), mw }], { source: 'csv:test@tallowmere.example' });
    // the readings' zone list is read (and kept for a few seconds) by the first batch
    expect(await send(0, 80)).toMatchObject({ stored: 1, rejected: [] });
    await api().patch(`/api/zones/${created.body.id}`).set('Authorization', `Bearer ${admin}`).send({ maxPlausibleMw: 60, reason: 'Feeder split' }).expect(200);
    const narrow = await send(1, 80);
    expect(narrow.stored).toBe(0);
    expect(narrow.rejected[0]).toMatchObject({ reason: 'implausible', message: expect.stringMatching(/plausible range 0–60 MW/) });
    await api().patch(`/api/zones/${created.body.id}`).set('Authorization', `Bearer ${admin}`).send({ active: false, reason: 'Retired' }).expect(200);
    const off = await send(2, 50);
    expect(off.stored).toBe(0);
    expect(off.rejected[0]).toMatchObject({ reason: 'unknown-zone', message: `No zone with code ${zone.code}` });
  });

  it('refuses a second zone with a name already taken, whatever its case, on create and on rename', async () => {
    const zone = { code: `DUPE${Date.now() % 100000}`, name: 'Dupe Hollow', timeZone: 'America/Denver', alertThresholdPct: 4, alertConsecutiveHours: 3, gateClosure: '09:30', minPlausibleMw: 0, maxPlausibleMw: 90 };
    const first = await api().post('/api/zones').set('Authorization', `Bearer ${admin}`).send(zone).expect(201);
    const twin = await api().post('/api/zones').set('Authorization', `Bearer ${admin}`).send({ ...zone, code: `${zone.code}B`, name: ' dupe hollow' }).expect(409);
    expect(twin.body.message).toBe(`Zone ${zone.code} is already called "Dupe Hollow"; choose another name`);
    const other = await api().post('/api/zones').set('Authorization', `Bearer ${admin}`).send({ ...zone, code: `${zone.code}C`, name: 'Dupe Ridge' }).expect(201);
    await api().patch(`/api/zones/${other.body.id}`).set('Authorization', `Bearer ${admin}`).send({ name: 'DUPE HOLLOW', reason: 'rename' }).expect(409);
    // a zone keeps its own name when saved again
    await api().patch(`/api/zones/${first.body.id}`).set('Authorization', `Bearer ${admin}`).send({ name: 'Dupe Hollow', reason: 'unchanged' }).expect(200);
  });
});
