import type { NestExpressApplication } from '@nestjs/platform-express';
import request from 'supertest';
import { startTestApp, tokenFor } from './support/test-app';

describe('users and the audit trail (real MariaDB)', () => {
  let app: NestExpressApplication;
  let admin: string;
  beforeAll(async () => {
    app = await startTestApp();
    admin = await tokenFor(app, 'admin');
  });
  afterAll(async () => {
    await app.close();
  });
  const api = () => request(app.getHttpServer());

  it('creates a user who can then sign in, and records it', async () => {
    const email = `new.operator.${Date.now()}@tallowmere.example`;
    const created = await api()
      .post('/api/users')
      .set('Authorization', `Bearer ${admin}`)
      .send({ email, name: 'New Operator', role: 'operator', password: 'a-long-password' })
      .expect(201);
    expect(created.body).toMatchObject({ email, role: 'operator', active: true });
    await api().post('/api/auth/login').send({ email, password: 'a-long-password' }).expect(200);

    const audit = await api().get('/api/audit').query({ action: 'user.create', subjectId: String(created.body.id) }).set('Authorization', `Bearer ${admin}`).expect(200);
    expect(audit.body.total).toBe(1);
    expect(audit.body.items[0]).toMatchObject({ actorEmail: 'dana.oakes@tallowmere.example', after: { email, role: 'operator' } });
  });

  it('refuses a duplicate e-mail with 409 and a short password with 400', async () => {
    const body = { email: 'pia.lund@tallowmere.example', name: 'Again', role: 'viewer', password: 'a-long-password' };
    await api().post('/api/users').set('Authorization', `Bearer ${admin}`).send(body).expect(409);
    const short = await api().post('/api/users').set('Authorization', `Bearer ${admin}`).send({ ...body, email: 'short@tallowmere.example', password: 'short' }).expect(400);
    expect(short.body.details).toContain('password must be at least 10 characters');
    const badRole = await api().post('/api/users').set('Authorization', `Bearer ${admin}`).send({ ...body, email: 'r@tallowmere.example', role: 'owner' }).expect(400);
    expect(badRole.body.details[0]).toMatch(/role must be one of/);
  });

  it('changes a role with a reason, audited with before and after; the new role applies at once', async () => {
    const email = `promoted.${Date.now()}@tallowmere.example`;
    const created = await api().post('/api/users').set('Authorization', `Bearer ${admin}`).send({ email, name: 'Soon Supervisor', role: 'viewer', password: 'a-long-password' }).expect(201);
    const login = await api().post('/api/auth/login').send({ email, password: 'a-long-password' }).expect(200);
    const theirToken = login.body.accessToken as string;
    await api().get('/api/audit').set('Authorization', `Bearer ${theirToken}`).expect(403);

    await api().patch(`/api/users/${created.body.id}`).set('Authorization', `Bearer ${admin}`).send({ role: 'supervisor', reason: 'Took over the night shift lead' }).expect(200);
    await api().get('/api/audit').set('Authorization', `Bearer ${theirToken}`).expect(200);

    const audit = await api().get('/api/audit').query({ action: 'user.role-change', subjectId: String(created.body.id) }).set('Authorization', `Bearer ${admin}`).expect(200);
    expect(audit.body.items[0]).toMatchObject({ before: { role: 'viewer' }, after: { role: 'supervisor' }, reason: 'Took over the night shift lead' });
  });

  it('deactivated users lose access at once, and cannot sign in', async () => {
    const email = `leaving.${Date.now()}@tallowmere.example`;
    const created = await api().post('/api/users').set('Authorization', `Bearer ${admin}`).send({ email, name: 'Leaving', role: 'operator', password: 'a-long-password' }).expect(201);
    const token = (await api().post('/api/auth/login').send({ email, password: 'a-long-password' }).expect(200)).body.accessToken as string;
    await api().patch(`/api/users/${created.body.id}`).set('Authorization', `Bearer ${admin}`).send({ active: false, reason: 'Left the cooperative' }).expect(200);
    await api().get('/api/auth/me').set('Authorization', `Bearer ${token}`).expect(401);
    await api().post('/api/auth/login').send({ email, password: 'a-long-password' }).expect(401);
  });

  it('does not let an admin lock themselves out', async () => {
    const me = await api().get('/api/auth/me').set('Authorization', `Bearer ${admin}`).expect(200);
    await api().patch(`/api/users/${me.body.id}`).set('Authorization', `Bearer ${admin}`).send({ active: false }).expect(400);
  });

  it('records sign-ins in the trail', async () => {
    const audit = await api().get('/api/audit').query({ action: 'auth.login', limit: 5 }).set('Authorization', `Bearer ${admin}`).expect(200);
    expect(audit.body.total).toBeGreaterThan(0);
    expect(audit.body.items[0].actorEmail).toMatch(/@tallowmere\.example$/);
  });

  it('keeps the trail append-only even for the database account', async () => {
    const { EntityManager } = await import('@mikro-orm/mariadb');
    const em = app.get(EntityManager).fork();
    await expect(em.getConnection().execute('update audit_entries set reason = ? where id = 1', ['tampered'])).rejects.toThrow(/append-only/);
    await expect(em.getConnection().execute('delete from audit_entries where id = 1')).rejects.toThrow(/append-only/);
  });
});
