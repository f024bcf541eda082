import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { demoHandle, signIn, startTestServer } from '../setup/test-server';

let server: Awaited<ReturnType<typeof startTestServer>>;
beforeAll(async () => {
  server = await startTestServer();
});
afterAll(async () => {
  await server?.stop();
});

describe('GET /api/tools/grit', () => {
  it('translates a JIS grade and names the standard', async () => {
    const res = await request(server.url).get('/api/tools/grit?grade=%236000').expect(200);
    // JIS R6001:1987, #6000 ds50 = 2.0 µm (R).
    expect(res.body).toMatchObject({ standard: 'jis', micrometres: 2 });
    // Whole-φ band holding 2 µm: φ = −log2(0.002) = 8.97 → band 1.953–3.906 µm (Krumbein's scale).
    expect(res.body.band.loUm).toBeCloseTo(1000 / 512, 6);
    expect(res.body.band.hiUm).toBeCloseTo(1000 / 256, 6);
    expect(Object.keys(res.body.nearest)).toEqual(expect.arrayContaining(['fepa-f', 'fepa-p', 'jis', 'ansi', 'mesh', 'iso6106', 'um']));
  });

  it('reads a superabrasive designation', async () => {
    const res = await request(server.url).get('/api/tools/grit?grade=D46').expect(200);
    // ISO 6106:2013: D46 is the 45/38 µm aperture pair (R).
    expect(res.body.standard).toBe('iso6106');
    expect(res.body.micrometres).toBeGreaterThanOrEqual(38);
    expect(res.body.micrometres).toBeLessThanOrEqual(46);
  });

  it('answers an unknown grade with 400 naming it', async () => {
    const res = await request(server.url).get('/api/tools/grit?grade=F9999').expect(400);
    expect(res.body.issues[0].path).toBe('grade');
    expect(res.body.error).toMatch(/F9999/);
  });
});

describe('GET /api/tools/hardness', () => {
  it('converts HRC 60 per ASTM E140 Table 1', async () => {
    const res = await request(server.url).get('/api/tools/hardness?value=60&scale=HRC').expect(200);
    // ASTM E140 Table 1 (R): HRC 60 = 697 HV = 81.2 HRA; HBW 654 is outside Brinell's normal range.
    expect(res.body.HV).toBeCloseTo(697, 0);
    expect(res.body.HRA).toBeCloseTo(81.2, 1);
  });

  it('refuses a value outside the table', async () => {
    const res = await request(server.url).get('/api/tools/hardness?value=75&scale=HRC').expect(400);
    expect(res.body.issues[0].path).toBe('value');
  });
});

describe('GET /api/tools/angle', () => {
  it('gives the angle of a setup and the gap for a wanted angle', async () => {
    // Worked example (published-values.md, derived two ways): R 100, d 250, L 200 → 18.2100°.
    // With a 20 mm bar, d = R + gap + 10, so gap = 140 mm.
    const angle = await request(server.url).get('/api/tools/angle?wheelDiameterMm=200&barDiameterMm=20&gapMm=140&projectionMm=200').expect(200);
    expect(angle.body.perSideDeg).toBeCloseTo(18.21, 3);
    expect(angle.body.inclusiveDeg).toBeCloseTo(36.42, 2);
    const gap = await request(server.url).get('/api/tools/angle?wheelDiameterMm=200&barDiameterMm=20&projectionMm=200&perSideDeg=18.21').expect(200);
    expect(gap.body.gapMm).toBeCloseTo(140, 1);
  });

  it('refuses an impossible setup with an explanation', async () => {
    const res = await request(server.url).get('/api/tools/angle?wheelDiameterMm=200&barDiameterMm=20&gapMm=140&projectionMm=500').expect(400);
    expect(res.body.issues[0].path).toBe('projectionMm');
    expect(res.body.error.length).toBeGreaterThan(20);
  });

  it('asks for exactly one of gap or angle', async () => {
    const res = await request(server.url).get('/api/tools/angle?wheelDiameterMm=200&barDiameterMm=20&projectionMm=200').expect(400);
    expect(res.body.issues[0].path).toBe('gapMm');
  });
});

