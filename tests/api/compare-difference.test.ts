import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import * as ss from 'simple-statistics';
import type { CompareRow } from '../../shared/compare-view';
import { startTestServer } from '../setup/test-server';
import { Method, Result, Steel } from '../../server/models';

let server: Awaited<ReturnType<typeof startTestServer>>;
beforeAll(async () => {
  server = await startTestServer();
});
afterAll(async () => {
  await server?.stop();
});

const api = (path: string) => request(server.url).get(path);
const METHOD = 'push-cut-test-v2';

/** The approved results of a cell, read here from the table (whole-φ cells). */
async function cellResults(row: CompareRow) {
  const steel = (await Steel.findOne({ where: { slug: row.steel } }))!;
  const method = (await Method.findOne({ where: { slug: METHOD } }))!;
  return Result.findAll({ where: { status: 'approved', sharpnessMethodId: method.id, steelId: steel.id, material: row.material, gritPhi: row.band.phi } });
}

/** Two cells of the steel with the most cells, the largest first. */
async function twoCells(): Promise<[CompareRow, CompareRow]> {
  const rows = (await api(`/api/compare?method=${METHOD}&pageSize=5000`).expect(200)).body.rows as CompareRow[];
  const bySteel = new Map<string, CompareRow[]>();
  for (const r of rows) bySteel.set(r.steel, [...(bySteel.get(r.steel) ?? []), r]);
  const list = [...bySteel.values()].sort((a, b) => b.length - a.length)[0].sort((x, y) => y.n - x.n);
  return [list[0], list[1]];
}

describe('GET /api/compare/difference', () => {
  it('gives the Hodges–Lehmann shift B − A of the results’ medians with its interval, recomputed here by brute force', async () => {
    const [a, b] = await twoCells();
    const res = await api(`/api/compare/difference?method=${METHOD}&a=${a.cell}&b=${b.cell}`).expect(200);
    const [ra, rb] = await Promise.all([cellResults(a), cellResults(b)]);
    expect(res.body.a.n).toBe(ra.length);
    expect(res.body.b.n).toBe(rb.length);
    // Independent recomputation: every pairwise difference, its median by simple-statistics.
    const diffs = ra.flatMap((x) => rb.map((y) => y.sharpnessMedianG - x.sharpnessMedianG)).sort((p, q) => p - q);
    const s = res.body.sharpness;
    expect(s.estimate).toBeCloseTo(ss.median(diffs), 9);
    expect(s.nA).toBe(ra.length);
    if (s.interval) {
      const [k, k2] = s.interval.ranks;
      expect(k2).toBe(diffs.length + 1 - k);
      expect(s.interval.lo).toBeCloseTo(diffs[k - 1], 9);
      expect(s.interval.hi).toBeCloseTo(diffs[diffs.length - k], 9);
      expect(s.interval.coverage).toBeGreaterThanOrEqual(0.95);
    } else expect(s.widestCoverage).toBeLessThan(0.95);
    expect(s.words).toMatch(/shift B − A/);
    expect(res.body.words[0]).toBe(s.words);
    // The within-edge spread: the median of each edge's sample SD (simple-statistics), over both cells.
    const sds = [...ra, ...rb].filter((r) => r.input.sharpness.readingsG.length > 1).map((r) => ss.sampleStandardDeviation(r.input.sharpness.readingsG));
    expect(res.body.withinEdge.edges).toBe(sds.length);
    if (sds.length) {
      expect(res.body.withinEdge.medianSdG).toBeCloseTo(ss.median(sds), 9);
      expect(res.body.words.join(' ')).toMatch(/One edge's own readings scatter/);
    }
  });

  it('compares retention where both cells report it, and says so where one does not', async () => {
    const [a, b] = await twoCells();
    const res = await api(`/api/compare/difference?method=${METHOD}&a=${a.cell}&b=${b.cell}`).expect(200);
    const [ra, rb] = await Promise.all([cellResults(a), cellResults(b)]);
    const ca = ra.map((r) => r.retentionCuts).filter((c): c is number => c !== null);
    const cb = rb.map((r) => r.retentionCuts).filter((c): c is number => c !== null);
    if (ca.length && cb.length) {
      expect(res.body.retention.estimate).toBeCloseTo(ss.median(ca.flatMap((x) => cb.map((y) => y - x))), 9);
      expect(res.body.retention.unit).toBe('cuts');
    } else {
      expect(res.body.retention).toBeNull();
      expect(res.body.words.join(' ')).toMatch(/Retention cannot be compared/);
    }
  });

  it('mirrors when A and B swap', async () => {
    const [a, b] = await twoCells();
    const ab = (await api(`/api/compare/difference?method=${METHOD}&a=${a.cell}&b=${b.cell}`).expect(200)).body;
    const ba = (await api(`/api/compare/difference?method=${METHOD}&a=${b.cell}&b=${a.cell}`).expect(200)).body;
    expect(ba.sharpness.estimate).toBeCloseTo(-ab.sharpness.estimate, 9);
    if (ab.sharpness.interval) expect(ba.sharpness.interval.lo).toBeCloseTo(-ab.sharpness.interval.hi, 9);
  });

  it('applies the view’s filters (hardness) to both cells', async () => {
    const [a, b] = await twoCells();
    const res = await api(`/api/compare/difference?method=${METHOD}&a=${a.cell}&b=${b.cell}&hrcMin=200`);
    // hrcMin above 100 is refused, naming the field
    expect(res.status).toBe(400);
    expect(res.body.issues[0].path).toBe('hrcMin');
    const high = (await api(`/api/compare/difference?method=${METHOD}&a=${a.cell}&b=${b.cell}&hrcMin=99`).expect(200)).body;
    expect(high.a).toBeNull();
    expect(high.sharpness).toBeNull();
    expect(high.words[0]).toMatch(/no results under these filters/);
  });

  it('answers 400 naming the field for a malformed or unknown cell', async () => {
    const bad = await api(`/api/compare/difference?method=${METHOD}&a=nonsense&b=aisi-d2:cbn:6`).expect(400);
    expect(bad.body.issues[0].path).toBe('a');
    const unknown = await api(`/api/compare/difference?method=${METHOD}&a=aisi-d2:cbn:6&b=no-such-steel:cbn:6`).expect(400);
    expect(unknown.body.issues[0].path).toBe('b');
    const missing = await api(`/api/compare/difference?method=${METHOD}&a=aisi-d2:cbn:6`).expect(400);
    expect(missing.body.issues[0].path).toBe('b');
  });
});
