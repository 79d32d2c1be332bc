import type { NestExpressApplication } from '@nestjs/platform-express';
import request from 'supertest';
import { DEMO_ZONES } from '@morrowline/shared';
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
