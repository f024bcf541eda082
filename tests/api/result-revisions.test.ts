/**
 * Edit and resubmit; corrections of published results (issue 17). Medians below are the
 * middle of an odd number of readings (definition of the median, common practice), and the
 * cell's n and median are read back from the stored cell.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { demoHandle, signIn, startTestServer } from '../setup/test-server';
import { AuditEntry, ComparisonCell, Result, ResultRevision } from '../../server/models';

let server: Awaited<ReturnType<typeof startTestServer>>;
type Session = Awaited<ReturnType<typeof signIn>>;
let author: Session;
let other: Session;
let mod: Session;

beforeAll(async () => {
  server = await startTestServer();
  author = await signIn(server.url, await demoHandle(server.url, 'member', 2));
  other = await signIn(server.url, await demoHandle(server.url, 'member', 3));
  mod = await signIn(server.url, await demoHandle(server.url, 'moderator'));
});
afterAll(async () => {
  await server?.stop();
});

// A steel and stone pairing of its own (EN 1.4034 on a JIS 1000 bench stone), so its cell holds only this file's results.
const input = (readingsG = [200, 210, 190], perSideDeg = 15, steel = 'en-1-4034') => ({
  steel,
  hardness: { value: 56, scale: 'HRC' },
  abrasive: 'alox-bench-stone-jis1000',
  edgeAngle: { perSideDeg },
  sharpness: { method: 'push-cut-test-v2', readingsG },
});

const send = (who: Session, method: 'post' | 'put', url: string, body: object) => who.agent[method](url).set('X-CSRF-Token', who.csrf).send(body);
const post = async (body = input()) => (await send(author, 'post', '/api/results', body).expect(201)).body.id as number;
const decide = (id: number, body: object) => send(mod, 'post', `/api/results/${id}/review`, body);

async function cellOf(id: number) {
  const result = (await Result.findByPk(id))!;
  const key = { methodId: result.sharpnessMethodId, steelId: result.steelId, material: result.material, gritPhi: result.gritPhi };
  return ComparisonCell.findOne({ where: { methodId: key.methodId, steelId: key.steelId, material: key.material, bandStart: 2 * key.gritPhi, bandWidth: 2 } });
}

describe('edit and resubmit before publication', () => {
  it('a returned result, edited by its author, goes back on the desk as pending with its trail and new derived values', async () => {
    const id = await post();
    await decide(id, { decision: 'return', note: 'Add two more readings.' }).expect(200);
    const mine = (await author.agent.get(`/api/results/${id}`).expect(200)).body;
    expect(mine).toMatchObject({ status: 'returned', review: { decision: 'returned', note: 'Add two more readings.' }, can: { edit: true } });

    const edited = await send(author, 'put', `/api/results/${id}`, input([200, 210, 190, 230, 220], 17)).expect(200);
    expect(edited.body.outcome).toBe('updated');
    expect(edited.body.result.status).toBe('pending');
    // Median of 190, 200, 210, 220, 230 is 210; 17° a side is 34° inclusive (2 × per side).
    expect(edited.body.result.derived).toMatchObject({ sharpnessMedianG: 210, perSideDeg: 17, inclusiveDeg: 34 });
    expect(edited.body.result.review).toBeNull();
    expect(edited.body.result.trail.map((t: { from: string | null; to: string }) => `${t.from}>${t.to}`)).toEqual(['null>pending', 'pending>returned', 'returned>pending']);
    expect(edited.body.revision).toMatchObject({ number: 2, status: 'applied' });
    expect(edited.body.revision.changes.map((c: { path: string }) => c.path)).toEqual(['edgeAngle.perSideDeg', 'sharpness.readingsG']);

    const desk = (await mod.agent.get('/api/review-desk').expect(200)).body;
    expect(desk.items.map((i: { id: number }) => i.id)).toContain(id);

    const revisions = (await author.agent.get(`/api/results/${id}/revisions`).expect(200)).body.items;
    expect(revisions.map((r: { number: number; status: string }) => `${r.number}:${r.status}`)).toEqual(['2:applied', '1:applied']);
  });

  it('a pending result is updated in place and stays pending; a draft is saved, saved again, then submitted', async () => {
    const id = await post();
    await send(author, 'put', `/api/results/${id}`, input([300, 310, 320])).expect(200);
    expect((await Result.findByPk(id))!.sharpnessMedianG).toBe(310);

    const draft = await send(author, 'post', '/api/results/drafts', input()).expect(201);
    expect(draft.body.status).toBe('draft');
    const desk = (await mod.agent.get('/api/review-desk').expect(200)).body;
    expect(desk.items.map((i: { id: number }) => i.id)).not.toContain(draft.body.id);
    const again = await send(author, 'put', `/api/results/${draft.body.id}/draft`, input([250, 260, 270])).expect(200);
    expect(again.body.result.status).toBe('draft');
    const submitted = await send(author, 'put', `/api/results/${draft.body.id}`, input([250, 260, 270])).expect(200);
    expect(submitted.body.result.status).toBe('pending');
    // A submitted result is no longer a draft.
    await send(author, 'put', `/api/results/${draft.body.id}/draft`, input()).expect(409);
  });

  it('only the author edits: others are told 404 for a hidden result, 403 for a published one; rejected or withdrawn ones are 409', async () => {
    const id = await post();
    await send(other, 'put', `/api/results/${id}`, input()).expect(404);
    await send(mod, 'put', `/api/results/${id}`, input()).expect(403);
    await request(server.url).put(`/api/results/${id}`).send(input()).expect(401);

    await decide(id, { decision: 'reject', note: 'Not a push-cut reading.' }).expect(200);
    const refused = await send(author, 'put', `/api/results/${id}`, input()).expect(409);
    expect(refused.body.error).toMatch(/Declined/);

    const published = await post();
    await decide(published, { decision: 'approve' }).expect(200);
    await send(other, 'put', `/api/results/${published}`, input()).expect(403);
  });

  it('refuses bad input naming the field, and stores nothing', async () => {
    const id = await post();
    const before = (await Result.findByPk(id))!.updatedAt.getTime();
    const bad = await send(author, 'put', `/api/results/${id}`, { ...input(), steel: 'no-such-steel' }).expect(400);
    expect(bad.body.issues).toEqual([{ path: 'steel', message: expect.stringContaining('no steel page') }]);
    expect((await Result.findByPk(id))!.updatedAt.getTime()).toBe(before);
    expect(await ResultRevision.count({ where: { resultId: id } })).toBe(0);
  });
});

describe('correcting a published result', () => {
  it('a correction waits (202) while the published version and its cell stay unchanged; approved, the cell follows', async () => {
    // A steel no other test here uses, so the cell holds this result alone.
    const own = (readings: number[]) => input(readings, 15, 'en-1-4116');
    const id = await post(own([200, 210, 190]));
    await decide(id, { decision: 'approve' }).expect(200);
    const cellBefore = (await cellOf(id))!;
    // Median of 190, 200, 210 is 200.
    expect(cellBefore.medianG).toBe(200);

    const proposed = await send(author, 'put', `/api/results/${id}`, own([400, 410, 390])).expect(202);
    expect(proposed.body).toMatchObject({ outcome: 'proposed', result: { status: 'approved' }, revision: { number: 2, status: 'pending' } });
    expect(proposed.body.revision.changes).toEqual([{ path: 'sharpness.readingsG', label: 'Readings (g)', before: '200, 210, 190', after: '400, 410, 390' }]);

    // Untouched: the published result, its derived values and its cell.
    const visitor = (await request(server.url).get(`/api/results/${id}`).expect(200)).body;
    expect(visitor.sharpness.readingsG).toEqual([200, 210, 190]);
    expect(visitor.derived.sharpnessMedianG).toBe(200);
    expect((await cellOf(id))!.medianG).toBe(200);
    // Visitors see only versions that were the result; the author sees the waiting one too.
    expect((await request(server.url).get(`/api/results/${id}/revisions`).expect(200)).body.items.map((r: { number: number }) => r.number)).toEqual([1]);
    expect((await author.agent.get(`/api/results/${id}/revisions`).expect(200)).body.items.map((r: { number: number }) => r.number)).toEqual([2, 1]);

    // On the desk, as a diff against the published version.
    const desk = (await mod.agent.get('/api/review-desk').expect(200)).body;
    const item = desk.resultRevisions.find((r: { result: { id: number } }) => r.result.id === id);
    expect(item).toMatchObject({ kind: 'result-revision', number: 2, changes: [{ path: 'sharpness.readingsG' }] });

    // Its author cannot approve it; another member cannot either.
    await send(author, 'post', `/api/results/${id}/revisions/2/review`, { decision: 'approve' }).expect(403);
    await send(mod, 'post', `/api/results/${id}/revisions/2/review`, { decision: 'approve' }).expect(200);
    const after = (await request(server.url).get(`/api/results/${id}`).expect(200)).body;
    expect(after.sharpness.readingsG).toEqual([400, 410, 390]);
    // Median of 390, 400, 410 is 400; the cell holds this result alone.
    expect(after.derived.sharpnessMedianG).toBe(400);
    expect((await cellOf(id))!.medianG).toBe(400);

    // Decided once: a second decision is 409, and both are in the audit log.
    await send(mod, 'post', `/api/results/${id}/revisions/2/review`, { decision: 'reject', note: 'Twice.' }).expect(409);
    const audit = await AuditEntry.findAll({ where: { subjectType: 'result', subjectId: id }, order: [['id', 'ASC']] });
    expect(audit.map((a) => `${a.action}:${a.outcome}`)).toEqual(['result.approve:done', 'result-revision.approve:done', 'result-revision.reject:refused']);
  });

  it('a returned correction leaves the published version as it was; a newer correction supersedes one still waiting', async () => {
    const id = await post(input([200, 210, 190]));
    await decide(id, { decision: 'approve' }).expect(200);
    await send(author, 'put', `/api/results/${id}`, input([500, 510, 490])).expect(202);
    await send(author, 'put', `/api/results/${id}`, input([220, 210, 190])).expect(202);
    await send(mod, 'post', `/api/results/${id}/revisions/2/review`, { decision: 'approve' }).expect(409);
    await send(mod, 'post', `/api/results/${id}/revisions/3/review`, { decision: 'return' }).expect(400);
    await send(mod, 'post', `/api/results/${id}/revisions/3/review`, { decision: 'return', note: 'Which reading changed, and why?' }).expect(200);
    expect((await request(server.url).get(`/api/results/${id}`).expect(200)).body.sharpness.readingsG).toEqual([200, 210, 190]);
    const items = (await author.agent.get(`/api/results/${id}/revisions`).expect(200)).body.items;
    expect(items.map((r: { number: number; status: string }) => `${r.number}:${r.status}`)).toEqual(['3:returned', '2:superseded', '1:applied']);
    expect(items[0].note).toBe('Which reading changed, and why?');
    await send(mod, 'post', `/api/results/${id}/revisions/9/review`, { decision: 'approve' }).expect(404);
  });
});
