import type { NestExpressApplication } from '@nestjs/platform-express';
import { io, type Socket } from 'socket.io-client';
import { DESK_EVENTS, DESK_NAMESPACE, type DeskHello } from '@morrowline/shared';
import { baseUrl, startTestApp, tokenFor } from './support/test-app';

function connect(app: NestExpressApplication, token?: string): Socket {
  return io(`${baseUrl(app)}${DESK_NAMESPACE}`, { auth: token ? { token } : {}, transports: ['websocket'], reconnection: false });
}

describe('the desk socket refuses connections without a valid token', () => {
  let app: NestExpressApplication;
  beforeAll(async () => {
    app = await startTestApp();
  });
  afterAll(async () => {
    await app.close();
  });

  it('refuses a connection with no token', async () => {
    const socket = connect(app);
    const error = await new Promise<Error>((resolve) => socket.on('connect_error', resolve));
    expect(error.message).toMatch(/Sign in/);
    socket.close();
  });

  it('refuses a forged token', async () => {
    const socket = connect(app, 'eyJhbGciOiJIUzI1NiJ9.eyJzdWIiOjF9.forged');
    const error = await new Promise<Error>((resolve) => socket.on('connect_error', resolve));
    expect(error.message).toMatch(/expired|sign in/i);
    socket.close();
  });

  it('greets a signed-in viewer with who they are', async () => {
    const socket = connect(app, await tokenFor(app, 'viewer'));
    const hello = await new Promise<DeskHello>((resolve, reject) => {
      socket.on(DESK_EVENTS.hello, resolve);
      socket.on('connect_error', reject);
    });
    expect(hello.user.role).toBe('viewer');
    socket.close();
  });
});
