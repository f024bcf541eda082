import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as ss from 'simple-statistics';
import { fn, col } from 'sequelize';
import { demoHandle, signIn, startTestServer } from '../setup/test-server';
import { Method, Result, User } from '../../server/models';
import type { ResultInput } from '../../shared/schemas/result';

let server: Awaited<ReturnType<typeof startTestServer>>;
let member: Awaited<ReturnType<typeof signIn>>;
let mod: Awaited<ReturnType<typeof signIn>>;
/** An approved demo result from the fullest cell, and that cell's key. */
let template: Result;

beforeAll(async () => {
  server = await startTestServer();
  member = await signIn(server.url, await demoHandle(server.url, 'member'));
  mod = await signIn(server.url, await demoHandle(server.url, 'moderator', 0));
  const [fullest] = (await Result.findAll({
    attributes: ['sharpnessMethodId', 'steelId', 'material', 'gritPhi', [fn('COUNT', col('id')), 'n']],
    where: { status: 'approved' },
    group: ['sharpnessMethodId', 'steelId', 'material', 'gritPhi'],
    order: [[fn('COUNT', col('id')), 'DESC']],
    limit: 1,
    raw: true,
  })) as unknown as { sharpnessMethodId: number; steelId: number; material: string; gritPhi: number; n: number }[];
  const memberId = (await User.findOne({ where: { handle: member.user.handle } }))!.id;
  const members = await Result.findAll({ where: { status: 'approved', sharpnessMethodId: fullest.sharpnessMethodId, steelId: fullest.steelId, material: fullest.material, gritPhi: fullest.gritPhi }, order: [['id', 'ASC']] });
  template = members.find((r) => r.authorId !== memberId)!;
  expect(Number(fullest.n)).toBeGreaterThanOrEqual(4);
});
afterAll(async () => {
  await server?.stop();
});

const post = async (input: ResultInput) => (await member.agent.post('/api/results').set('X-CSRF-Token', member.csrf).send(input).expect(201)).body.id as number;
const context = async (id: number) => (await mod.agent.get(`/api/review-desk/results/${id}/context`).expect(200)).body;
const withReadings = (readingsG: number[], perSideDeg?: number): ResultInput => ({
  ...template.input,
  edgeAngle: perSideDeg === undefined ? template.input.edgeAngle : { perSideDeg },
  sharpness: { ...template.input.sharpness, readingsG },
});

/** The approved medians of the template's cell, read straight from the table. */
async function cellMedians(): Promise<number[]> {
  const rows = await Result.findAll({
    where: { status: 'approved', sharpnessMethodId: template.sharpnessMethodId, steelId: template.steelId, material: template.material, gritPhi: template.gritPhi },
    attributes: ['sharpnessMedianG'],
  });
  return rows.map((r) => r.sharpnessMedianG);
}

