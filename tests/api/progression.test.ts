import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import Papa from 'papaparse';
import { IMPORT_COLUMNS } from '../../shared/csv';
import { toCsv } from '../../shared/csv-writer';
import { parseGrit } from '../../shared/grit';
import { demoHandle, signIn, startTestServer } from '../setup/test-server';
import { Op } from 'sequelize';
import { Abrasive, Result } from '../../server/models';
import { ChangeRow } from '../../server/changes/change-row';

let server: Awaited<ReturnType<typeof startTestServer>>;
let member: Awaited<ReturnType<typeof signIn>>;
let publisher: Awaited<ReturnType<typeof signIn>>;
beforeAll(async () => {
  server = await startTestServer();
  member = await signIn(server.url, await demoHandle(server.url, 'member'));
  publisher = await signIn(server.url, await demoHandle(server.url, 'publisher'));
});
afterAll(async () => {
  await server?.stop();
});

const COARSE = 'alox-vitrified-wheel-250-coarse';
const CBN = 'cbn-resin-wheel-250-b46';
const input = (progression?: unknown) => ({
  steel: 'aisi-d2',
  hardness: { value: 61, scale: 'HRC' },
  ...(progression === undefined ? {} : { progression }),
  abrasive: 'diamond-resin-wheel-250-15um',
  edgeAngle: { perSideDeg: 16 },
  sharpness: { method: 'push-cut-test-v2', readingsG: [150, 160, 155] },
});
const post = (body: object) => member.agent.post('/api/results').set('X-CSRF-Token', member.csrf).send(body);

