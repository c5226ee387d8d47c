import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { type Client, createStudio, createUser, signedIn, type TestUser, waitForMail } from '../helpers/factories';
import { postTake, STUDIO_SPEC } from '../helpers/studio-fixtures';
import { createTestApp } from '../helpers/test-server';

const ctx = createTestApp();
afterAll(() => ctx.close());

let admin: Client;
let player: TestUser;
let t: Client;
let p: Client;
let takeId: string;
let studioId: string;

beforeAll(async () => {
  const teacher = await createUser(ctx.db, { role: 'teacher', name: 'Mara Quill' });
  player = await createUser(ctx.db, { role: 'player', name: 'Theo Park' });
  studioId = (await createStudio(ctx.db, teacher.id, [player.id], 'Remarks studio')).id;
  [admin, t, p] = await Promise.all([
    signedIn(ctx.app, await createUser(ctx.db, { role: 'admin' })),
    signedIn(ctx.app, teacher),
    signedIn(ctx.app, player),
  ]);
  takeId = (await postTake(p, STUDIO_SPEC, { miss: 2 })).id;
});

describe('remarks on a take', () => {
  it('the teacher pins a remark to a missed note; the player is told in the app and by e-mail', async () => {
    const take = (await t.get(`/api/takes/${takeId}`).expect(200)).body.take;
    const missed = take.score.results.findIndex((r: { verdict: string }) => r.verdict === 'missed');
    expect(missed).toBeGreaterThanOrEqual(0);
    const res = await t.post(`/api/takes/${takeId}/remarks`, {
      body: 'You skipped the entry note; land on it.',
      noteIndex: missed,
    });
    expect(res.status).toBe(201);
    expect(res.body.remark).toMatchObject({
      takeId,
      noteIndex: missed,
      parentId: null,
      author: { name: 'Mara Quill', role: 'teacher' },
    });

    const n = await p.get('/api/notifications').expect(200);
    expect(n.body.unread).toBeGreaterThanOrEqual(1);
    expect(n.body.notifications[0]).toMatchObject({ kind: 'remark', link: `/takes/${takeId}`, read: false });
    await p.post('/api/notifications/read').expect(200);
    expect((await p.get('/api/notifications').expect(200)).body.unread).toBe(0);

    const [mail] = await waitForMail(admin, player.email);
    expect(mail.to).toBe(player.email);
    expect(mail.subject).toContain('Mara Quill');
    expect(mail.text).toContain('You skipped the entry note');
    expect(mail.text).toContain(`/takes/${takeId}`);
    expect(mail.text).toContain(`note ${missed + 1}`);
  });

  it('the player reads it and answers; the teacher sees the answer and is told', async () => {
    const list = await p.get(`/api/takes/${takeId}/remarks`).expect(200);
    const first = list.body.remarks[0];
    expect((await p.post(`/api/takes/${takeId}/remarks`, { body: 'Without answering anything' })).status).toBe(400);
    const reply = await p.post(`/api/takes/${takeId}/remarks`, {
      body: 'Got it, I will try again at 90.',
      parentId: first.id,
    });
    expect(reply.status).toBe(201);
    expect(reply.body.remark).toMatchObject({ parentId: first.id, author: { role: 'player' } });
    const seen = await t.get(`/api/takes/${takeId}/remarks`).expect(200);
    expect(seen.body.remarks.map((r: { body: string }) => r.body)).toEqual([
      'You skipped the entry note; land on it.',
      'Got it, I will try again at 90.',
    ]);
    const n = await t.get('/api/notifications').expect(200);
    expect(n.body.notifications[0]).toMatchObject({ kind: 'reply', link: `/takes/${takeId}` });
    // The teacher's page of this player counts the take's remarks (the pinned one and the answer).
    const detail = await t.get(`/api/studios/${studioId}/players/${player.id}`).expect(200);
    const row = JSON.stringify(detail.body).match(new RegExp(`"id":"${takeId}"[^}]*"remarkCount":(\\d+)`));
    expect(row?.[1]).toBe('2');
  });

  it('refuses a note the take does not have, an empty remark, and another player', async () => {
    const bad = await t.post(`/api/takes/${takeId}/remarks`, { body: 'Here', noteIndex: 9999 });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields.noteIndex).toBeDefined();
    const empty = await t.post(`/api/takes/${takeId}/remarks`, { body: '   ' });
    expect(empty.status).toBe(400);
    expect(empty.body.error.fields.body).toBeDefined();
    const stranger = await signedIn(ctx.app, await createUser(ctx.db, { role: 'player' }));
    expect((await stranger.get(`/api/takes/${takeId}/remarks`)).status).toBe(404);
    expect((await stranger.post(`/api/takes/${takeId}/remarks`, { body: 'Hi' })).status).toBe(404);
  });
});
