import type { NestExpressApplication } from '@nestjs/platform-express';
import { io } from 'socket.io-client';
import request from 'supertest';
import { DESK_NAMESPACE } from '@morrowline/shared';
import { DatabaseProxy } from './support/db-proxy';
import { baseUrl, demoUser, startTestApp, tokenFor } from './support/test-app';

const DATABASE_DOWN = 'The server cannot reach its database; try again shortly';

/** What a desk sees when the server loses its database mid-session, and after it is back. */
describe('a database outage is a 503, not a sign-out (real MariaDB behind a relay)', () => {
  const proxy = new DatabaseProxy(Number(process.env.DB_PORT ?? 3308));
  const savedPort = process.env.DB_PORT;
  let app: NestExpressApplication;
  let token: string;
  const api = () => request(app.getHttpServer());

  beforeAll(async () => {
    process.env.DB_PORT = String(await proxy.open());
    try {
      app = await startTestApp();
    } finally {
      process.env.DB_PORT = savedPort;
    }
    token = await tokenFor(app, 'operator');
    await api().get('/api/auth/me').set('Authorization', `Bearer ${token}`).expect(200);
    await proxy.cut();
  });
  afterAll(async () => {
    await proxy.open().catch(() => undefined);
    await app.close();
    await proxy.cut();
  });

  /** No driver message, no address: neither the database's nor the relay's port. */
  function expectNoInternals(text: string): void {
    expect(text).not.toMatch(/ECONN|ER_|SqlError|127\.0\.0\.1|localhost|pool/i);
    expect(text).not.toContain(String(proxy.port));
  }

  it('answers a signed-in request 503 with Retry-After, not 401', async () => {
    const response = await api().get('/api/auth/me').set('Authorization', `Bearer ${token}`);
    expect(response.status).toBe(503);
    expect(response.body).toMatchObject({ statusCode: 503, message: DATABASE_DOWN });
    expect(Number(response.headers['retry-after'])).toBeGreaterThan(0);
    expectNoInternals(JSON.stringify(response.body));
  });

  it('answers sign-in 503, not 500 or 401', async () => {
    const user = demoUser('viewer');
    const response = await api().post('/api/auth/login').send({ email: user.email, password: user.password });
    expect(response.status).toBe(503);
    expect(response.body.message).toBe(DATABASE_DOWN);
    expectNoInternals(JSON.stringify(response.body));
  });

  it('answers health 503 with the database down', async () => {
    const response = await api().get('/api/health').expect(503);
    expect(response.body).toMatchObject({ status: 'degraded', database: 'down' });
  });

  it('refuses a desk socket handshake with the same sentence, no driver message or address', async () => {
    const socket = io(`${baseUrl(app)}${DESK_NAMESPACE}`, { auth: { token }, transports: ['websocket'], reconnection: false });
    const error = await new Promise<Error>((resolve) => socket.on('connect_error', resolve));
    socket.close();
    expect(error.message).toBe(DATABASE_DOWN);
    expectNoInternals(error.message);
  });

  it('takes the same token again once the database is back: nobody was signed out', async () => {
    await proxy.open();
    await api().get('/api/auth/me').set('Authorization', `Bearer ${token}`).expect(200);
    await api().get('/api/health').expect(200);
  });
});
