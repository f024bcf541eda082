import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { demoHandle, signIn, startTestServer } from '../setup/test-server';
import { AuditEntry, Result, User } from '../../server/models';
import { IMPORT_COLUMNS } from '../../shared/csv';
import { toCsv } from '../../shared/csv-writer';

let server: Awaited<ReturnType<typeof startTestServer>>;
let member: Awaited<ReturnType<typeof signIn>>;
let mod1: Awaited<ReturnType<typeof signIn>>;
let mod2: Awaited<ReturnType<typeof signIn>>;

beforeAll(async () => {
  server = await startTestServer();
  member = await signIn(server.url, await demoHandle(server.url, 'member'));
  mod1 = await signIn(server.url, await demoHandle(server.url, 'moderator', 0));
  mod2 = await signIn(server.url, await demoHandle(server.url, 'moderator', 1));
});
afterAll(async () => {
  await server?.stop();
});

const input = (readings = [180, 175, 190, 170, 185]) => ({
  steel: 'aisi-m2',
  hardness: { value: 64, scale: 'HRC' },
  abrasive: 'cbn-electroplated-wheel-250-b126',
  grit: { standard: 'iso6106', grade: 'B126' },
  edgeAngle: { perSideDeg: 16 },
  sharpness: { method: 'push-cut-test-v2', readingsG: readings },
});

async function postPending(readings?: number[]) {
  return (await member.agent.post('/api/results').set('X-CSRF-Token', member.csrf).send(input(readings)).expect(201)).body.id as number;
}

const review = (who: typeof mod1, id: number, body: object) => who.agent.post(`/api/results/${id}/review`).set('X-CSRF-Token', who.csrf).send(body);

describe('two moderators on the same item', () => {
  it('refuses the second decision with 409, and the audit log records both attempts', async () => {
    const id = await postPending();
    await review(mod1, id, { decision: 'approve' }).expect(200);
    const second = await review(mod2, id, { decision: 'reject', note: 'Readings look copied.' }).expect(409);
    expect(second.body.error).toMatch(/already decided.*Published/);

    const log = await mod1.agent.get('/api/audit?action=result.').expect(200);
    const forId = (log.body.items as { subjectId: number; outcome: string; action: string; actor: { handle: string }; reason: string | null; details: { refusal?: string } }[]).filter(
      (e) => e.subjectId === id,
    );
    expect(forId).toHaveLength(2);
    const [refused, done] = forId; // newest first
    expect(done).toMatchObject({ action: 'result.approve', outcome: 'done', actor: { handle: mod1.user.handle } });
    expect(refused).toMatchObject({ action: 'result.reject', outcome: 'refused', actor: { handle: mod2.user.handle }, reason: 'Readings look copied.' });
    expect(refused.details.refusal).toMatch(/already decided/);
  });

  it('of two decisions at the same moment, exactly one wins and the other is answered 409 (20 tries)', async () => {
    // On PostgreSQL the two transactions run side by side (no write queue): the conditional
    // update and SERIALIZABLE isolation must still let only one through.
    const ids: number[] = [];
    for (let i = 0; i < 20; i += 1) ids.push(await postPending([170 + i, 175, 180]));
    const outcomes = await Promise.all(ids.map((id) => Promise.all([review(mod1, id, { decision: 'approve' }), review(mod2, id, { decision: 'approve' })])));
    for (const [i, pair] of outcomes.entries()) expect(pair.map((r) => r.status).sort(), `result ${ids[i]}`).toEqual([200, 409]);
    for (const id of ids) {
      const trail = (await mod1.agent.get(`/api/results/${id}`).expect(200)).body.trail as { to: string }[];
      expect(trail.filter((e) => e.to === 'approved'), `approvals of ${id}`).toHaveLength(1);
    }
    const approved = await Result.count({ where: { id: ids, status: 'approved' } });
    expect(approved).toBe(20);
  });

  it('keeps the audit log unchangeable and readable by moderators only', async () => {
    await member.agent.get('/api/audit').expect(403);
    await request(server.url).get('/api/audit').expect(401);
    await mod1.agent.delete('/api/audit/1').set('X-CSRF-Token', mod1.csrf).expect(404);
    const entry = await AuditEntry.findOne();
    await expect(entry!.update({ reason: 'edited' })).rejects.toThrow(/never changed/);
    await expect(AuditEntry.destroy({ where: {} })).rejects.toThrow(/never changed/);
  });
});

