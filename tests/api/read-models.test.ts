import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { compareQuerySchema, type CompareQuery } from '../../shared/schemas/compare';
import { sortRows } from '../../shared/compare-view';
import { resultRow } from '../../server/commands/submit-result';
import { Abrasive, Method, Result, Steel, User } from '../../server/models';
import { cellsOf, memberAttributes, rebuildAllCells } from '../../server/aggregates/comparison-cells';
import { methodCells } from '../../server/aggregates/cell-cache';
import { cellMatches, presentCell, resolveView, resultWhere, viewRows } from '../../server/queries/compare-view';
import { approvedResults } from '../../server/read-models/approved-results';
import { ABRASIVE_MATERIALS, BONDS, STEEL_CATEGORIES } from '../../shared/vocabulary';
import type { BandedMember } from '../../shared/aggregate';
import { demoHandle, signIn, startTestServer } from '../setup/test-server';
import { mulberry32 } from '../../seed/data/results';

/**
 * The comparison's live filters (hardness, angle, dates, bond, publishers) are answered from the
 * approved results held in memory (server/read-models/approved-results.ts). The reference here is
 * SQLite itself: the same view selected by a SQL `where` (resultWhere, the path of decision 015)
 * over the results table, grouped by the same cell code. The two must give the same rows.
 */

let server: Awaited<ReturnType<typeof startTestServer>>;
beforeAll(async () => {
  server = await startTestServer();
});
afterAll(async () => {
  await server?.stop();
});


/** The view's rows as the results table gives them through SQL. */
async function rowsFromSql(query: CompareQuery) {
  const view = await resolveView(query);
  const members = (await Result.findAll({ where: await resultWhere(view), attributes: [...memberAttributes], raw: true })) as unknown as BandedMember[];
  const { overallMedianG } = await methodCells(view.method.id, view.step);
  return sortRows(cellsOf(members, [view.step]).filter((c) => cellMatches(view, c)).map((c) => presentCell(view, c, overallMedianG)));
}

/** The view's rows as the comparison answers them. */
async function rowsFromMemory(query: CompareQuery) {
  const { rows, source } = await viewRows(await resolveView(query));
  expect(source).toBe('results');
  return sortRows(rows);
}

/**
 * Random filter combinations over the pages and dates the database holds; every one has a live
 * filter. Read in id order, so both dialects draw the same combinations.
 */
async function combinations(seed: number, count: number): Promise<CompareQuery[]> {
  const rand = mulberry32(seed);
  const pick = <T>(list: readonly T[]) => list[Math.floor(rand() * list.length)];
  const some = <T>(list: readonly T[], most: number) => [...new Set(Array.from({ length: 1 + Math.floor(rand() * most) }, () => pick(list)))];
  const methods = (await Method.findAll({ attributes: ['slug'], order: [['id', 'ASC']] })).map((m) => m.slug);
  const steels = (await Steel.findAll({ attributes: ['slug'], order: [['id', 'ASC']] })).map((s) => s.slug);
  const stored = await Result.findAll({ where: { status: 'approved' }, attributes: ['hrc', 'perSideDeg', 'createdAt'], order: [['id', 'ASC']], raw: true });
  const days = stored.map((r) => new Date(r.createdAt).toISOString().slice(0, 10)).sort();
  const hrcs = stored.map((r) => r.hrc);
  const angles = stored.map((r) => r.perSideDeg);
  const out: CompareQuery[] = [];
  while (out.length < count) {
    const q: Record<string, unknown> = {};
    if (rand() < 0.5) q.method = pick(methods);
    if (rand() < 0.3) q.steel = some(steels, 3).join(',');
    if (rand() < 0.2) q.category = some(Object.keys(STEEL_CATEGORIES), 2).join(',');
    if (rand() < 0.3) q.material = some(Object.keys(ABRASIVE_MATERIALS), 2).join(',');
    if (rand() < 0.2) q.umMin = pick([0.5, 1, 3, 10]);
    if (rand() < 0.2) q.umMax = pick([20, 40, 100, 300]);
    if (rand() < 0.5) q.step = 0.5;
    // Live filters, bounds often taken from stored values so the inclusive edges are tried.
    const live = rand();
    if (live < 0.35 || rand() < 0.2) {
      const [a, b] = [pick(hrcs), pick(hrcs)].sort((x, y) => x - y);
      if (rand() < 0.8) q.hrcMin = a;
      if (rand() < 0.8) q.hrcMax = b;
      if (q.hrcMin === undefined && q.hrcMax === undefined) q.hrcMin = a;
    }
    if ((live >= 0.35 && live < 0.55) || rand() < 0.2) {
      const [a, b] = [pick(angles), pick(angles)].sort((x, y) => x - y);
      q.angleMin = a;
      if (rand() < 0.6) q.angleMax = b;
    }
    if ((live >= 0.55 && live < 0.75) || rand() < 0.2) {
      const [a, b] = [pick(days), pick(days)].sort();
      if (rand() < 0.7) q.postedFrom = a;
      if (rand() < 0.7 || q.postedFrom === undefined) q.postedTo = b;
    }
    if ((live >= 0.75 && live < 0.9) || rand() < 0.15) q.bond = some(Object.keys(BONDS), 2).join(',');
    if (live >= 0.9 || rand() < 0.15) q.publisher = '1';
    // The progression filters (issue 16): materials passed through, number of steps.
    if (rand() < 0.15) q.via = some(Object.keys(ABRASIVE_MATERIALS), 2).join(',');
    if (rand() < 0.15) q.steps = some(['0', '1', '2', '3'], 2).join(',');
    const parsed = compareQuerySchema.safeParse(q);
    if (parsed.success) out.push(parsed.data);
  }
  return out;
}

