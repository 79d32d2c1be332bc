import type { NestExpressApplication } from '@nestjs/platform-express';
import request from 'supertest';
import type { AuditEntryDto, FeedKeyDto, Page } from '@morrowline/shared';
import { connectFeed, connected, createZone, hourIso, send } from './support/feeds';
import { startTestApp, tokenFor } from './support/test-app';

jest.setTimeout(120_000);

describe('feed keys (real MariaDB)', () => {
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

  it('lets only an admin manage keys', async () => {
    await api().get('/api/feeds/keys').set('Authorization', `Bearer ${operator}`).expect(403);
    await api().post('/api/feeds/keys').set('Authorization', `Bearer ${operator}`).send({ name: 'sneaky' }).expect(403);
    await api().post('/api/feeds/keys/1/revoke').set('Authorization', `Bearer ${operator}`).send({}).expect(403);
    const bad = await api().post('/api/feeds/keys').set('Authorization', `Bearer ${admin}`).send({ name: '', zone: 'lower' }).expect(400);
    expect(bad.body.details).toEqual(expect.arrayContaining(['zone must be a zone code such as MILLRACE']));
  });

  it('shows a new key once, stores only its hash, and audits creation and revocation', async () => {
    const zone = await createZone(app, admin);
    const name = `Harrow substation RTU ${Date.now()}`;
    const created = await api().post('/api/feeds/keys').set('Authorization', `Bearer ${admin}`).send({ name, zone }).expect(201);
    const apiKey = created.body.apiKey as string;
    expect(apiKey).toMatch(/^mlfeed_[A-Za-z0-9_-]{40,}$/);
    expect(created.body.feedKey).toMatchObject({ name, zone, revokedAt: null, prefix: apiKey.slice(0, 13) });
    await api().post('/api/feeds/keys').set('Authorization', `Bearer ${admin}`).send({ name }).expect(409);

    const listed = await api().get('/api/feeds/keys').set('Authorization', `Bearer ${admin}`).expect(200);
    expect(JSON.stringify(listed.body)).not.toContain(apiKey);
    expect(JSON.stringify(listed.body)).not.toMatch(/keyHash|[0-9a-f]{64}/);
    const listedKey = (listed.body as FeedKeyDto[]).find((k) => k.name === name)!;

    // The key works...
    const socket = connectFeed(app, apiKey);
    await connected(socket);
    const ack = await send(socket, [{ zone, hour: hourIso(Math.floor(Date.now() / 3_600_000) * 3_600_000 - 3_600_000), mw: 10 }]);
    expect(ack.stored).toBe(1);

    // ...until it is revoked: a connected feed is cut off at its next batch, a new one refused.
    const revoked = await api().post(`/api/feeds/keys/${listedKey.id}/revoke`).set('Authorization', `Bearer ${admin}`).send({ reason: 'RTU replaced' }).expect(200);
    expect(revoked.body.revokedAt).not.toBeNull();
    const refusedBatch = await send(socket, [{ zone, hour: hourIso(Date.now() - 7_200_000), mw: 10 }]);
    expect(refusedBatch).toMatchObject({ stored: 0, error: expect.stringMatching(/revoked/) });
    socket.close();
    const again = connectFeed(app, apiKey);
    await expect(connected(again)).rejects.toThrow(/revoked/);
    again.close();

    const audit = await api().get(`/api/audit?subjectType=feed-key&subjectId=${listedKey.id}`).set('Authorization', `Bearer ${admin}`).expect(200);
    const actions = (audit.body as Page<AuditEntryDto>).items.map((e) => e.action).sort();
    expect(actions).toEqual(['feed-key.create', 'feed-key.revoke']);
    expect((audit.body as Page<AuditEntryDto>).items.find((e) => e.action === 'feed-key.revoke')?.reason).toBe('RTU replaced');
  });

  it('refuses a connection without a key or with an unknown one', async () => {
    const none = connectFeed(app, undefined);
    await expect(connected(none)).rejects.toThrow(/apiKey/);
    none.close();
    const wrong = connectFeed(app, 'mlfeed_not-a-real-key');
    await expect(connected(wrong)).rejects.toThrow(/not known/);
    wrong.close();
  });
});
