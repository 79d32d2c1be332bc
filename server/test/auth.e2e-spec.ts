import type { NestExpressApplication } from '@nestjs/platform-express';
import { JwtService } from '@nestjs/jwt';
import request from 'supertest';
import { ROLES } from '@morrowline/shared';
import { demoUser, startTestApp, tokenFor } from './support/test-app';
import { loadConfig } from '../src/config/configuration';

describe('sign-in and roles (real MariaDB)', () => {
  let app: NestExpressApplication;
  beforeAll(async () => {
    app = await startTestApp();
  });
  afterAll(async () => {
    await app.close();
  });

  it.each(ROLES)('signs in the demo %s and /auth/me answers the role', async (role) => {
    const token = await tokenFor(app, role);
    const me = await request(app.getHttpServer()).get('/api/auth/me').set('Authorization', `Bearer ${token}`).expect(200);
    expect(me.body).toMatchObject({ email: demoUser(role).email, role });
    expect(me.body).not.toHaveProperty('passwordHash');
  });

  it('answers 401 without a token, in the common error shape', async () => {
    const response = await request(app.getHttpServer()).get('/api/zones').expect(401);
    expect(response.body).toMatchObject({ statusCode: 401, error: 'Unauthorized', path: '/api/zones' });
    expect(typeof response.body.timestamp).toBe('string');
  });

  it('answers 401 to a token signed with another secret', async () => {
    const forged = await new JwtService({ secret: 'another-secret' }).signAsync({ sub: 1, email: 'x@y.z', role: 'admin' });
    await request(app.getHttpServer()).get('/api/users').set('Authorization', `Bearer ${forged}`).expect(401);
  });

  it('answers 401 with an expiry message to an expired token', async () => {
    const user = demoUser('admin');
    const jwt = new JwtService({ secret: loadConfig().jwt.secret });
    const expired = await jwt.signAsync({ sub: 6, email: user.email, role: 'admin', exp: Math.floor(Date.now() / 1000) - 10 });
    const response = await request(app.getHttpServer()).get('/api/auth/me').set('Authorization', `Bearer ${expired}`).expect(401);
    expect(response.body.message).toMatch(/expired/);
  });

  it('answers 403 to a viewer on an admin route', async () => {
    const token = await tokenFor(app, 'viewer');
    const response = await request(app.getHttpServer()).get('/api/users').set('Authorization', `Bearer ${token}`).expect(403);
    expect(response.body.message).toMatch(/viewer/);
  });

  it('gives the same 401 for a wrong password and an unknown e-mail', async () => {
    const wrongPassword = await request(app.getHttpServer())
      .post('/api/auth/login')
      .send({ email: demoUser('operator').email, password: 'not-the-password' })
      .expect(401);
    const unknownEmail = await request(app.getHttpServer())
      .post('/api/auth/login')
      .send({ email: 'nobody@tallowmere.example', password: 'not-the-password' })
      .expect(401);
    expect(wrongPassword.body.message).toBe(unknownEmail.body.message);
    expect(wrongPassword.body.message).not.toMatch(/password is wrong|unknown|no such/i);
  });

  it('rejects unknown fields and malformed e-mails with details', async () => {
    const response = await request(app.getHttpServer()).post('/api/auth/login').send({ email: 'not-an-email', password: 'x', admin: true }).expect(400);
    expect(response.body.details).toEqual(expect.arrayContaining(['property admin should not exist', 'email must be an e-mail address']));
  });

  it('answers 429 to rapid repeated wrong sign-ins on one account', async () => {
    const email = 'someone.guessing@tallowmere.example';
    const limit = loadConfig().loginAttemptsPerMinute;
    const statuses: number[] = [];
    for (let i = 0; i < limit + 2; i++) {
      const response = await request(app.getHttpServer()).post('/api/auth/login').send({ email, password: `guess-${i}` });
      statuses.push(response.status);
    }
    expect(statuses.slice(0, limit).every((s) => s === 401)).toBe(true);
    expect(statuses[statuses.length - 1]).toBe(429);
  });

  it('answers health with the database status, without a token', async () => {
    const response = await request(app.getHttpServer()).get('/api/health').expect(200);
    expect(response.body).toMatchObject({ status: 'ok', database: 'up' });
  });

  it('serves the OpenAPI document', async () => {
    const response = await request(app.getHttpServer()).get('/api/docs-json').expect(200);
    expect(Object.keys(response.body.paths)).toEqual(expect.arrayContaining(['/api/auth/login', '/api/users', '/api/zones']));
  });

  it('sends security headers and keeps CORS closed', async () => {
    const response = await request(app.getHttpServer()).get('/api/health').set('Origin', 'https://elsewhere.example');
    expect(response.headers['x-content-type-options']).toBe('nosniff');
    expect(response.headers['access-control-allow-origin']).toBeUndefined();
  });
});
