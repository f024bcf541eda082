import { execFile } from 'node:child_process';
import { promisify } from 'node:util';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import * as ss from 'simple-statistics';
import Papa from 'papaparse';
import { Op } from 'sequelize';
import { gritBandPhi } from '../../shared/grit';
import { COMPARE_SORT_KEYS } from '../../shared/schemas/compare';
import type { CompareRow } from '../../shared/compare-view';
import { demoHandle, signIn, startTestServer } from '../setup/test-server';
import { Abrasive, ComparisonCell, Method, Result, Steel, User } from '../../server/models';
import { rebuildAllCells } from '../../server/aggregates/comparison-cells';

let server: Awaited<ReturnType<typeof startTestServer>>;
beforeAll(async () => {
  server = await startTestServer();
});
afterAll(async () => {
  await server?.stop();
});

const api = (path: string) => request(server.url).get(path);
type Body = { rows: CompareRow[]; method: { slug: string }; source: string; total: number; totalResults: number; shrinkage: { overallMedianG: number } };
const view = async (qs: string): Promise<Body> => (await api(`/api/compare?pageSize=5000&${qs}`).expect(200)).body;

/** Type 7 quantile (Hyndman and Fan 1996, definition 7; the default of R and NumPy), written out here. */
function type7(values: number[], p: number): number {
  const s = [...values].sort((a, b) => a - b);
  const h = (s.length - 1) * p;
  const lo = Math.floor(h);
  return s[lo] + (h - lo) * (s[Math.min(lo + 1, s.length - 1)] - s[lo]);
}

async function methodId(slug: string) {
  return (await Method.findOne({ where: { slug } }))!.id;
}

/** The view's cells recomputed here from the approved results, by steel slug, material and band φ. */
async function recompute(methodSlug: string, step: 1 | 0.5, where: Record<string | symbol, unknown> = {}) {
  const rows = await Result.findAll({ where: { status: 'approved', sharpnessMethodId: await methodId(methodSlug), ...where }, include: [{ model: Steel, as: 'steel' }], raw: true, nest: true });
  const cells = new Map<string, typeof rows>();
  for (const r of rows) {
    // Whole φ as stored; half φ from the particle size (shared/grit.ts, tested against its tables).
    const phi = step === 1 ? r.gritPhi : gritBandPhi(r.gritUm, 0.5);
    const key = `${(r.steel as unknown as { slug: string }).slug}:${r.material}:${phi}`;
    cells.set(key, [...(cells.get(key) ?? []), r]);
  }
  return cells;
}

