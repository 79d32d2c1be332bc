import type { NestExpressApplication } from '@nestjs/platform-express';
import request from 'supertest';
import { DEMO_USERS, type HandoverDraftDto, type HandoverNoteDto } from '@morrowline/shared';
import { startTestApp, tokenFor } from './support/test-app';

async function signIn(app: NestExpressApplication, email: string): Promise<string> {
  const user = DEMO_USERS.find((u) => u.email === email)!;
  const response = await request(app.getHttpServer()).post('/api/auth/login').send({ email, password: user.password }).expect(200);
  return response.body.accessToken as string;
}

describe('the shift log (real MariaDB)', () => {
  let app: NestExpressApplication;
  let ines: string; // operator, outgoing
  let tomas: string; // operator, incoming
  beforeAll(async () => {
    app = await startTestApp();
    ines = await signIn(app, 'ines.marlow@tallowmere.example');
    tomas = await signIn(app, 'tomas.reedy@tallowmere.example');
  });
  afterAll(async () => {
    await app.close();
  });
  const api = () => request(app.getHttpServer());

  it('tells the current shift and who signed in during it', async () => {
    const response = await api().get('/api/handover/shift').set('Authorization', `Bearer ${ines}`).expect(200);
    expect(Date.parse(response.body.current.start)).toBeLessThanOrEqual(Date.now());
    expect(Date.parse(response.body.current.end)).toBeGreaterThan(Date.now());
    expect(response.body.previous.end).toBe(response.body.current.start);
    expect(response.body.onShift.map((u: { name: string }) => u.name)).toEqual(expect.arrayContaining(['Ines Marlow', 'Tomas Reedy']));
  });

  it('carries open items to the next note until they are closed', async () => {
    const first = await api()
      .post('/api/handover')
      .set('Authorization', `Bearer ${ines}`)
      .send({
        body: 'Quiet morning. Copperline smelter back on two shifts from Monday.',
        items: [
          { kind: 'outage-in-progress', zoneCode: 'QUARRY', text: 'Feeder Q-7 out since 09:40, crew on site', status: 'open' },
          { kind: 'other', text: 'Printer in the desk room fixed', status: 'closed' },
        ],
      })
      .expect(201);
    const firstNote = first.body as HandoverNoteDto;
    expect(firstNote.items).toHaveLength(2);

    const draft = (await api().get('/api/handover/draft').set('Authorization', `Bearer ${tomas}`).expect(200)).body as HandoverDraftDto;
    expect(draft.openItems.map((i) => i.text)).toEqual(['Feeder Q-7 out since 09:40, crew on site']);
    const carried = draft.openItems[0];

    const second = await api()
      .post('/api/handover')
      .set('Authorization', `Bearer ${tomas}`)
      .send({ body: 'Q-7 restored at 15:10.', items: [{ kind: carried.kind, zoneCode: carried.zoneCode, text: carried.text, status: 'closed', carriedFromItemId: carried.id }] })
      .expect(201);
    expect(second.body.items[0]).toMatchObject({ status: 'closed', carriedFromItemId: carried.id });

    const after = (await api().get('/api/handover/draft').set('Authorization', `Bearer ${ines}`).expect(200)).body as HandoverDraftDto;
    expect(after.openItems).toEqual([]);
  });

  it('lets only an operator or supervisor acknowledge, and not the author', async () => {
    const note = (
      await api().post('/api/handover').set('Authorization', `Bearer ${ines}`).send({ body: 'Nothing open.', items: [] }).expect(201)
    ).body as HandoverNoteDto;

    const pending = await api().get('/api/handover/pending').set('Authorization', `Bearer ${tomas}`).expect(200);
    expect(pending.body.map((n: HandoverNoteDto) => n.id)).toContain(note.id);

    await api().post(`/api/handover/${note.id}/acknowledge`).set('Authorization', `Bearer ${ines}`).send({}).expect(403);
    await api().post(`/api/handover/${note.id}/acknowledge`).set('Authorization', `Bearer ${await tokenFor(app, 'viewer')}`).send({}).expect(403);
    await api().post(`/api/handover/${note.id}/acknowledge`).set('Authorization', `Bearer ${await tokenFor(app, 'admin')}`).send({}).expect(403);

    const acknowledged = await api().post(`/api/handover/${note.id}/acknowledge`).set('Authorization', `Bearer ${tomas}`).send({ reply: 'Got it, thanks.' }).expect(201);
    expect(acknowledged.body).toMatchObject({ acknowledgedBy: { name: 'Tomas Reedy' }, reply: 'Got it, thanks.' });
    await api().post(`/api/handover/${note.id}/acknowledge`).set('Authorization', `Bearer ${await tokenFor(app, 'supervisor')}`).send({}).expect(400);

    const stillPending = await api().get('/api/handover/pending').set('Authorization', `Bearer ${tomas}`).expect(200);
    expect(stillPending.body.map((n: HandoverNoteDto) => n.id)).not.toContain(note.id);
  });

  it('finds notes by text and by zone', async () => {
    const byText = await api().get('/api/handover').query({ q: 'smelter' }).set('Authorization', `Bearer ${tomas}`).expect(200);
    expect(byText.body.items.length).toBeGreaterThan(0);
    expect(byText.body.items.every((n: HandoverNoteDto) => /smelter/i.test(n.body))).toBe(true);
    const byZone = await api().get('/api/handover').query({ zone: 'QUARRY' }).set('Authorization', `Bearer ${tomas}`).expect(200);
    expect(byZone.body.items.length).toBeGreaterThanOrEqual(2);
    const none = await api().get('/api/handover').query({ q: 'no note says this 12345' }).set('Authorization', `Bearer ${tomas}`).expect(200);
    expect(none.body.total).toBe(0);
  });

  it('rejects an empty note and a bad item with a clear message', async () => {
    const empty = await api().post('/api/handover').set('Authorization', `Bearer ${ines}`).send({ body: '  ', items: [] }).expect(400);
    expect(empty.body.message).toMatch(/needs some text/);
    const bad = await api().post('/api/handover').set('Authorization', `Bearer ${ines}`).send({ body: 'x', items: [{ kind: 'gossip', text: '', status: 'open' }] }).expect(400);
    expect(bad.body.details).toEqual(expect.arrayContaining([expect.stringMatching(/kind must be one of/), 'each item needs a line of text']));
    await api().post('/api/handover').set('Authorization', `Bearer ${await tokenFor(app, 'viewer')}`).send({ body: 'x', items: [] }).expect(403);
  });

  it('shows a note with its shift events gathered from the audit trail', async () => {
    const list = await api().get('/api/handover').set('Authorization', `Bearer ${tomas}`).expect(200);
    const note = await api().get(`/api/handover/${list.body.items[0].id}`).set('Authorization', `Bearer ${tomas}`).expect(200);
    expect(Array.isArray(note.body.events)).toBe(true);
    expect(note.body.events.every((e: { action: string }) => !e.action.startsWith('auth.'))).toBe(true);
  });
});