describe('the desk', () => {
  it('lists pending results oldest first, filtered by author, steel and kind', async () => {
    const id = await postPending([300, 310, 305]);
    const desk = await mod1.agent.get(`/api/review-desk?author=${member.user.handle}&steel=aisi-m2`).expect(200);
    const items = desk.body.items as { id: number; kind: string; author: { handle: string }; createdAt: string }[];
    expect(items.map((i) => i.id)).toContain(id);
    expect(items.every((i) => i.kind === 'result' && i.author.handle === member.user.handle)).toBe(true);
    const times = items.map((i) => Date.parse(i.createdAt));
    expect([...times].sort((a, b) => a - b)).toEqual(times);
    const flagsOnly = await mod1.agent.get('/api/review-desk?kind=flag').expect(200);
    expect(flagsOnly.body.items).toEqual([]);
    await mod1.agent.get('/api/review-desk?kind=everything').expect(400);
  });

  it('takes flags from members into the queue, and closes them with an audit entry', async () => {
    const approved = (await request(server.url).get('/api/results').expect(200)).body.items[0].id as number;
    const flag = await member.agent.post('/api/flags').set('X-CSRF-Token', member.csrf).send({ subjectType: 'result', subject: approved, reason: 'implausible-figures', text: 'Median below the tester’s floor.' }).expect(201);
    await member.agent.post('/api/flags').set('X-CSRF-Token', member.csrf).send({ subjectType: 'result', subject: approved, reason: 'duplicate' }).expect(409);
    await member.agent.post('/api/flags').set('X-CSRF-Token', member.csrf).send({ subjectType: 'steel', subject: 'aisi-d2', reason: 'other' }).expect(400);
    await member.agent.post('/api/flags').set('X-CSRF-Token', member.csrf).send({ subjectType: 'steel', subject: 'aisi-d2', reason: 'missing-method', text: 'No source for the Mo range.' }).expect(201);
    const pending = await postPending([111, 112, 113]);
    await member.agent.post('/api/flags').set('X-CSRF-Token', member.csrf).send({ subjectType: 'result', subject: pending, reason: 'duplicate' }).expect(404);

    const desk = await mod1.agent.get('/api/review-desk?kind=flag').expect(200);
    const flags = desk.body.flags as { id: number; subject: { path: string }; reasonLabel: string }[];
    expect(flags.map((f) => f.subject.path)).toEqual(expect.arrayContaining([`/results/${approved}`, '/steels/aisi-d2']));
    await member.agent.post(`/api/flags/${flag.body.id}/resolve`).set('X-CSRF-Token', member.csrf).send({ outcome: 'dismissed', note: 'x' }).expect(403);
    await mod1.agent.post(`/api/flags/${flag.body.id}/resolve`).set('X-CSRF-Token', mod1.csrf).send({ outcome: 'dismissed', note: 'Within the method’s range.' }).expect(200);
    await mod2.agent.post(`/api/flags/${flag.body.id}/resolve`).set('X-CSRF-Token', mod2.csrf).send({ outcome: 'upheld', note: 'late' }).expect(409);
    const log = await mod1.agent.get('/api/audit?action=flag.').expect(200);
    expect(log.body.items.map((e: { outcome: string }) => e.outcome)).toEqual(['refused', 'done']);
  });

  it('bulk-approves a trusted publisher’s import in one go, refreshing cells, and audits each decision', async () => {
    const publisher = await signIn(server.url, await demoHandle(server.url, 'publisher'));
    const row = (i: number) => ['en-1-4116', String(55 + (i % 2)), 'HRC', '', '', '', 'diamond-resin-wheel-250-15um', '', '', String(15 + (i % 3)), '', '', '', '', 'push-cut-test-v2', `${140 + i};150;145`, '', '', ''];
    const csv = toCsv([[...IMPORT_COLUMNS], ...Array.from({ length: 40 }, (_, i) => row(i))]);
    const imported = await publisher.agent.post('/api/import/results').set('X-CSRF-Token', publisher.csrf).attach('file', Buffer.from(csv), 'batch.csv').expect(201);
    const importId = imported.body.importId as number;

    const desk = await mod1.agent.get(`/api/review-desk?importId=${importId}`).expect(200);
    expect(desk.body.items).toHaveLength(40);
    expect(desk.body.items.every((i: { importId: number }) => i.importId === importId)).toBe(true);
    expect(desk.body.imports).toEqual(expect.arrayContaining([expect.objectContaining({ id: importId, rows: 40, pending: 40, publisher: expect.objectContaining({ handle: publisher.user.handle }) })]));

    const cellN = async () => {
      const res = await request(server.url).get('/api/compare?method=push-cut-test-v2&steel=en-1-4116&material=diamond').expect(200);
      return (res.body.rows as { n: number }[]).reduce((s, r) => s + r.n, 0);
    };
    const before = await cellN();
    // One of them was already decided by someone else: refused, the rest approved.
    const first = desk.body.items[0].id as number;
    await review(mod2, first, { decision: 'return', note: 'Add the heat treatment.' }).expect(200);
    await member.agent.post('/api/review-desk/bulk-approve').set('X-CSRF-Token', member.csrf).send({ importId }).expect(403);
    const bulk = await mod1.agent.post('/api/review-desk/bulk-approve').set('X-CSRF-Token', mod1.csrf).send({ importId, note: 'Batch checked against the lab’s sheet.' }).expect(200);
    expect(bulk.body.approved).toHaveLength(39);
    expect(bulk.body.refused).toEqual([{ id: first, reason: expect.stringMatching(/already decided/) }]);
    expect(await cellN()).toBe(before + 39);
    expect(await Result.count({ where: { id: bulk.body.approved, status: 'approved' } })).toBe(39);

    // Every decision of the bulk approval is audited one by one: 39 done and the refused one.
    const mod1Id = (await User.findOne({ where: { handle: mod1.user.handle } }))!.id;
    const entries = await AuditEntry.findAll({ where: { actorId: mod1Id, action: 'result.approve', subjectType: 'result', subjectId: desk.body.items.map((i: { id: number }) => i.id) } });
    expect(entries.filter((e) => e.outcome === 'done')).toHaveLength(39);
    expect(entries.filter((e) => e.outcome === 'refused').map((e) => e.subjectId)).toEqual([first]);
    expect(entries.every((e) => e.reason === 'Batch checked against the lab’s sheet.' && (e.details as { importId?: number }).importId === importId)).toBe(true);
    const after = await mod1.agent.get('/api/review-desk').expect(200);
    expect(after.body.imports.map((b: { id: number }) => b.id)).not.toContain(importId);
  });
});