describe('GET /api/tools/side-angle (flat bevels on a wheel\'s side)', () => {
  it('gives the angle from the gap and the gap for an angle: sin α = (gap + bar/2) / projection', async () => {
    // by hand: (24 + 6) / 120 = 0.25, asin 0.25 = 14.4775°
    const angle = await request(server.url).get('/api/tools/side-angle?barDiameterMm=12&gapMm=24&projectionMm=120').expect(200);
    expect(angle.body.perSideDeg).toBeCloseTo(14.4775, 4);
    const gap = await request(server.url).get('/api/tools/side-angle?barDiameterMm=12&perSideDeg=14.4775&projectionMm=120').expect(200);
    expect(gap.body.gapMm).toBeCloseTo(24, 3);
    expect(Object.keys(gap.body)).toEqual(['gapMm']);
  });

  it.each([
    ['a projection too short to reach the face', 'barDiameterMm=12&gapMm=50&projectionMm=40', 'projectionMm'],
    ['an angle that puts the bar inside the wheel', 'barDiameterMm=12&perSideDeg=10&projectionMm=20', 'projectionMm'],
    ['an angle of 90° or more', 'barDiameterMm=12&perSideDeg=95&projectionMm=100', 'perSideDeg'],
    ['a negative gap', 'barDiameterMm=12&gapMm=-1&projectionMm=100', 'gapMm'],
    ['no bar', 'gapMm=10&projectionMm=100', 'barDiameterMm'],
    ['both a gap and an angle', 'barDiameterMm=12&gapMm=10&perSideDeg=15&projectionMm=100', 'gapMm'],
    ['an unknown parameter', 'barDiameterMm=12&gapMm=10&projectionMm=100&wheel=1', ''],
  ])('refuses %s, naming the field', async (_case, query, field) => {
    const res = await request(server.url).get(`/api/tools/side-angle?${query}`).expect(400);
    if (field) expect(res.body.issues.map((i: { path: string }) => i.path)).toContain(field);
  });

  it('takes the blade-plane offset on the rim too: 10 mm off turns a 15° setup into 18.9° (issue 18)', async () => {
    const gap = await request(server.url).get('/api/tools/angle?wheelDiameterMm=250&barDiameterMm=12&projectionMm=140&perSideDeg=15').expect(200);
    const res = await request(server.url).get(`/api/tools/angle?wheelDiameterMm=250&barDiameterMm=12&projectionMm=140&gapMm=${gap.body.gapMm}&offsetMm=10`).expect(200);
    expect(res.body.perSideDeg).toBeCloseTo(18.9, 1);
  });
});

describe('wear drift and retention', () => {
  it('shows a worn vitrified wheel raising the angle of an unchanged setup (common practice)', async () => {
    const res = await request(server.url).get('/api/tools/wear-drift?originalDiameterMm=200&currentDiameterMm=180&barDiameterMm=12&gapMm=130&projectionMm=180').expect(200);
    expect(res.body.currentPerSideDeg).toBeGreaterThan(res.body.originalPerSideDeg);
    expect(res.body.restoringGapMm).toBeLessThan(res.body.currentGapMm);
  });

  it('computes ICP and TCC per ISO 8442-5 from per-cycle cuts', async () => {
    // Hand-worked: 60 cycles: 20, 18, 16 then 2 mm each → ICP 54 mm, TCC 54 + 57 × 2 = 168 mm.
    const cutsMm = [20, 18, 16, ...Array.from({ length: 57 }, () => 2)];
    const res = await request(server.url).post('/api/tools/retention').send({ cutsMm }).expect(200);
    expect(res.body).toMatchObject({ icpMm: 54, tccMm: 168, cycles: 60 });
    const { csrf, agent } = await signIn(server.url, await demoHandle(server.url, 'member'));
    await agent.post('/api/tools/retention').set('X-CSRF-Token', csrf).send({ cutsMm: [] }).expect(400);
  });
});
