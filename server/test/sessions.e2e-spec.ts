import { JwtService } from '@nestjs/jwt';
import type { NestExpressApplication } from '@nestjs/platform-express';
import { io, type Socket } from 'socket.io-client';
import request from 'supertest';
import { DESK_EVENTS, DESK_NAMESPACE, type UserDto } from '@morrowline/shared';
import { loadConfig } from '../src/config/configuration';
import { baseUrl, demoUser, startTestApp, tokenFor } from './support/test-app';

function desk(app: NestExpressApplication, token: string, namespace = DESK_NAMESPACE): Socket {
  return io(`${baseUrl(app)}${namespace}`, { auth: { token }, transports: ['websocket'], reconnection: false });
}

/** Resolves once the socket is connected and greeted. */
async function greeted(socket: Socket): Promise<void> {
  await new Promise((resolve, reject) => {
    socket.once(DESK_EVENTS.hello, resolve);
    socket.once('connect_error', reject);
  });
}

/** Resolves with the reason the server gave when it closed the socket. */
function closedByServer(socket: Socket): Promise<string> {
  return new Promise((resolve) => socket.once('disconnect', (reason) => resolve(reason)));
}

function refusal(socket: Socket): Promise<Error> {
  return new Promise((resolve) => socket.once('connect_error', resolve));
}

describe('sessions that end (real MariaDB)', () => {
  let app: NestExpressApplication;
  let admin: string;
  const api = () => request(app.getHttpServer());
  const as = (token: string) => ({ Authorization: `Bearer ${token}` });

  beforeAll(async () => {
    app = await startTestApp();
    admin = await tokenFor(app, 'admin');
  });
  afterAll(async () => {
    await app.close();
  });

  async function newUser(role: 'viewer' | 'operator'): Promise<{ user: UserDto; token: string }> {
    const email = `session.${role}.${Date.now()}.${Math.floor(Math.random() * 1e6)}@tallowmere.example`;
    const password = 'a-long-enough-password';
    const user = (await api().post('/api/users').set(as(admin)).send({ email, name: 'Session Test', role, password }).expect(201)).body as UserDto;
    const token = ((await api().post('/api/auth/login').send({ email, password }).expect(200)).body as { accessToken: string }).accessToken;
    return { user, token };
  }

  it('sign-out ends the token on the server, and closes the desk socket', async () => {
    const { token } = await newUser('operator');
    const socket = desk(app, token);
    await greeted(socket);
    const closed = closedByServer(socket);
    await api().post('/api/auth/logout').set(as(token)).expect(204);
    expect(await closed).toBe('io server disconnect');
    const after = await api().get('/api/auth/me').set(as(token)).expect(401);
    expect(after.body.message).toBe('Your session has ended; sign in again');
    const again = desk(app, token);
    expect((await refusal(again)).message).toBe('Your session has ended; sign in again');
    again.close();
  });

  it('a new sign-in after sign-out works', async () => {
    const user = demoUser('viewer');
    const first = await tokenFor(app, 'viewer');
    await api().post('/api/auth/logout').set(as(first)).expect(204);
    const second = ((await api().post('/api/auth/login').send({ email: user.email, password: user.password }).expect(200)).body as { accessToken: string }).accessToken;
    await api().get('/api/auth/me').set(as(second)).expect(200);
    await api().get('/api/auth/me').set(as(first)).expect(401);
  });

  it('deactivation closes the open desk socket and refuses the token', async () => {
    const { user, token } = await newUser('viewer');
    const socket = desk(app, token);
    await greeted(socket);
    const closed = closedByServer(socket);
    await api().patch(`/api/users/${user.id}`).set(as(admin)).send({ active: false, reason: 'left the cooperative' }).expect(200);
    expect(await closed).toBe('io server disconnect');
    expect((await api().get('/api/auth/me').set(as(token)).expect(401)).body.message).toMatch(/no longer active/);
  });

  it('a role change closes the desk socket; it reconnects with the new role', async () => {
    const { user, token } = await newUser('viewer');
    const socket = desk(app, token);
    await greeted(socket);
    const closed = closedByServer(socket);
    await api().patch(`/api/users/${user.id}`).set(as(admin)).send({ role: 'operator', reason: 'trained' }).expect(200);
    expect(await closed).toBe('io server disconnect');
    const again = desk(app, token);
    const hello = await new Promise<{ user: { role: string } }>((resolve) => again.once(DESK_EVENTS.hello, resolve));
    expect(hello.user.role).toBe('operator');
    again.close();
  });

  it('closes a desk socket when its token expires', async () => {
    const { user, token } = await newUser('viewer');
    const claims = new JwtService().decode<{ sv: number }>(token);
    const shortLived = await new JwtService({ secret: loadConfig().jwt.secret }).signAsync(
      { sub: user.id, email: user.email, role: user.role, sv: claims.sv },
      { expiresIn: 2 },
    );
    const socket = desk(app, shortLived);
    await greeted(socket);
    expect(await closedByServer(socket)).toBe('io server disconnect');
  });

  it('refuses a garbage token as not valid, not as expired (HTTP and socket)', async () => {
    const garbage = 'eyJhbGciOiJIUzI1NiJ9.eyJzdWIiOjF9.not-a-signature';
    const http = await api().get('/api/auth/me').set(as(garbage)).expect(401);
    expect(http.body.message).toBe('Your sign-in is not valid; sign in again');
    const socket = desk(app, garbage);
    expect((await refusal(socket)).message).toBe('Your sign-in is not valid; sign in again');
    socket.close();
  });

  it('refuses connections to the root socket namespace, token or not', async () => {
    const socket = desk(app, await tokenFor(app, 'operator'), '/');
    expect((await refusal(socket)).message).toMatch(/Connect to \/desk/);
    socket.close();
  });
});

