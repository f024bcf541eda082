/**
 * The OpenAPI document of API v1 (server/openapi/): it covers exactly the routes the app mounts,
 * its schemas compile as JSON Schema 2020-12 (the dialect of OpenAPI 3.1, validated with ajv, a
 * general-purpose validator), and real answers of the API hold to them.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import type { Express } from 'express';
import { demoHandle, signIn, startTestServer } from '../setup/test-server';
import { registeredRoutes } from '../setup/registered-routes';
import { openApiPath, type OpenApiDocument } from '../../server/openapi/document';
import { documentChecks, type Operation } from '../setup/openapi-validate';

let server: Awaited<ReturnType<typeof startTestServer>>;
let doc: OpenApiDocument;
let validatorFor: ReturnType<typeof documentChecks>['validatorFor'];
let expectDocumented: ReturnType<typeof documentChecks>['expectDocumented'];
beforeAll(async () => {
  server = await startTestServer();
  doc = (await request(server.url).get('/api/v1/openapi.json').expect(200).expect('Content-Type', /json/)).body as OpenApiDocument;
  ({ validatorFor, expectDocumented } = documentChecks(doc));
});
afterAll(async () => {
  await server?.stop();
});

const appOf = () => server.server.listeners('request')[0] as unknown as Express;
const operations = () => Object.entries(doc.paths).flatMap(([path, ops]) => Object.entries(ops).map(([method, op]) => ({ path, method, op: op as unknown as Operation })));

describe('the OpenAPI document', () => {
  it('is OpenAPI 3.1 with the security schemes of the session (cookie + X-CSRF-Token) and of API tokens', () => {
    expect(doc.openapi).toBe('3.1.0');
    expect(doc.servers).toEqual([expect.objectContaining({ url: '/api/v1' })]);
    expect(doc.components.securitySchemes).toMatchObject({
      sessionCookie: { type: 'apiKey', in: 'cookie' },
      csrfToken: { type: 'apiKey', in: 'header', name: 'X-CSRF-Token' },
      bearerToken: { type: 'http', scheme: 'bearer' },
    });
  });

  it('documents every route the app mounts under /api/v1, and mounts every documented one', () => {
    const mounted = registeredRoutes(appOf())
      .filter((r) => r.includes(' /api/v1/'))
      .map((r) => {
        const [method, path] = r.split(' ');
        return `${method} ${openApiPath(path.slice('/api/v1'.length))}`;
      });
    const documented = operations().map((o) => `${o.method.toUpperCase()} ${o.path}`);
    expect(mounted.filter((r) => !documented.includes(r)), 'describe these in server/openapi/routes.ts').toEqual([]);
    expect(documented.filter((r) => !mounted.includes(r)), 'these are documented but not mounted').toEqual([]);
    // The unversioned alias answers the same routes.
    const alias = registeredRoutes(appOf()).filter((r) => / \/api\//.test(r) && !r.includes(' /api/v1/'));
    expect(alias.map((r) => r.replace(' /api/', ' /api/v1/')).filter((r) => !registeredRoutes(appOf()).includes(r))).toEqual([]);
  });

  it('names every path parameter, describes every answer, and its schemas and examples compile and hold (ajv, JSON Schema 2020-12)', () => {
    for (const { path, method, op } of operations()) {
      for (const name of [...path.matchAll(/\{(\w+)\}/g)].map((m) => m[1])) {
        expect(op.parameters?.some((p) => p.in === 'path' && p.name === name), `${method} ${path}: {${name}}`).toBe(true);
      }
      expect(Object.keys(op.responses).some((s) => s.startsWith('2')), `${method} ${path} has a success answer`).toBe(true);
      expect(op.responses['400'], `${method} ${path} documents its 400`).toBeDefined();
      for (const response of Object.values(op.responses)) for (const media of Object.values(response.content ?? {})) validatorFor(media.schema);
      for (const media of Object.values(op.requestBody?.content ?? {})) {
        const validate = validatorFor(media.schema);
        if (media.example !== undefined) expect(validate(media.example), `${method} ${path}: its example fits its schema`).toBe(true);
      }
    }
  });
});

describe('answers of the API hold to the document', () => {
  it('health, session, lists and one result, for a visitor', async () => {
    const get = (url: string) => request(server.url).get(`/api/v1${url}`);
    expectDocumented('get', '/health', await get('/health').expect(200));
    expectDocumented('get', '/session', await get('/session').expect(200));
    expectDocumented('get', '/steels', await get('/steels').expect(200));
    expectDocumented('get', '/methods', await get('/methods').expect(200));
    const results = await get('/results?status=approved').expect(200);
    expectDocumented('get', '/results', results);
    expectDocumented('get', '/results/{id}', await get(`/results/${results.body.items[0].id}`).expect(200));
  });

  it('a signed-in member’s own lists, a workshop with one of everything, an edit and its revision list, the difference of two cells', async () => {
    const member = await signIn(server.url, await demoHandle(server.url, 'member', 5));
    const get = (url: string) => member.agent.get(`/api/v1${url}`);
    const send = (method: 'post' | 'put', url: string, body: object) => member.agent[method](`/api/v1${url}`).set('X-CSRF-Token', member.csrf).send(body);
    const example = (doc.paths['/results'] as unknown as Record<string, Operation>).post.requestBody!.content['application/json'].example as Record<string, unknown>;

    // A draft, then an edit of it (applied at once: 200), then its versions.
    const draft = await send('post', '/results/drafts', example).expect(201);
    expectDocumented('post', '/results/drafts', draft);
    const edited = await send('put', `/results/${draft.body.id}/draft`, { ...example, edgeAngle: { perSideDeg: 16 } }).expect(200);
    expectDocumented('put', '/results/{id}/draft', edited);
    const revisions = await get(`/results/${draft.body.id}/revisions`).expect(200);
    expect(revisions.body.items.length).toBeGreaterThanOrEqual(2);
    expectDocumented('get', '/results/{id}/revisions', revisions);

    const me = await get('/me').expect(200);
    expect(me.body.drafts.map((r: { id: number }) => r.id)).toContain(draft.body.id);
    expectDocumented('get', '/me', me);
    expectDocumented('get', '/results', await get(`/results?author=${me.body.account.handle}`).expect(200));

    // The workshop: a grinder, a jig, a setup and a wheel, so every list of its answer has a row (invented figures).
    const grinderId = (await send('post', '/workshop/grinders', { name: 'Test grinder', spindleRpm: 90, barDiameterMm: 12, barMount: 'with-rotation' }).expect(201)).body.id;
    const jig = await send('post', '/workshop/jigs', { name: 'Test jig', offsetMm: 0 }).expect(201);
    expectDocumented('post', '/workshop/jigs', jig);
    await send('post', '/workshop/setups', { name: 'Test setup', jigId: jig.body.id, projectionMm: 140, perSideDeg: 15 }).expect(201);
    const wheel = await send('post', '/workshop/wheels', { name: 'Test wheel', abrasive: 'cbn-electroplated-wheel-250-b126', grinderId, originalDiameterMm: 250, ratedSpeedMps: 20 }).expect(201);
    expectDocumented('post', '/workshop/wheels', wheel);
    await send('post', `/wheels/${wheel.body.id}/measurements`, { measuredOn: '2026-03-01', diameterMm: 249 }).expect(201);
    const workshop = await get('/workshop').expect(200);
    for (const list of ['grinders', 'jigs', 'setups', 'wheels']) expect(workshop.body[list], list).toHaveLength(1);
    expectDocumented('get', '/workshop', workshop);
    const wheels = await get('/wheels').expect(200);
    expect(wheels.body.items.length).toBeGreaterThan(0);
    expectDocumented('get', '/wheels', wheels);

    // The difference of the two largest cells of the first steel in the comparison.
    const rows = (await get('/compare?method=push-cut-test-v2&pageSize=5000').expect(200)).body.rows as { steel: string; cell: string; n: number }[];
    const [a, b] = rows.filter((r) => r.steel === rows[0].steel).sort((x, y) => y.n - x.n);
    const difference = await get(`/compare/difference?method=push-cut-test-v2&a=${a.cell}&b=${b.cell}`).expect(200);
    expect(difference.body.sharpness).not.toBeNull();
    expectDocumented('get', '/compare/difference', difference);
  });

  it('a page edited live and by proposal, its history, a revision, its review and a revert: every revision named by id and by its number on the page', async () => {
    const moderator = await signIn(server.url, await demoHandle(server.url, 'moderator'));
    const member = await signIn(server.url, await demoHandle(server.url, 'member', 2));
    const send = (who: typeof member, method: 'post' | 'put', url: string, body: object) => who.agent[method](`/api/v1${url}`).set('X-CSRF-Token', who.csrf).send(body);
    const slug = 'aisi-52100';
    const page = await moderator.agent.get(`/api/v1/steels/${slug}`).expect(200);
    expectDocumented('get', '/steels/{slug}', page);
    const p = page.body as Record<string, unknown> & { revision: number };
    const edit = (summary: string, hardnessHrc: object, baseRevision: number) => ({
      ...Object.fromEntries(['name', 'category', 'designations', 'composition', 'citations', 'sources'].map((k) => [k, p[k]])),
      body: p.body,
      hardnessHrc,
      baseRevision,
      summary,
    });
    const live = await send(moderator, 'put', `/steels/${slug}`, edit('Range as tempered', { min: 58, max: 63 }, p.revision)).expect(200);
    expectDocumented('put', '/steels/{slug}', live);
    const proposed = await send(member, 'put', `/steels/${slug}`, edit('Narrower range', { min: 59, max: 62 }, live.body.revision.id)).expect(202);
    expectDocumented('put', '/steels/{slug}', proposed);
    expect([live.body.revision.number, proposed.body.revision.number]).toEqual([p.revisionNumber as number + 1, p.revisionNumber as number + 2]);
    expectDocumented('get', '/page-revisions/{id}', await moderator.agent.get(`/api/v1/page-revisions/${proposed.body.revision.id}`).expect(200));
    const reviewed = await send(moderator, 'post', `/page-revisions/${proposed.body.revision.id}/review`, { decision: 'approve' }).expect(200);
    expectDocumented('post', '/page-revisions/{id}/review', reviewed);
    const reverted = await send(moderator, 'post', `/steels/${slug}/revert`, { toRevision: p.revision }).expect(200);
    expectDocumented('post', '/steels/{slug}/revert', reverted);
    expect(reverted.body.revision).toMatchObject({ revertedFromNumber: p.revisionNumber, summary: `Reverted to revision ${p.revisionNumber as number}` });
    const history = await moderator.agent.get(`/api/v1/steels/${slug}/revisions`).expect(200);
    expectDocumented('get', '/steels/{slug}/revisions', history);
    expectDocumented('get', '/steels/{slug}/revisions/{id}', await moderator.agent.get(`/api/v1/steels/${slug}/revisions/${reverted.body.revision.id}`).expect(200));
  });

  it('an admin’s page of accounts, with its Link header', async () => {
    const admin = await signIn(server.url, await demoHandle(server.url, 'admin'));
    const users = await admin.agent.get('/api/v1/admin/users').expect(200);
    expect(users.headers.link).toContain('rel="first"');
    expectDocumented('get', '/admin/users', users);
  });

  it('refusals: 400 naming the field, 401, 404', async () => {
    const bad = await request(server.url).get('/api/v1/results?page=0').expect(400);
    expect(bad.body.issues[0].path).toBe('page');
    expectDocumented('get', '/results', bad);
    expectDocumented('get', '/results/{id}', await request(server.url).get('/api/v1/results/999999999').expect(404));
    expectDocumented('get', '/me', await request(server.url).get('/api/v1/me').expect(401));
  });

  it('the documented example of POST /results is accepted, and the answer fits, signed in with the session and its CSRF token', async () => {
    const member = await signIn(server.url, await demoHandle(server.url, 'member'));
    const example = (doc.paths['/results'] as unknown as Record<string, Operation>).post.requestBody!.content['application/json'].example;
    const session = await member.agent.get('/api/v1/session').expect(200);
    expectDocumented('get', '/session', session);
    const created = await member.agent.post('/api/v1/results').set('X-CSRF-Token', member.csrf).send(example as object).expect(201);
    expectDocumented('post', '/results', created);
  });

  it('serves the reference page and its assets from the installed package (no other origin)', async () => {
    const page = await request(server.url).get('/api/v1/reference/').expect(200).expect('Content-Type', /html/);
    const sources = [...page.text.matchAll(/(?:src|href)="([^"]+)"/g)].map((m) => m[1]);
    expect(sources.length).toBeGreaterThan(0);
    for (const src of sources) {
      expect(src).not.toMatch(/^(?:https?:)?\/\//);
      await request(server.url).get(`/api/v1/reference/${src}`).expect(200);
    }
    expect((await request(server.url).get('/api/v1/reference/reference.js').expect(200)).text).toContain('/api/v1/openapi.json');
    await request(server.url).get('/api/v1/reference').expect(301).expect('Location', '/api/v1/reference/');
  });
});
