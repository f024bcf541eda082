import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { angleFromSetup } from '../../shared/geometry';
import { demoHandle, signIn, startTestServer } from '../setup/test-server';

let server: Awaited<ReturnType<typeof startTestServer>>;
beforeAll(async () => {
  server = await startTestServer();
});
afterAll(async () => {
  await server?.stop();
});

const wheel = { name: 'Vitrified 220 on the left', wears: true, originalDiameterMm: 250, barDiameterMm: 12, projectionMm: 150, usualAnglesDeg: [15, 20] };

describe('wheel log', () => {
  it('is for signed-in members only', async () => {
    await request(server.url).get('/api/wheels').expect(401);
  });

  it('keeps measured diameters and gives the gap for the usual angles on the wheel as it is now', async () => {
    const { agent, csrf } = await signIn(server.url, await demoHandle(server.url, 'member'));
    const created = await agent.post('/api/wheels').set('X-CSRF-Token', csrf).send(wheel).expect(201);
    const id = created.body.id;
    expect(created.body.currentDiameterMm).toBe(250);
    await agent.post(`/api/wheels/${id}/measurements`).set('X-CSRF-Token', csrf).send({ measuredOn: '2026-06-01', diameterMm: 248 }).expect(201);
    const after = await agent.post(`/api/wheels/${id}/measurements`).set('X-CSRF-Token', csrf).send({ measuredOn: '2026-07-31', diameterMm: 244 }).expect(201);
    expect(after.body.currentDiameterMm).toBe(244);
    expect(after.body.wearMm).toBe(6);
    // 4 mm lost over 60 days → 2 mm per 30 days (hand-worked).
    expect(after.body.wearPer30DaysMm).toBeCloseTo(2, 10);
    // Each gap, set on the 244 mm wheel, gives back the usual angle (checked with the forward formula).
    for (const g of after.body.gaps as { perSideDeg: number; gapMm: number }[]) {
      const back = angleFromSetup({ wheelDiameterMm: 244, barDiameterMm: 12, gapMm: g.gapMm, projectionMm: 150 });
      expect(back.perSideDeg).toBeCloseTo(g.perSideDeg, 6);
    }
    const list = await agent.get('/api/wheels').expect(200);
    expect(list.body.items.map((w: { id: number }) => w.id)).toContain(id);
  });

  it('refuses a diameter larger than the original, and another member\'s wheel', async () => {
    const owner = await signIn(server.url, await demoHandle(server.url, 'member'));
    const created = await owner.agent.post('/api/wheels').set('X-CSRF-Token', owner.csrf).send(wheel).expect(201);
    const res = await owner.agent.post(`/api/wheels/${created.body.id}/measurements`).set('X-CSRF-Token', owner.csrf).send({ measuredOn: '2026-08-01', diameterMm: 260 }).expect(400);
    expect(res.body.issues[0].path).toBe('diameterMm');
    const other = await signIn(server.url, await demoHandle(server.url, 'member', 1));
    await other.agent.post(`/api/wheels/${created.body.id}/measurements`).set('X-CSRF-Token', other.csrf).send({ measuredOn: '2026-08-01', diameterMm: 240 }).expect(404);
    const bad = await owner.agent.post(`/api/wheels/${created.body.id}/measurements`).set('X-CSRF-Token', owner.csrf).send({ measuredOn: 'yesterday', diameterMm: 240 }).expect(400);
    expect(bad.body.issues[0].path).toBe('measuredOn');
  });
});