describe('retraction', () => {
  it('hides the author’s approved result from the comparison and search, keeps it, and records why', async () => {
    const id = await postPending([90, 95, 92, 91, 93]);
    await review(mod1, id, { decision: 'approve' }).expect(200);
    const cellN = async () => {
      const res = await request(server.url).get('/api/compare?method=push-cut-test-v2&steel=aisi-m2&material=cbn').expect(200);
      return (res.body.rows as { n: number }[]).reduce((s, r) => s + r.n, 0);
    };
    const before = await cellN();
    await mod1.agent.post(`/api/results/${id}/retract`).set('X-CSRF-Token', mod1.csrf).send({ reason: 'not mine' }).expect(403);
    await member.agent.post(`/api/results/${id}/retract`).set('X-CSRF-Token', member.csrf).send({}).expect(400);
    const res = await member.agent.post(`/api/results/${id}/retract`).set('X-CSRF-Token', member.csrf).send({ reason: 'The tester was out of calibration that day.' }).expect(200);
    expect(res.body.status).toBe('retracted');
    expect(res.body.trail.at(-1)).toMatchObject({ from: 'approved', to: 'retracted', note: 'The tester was out of calibration that day.' });
    expect(await cellN()).toBe(before - 1);
    const hits = await request(server.url).get('/api/search?q=m2&type=result').expect(200);
    expect(hits.body.hits.map((h: { id: number }) => h.id)).not.toContain(id);
    expect(await Result.findByPk(id)).not.toBeNull();
    await member.agent.post(`/api/results/${id}/retract`).set('X-CSRF-Token', member.csrf).send({ reason: 'again' }).expect(403);
  });
});

describe('duplicate detection', () => {
  it('points out an earlier result of the same author with the same steel, abrasive, grit, angle and readings', async () => {
    const readings = [401, 402, 403, 404, 405];
    const id = await postPending(readings);
    const same = await member.agent.post('/api/me/duplicate-check').set('X-CSRF-Token', member.csrf).send(input([...readings].reverse())).expect(200);
    expect(same.body.duplicates.map((d: { id: number }) => d.id)).toEqual([id]);
    const different = await member.agent.post('/api/me/duplicate-check').set('X-CSRF-Token', member.csrf).send(input([401, 402, 403, 404, 406])).expect(200);
    expect(different.body.duplicates).toEqual([]);
    const other = await signIn(server.url, await demoHandle(server.url, 'member', 1));
    const notMine = await other.agent.post('/api/me/duplicate-check').set('X-CSRF-Token', other.csrf).send(input(readings)).expect(200);
    expect(notMine.body.duplicates).toEqual([]);
  });
});