describe('a result’s progression', () => {
  it('is stored in order with each step’s µm (from its own grit, else its page’s) and given back by the API', async () => {
    const res = await post(input([{ abrasive: COARSE }, { abrasive: CBN, grit: { standard: 'iso6106', grade: 'B64' }, perSideDeg: 15 }])).expect(201);
    const coarse = (await Abrasive.findOne({ where: { slug: COARSE } }))!;
    expect(res.body.progression).toHaveLength(2);
    expect(res.body.progression[0]).toMatchObject({ abrasive: COARSE, material: coarse.material, perSideDeg: null });
    // The page's labelled grit, parsed by shared/grit.ts (tested against its published tables).
    expect(res.body.progression[0].gritUm).toBeCloseTo(parseGrit(coarse.gritGrade, coarse.gritStandard as never).micrometres, 2);
    // ISO 6106 B64: 63/53 µm sieve apertures (published-values.md, R) — the grit given wins over the page's.
    expect(res.body.progression[1]).toMatchObject({ abrasive: CBN, material: 'cbn', grit: { standard: 'iso6106', grade: 'B64' }, perSideDeg: 15 });
    const row = (await Result.findByPk(res.body.id))!;
    expect(row.progressionSteps).toBe(2);
    expect(row.progressionMaterials).toBe(`,${[coarse.material, 'cbn'].sort().join(',')},`);
    const read = await request(server.url).get(`/api/results/${res.body.id}`);
    if (read.status === 200) expect(read.body.progression.map((s: { abrasive: string }) => s.abrasive)).toEqual([COARSE, CBN]);
  });

  it('is empty for a result posted without one, and for results stored before it existed', async () => {
    const res = await post(input()).expect(201);
    expect(res.body.progression).toEqual([]);
    const row = (await Result.findByPk(res.body.id))!;
    expect(row.progressionSteps).toBe(0);
    expect(row.progressionMaterials).toBe('');
  });

  it.each([
    ['an unknown abrasive', [{ abrasive: COARSE }, { abrasive: 'no-such-wheel' }], 'progression.1.abrasive'],
    ['an unreadable grit', [{ abrasive: COARSE, grit: { grade: 'Q7' } }], 'progression.0.grit.grade'],
    ['a grit of the wrong standard', [{ abrasive: CBN, grit: { standard: 'jis', grade: 'B46' } }], 'progression.0.grit.grade'],
    ['an angle above 60°', [{ abrasive: COARSE, perSideDeg: 75 }], 'progression.0.perSideDeg'],
    ['an unknown field', [{ abrasive: COARSE, colour: 'red' }], 'progression.0.colour'],
    ['no steps', [], 'progression'],
    ['nine steps', Array.from({ length: 9 }, () => ({ abrasive: COARSE })), 'progression'],
  ])('refuses %s with 400 naming the field', async (_what, steps, path) => {
    const before = await Result.count();
    const res = await post(input(steps)).expect(400);
    expect(res.body.issues.map((i: { path: string }) => i.path)).toContain(path);
    expect(await Result.count()).toBe(before);
  });

  it('goes through the CSV import and comes back the same in the export', async () => {
    const row: Record<string, string> = {
      steel: 'aisi-d2',
      hardness: '62',
      progression: `${COARSE} > ${CBN} (iso6106 B64, 14.5°)`,
      abrasive: 'diamond-resin-wheel-250-15um',
      angle_per_side_deg: '15',
      sharpness_method: 'push-cut-test-v2',
      readings_g: '140;150;145',
    };
    const csv = toCsv([[...IMPORT_COLUMNS], IMPORT_COLUMNS.map((c) => row[c] ?? '')]);
    const bad = toCsv([[...IMPORT_COLUMNS], IMPORT_COLUMNS.map((c) => (c === 'progression' ? `${COARSE} > nowhere-stone` : (row[c] ?? '')))]);
    const upload = (text: string) =>
      publisher.agent.post('/api/import/results').set('X-CSRF-Token', publisher.csrf).attach('file', Buffer.from(text, 'utf8'), { filename: 'r.csv', contentType: 'text/csv' });
    const refused = await upload(bad);
    expect(refused.status).toBe(400);
    expect(JSON.stringify(refused.body)).toMatch(/progression/);
    await upload(csv).expect(201);
    const stored = await Result.findOne({ where: { progressionSteps: 2 }, order: [['id', 'DESC']] });
    expect(stored!.input.progression).toEqual([{ abrasive: COARSE }, { abrasive: CBN, grit: { standard: 'iso6106', grade: 'B64' }, perSideDeg: 14.5 }]);
    const exported = await publisher.agent.get('/api/me/results.csv').expect(200);
    const rows = Papa.parse<string[]>(exported.text.trim()).data;
    const col = rows[0].indexOf('progression');
    expect(col).toBeGreaterThanOrEqual(0);
    expect(rows.slice(1).map((r) => r[col])).toContain(`${COARSE} > ${CBN} (iso6106 B64, 14.5°)`);
  });

  it('narrows the comparison to results reached through a material or with a number of steps', async () => {
    const view = async (qs: string) => (await request(server.url).get(`/api/compare?method=push-cut-test-v2&pageSize=5000&${qs}`).expect(200)).body as { rows: { n: number }[]; source: string };
    const sum = (b: { rows: { n: number }[] }) => b.rows.reduce((s, r) => s + r.n, 0);
    // Recomputed here from what was entered: each step's abrasive page and its material.
    const materialOf = new Map((await Abrasive.findAll()).map((a) => [a.slug, a.material]));
    const methodId = (await Result.findOne({ where: { status: 'approved' }, include: [{ association: 'sharpnessMethod', where: { slug: 'push-cut-test-v2' } }] }))!.sharpnessMethodId;
    const approved = await Result.findAll({ where: { status: 'approved', sharpnessMethodId: methodId } });
    const steps = (r: Result) => r.input.progression ?? [];
    const via = await view('via=cbn');
    expect(via.source).toBe('results');
    expect(sum(via)).toBe(approved.filter((r) => steps(r).some((s) => materialOf.get(s.abrasive) === 'cbn')).length);
    expect(sum(via)).toBeGreaterThan(0);
    expect(sum(await view('steps=0'))).toBe(approved.filter((r) => steps(r).length === 0).length);
    expect(sum(await view('steps=1,2'))).toBe(approved.filter((r) => [1, 2].includes(steps(r).length)).length);
    await request(server.url).get('/api/compare?steps=9').expect(400);
    await request(server.url).get('/api/compare?via=granite').expect(400);
  });
  it('names each step’s abrasive, and a renamed abrasive reaches the steps at once (its page change drops the kept look-ups)', async () => {
    const moderator = await signIn(server.url, await demoHandle(server.url, 'moderator'));
    const posted = await post(input([{ abrasive: COARSE }, { abrasive: CBN }])).expect(201);
    const [coarse, cbn] = await Promise.all([Abrasive.findOne({ where: { slug: COARSE } }), Abrasive.findOne({ where: { slug: CBN } })]);
    expect(posted.body.progression.map((s: { abrasiveName: string }) => s.abrasiveName)).toEqual([coarse!.name, cbn!.name]);
    await moderator.agent.post(`/api/v1/results/${posted.body.id}/review`).set('X-CSRF-Token', moderator.csrf).send({ decision: 'approve' }).expect(200);
    // A list item is the result's summary (decision 032): its progression is in the result's own answer.
    const stepNames = async () => {
      const one = await request(server.url).get(`/api/v1/results/${posted.body.id}`).expect(200);
      return one.body.progression.map((s: { abrasiveName: string }) => s.abrasiveName);
    };
    expect(await stepNames()).toEqual([coarse!.name, cbn!.name]);

    // The rename, as a write through the app's write path: the feed records it as a page change (renamed).
    const renamed = `${coarse!.name} (renamed, invented)`;
    const since = (await ChangeRow.max('id')) as number;
    await server.ctx.db.write((transaction) => coarse!.update({ name: renamed }, { transaction }));
    const rows = await ChangeRow.findAll({ where: { id: { [Op.gt]: since } } });
    expect(rows.map((r) => r.kind)).toEqual(['page']);
    expect(await stepNames()).toEqual([renamed, cbn!.name]);
  });
});