describe('GET /api/review-desk/results/:id/context', () => {
  it('gives the cell the result would join: n, median and quartiles equal to simple-statistics on the approved results', async () => {
    const low = Math.max(1, Math.round(template.sharpnessMedianG * 0.2));
    const id = await post(withReadings([low, low, low]));
    const body = await context(id);
    const medians = await cellMedians();
    // Independent recomputation: simple-statistics 7.12 quantile() is R's type 7 (its source says so).
    expect(body.cell.figures.n).toBe(medians.length);
    expect(body.cell.figures.median).toBeCloseTo(ss.median(medians), 9);
    expect(body.cell.figures.q1).toBeCloseTo(ss.quantile(medians, 0.25), 9);
    expect(body.cell.figures.q3).toBeCloseTo(ss.quantile(medians, 0.75), 9);
    // Percentile rank, (below + ½ · equal) / n × 100, counted here by hand.
    const below = medians.filter((m) => m < low).length;
    const equal = medians.filter((m) => m === low).length;
    expect(body.cell.position.percentileRank).toBeCloseTo(((below + equal / 2) / medians.length) * 100, 9);
    // Tukey's fences (Tukey 1977, recalled from memory): Q1 − 1.5 · IQR, Q3 + 1.5 · IQR.
    const iqr = ss.interquartileRange(medians);
    const lowerFence = ss.quantile(medians, 0.25) - 1.5 * iqr;
    expect(body.cell.outlier.fences[0]).toBeCloseTo(lowerFence, 9);
    expect(body.cell.outlier.fences[1]).toBeCloseTo(ss.quantile(medians, 0.75) + 1.5 * iqr, 9);
    expect(body.cell.outlier.outside).toBe(low < lowerFence ? 'low' : null);
    expect(body.cell.outlier.rule).toMatch(/Tukey/);
    expect(body.cell.outlier.source).toMatch(/Exploratory Data Analysis.*1977/);
    if (low < body.cell.figures.q1) expect(body.cell.position.words).toMatch(/below the lower quartile/);
  });

  it("compares the method's required readings with the result's", async () => {
    const method = await Method.findByPk(template.sharpnessMethodId);
    const given = Math.max(1, method!.readingsPerEdge - 2);
    const id = await post(withReadings(Array.from({ length: given }, () => template.sharpnessMedianG)));
    const { readings } = await context(id);
    expect(readings).toMatchObject({ required: method!.readingsPerEdge, given, short: method!.readingsPerEdge - given });
    expect(readings.words).toMatch(new RegExp(`asks for ${method!.readingsPerEdge} readings.*has ${given}`));
  });

  it('lists near-duplicates by the rule it states: same steel, abrasive, grit and method, angle within 0.25°, median within 5 %', async () => {
    const m = template.sharpnessMedianG;
    const angle = template.perSideDeg;
    const first = await post(withReadings([m, m, m]));
    const near = await post(withReadings([m * 1.04, m * 1.04, m * 1.04], angle + 0.2)); // within both tolerances
    const farMedian = await post(withReadings([m * 1.06, m * 1.06, m * 1.06])); // 6 % off
    const farAngle = await post(withReadings([m, m, m], angle + 0.3)); // 0.3° off
    const body = await context(first);
    expect(body.nearDuplicateRule).toMatch(/within 0\.25°.*within 5 %/);
    const ids = (body.nearDuplicates as { id: number }[]).map((d) => d.id);
    expect(ids).toContain(near);
    expect(ids).toContain(template.id); // the published one it repeats, by another author
    expect(ids).not.toContain(first);
    expect(ids).not.toContain(farMedian);
    expect(ids).not.toContain(farAngle);
    const byId = new Map((body.nearDuplicates as { id: number; sameAuthor: boolean; status: string }[]).map((d) => [d.id, d]));
    expect(byId.get(near)).toMatchObject({ sameAuthor: true, status: 'pending' });
    expect(byId.get(template.id)).toMatchObject({ sameAuthor: false, status: 'approved' });
  });

  it("gives the author's record from the results table", async () => {
    const id = await post(withReadings([template.sharpnessMedianG]));
    const returned = await post(withReadings([template.sharpnessMedianG * 2]));
    await mod.agent.post(`/api/results/${returned}/review`).set('X-CSRF-Token', mod.csrf).send({ decision: 'return', note: 'Add two more readings.' }).expect(200);
    const { authorRecord } = await context(id);
    const authorId = (await User.findOne({ where: { handle: member.user.handle } }))!.id;
    const count = (status: string) => Result.count({ where: { authorId, status } });
    expect(authorRecord).toMatchObject({ published: await count('approved'), pending: await count('pending'), returnedNow: await count('returned'), rejected: await count('rejected') });
    expect(authorRecord.returnedNow).toBeGreaterThanOrEqual(1);
    expect(authorRecord.everReturned).toBeGreaterThanOrEqual(authorRecord.returnedNow);
  });

  it('answers 409 for a result that is not pending, 404 for none, 403 for a member', async () => {
    await mod.agent.get(`/api/review-desk/results/${template.id}/context`).expect(409);
    await mod.agent.get('/api/review-desk/results/99999999/context').expect(404);
    const id = await post(withReadings([template.sharpnessMedianG]));
    await member.agent.get(`/api/review-desk/results/${id}/context`).expect(403);
    await mod.agent.get(`/api/review-desk/results/${id}/context?x=1`).expect(400);
  });
});
