import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import Papa from 'papaparse';
import { demoHandle, signIn, startTestServer } from '../setup/test-server';
import { Result, User } from '../../server/models';

let server: Awaited<ReturnType<typeof startTestServer>>;
beforeAll(async () => {
  server = await startTestServer();
});
afterAll(async () => {
  await server?.stop();
});

const input = (readings: number[]) => ({
  steel: 'aisi-1095',
  hardness: { value: 59, scale: 'HRC' },
  abrasive: 'alox-bench-stone-jis6000',
  edgeAngle: { perSideDeg: 18 },
  sharpness: { method: 'push-cut-test-v2', readingsG: readings },
});

describe('public profiles', () => {
  it('show handle, badge, counts, methods and published results, never an e-mail address', async () => {
    const handle = await demoHandle(server.url, 'publisher');
    const user = (await User.findOne({ where: { handle } }))!;
    const published = await Result.count({ where: { authorId: user.id, status: 'approved' } });
    const res = await request(server.url).get(`/api/profiles/${handle}`).expect(200);
    expect(res.body).toMatchObject({ handle, role: 'publisher', badge: { label: 'Publisher' }, counts: { published } });
    expect(res.body.methods.reduce((s: number, m: { results: number }) => s + m.results, 0)).toBe(published);
    expect(res.body.recent.every((r: { status: string; author: { handle: string } }) => r.status === 'approved' && r.author.handle === handle)).toBe(true);
    expect(JSON.stringify(res.body)).not.toContain(user.email!);
    await request(server.url).get('/api/profiles/nobody-here').expect(404);
    await request(server.url).get('/api/profiles/Bad%20Handle').expect(400);
  });

  it('export a member’s published results as CSV', async () => {
    const handle = await demoHandle(server.url, 'publisher');
    const csv = await request(server.url).get(`/api/profiles/${handle}/results.csv`).expect(200);
    expect(csv.headers['content-type']).toMatch(/text\/csv/);
    const rows = Papa.parse<string[]>(csv.text.trim()).data;
    const status = rows[0].indexOf('status');
    expect(rows.slice(1).every((r) => r[status] === 'approved')).toBe(true);
  });
});

describe('the member’s own page', () => {
  it('needs a sign-in', async () => {
    await request(server.url).get('/api/me').expect(401);
  });

  it('shows pending and returned items with the moderator’s note, follows and settings', async () => {
    const member = await signIn(server.url, await demoHandle(server.url, 'member', 5));
    const moderator = await signIn(server.url, await demoHandle(server.url, 'moderator'));
    const a = (await member.agent.post('/api/results').set('X-CSRF-Token', member.csrf).send(input([220, 222, 224])).expect(201)).body.id;
    const b = (await member.agent.post('/api/results').set('X-CSRF-Token', member.csrf).send(input([230, 232, 234])).expect(201)).body.id;
    await moderator.agent.post(`/api/results/${b}/review`).set('X-CSRF-Token', moderator.csrf).send({ decision: 'return', note: 'Which stone was last?' }).expect(200);
    await member.agent.post('/api/me/follows').set('X-CSRF-Token', member.csrf).send({ pageType: 'abrasive', slug: 'alox-bench-stone-jis6000' }).expect(201);
    await member.agent.put('/api/me/notifications').set('X-CSRF-Token', member.csrf).send({ digest: false }).expect(200);
    await member.agent.put('/api/me/notifications').set('X-CSRF-Token', member.csrf).send({ digest: 'no' }).expect(400);

    const me = await member.agent.get('/api/me').expect(200);
    expect(me.body.pending.map((r: { id: number }) => r.id)).toContain(a);
    expect(me.body.returned.find((r: { id: number }) => r.id === b).review).toMatchObject({ decision: 'returned', note: 'Which stone was last?' });
    expect(me.body.following).toEqual([{ pageType: 'abrasive', slug: 'alox-bench-stone-jis6000', name: expect.any(String) }]);
    expect(me.body.notifications).toEqual({ review: true, application: true, digest: false });
    expect(me.body.tokens).toEqual([]);
    expect(me.body.can).toMatchObject({ import: false, tokens: false, apply: true });
    expect(me.body.account).toMatchObject({ handle: member.user.handle, hasEmail: true });
    expect(JSON.stringify(me.body)).not.toMatch(/@example\.test/);

    await member.agent.delete('/api/me/follows/abrasive/alox-bench-stone-jis6000').set('X-CSRF-Token', member.csrf).expect(204);
    expect((await member.agent.get('/api/me').expect(200)).body.following).toEqual([]);
  });

  it('shows a publisher their tokens and imports', async () => {
    const publisher = await signIn(server.url, await demoHandle(server.url, 'publisher', 1));
    await publisher.agent.post('/api/tokens').set('X-CSRF-Token', publisher.csrf).send({ name: 'bench pc' }).expect(201);
    const template = await request(server.url).get('/api/import/template.csv').expect(200);
    const imported = await publisher.agent.post('/api/import/results').set('X-CSRF-Token', publisher.csrf).attach('file', Buffer.from(template.text), 't.csv').expect(201);
    const me = await publisher.agent.get('/api/me').expect(200);
    expect(me.body.tokens.map((t: { name: string }) => t.name)).toContain('bench pc');
    expect(me.body.imports[0]).toMatchObject({ id: imported.body.importId, rows: 2, pending: 2 });
    expect(me.body.can).toMatchObject({ import: true, tokens: true, apply: false });
  });
});