describe('sign-in limits (real MariaDB)', () => {
  let app: NestExpressApplication;
  const api = () => request(app.getHttpServer());

  afterEach(async () => {
    await app.close();
    delete process.env.TRUST_PROXY;
    delete process.env.PASSWORD_CHECK_CONCURRENCY;
    delete process.env.PASSWORD_CHECK_QUEUE;
  });

  it('does not believe X-Forwarded-For unless TRUST_PROXY names the proxy', async () => {
    app = await startTestApp();
    const admin = await tokenFor(app, 'admin');
    const email = `spoofer.${Date.now()}@tallowmere.example`;
    await api().post('/api/auth/login').set('X-Forwarded-For', '203.0.113.77').send({ email, password: 'guess' }).expect(401);
    const audit = await api().get('/api/audit').query({ action: 'auth.login-failed' }).set('Authorization', `Bearer ${admin}`).expect(200);
    const entries = (audit.body.items ?? audit.body) as { after: { email?: string; address?: string } | null }[];
    const mine = entries.find((e) => e.after?.email === email);
    expect(mine?.after?.address).toMatch(/127\.0\.0\.1/);
  });

  it('limits one e-mail across addresses, and every 429 says Retry-After', async () => {
    process.env.TRUST_PROXY = 'loopback';
    app = await startTestApp();
    const email = `rotating.${Date.now()}@tallowmere.example`;
    const limit = loadConfig().loginAttemptsPerMinute;
    const statuses: number[] = [];
    let retryAfter: string | undefined;
    for (let i = 0; i < limit + 1; i++) {
      const response = await api().post('/api/auth/login').set('X-Forwarded-For', `198.51.100.${i + 1}`).send({ email, password: `guess-${i}` });
      statuses.push(response.status);
      retryAfter = response.headers['retry-after'];
    }
    expect(statuses.slice(0, limit).every((s) => s === 401)).toBe(true);
    expect(statuses[limit]).toBe(429);
    expect(Number(retryAfter)).toBeGreaterThan(0);
  });

  it('checks at most the configured number of passwords at once; the rest get 503 with Retry-After, none a 500', async () => {
    process.env.TRUST_PROXY = 'loopback';
    process.env.PASSWORD_CHECK_CONCURRENCY = '1';
    process.env.PASSWORD_CHECK_QUEUE = '0';
    app = await startTestApp();
    const responses = await Promise.all(
      Array.from({ length: 8 }, (_, i) =>
        api().post('/api/auth/login').set('X-Forwarded-For', `192.0.2.${i + 1}`).send({ email: `unknown.${i}.${Date.now()}@tallowmere.example`, password: 'guess' }),
      ),
    );
    const statuses = responses.map((r) => r.status);
    expect(statuses.every((s) => s === 401 || s === 503)).toBe(true);
    const busy = responses.filter((r) => r.status === 503);
    expect(busy.length).toBeGreaterThan(0);
    expect(busy.every((r) => Number(r.headers['retry-after']) > 0)).toBe(true);
    expect(busy[0].body.message).toMatch(/busy checking other sign-ins/);
  });
});