async function expectSameAsSql(queries: CompareQuery[]) {
  let nonEmpty = 0;
  for (const q of queries) {
    const fromSql = await rowsFromSql(q);
    expect(await rowsFromMemory(q), JSON.stringify(q)).toEqual(fromSql);
    if (fromSql.length) nonEmpty += 1;
  }
  // The combinations must select something most of the time, or the equality proves little.
  expect(nonEmpty).toBeGreaterThan(queries.length / 2);
}

describe('the live filters answered from memory', () => {
  it('give the same rows as the SQL path on the demo data, for 120 filter combinations', async () => {
    await expectSameAsSql(await combinations(0x5eed, 120));
  });

  it('follow approvals, a retraction and a role change at once', async () => {
    const member = await signIn(server.url, await demoHandle(server.url, 'member'));
    const mod = await signIn(server.url, await demoHandle(server.url, 'moderator'));
    const q = compareQuerySchema.parse({ method: 'push-cut-test-v2', hrcMin: '60', step: '0.5' });
    const count = async () => (await request(server.url).get('/api/compare?method=push-cut-test-v2&hrcMin=60&pageSize=5000').expect(200)).body.totalResults as number;
    const before = await count();
    const ids: number[] = [];
    for (const steel of ['aisi-o1', 'aisi-52100']) {
      const input = {
        steel, hardness: { value: 61, scale: 'HRC' }, abrasive: 'diamond-resin-wheel-250-15um', grit: { standard: 'um', grade: '15 µm' },
        edgeAngle: { perSideDeg: 15 }, sharpness: { method: 'push-cut-test-v2', readingsG: [150, 155, 152] },
      };
      const posted = await member.agent.post('/api/results').set('X-CSRF-Token', member.csrf).send(input).expect(201);
      await mod.agent.post(`/api/results/${posted.body.id}/review`).set('X-CSRF-Token', mod.csrf).send({ decision: 'approve' }).expect(200);
      ids.push(posted.body.id);
    }
    expect(await count()).toBe(before + 2);
    await member.agent.post(`/api/results/${ids[0]}/retract`).set('X-CSRF-Token', member.csrf).send({ reason: 'checking the read model' }).expect(200);
    expect(await count()).toBe(before + 1);
    expect(await rowsFromMemory(q)).toEqual(await rowsFromSql(q));

    // A member becomes a publisher: the publishers-only view counts their results at once.
    const author = await User.findOne({ where: { handle: member.user.handle } });
    const onlyPublishers = compareQuerySchema.parse({ method: 'push-cut-test-v2', publisher: '1' });
    const publishedBefore = (await rowsFromMemory(onlyPublishers)).reduce((s, r) => s + r.n, 0);
    await server.ctx.db.write((transaction) => author!.update({ role: 'publisher' }, { transaction }));
    const theirs = await Result.count({ where: { authorId: author!.id, status: 'approved', sharpnessMethodId: (await Method.findOne({ where: { slug: 'push-cut-test-v2' } }))!.id } });
    expect(theirs).toBeGreaterThan(0);
    expect((await rowsFromMemory(onlyPublishers)).reduce((s, r) => s + r.n, 0)).toBe(publishedBefore + theirs);
    expect(await rowsFromMemory(onlyPublishers)).toEqual(await rowsFromSql(onlyPublishers));
  });

  it('give the same rows as the SQL path on 3 000 generated results, for 120 filter combinations', async () => {
    const rand = mulberry32(0xda7a);
    const pick = <T>(list: readonly T[]) => list[Math.floor(rand() * list.length)];
    const [steels, abrasives, methods, authors] = await Promise.all([Steel.findAll(), Abrasive.findAll(), Method.findAll(), User.findAll({ where: { banned: false } })]);
    // Retention methods name the medium a cut count is made in; sharpness methods do not.
    const sharpness = methods.filter((m) => !m.retentionMedium);
    const retention = methods.find((m) => m.retentionMedium) ?? null;
    const now = Date.UTC(2026, 5, 1);
    const rows = Array.from({ length: 3000 }, () => {
      const steel = pick(steels);
      const abrasive = pick(abrasives);
      const method = pick(sharpness);
      const input = {
        steel: steel.slug,
        hardness: { value: Math.round((55 + rand() * 11) * 10) / 10, scale: 'HRC' as const },
        abrasive: abrasive.slug,
        edgeAngle: { perSideDeg: Math.round((10 + rand() * 15) * 2) / 2 },
        sharpness: { method: method.slug, readingsG: Array.from({ length: method.readingsPerEdge }, () => Math.round(100 + rand() * 300)) },
        ...(retention && rand() < 0.3 ? { retention: { method: retention.slug, cuts: Math.round(100 + rand() * 400) } } : {}),
      };
      const createdAt = new Date(now - Math.floor(rand() * 900 * 86_400_000));
      const r = resultRow(pick(authors).id, rand() < 0.9 ? 'approved' : 'pending', input as never, { steel, abrasive, sharpnessMethod: method, retentionMethod: input.retention ? retention : null, stepAbrasives: new Map() });
      return { ...r, approvedAt: r.status === 'approved' ? createdAt : null, createdAt, updatedAt: createdAt };
    });
    await server.ctx.db.write((transaction) => Result.bulkCreate(rows, { transaction, validate: false }));
    await rebuildAllCells(server.ctx.db);
    expect(await approvedResults.size()).toBe(await Result.count({ where: { status: 'approved' } }));
    await expectSameAsSql(await combinations(0xc0ffee, 120));
  });
});