describe('the comparison table', () => {
  it('compares one method version at a time, the one with the most published results by default', async () => {
    const counts = await Result.findAll({ where: { status: 'approved' }, attributes: ['sharpnessMethodId'], raw: true });
    const byMethod = new Map<number, number>();
    for (const c of counts) byMethod.set(c.sharpnessMethodId, (byMethod.get(c.sharpnessMethodId) ?? 0) + 1);
    const busiest = [...byMethod.entries()].sort((a, b) => b[1] - a[1])[0][0];
    const body = await view('');
    expect(body.method.slug).toBe((await Method.findByPk(busiest))!.slug);
    expect(body.source).toBe('cells');
    expect(new Set(body.rows.map((r) => r.method))).toEqual(new Set([body.method.slug]));
    const v1 = await view('method=push-cut-test-v1');
    expect(new Set(v1.rows.map((r) => r.method))).toEqual(new Set(['push-cut-test-v1']));
  });

  it.each([
    ['push-cut-test-v2', 1],
    ['push-cut-test-v2', 0.5],
    ['push-cut-test-v1', 1],
    ['push-cut-test-v1', 0.5],
  ] as const)('matches every cell of %s (band %s φ) recomputed from its approved results with simple-statistics', async (method, step) => {
    const body = await view(`method=${method}&step=${step}`);
    const expected = await recompute(method, step);
    expect(body.rows.map((r) => r.cell).sort()).toEqual([...expected.keys()].sort());
    for (const row of body.rows) {
      const members = expected.get(row.cell)!;
      const g = members.map((m) => m.sharpnessMedianG);
      expect(row.n, row.cell).toBe(members.length);
      expect(row.testers).toBe(new Set(members.map((m) => m.authorId)).size);
      // the API gives grams to 0.01 g
      expect(row.sharpnessG.median).toBeCloseTo(ss.median(g), 1);
      expect(row.sharpnessG.mean).toBeCloseTo(ss.mean(g), 1);
      expect(row.sharpnessG.q1).toBeCloseTo(type7(g, 0.25), 1);
      expect(row.sharpnessG.q3).toBeCloseTo(type7(g, 0.75), 1);
      if (g.length > 1) expect(row.sharpnessG.sd!).toBeCloseTo(ss.sampleStandardDeviation(g), 1);
      else expect(row.sharpnessG.sd).toBeNull();
      const cuts = members.map((m) => m.retentionCuts).filter((c): c is number => c !== null);
      expect(row.retentionCuts?.median ?? null).toBe(cuts.length ? ss.median(cuts) : null);
      expect(row.hrcRange[0]).toBeCloseTo(ss.min(members.map((m) => m.hrc)), 1);
      expect(row.hrcRange[1]).toBeCloseTo(ss.max(members.map((m) => m.hrc)), 1);
      expect(row.fewResults).toBe(members.length < 3);
      expect(row.singleTester).toBe(row.testers === 1);
      expect(row.band.step).toBe(step);
    }
    // every approved result of the method counts exactly once, and no other
    const approved = await Result.count({ where: { status: 'approved', sharpnessMethodId: await methodId(method) } });
    expect(body.totalResults).toBe(approved);
  });

  it('never counts pending, returned, rejected or retracted results', async () => {
    const v2 = await methodId('push-cut-test-v2');
    const others = await Result.count({ where: { sharpnessMethodId: v2, status: { [Op.ne]: 'approved' } } });
    expect(others).toBeGreaterThan(0); // the demo data holds pending, returned and rejected results
    const before = await view('method=push-cut-test-v2');
    const cell = before.rows.find((r) => r.n >= 3)!;
    const [steel, material, phi] = cell.cell.split(':');
    const steelId = (await Steel.findOne({ where: { slug: steel } }))!.id;
    const victim = (await Result.findOne({ where: { status: 'approved', sharpnessMethodId: v2, steelId, material, gritPhi: Number(phi) } }))!;
    // A write through the model records its change; the feed refreshes the cell in the same transaction.
    await server.ctx.db.write((transaction) => victim.update({ status: 'retracted' }, { transaction }));
    const after = await view('method=push-cut-test-v2');
    expect(after.rows.find((r) => r.cell === cell.cell)!.n).toBe(cell.n - 1);
    expect(after.totalResults).toBe(before.totalResults - 1);
    // the path that reads results (any hardness filter) excludes it too
    const live = await view('method=push-cut-test-v2&hrcMin=0&hrcMax=100');
    expect(live.source).toBe('results');
    expect(live.rows.find((r) => r.cell === cell.cell)!.n).toBe(cell.n - 1);
  });

  it('gives the same cells from the precomputed table and from the results', async () => {
    for (const step of [1, 0.5]) {
      const cells = await view(`method=push-cut-test-v2&step=${step}`);
      const live = await view(`method=push-cut-test-v2&step=${step}&angleMin=0`);
      expect(live.source).toBe('results');
      const strip = (rows: CompareRow[]) => rows.map((r) => ({ ...r, sharpnessG: { ...r.sharpnessG, mean: Math.round(r.sharpnessG.mean * 1e6), sd: r.sharpnessG.sd && Math.round(r.sharpnessG.sd * 1e6), ci95: null } }));
      expect(strip(live.rows)).toEqual(strip(cells.rows));
    }
  });

  it('filters by steels, category, material, bond and particle size', async () => {
    const two = await view('method=push-cut-test-v2&steel=aisi-d2,aisi-52100');
    expect(new Set(two.rows.map((r) => r.steel))).toEqual(new Set(['aisi-d2', 'aisi-52100']));
    const stainless = await view('method=push-cut-test-v2&category=stainless');
    expect(stainless.rows.length).toBeGreaterThan(0);
    expect(stainless.rows.every((r) => r.steelCategory === 'stainless')).toBe(true);
    const superabrasive = await view('method=push-cut-test-v2&material=cbn&material=diamond');
    expect(new Set(superabrasive.rows.map((r) => r.material))).toEqual(new Set(['cbn', 'diamond']));
    const fine = await view('method=push-cut-test-v2&umMin=4&umMax=16');
    expect(fine.rows.length).toBeGreaterThan(0);
    expect(fine.rows.every((r) => r.band.loUm < 16 && r.band.hiUm > 4)).toBe(true);
    const all = await view('method=push-cut-test-v2');
    expect(fine.rows.length).toBe(all.rows.filter((r) => r.band.loUm < 16 && r.band.hiUm > 4).length);

    const plated = await view('method=push-cut-test-v2&bond=electroplated');
    expect(plated.source).toBe('results');
    const platedIds = (await Abrasive.findAll({ where: { bond: 'electroplated' } })).map((a) => a.id);
    const expected = await Result.count({ where: { status: 'approved', sharpnessMethodId: await methodId('push-cut-test-v2'), abrasiveId: platedIds } });
    expect(plated.totalResults).toBe(expected);
  });

  it('filters by hardness, angle, publisher and date from the results', async () => {
    const v2 = await methodId('push-cut-test-v2');
    const hard = await view('method=push-cut-test-v2&hrcMin=60&hrcMax=62');
    expect(hard.rows.every((r) => r.hrcRange[0] >= 60 && r.hrcRange[1] <= 62)).toBe(true);
    expect(hard.totalResults).toBe(await Result.count({ where: { status: 'approved', sharpnessMethodId: v2, hrc: { [Op.between]: [60, 62] } } }));
    const steep = await view('method=push-cut-test-v2&angleMin=18');
    expect(steep.rows.every((r) => r.angleRange[0] >= 18)).toBe(true);
    const publishers = (await User.findAll({ where: { role: 'publisher' } })).map((u) => u.id);
    const pro = await view('method=push-cut-test-v2&publisher=1');
    expect(pro.totalResults).toBe(await Result.count({ where: { status: 'approved', sharpnessMethodId: v2, authorId: publishers } }));
    const recent = await view('method=push-cut-test-v2&postedFrom=2026-06-01&postedTo=2026-10-31');
    const inRange = await Result.count({
      where: { status: 'approved', sharpnessMethodId: v2, createdAt: { [Op.gte]: new Date('2026-06-01T00:00:00Z'), [Op.lt]: new Date('2026-11-01T00:00:00Z') } },
    });
    expect(inRange).toBeGreaterThan(0);
    expect(recent.totalResults).toBe(inRange);
  });

  it('follows a new publisher in the publishers-only view at once', async () => {
    const v2 = await methodId('push-cut-test-v2');
    const proCount = async () => Result.count({ where: { status: 'approved', sharpnessMethodId: v2, authorId: (await User.findAll({ where: { role: 'publisher' } })).map((u) => u.id) } });
    expect((await view('method=push-cut-test-v2&publisher=1')).totalResults).toBe(await proCount());
    // a member with published results on this method becomes a publisher (an approved application)
    const authors = await Result.findAll({ where: { status: 'approved', sharpnessMethodId: v2 }, attributes: ['authorId'], raw: true });
    const member = await User.findOne({ where: { role: 'member', id: [...new Set(authors.map((a) => a.authorId))] } });
    expect(member).not.toBeNull();
    await server.ctx.db.write((transaction) => member!.update({ role: 'publisher' }, { transaction }));
    const after = await view('method=push-cut-test-v2&publisher=1');
    expect(after.totalResults).toBe(await proCount());
    await server.ctx.db.write((transaction) => member!.update({ role: 'member' }, { transaction }));
    expect((await view('method=push-cut-test-v2&publisher=1')).totalResults).toBe(await proCount());
  });

  it('sorts on every column, both ways, and pages', async () => {
    const value: Record<string, (r: CompareRow) => number | string | null> = {
      steel: (r) => r.steelName.toLowerCase(),
      material: (r) => r.materialLabel.toLowerCase(),
      band: (r) => r.band.phi,
      n: (r) => r.n,
      testers: (r) => r.testers,
      median: (r) => r.sharpnessG.median,
      q1: (r) => r.sharpnessG.q1,
      q3: (r) => r.sharpnessG.q3,
      mean: (r) => r.sharpnessG.mean,
      ci: (r) => (r.sharpnessG.ci95 ? r.sharpnessG.ci95[1] - r.sharpnessG.ci95[0] : null),
      retention: (r) => r.retentionCuts?.median ?? null,
      hrc: (r) => r.hrcRange[0],
      angle: (r) => r.angleRange[0],
      ranked: (r) => r.rankedMedianG,
    };
    for (const key of COMPARE_SORT_KEYS) {
      for (const desc of [false, true]) {
        const { rows } = await view(`method=push-cut-test-v2&sort=${desc ? '-' : ''}${key}`);
        const values = rows.map(value[key]);
        const present = values.filter((v) => v !== null);
        // missing values come last
        expect(values.slice(present.length).every((v) => v === null), key).toBe(true);
        for (let i = 1; i < present.length; i++) {
          const a = present[i - 1]!;
          const b = present[i]!;
          const ok = typeof a === 'number' ? (desc ? a >= (b as number) : a <= (b as number)) : desc ? a.localeCompare(b as string) >= 0 : a.localeCompare(b as string) <= 0;
          expect(ok, `${desc ? '-' : ''}${key} at ${i}: ${a} then ${b}`).toBe(true);
        }
      }
    }
    const all = await view('method=push-cut-test-v2&sort=-n');
    const page2 = (await api('/api/compare?method=push-cut-test-v2&sort=-n&pageSize=10&page=2').expect(200)).body as Body & { page: number };
    expect(page2.rows.map((r) => r.cell)).toEqual(all.rows.slice(10, 20).map((r) => r.cell));
    expect(page2.total).toBe(all.total);
  });

  it('answers a repeated view with 304 when the client has it, and a changed one in full', async () => {
    const first = await api('/api/compare?method=push-cut-test-v2').expect(200);
    const etag = first.headers.etag as string;
    expect(etag).toMatch(/^W\/"/);
    await api('/api/compare?method=push-cut-test-v2').set('If-None-Match', etag).expect(304);
    const other = await api('/api/compare?method=push-cut-test-v2&sort=-n').expect(200);
    expect(other.headers.etag).not.toBe(etag);
  });

  it('ranks with shrinkage toward the method’s overall median', async () => {
    const body = await view('method=push-cut-test-v2&sort=ranked');
    const medians = (await Result.findAll({ where: { status: 'approved', sharpnessMethodId: await methodId('push-cut-test-v2') }, raw: true })).map((r) => r.sharpnessMedianG);
    expect(body.shrinkage.overallMedianG).toBeCloseTo(ss.median(medians), 9);
    // the API gives grams to 0.01 g
    for (const r of body.rows) {
      // (n · median + 3 · overall) / (n + 3), worked by hand in tests/unit/compare.test.ts
      expect(r.rankedMedianG).toBeCloseTo((r.n * r.sharpnessG.median + 3 * ss.median(medians)) / (r.n + 3), 1);
    }
  });

  it('refuses bad queries with 400 naming the field', async () => {
    const cases: [string, string][] = [
      ['method=no-such-method', 'method'],
      ['steel=aisi-d2,no-such-steel', 'steel'],
      ['sort=colour', 'sort'],
      ['hrcMin=62&hrcMax=58', 'hrcMax'],
      ['step=2', 'step'],
      ['material=unobtainium', 'material.0'],
      ['postedFrom=yesterday', 'postedFrom'],
      ['publisher=maybe', 'publisher'],
      ['colour=red', 'colour'],
    ];
    for (const [qs, path] of cases) {
      const res = await api(`/api/compare?${qs}`).expect(400);
      expect(res.body.issues.map((i: { path: string }) => i.path), qs).toContain(path);
    }
  });

  it('shows an approval in the table and in search at once', async () => {
    const member = await signIn(server.url, await demoHandle(server.url, 'member'));
    const input = {
      steel: 'aisi-m2',
      hardness: { value: 64, scale: 'HRC' },
      abrasive: 'diamond-resin-wheel-250-15um',
      grit: { standard: 'um', grade: '15 µm' },
      edgeAngle: { perSideDeg: 15 },
      sharpness: { method: 'push-cut-test-v2', readingsG: [150, 155, 160, 150, 152] },
    };
    const cellOf = async () => (await view('method=push-cut-test-v2&steel=aisi-m2&material=diamond')).rows.find((r) => r.cell === 'aisi-m2:diamond:6');
    const before = (await cellOf())?.n ?? 0;
    const posted = await member.agent.post('/api/results').set('X-CSRF-Token', member.csrf).send(input).expect(201);
    expect((await cellOf())?.n ?? 0).toBe(before);
    const mod = await signIn(server.url, await demoHandle(server.url, 'moderator'));
    await mod.agent.post(`/api/results/${posted.body.id}/review`).set('X-CSRF-Token', mod.csrf).send({ decision: 'approve' }).expect(200);
    expect((await cellOf())!.n).toBe(before + 1);
    // the cell's search document follows after the commit (asynchronously, within moments)
    let hit: { cell?: { n: number } } | undefined;
    for (let i = 0; i < 50 && hit?.cell?.n !== before + 1; i++) {
      const res = await api(`/api/search?type=cell&q=${encodeURIComponent('m2 diamond 15 µm')}`).expect(200);
      hit = res.body.hits.find((h: { cell?: { ref: string; method: string } }) => h.cell?.ref === 'aisi-m2:diamond:6' && h.cell.method === 'push-cut-test-v2');
      if (hit?.cell?.n !== before + 1) await new Promise((r) => setTimeout(r, 20));
    }
    expect(hit?.cell?.n).toBe(before + 1);
  });

  it('keeps the cached cells equal to a full re-read after approvals and a retraction', async () => {
    const both = 'method=push-cut-test-v2&step=0.5';
    const whole = 'method=push-cut-test-v2';
    // Read (and so cache) both band steps first, so the writes below patch them.
    await view(both);
    await view(whole);
    const member = await signIn(server.url, await demoHandle(server.url, 'member'));
    const mod = await signIn(server.url, await demoHandle(server.url, 'moderator'));
    const ids: number[] = [];
    for (const [steel, um] of [['aisi-o1', 150], ['aisi-52100', 151]] as const) {
      const input = {
        steel, hardness: { value: 61, scale: 'HRC' }, abrasive: 'diamond-resin-wheel-250-15um', grit: { standard: 'um', grade: '15 µm' },
        edgeAngle: { perSideDeg: 15 }, sharpness: { method: 'push-cut-test-v2', readingsG: [um, um + 5, um + 2] },
      };
      const posted = await member.agent.post('/api/results').set('X-CSRF-Token', member.csrf).send(input).expect(201);
      await mod.agent.post(`/api/results/${posted.body.id}/review`).set('X-CSRF-Token', mod.csrf).send({ decision: 'approve' }).expect(200);
      ids.push(posted.body.id);
    }
    await member.agent.post(`/api/results/${ids[0]}/retract`).set('X-CSRF-Token', member.csrf).send({ reason: 'checking the cache' }).expect(200);
    const patched = [await view(both), await view(whole)];
    // A full rebuild announces every cell as changed, which makes the cache read every cell again.
    await rebuildAllCells(server.ctx.db);
    const reread = [await view(both), await view(whole)];
    expect(patched.map((v) => v.rows)).toEqual(reread.map((v) => v.rows));
    expect(patched.map((v) => v.totalResults)).toEqual(reread.map((v) => v.totalResults));
    expect(patched[1].shrinkage).toEqual(reread[1].shrinkage);
  });
});

describe('search lands on comparison cells', () => {
  it.each([
    ['d2 cbn', 'aisi-d2', 'cbn'],
    ['d2 cbn 62 µm', 'aisi-d2', 'cbn'],
    ['1.2379 diamond 15 µm', 'aisi-d2', 'diamond'],
    ['52100 fine', 'aisi-52100', undefined],
  ])('"%s" finds %s cells with n and median in the hit', async (q, steel, material) => {
    const res = await api(`/api/search?type=cell&q=${encodeURIComponent(q)}`).expect(200);
    expect(res.body.hits.length, q).toBeGreaterThan(0);
    for (const h of res.body.hits as { title: string; snippet: string; cell: { ref: string; n: number; medianG: number } }[]) {
      expect(h.cell.ref.startsWith(`${steel}:${material ?? ''}`)).toBe(true);
      expect(h.cell.n).toBeGreaterThan(0);
      expect(h.snippet).toMatch(/\d+ results? from \d+ testers?; median \d+ g/);
    }
    expect(res.body.facets.cell).toBeGreaterThan(0);
  });
});

describe('a cell, a pair, the points and the export', () => {
  it('opens a cell’s results with author and method, under the view’s filters', async () => {
    const { rows } = await view('method=push-cut-test-v2&sort=-n');
    const cell = rows[0];
    const res = await api(`/api/compare/cell?method=push-cut-test-v2&cell=${cell.cell}`).expect(200);
    expect(res.body.total).toBe(cell.n);
    expect(res.body.cell).toMatchObject({ cell: cell.cell, n: cell.n });
    for (const r of res.body.items) {
      expect(r.status).toBe('approved');
      expect(r.steel).toBe(cell.steel);
      expect(r.abrasiveMaterial).toBe(cell.material);
      expect(r.sharpness.method).toBe('push-cut-test-v2');
      expect(typeof r.author.handle).toBe('string');
    }
    const filtered = await api(`/api/compare/cell?method=push-cut-test-v2&cell=${cell.cell}&hrcMin=61`).expect(200);
    expect(filtered.body.items.every((r: { derived: { hrc: number } }) => r.derived.hrc >= 61)).toBe(true);
    await api(`/api/compare/cell?method=push-cut-test-v2&cell=${cell.steel}:${cell.material}:6.5`).expect(400);
    await api('/api/compare/cell?cell=no-such-steel:cbn:6').expect(400);
  });

  it('pairs two cells by tester and gives the median difference', async () => {
    // two cells on one steel that share testers
    const { rows } = await view('method=push-cut-test-v2');
    const bySteel = new Map<string, CompareRow[]>();
    for (const r of rows) bySteel.set(r.steel, [...(bySteel.get(r.steel) ?? []), r]);
    const candidates = [...bySteel.values()].filter((list) => list.length >= 2).sort((a, b) => b.length - a.length)[0];
    const [a, b] = [...candidates].sort((x, y) => y.n - x.n);
    const res = await api(`/api/compare/paired?method=push-cut-test-v2&a=${a.cell}&b=${b.cell}`).expect(200);
    const members = async (row: CompareRow) =>
      (await api(`/api/compare/cell?method=push-cut-test-v2&cell=${row.cell}&page=1`).expect(200)).body.items as { author: { handle: string }; derived: { sharpnessMedianG: number } }[];
    // recompute the pairing from the drill-down of each cell (every result fits on one page here)
    const [ia, ib] = await Promise.all([members(a), members(b)]);
    expect(ia.length).toBe(a.n);
    const per = (items: typeof ia) => {
      const m = new Map<string, number[]>();
      for (const i of items) m.set(i.author.handle, [...(m.get(i.author.handle) ?? []), i.derived.sharpnessMedianG]);
      return m;
    };
    const pa = per(ia);
    const pb = per(ib);
    const diffs = [...pa.keys()].filter((h) => pb.has(h)).map((h) => ss.median(pa.get(h)!) - ss.median(pb.get(h)!));
    expect(res.body.paired.n).toBe(diffs.length);
    if (diffs.length) expect(res.body.paired.medianDiffG).toBeCloseTo(ss.median(diffs), 1);
    expect(res.body.a.cell).toBe(a.cell);
    expect(res.body.unpairedMedianDiffG).toBeCloseTo(a.sharpnessG.median - b.sharpnessG.median, 1);
  });

  it('gives chart points, sampled evenly when there are many', async () => {
    const res = await api('/api/compare/points?method=push-cut-test-v2&steel=aisi-d2').expect(200);
    const { rows } = await view('method=push-cut-test-v2&steel=aisi-d2');
    expect(res.body.total).toBe(rows.reduce((s, r) => s + r.n, 0));
    expect(res.body.points.length).toBe(res.body.total);
    expect(res.body.points[0]).toEqual(expect.objectContaining({ steel: 'aisi-d2', gritUm: expect.any(Number), medianG: expect.any(Number), author: expect.any(String) }));
    const sampled = await api('/api/compare/points?method=push-cut-test-v2&limit=10').expect(200);
    expect(sampled.body.points.length).toBeLessThanOrEqual(10);
    expect(sampled.body.sampledEvery).toBeGreaterThan(1);
  });

  it('exports the whole view as CSV and JSON with licence, citation and method version, neutralising formulas', async () => {
    // a page name written as a formula (page names are community-edited)
    const steel = (await Steel.findOne({ where: { slug: 'aisi-o1' } }))!;
    // (the comparison names it from the next read on: the write's commit clears the page names)
    await server.ctx.db.write((transaction) => steel.update({ name: '=HYPERLINK("http://evil.example","O1")' }, { transaction }));
    const res = await api('/api/compare/export?format=csv&method=push-cut-test-v2&category=tool&sort=-median').expect(200);
    expect(res.headers['content-type']).toMatch(/text\/csv/);
    expect(res.headers['content-disposition']).toMatch(/attachment; filename="edgeledger-comparison-push-cut-test-v2-\d{4}-\d{2}-\d{2}\.csv"/);
    const text = res.text;
    expect(text).toMatch(/^# .*CC BY 4\.0/);
    const cited = /Retrieved (\d{4}-\d{2}-\d{2}) from (\S+)\. Licence/.exec(text)!;
    expect(cited[1]).toBe(new Date().toISOString().slice(0, 10));
    const url = new URL(cited[2]);
    expect(`${url.origin}${url.pathname}`).toBe(`${server.ctx.baseUrl}/compare`);
    expect(Object.fromEntries(url.searchParams)).toEqual({ category: 'tool', method: 'push-cut-test-v2', sort: '-median' });
    expect(text).toContain('# Method versions: push-cut-test-v2 (Push-cut sharpness test, version 2; version 2)');
    const parsed = Papa.parse<Record<string, string>>(text, { header: true, comments: '#', skipEmptyLines: true });
    expect(parsed.errors).toEqual([]);
    const { rows } = await view('method=push-cut-test-v2&category=tool&sort=-median');
    expect(parsed.data.map((r) => r.steel)).toEqual(rows.map((r) => r.steel));
    expect(parsed.data.map((r) => Number(r.median_g))).toEqual(rows.map((r) => Math.round(r.sharpnessG.median * 100) / 100));
    const o1 = parsed.data.find((r) => r.steel === 'aisi-o1');
    expect(o1?.steel_name.startsWith("'=")).toBe(true);

    const json = await api('/api/compare/export?format=json&method=push-cut-test-v2&category=tool').expect(200);
    expect(json.body.licence).toMatchObject({ name: 'CC BY 4.0' });
    expect(json.body.methods).toEqual([{ slug: 'push-cut-test-v2', name: 'Push-cut sharpness test, version 2', version: 2 }]);
    expect(json.body.rows).toHaveLength(rows.length);
  });
});

describe('npm run reaggregate', () => {
  it('rebuilds the same table as the incremental path', async () => {
    // Incremental changes: approve every pending result, retract a few approved ones.
    const mod = await signIn(server.url, await demoHandle(server.url, 'moderator'));
    const modUser = (await User.findOne({ where: { handle: mod.user.handle } }))!;
    const pending = await Result.findAll({ where: { status: 'pending', authorId: { [Op.ne]: modUser.id } } });
    expect(pending.length).toBeGreaterThan(0);
    for (const p of pending) await mod.agent.post(`/api/results/${p.id}/review`).set('X-CSRF-Token', mod.csrf).send({ decision: 'approve' }).expect(200);
    const some = await Result.findAll({ where: { status: 'approved' }, order: [['id', 'ASC']], limit: 5 });
    await server.ctx.db.write(async (transaction) => {
      for (const r of some) await r.update({ status: 'retracted' }, { transaction });
    });

    const snapshot = async () =>
      ((await ComparisonCell.findAll({ raw: true })) as unknown as Record<string, unknown>[])
        .map(({ updatedAt: _, ...c }) => Object.fromEntries(Object.entries(c).map(([k, v]) => [k, typeof v === 'number' ? Math.round(v * 1e9) / 1e9 : v])))
        .sort((a, b) => JSON.stringify(a).localeCompare(JSON.stringify(b)));
    const incremental = await snapshot();
    expect(incremental.length).toBeGreaterThan(0);

    // The real command, in its own process, on the same database (file, or PostgreSQL database).
    const { stdout } = await promisify(execFile)('npx', ['tsx', 'server/db/cli.ts', 'reaggregate'], {
      env: { ...process.env, NODE_ENV: 'test', DATA_DIR: server.dataDir, ...(server.ctx.env.DATABASE_URL && { DATABASE_URL: server.ctx.env.DATABASE_URL }) },
      timeout: 60_000,
    });
    expect(stdout).toMatch(/Rebuilt \d+ comparison cells/);
    expect(Number(/Rebuilt (\d+)/.exec(stdout)![1])).toBe(incremental.length);
    expect(await snapshot()).toEqual(incremental);
  }, 90_000);
});
