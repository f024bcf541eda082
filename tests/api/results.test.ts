import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { demoHandle, signIn, startTestServer } from '../setup/test-server';
import { Result } from '../../server/models';

let server: Awaited<ReturnType<typeof startTestServer>>;
beforeAll(async () => {
  server = await startTestServer();
});
afterAll(async () => {
  await server?.stop();
});

/** A valid result on the demo data's pages. */
const goodInput = () => ({
  steel: 'aisi-d2',
  hardness: { value: 61, scale: 'HRC' },
  abrasive: 'cbn-electroplated-wheel-250-b126',
  grit: { standard: 'iso6106', grade: 'B126' },
  edgeAngle: { perSideDeg: 15 },
  sharpness: { method: 'push-cut-test-v2', readingsG: [180, 175, 190, 170, 185] },
  retention: { method: 'card-cut-retention-v1', cuts: 240 },
  notes: {
    type: 'doc',
    content: [
      { type: 'heading', attrs: { level: 2 }, content: [{ type: 'text', text: 'Setup' }] },
      { type: 'paragraph', content: [{ type: 'text', text: 'Light passes, ' }, { type: 'text', text: 'no burr', marks: [{ type: 'bold' }] }] },
    ],
  },
});

describe('sign-in', () => {
  it.each(['member', 'publisher', 'moderator', 'admin'])('signs a %s in through the OAuth2 round trip', async (role) => {
    const handle = await demoHandle(server.url, role);
    const { user } = await signIn(server.url, handle);
    expect(user).toEqual(expect.objectContaining({ handle, role }));
  });

  it('gives a visitor no user and a CSRF token', async () => {
    const res = await request(server.url).get('/api/session').expect(200);
    expect(res.body.user).toBeNull();
    expect(typeof res.body.csrfToken).toBe('string');
  });

  it('refuses a reused authorization code', async () => {
    const handle = await demoHandle(server.url, 'member');
    const agent = request.agent(server.url);
    const start = await agent.get(`/auth/signin?as=${handle}`).expect(302);
    const authorize = await fetch(start.headers.location, { redirect: 'manual' });
    const callback = new URL(authorize.headers.get('location')!);
    await agent.get(`${callback.pathname}${callback.search}`).expect(302);
    const replay = await request(server.url).get(`${callback.pathname}${callback.search}`);
    expect(replay.status).toBeGreaterThanOrEqual(300);
    expect(replay.headers.location ?? '').not.toBe('/');
  });
});

describe('posting a result', () => {
  it('refuses a visitor with 401', async () => {
    await request(server.url).post('/api/results').send(goodInput()).expect(401);
  });

  it('refuses a signed-in write without the CSRF header', async () => {
    const { agent } = await signIn(server.url, await demoHandle(server.url, 'member'));
    const res = await agent.post('/api/results').send(goodInput()).expect(403);
    expect(res.body.error).toMatch(/CSRF/);
  });

  it('stores a member\'s result as pending with derived values and rendered notes', async () => {
    const { agent, csrf, user } = await signIn(server.url, await demoHandle(server.url, 'member'));
    const res = await agent.post('/api/results').set('X-CSRF-Token', csrf).send(goodInput()).expect(201);
    expect(res.body).toMatchObject({ status: 'pending', author: { handle: user.handle }, abrasiveMaterial: 'cbn', steel: 'aisi-d2' });
    // ISO 6106:2013: B126 is the 125/106 µm aperture pair; median of five readings by hand: 180.
    expect(res.body.derived).toMatchObject({ hrc: 61, perSideDeg: 15, inclusiveDeg: 30, sharpnessMedianG: 180 });
    expect(res.body.derived.gritUm).toBeGreaterThan(106);
    expect(res.body.derived.gritUm).toBeLessThan(126);
    expect(res.body.notesHtml).toBe('<h2>Setup</h2><p>Light passes, <strong>no burr</strong></p>');
  });

  it('refuses a retention method as the sharpness method, and a sharpness method as the retention method (400 naming the field)', async () => {
    const { agent, csrf } = await signIn(server.url, await demoHandle(server.url, 'member'));
    const before = await Result.count();
    const swapped = { ...goodInput(), sharpness: { method: 'card-cut-retention-v1', readingsG: [180, 175, 190] }, retention: { method: 'push-cut-test-v2', cuts: 240 } };
    const res = await agent.post('/api/results').set('X-CSRF-Token', csrf).send(swapped).expect(400);
    const paths = (res.body.issues as { path: string; message: string }[]).map((i) => `${i.path}: ${i.message}`);
    expect(paths).toEqual(expect.arrayContaining([expect.stringMatching(/^sharpness\.method: .*retention method/), expect.stringMatching(/^retention\.method: .*no retention medium/)]));
    expect(await Result.count()).toBe(before);
  });

  it('answers bad input with 400 naming each field, and stores nothing', async () => {
    const { agent, csrf } = await signIn(server.url, await demoHandle(server.url, 'member'));
    const before = await Result.count();
    const bad = { ...goodInput(), hardness: { value: 95, scale: 'HRC' }, sharpness: { method: 'push-cut-test-v2', readingsG: [] }, edgeAngle: { perSideDeg: -3 } };
    const res = await agent.post('/api/results').set('X-CSRF-Token', csrf).send(bad).expect(400);
    const paths = (res.body.issues as { path: string }[]).map((i) => i.path);
    expect(paths).toEqual(expect.arrayContaining(['sharpness.readingsG', 'edgeAngle.perSideDeg', 'hardness.value']));
    expect(await Result.count()).toBe(before);
  });

  it('refuses an out-of-table hardness with the field named', async () => {
    const { agent, csrf } = await signIn(server.url, await demoHandle(server.url, 'member'));
    const res = await agent.post('/api/results').set('X-CSRF-Token', csrf).send({ ...goodInput(), hardness: { value: 95, scale: 'HRC' } }).expect(400);
    expect(res.body.issues).toEqual(expect.arrayContaining([expect.objectContaining({ path: 'hardness.value' })]));
  });

  it('refuses unknown pages and unknown fields', async () => {
    const { agent, csrf } = await signIn(server.url, await demoHandle(server.url, 'member'));
    const unknownPage = await agent.post('/api/results').set('X-CSRF-Token', csrf).send({ ...goodInput(), steel: 'no-such-steel' }).expect(400);
    expect(unknownPage.body.issues).toEqual([expect.objectContaining({ path: 'steel' })]);
    const extra = await agent.post('/api/results').set('X-CSRF-Token', csrf).send({ ...goodInput(), status: 'approved' }).expect(400);
    expect(extra.body.issues[0]).toEqual({ path: 'status', message: 'unknown field: not accepted here' });
  });

  it('rejects notes holding HTML-ish nodes or javascript: links', async () => {
    const { agent, csrf } = await signIn(server.url, await demoHandle(server.url, 'member'));
    const notes = { type: 'doc', content: [{ type: 'paragraph', content: [{ type: 'text', text: 'x', marks: [{ type: 'link', attrs: { href: 'javascript:alert(1)' } }] }] }] };
    const res = await agent.post('/api/results').set('X-CSRF-Token', csrf).send({ ...goodInput(), notes }).expect(400);
    expect(res.body.issues[0].path).toMatch(/^notes\./);
  });
});