describe('the public results list answered from memory', () => {
  /** The list as SQL gives it: approved results newest first, counted with COUNT and paged with OFFSET. */
  async function listFromSql(page: number, where: Record<string, unknown> = {}) {
    const { rows, count } = await Result.findAndCountAll({ where: { status: 'approved', ...where }, attributes: ['id'], order: [['createdAt', 'DESC'], ['id', 'DESC']], limit: 25, offset: (page - 1) * 25 });
    return { ids: rows.map((r) => r.id), total: count };
  }
  const listFromApi = async (qs: string) => {
    const body = (await request(server.url).get(`/api/results?${qs}`).expect(200)).body as { items: { id: number }[]; total: number; page: number; pageSize: number };
    expect(body.pageSize).toBe(25);
    return { ids: body.items.map((r) => r.id), total: body.total };
  };

  /** What a list item holds (presentResultSummary): no input in full, notes or trail. */
  const summaryFields = ['abrasive', 'abrasiveMaterial', 'abrasiveMaterialLabel', 'abrasiveName', 'author', 'bond', 'can', 'createdAt', 'derived', 'id', 'review', 'sharpnessMethodName', 'status', 'steel', 'steelName', 'updatedAt'];

  it('gives the pages, totals and order of the SQL list, whole and by steel or abrasive, across writes', async () => {
    const check = async () => {
      const total = await Result.count({ where: { status: 'approved' } });
      for (const page of [1, 2, 3, Math.ceil(total / 25), Math.ceil(total / 25) + 1]) {
        expect(await listFromApi(`status=approved&page=${page}`), `page ${page}`).toEqual(await listFromSql(page));
        expect(await listFromApi(`page=${page}`), `page ${page}`).toEqual(await listFromSql(page));
      }
      const steel = (await Steel.findOne({ where: { slug: 'aisi-d2' } }))!;
      const abrasive = (await Abrasive.findOne({ where: { slug: 'diamond-resin-wheel-250-15um' } }))!;
      for (const page of [1, 2]) {
        expect(await listFromApi(`steel=aisi-d2&page=${page}`)).toEqual(await listFromSql(page, { steelId: steel.id }));
        expect(await listFromApi(`abrasive=${abrasive.slug}&page=${page}`)).toEqual(await listFromSql(page, { abrasiveId: abrasive.id }));
      }
    };
    await check();
    const member = await signIn(server.url, await demoHandle(server.url, 'member'));
    const mod = await signIn(server.url, await demoHandle(server.url, 'moderator'));
    const input = {
      steel: 'aisi-d2', hardness: { value: 60, scale: 'HRC' }, abrasive: 'diamond-resin-wheel-250-15um', grit: { standard: 'um', grade: '15 µm' },
      edgeAngle: { perSideDeg: 17 }, sharpness: { method: 'push-cut-test-v2', readingsG: [170, 175, 172] },
    };
    const posted = await member.agent.post('/api/results').set('X-CSRF-Token', member.csrf).send(input).expect(201);
    await mod.agent.post(`/api/results/${posted.body.id}/review`).set('X-CSRF-Token', mod.csrf).send({ decision: 'approve' }).expect(200);
    expect((await listFromApi('status=approved')).ids[0]).toBe(posted.body.id);
    await check();
    // Each item is the result's own answer without what was entered in full, the notes and the
    // trail (that one reads the pages through joins; the list names them from the kept lookups),
    // for a visitor and for the author (who sees the review note in both).
    for (const who of [request(server.url), member.agent]) {
      const items = ((await who.get('/api/results?status=approved').expect(200)).body as { items: { id: number }[] }).items;
      for (const item of items.slice(0, 5)) {
        expect((await who.get(`/api/results/${item.id}`).expect(200)).body).toMatchObject(item);
        expect(Object.keys(item).sort()).toEqual(summaryFields);
      }
    }
    const own = ((await member.agent.get('/api/results?status=approved').expect(200)).body as { items: { id: number; review: unknown }[] }).items.find((r) => r.id === posted.body.id);
    expect(own?.review).toMatchObject({ decision: 'approved' });
    await member.agent.post(`/api/results/${posted.body.id}/retract`).set('X-CSRF-Token', member.csrf).send({ reason: 'checking the list' }).expect(200);
    expect((await listFromApi('status=approved')).ids).not.toContain(posted.body.id);
    await check();
  });
});