describe('review', () => {
  async function postPending() {
    const { agent, csrf } = await signIn(server.url, await demoHandle(server.url, 'member'));
    const res = await agent.post('/api/results').set('X-CSRF-Token', csrf).send(goodInput()).expect(201);
    return { id: res.body.id as number, author: { agent, csrf } };
  }

  it('refuses a member with 403', async () => {
    const { id } = await postPending();
    const { agent, csrf } = await signIn(server.url, await demoHandle(server.url, 'member', 1));
    await agent.post(`/api/results/${id}/review`).set('X-CSRF-Token', csrf).send({ decision: 'approve' }).expect(403);
    await agent.get('/api/review-desk').expect(403);
  });

  it('answers a decision with the result as a later read gives it, trail included', async () => {
    const { id } = await postPending();
    const mod = await signIn(server.url, await demoHandle(server.url, 'moderator'));
    const decided = await mod.agent.post(`/api/results/${id}/review`).set('X-CSRF-Token', mod.csrf).send({ decision: 'approve', note: 'Clear method notes.' }).expect(200);
    const read = await mod.agent.get(`/api/results/${id}`).expect(200);
    expect(decided.body).toEqual(read.body);
    expect(decided.body.trail.map((e: { to: string; by: { handle: string } }) => [e.to, e.by.handle])).toEqual([
      ['pending', expect.any(String)],
      ['approved', mod.user.handle],
    ]);
  });

  it('lets a moderator return a result with a note that its author then sees', async () => {
    const { id, author } = await postPending();
    const mod = await signIn(server.url, await demoHandle(server.url, 'moderator'));
    const desk = await mod.agent.get('/api/review-desk').expect(200);
    expect(desk.body.items.map((r: { id: number }) => r.id)).toContain(id);
    await mod.agent.post(`/api/results/${id}/review`).set('X-CSRF-Token', mod.csrf).send({ decision: 'return' }).expect(400);
    await mod.agent.post(`/api/results/${id}/review`).set('X-CSRF-Token', mod.csrf).send({ decision: 'return', note: 'Please add the hardness test method.' }).expect(200);
    const seen = await author.agent.get(`/api/results/${id}`).expect(200);
    expect(seen.body.status).toBe('returned');
    expect(seen.body.review).toMatchObject({ decision: 'returned', note: 'Please add the hardness test method.' });
    expect(seen.body.trail.map((e: { to: string }) => e.to)).toEqual(['pending', 'returned']);
    // a visitor sees neither the returned result nor its note
    await request(server.url).get(`/api/results/${id}`).expect(404);
  });

  it('refuses a second decision with 409', async () => {
    const { id } = await postPending();
    const mod = await signIn(server.url, await demoHandle(server.url, 'moderator'));
    await mod.agent.post(`/api/results/${id}/review`).set('X-CSRF-Token', mod.csrf).send({ decision: 'approve' }).expect(200);
    const again = await mod.agent.post(`/api/results/${id}/review`).set('X-CSRF-Token', mod.csrf).send({ decision: 'reject', note: 'late' }).expect(409);
    expect(again.body.error).toMatch(/already decided/);
  });

  it('counts an approved result in the comparison and finds it by search at once', async () => {
    const cellOf = async () => {
      const res = await request(server.url).get('/api/compare?method=push-cut-test-v2&steel=aisi-d2&material=cbn').expect(200);
      return (res.body.rows as { gritBand: { loUm: number; hiUm: number }; n: number }[]).find((r) => r.gritBand.loUm < 120 && r.gritBand.hiUm > 120);
    };
    const before = (await cellOf())?.n ?? 0;
    const { id } = await postPending();
    expect((await cellOf())?.n ?? 0).toBe(before);
    const searchBefore = await request(server.url).get('/api/search?q=d2&type=result').expect(200);
    expect(searchBefore.body.hits.map((h: { id: number }) => h.id)).not.toContain(id);

    const mod = await signIn(server.url, await demoHandle(server.url, 'moderator'));
    await mod.agent.post(`/api/results/${id}/review`).set('X-CSRF-Token', mod.csrf).send({ decision: 'approve' }).expect(200);

    expect((await cellOf())!.n).toBe(before + 1);
    const found = await request(server.url).get(`/api/search?q=${encodeURIComponent('d2 cbn')}&type=result`).expect(200);
    expect(found.body.hits.length).toBeGreaterThan(0);
    const all = await request(server.url).get('/api/search?q=d2').expect(200);
    expect(all.body.facets.result).toBeGreaterThan(searchBefore.body.facets.result);
  });
});

describe('reading', () => {
  it('lists approved results to visitors, newest first, in pages', async () => {
    const res = await request(server.url).get('/api/results').expect(200);
    expect(res.body.items.length).toBeGreaterThan(0);
    expect(res.body.items.every((r: { status: string }) => r.status === 'approved')).toBe(true);
    expect(res.body.total).toBeGreaterThan(res.body.items.length);
    await request(server.url).get('/api/results?status=pending').expect(403);
  });

  it('finds steels by any designation', async () => {
    for (const q of ['d2', '1.2379', 'X153CrMoV12', 'SKD11']) {
      const res = await request(server.url).get(`/api/search?q=${encodeURIComponent(q)}&type=steel`).expect(200);
      expect(res.body.hits[0]?.slug, q).toBe('aisi-d2');
    }
    const cbn = await request(server.url).get('/api/search?q=cbn').expect(200);
    expect(cbn.body.facets.abrasive).toBeGreaterThan(0);
    expect(cbn.body.facets.result).toBeGreaterThan(0);
  });

  it('serves the reference pages', async () => {
    const steels = await request(server.url).get('/api/steels').expect(200);
    expect(steels.body.items.length).toBeGreaterThanOrEqual(15);
    const d2 = await request(server.url).get('/api/steels/aisi-d2').expect(200);
    expect(d2.body.designations).toEqual(expect.arrayContaining([{ system: 'WNr', code: '1.2379' }]));
    expect(typeof d2.body.revision).toBe('number');
    await request(server.url).get('/api/steels/nope').expect(404);
    await request(server.url).get('/api/steels/Bad%20Slug').expect(400);
    await request(server.url).get('/api/abrasives').expect(200);
    await request(server.url).get('/api/methods').expect(200);
    await request(server.url).get('/api/health').expect(200);
  });
});

describe('many people posting at once', () => {
  it('stores every one of 16 concurrent posts, each answered as a later read of it gives it', async () => {
    const members = await Promise.all([0, 1, 2, 3].map(async (i) => signIn(server.url, await demoHandle(server.url, 'member', i))));
    const posts = await Promise.all(
      Array.from({ length: 16 }, (_, i) => {
        const who = members[i % members.length];
        return who.agent.post('/api/results').set('X-CSRF-Token', who.csrf).send({ ...goodInput(), edgeAngle: { perSideDeg: 10 + i / 2 } });
      }),
    );
    expect(posts.map((p) => p.status)).toEqual(Array(16).fill(201));
    expect(new Set(posts.map((p) => p.body.id)).size).toBe(16);
    for (const [i, p] of posts.entries()) {
      const who = members[i % members.length];
      const read = await who.agent.get(`/api/results/${p.body.id}`).expect(200);
      expect(p.body).toEqual(read.body);
      expect(p.body.edgeAngle.perSideDeg).toBe(10 + i / 2);
      expect(p.body.author.handle).toBe(who.user.handle);
    }
  });
});