describe('a page for signed-in people', () => {
  it('is the visitor’s page with the person’s own allowed actions, and follows a protection at once', async () => {
    const member = await signIn(server.url, await demoHandle(server.url, 'member'));
    const mod = await signIn(server.url, await demoHandle(server.url, 'moderator'));
    const slug = 'aisi-o1';
    const read = async () => {
      const visitor = (await request(server.url).get(`/api/steels/${slug}`).expect(200)).body;
      const asMember = (await member.agent.get(`/api/steels/${slug}`).expect(200)).body;
      const asModerator = (await mod.agent.get(`/api/steels/${slug}`).expect(200)).body;
      const { can: visitorCan, ...shared } = visitor;
      for (const page of [asMember, asModerator]) expect({ ...page, can: undefined }).toEqual({ ...shared, can: undefined });
      return { visitorCan, memberCan: asMember.can, moderatorCan: asModerator.can, isProtected: visitor.isProtected };
    };
    // The rules of shared/permissions.ts: any member proposes an edit; moderators publish, revert, protect and merge.
    expect(await read()).toEqual({
      visitorCan: { edit: false, publish: false, revert: false, protect: false, merge: false },
      memberCan: { edit: true, publish: false, revert: false, protect: false, merge: false },
      moderatorCan: { edit: true, publish: true, revert: true, protect: true, merge: true },
      isProtected: false,
    });
    await mod.agent.post(`/api/steels/${slug}/protect`).set('X-CSRF-Token', mod.csrf).send({ protected: true }).expect(200);
    const after = await read();
    expect(after.isProtected).toBe(true);
    expect(after.memberCan.edit).toBe(false);
    expect(after.moderatorCan.edit).toBe(true);
  });
});

describe('the answer cache switch', () => {
  it('keeps answers by default and none with ANSWER_CACHE=off, the answers alike; /api/health counts', async () => {
    const stats = async (url: string) => (await request(url).get('/api/health').expect(200)).body.answerCache as { on: boolean; hits: number; misses: number };
    const paths = ['/api/steels/aisi-d2', '/api/compare?method=push-cut-test-v2&hrcMin=60', '/api/abrasives'];
    // Two servers over the same fresh copy of the demo data (the one above has had writes).
    const cached = await startTestServer();
    const kept: unknown[] = [];
    try {
      for (const p of paths) kept.push((await request(cached.url).get(p).expect(200)).body, (await request(cached.url).get(p).expect(200)).body);
      const onAfter = await stats(cached.url);
      expect(onAfter.on).toBe(true);
      // The second asking of each is served from the kept answers.
      expect(onAfter.hits).toBeGreaterThanOrEqual(paths.length);
    } finally {
      await cached.stop();
    }
    const off = await startTestServer({ ANSWER_CACHE: 'off' });
    try {
      const fresh: unknown[] = [];
      for (const p of paths) fresh.push((await request(off.url).get(p).expect(200)).body, (await request(off.url).get(p).expect(200)).body);
      const offAfter = await stats(off.url);
      expect(offAfter).toEqual({ on: false, hits: 0, misses: 2 * paths.length });
      expect(fresh).toEqual(kept);
    } finally {
      await off.stop();
    }
  });
});
