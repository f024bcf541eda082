/**
 * Answers of the comparison, search, tools, price reports and curation routes held to the OpenAPI document with ajv
 * (a general-purpose JSON Schema 2020-12 validator): successes and refusals (400 naming the field,
 * 401, 403, 404, 409, with the refusals that carry more than an error). Their schemas are closed (`additionalProperties: false`), so a field the
 * server sends but the document does not name fails here. Figures sent are invented.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import sharp from 'sharp';
import type { OpenApiDocument } from '../../server/openapi/document';
import { documentChecks } from '../setup/openapi-validate';
import { demoHandle, signIn, startTestServer } from '../setup/test-server';
import { IMPORT_COLUMNS } from '../../shared/csv';
import { toCsv } from '../../shared/csv-writer';

let server: Awaited<ReturnType<typeof startTestServer>>;
let checks: ReturnType<typeof documentChecks>;
type Session = Awaited<ReturnType<typeof signIn>>;
let member: Session, publisher: Session, moderator: Session, admin: Session;

beforeAll(async () => {
  server = await startTestServer();
  checks = documentChecks((await request(server.url).get('/api/v1/openapi.json').expect(200)).body as OpenApiDocument);
  [member, publisher, moderator, admin] = await Promise.all(
    (['member', 'publisher', 'moderator', 'admin'] as const).map(async (role) => signIn(server.url, await demoHandle(server.url, role, role === 'member' ? 2 : 0))),
  );
});
afterAll(async () => {
  await server?.stop();
});

const documented = (method: string, path: string, res: { status: number; body: unknown }) => checks.expectDocumented(method, path, res);
const get = (url: string, who?: Session) => (who ? who.agent.get(`/api/v1${url}`) : request(server.url).get(`/api/v1${url}`));
const send = (who: Session | null, method: 'post' | 'put' | 'patch', url: string, body: object) =>
  who ? who.agent[method](`/api/v1${url}`).set('X-CSRF-Token', who.csrf).send(body) : request(server.url)[method](`/api/v1${url}`).send(body);

describe('the comparison and search hold to the document', () => {
  const method = 'push-cut-test-v2';
  type Row = { cell: string; steel: string; n: number; testers: number };

  it('the table (from the cells and from the results), a cell, two cells paired and as independent samples, the chart points; a bad cell or method is a 400 naming it', async () => {
    const table = await get(`/compare?method=${method}&pageSize=500`).expect(200);
    expect(table.body.source).toBe('cells');
    expect(table.body.rows.length).toBeGreaterThan(1);
    documented('get', '/compare', table);
    const live = await get(`/compare?method=${method}&hrcMin=58&pageSize=3&page=2`).expect(200);
    expect([live.body.source, live.body.liveFilters]).toEqual(['results', ['hrcMin']]);
    documented('get', '/compare', live);

    // The two best-filled cells of one steel: most likely to share testers.
    const rows = table.body.rows as Row[];
    const steel = rows.find((r) => rows.filter((o) => o.steel === r.steel).length > 1)!.steel;
    const [a, b] = rows.filter((r) => r.steel === steel).sort((x, y) => y.testers - x.testers);
    const cell = await get(`/compare/cell?method=${method}&cell=${encodeURIComponent(a.cell)}`).expect(200);
    expect([cell.body.cell.cell, cell.body.total]).toEqual([a.cell, a.n]);
    documented('get', '/compare/cell', cell);
    const two = `method=${method}&a=${encodeURIComponent(a.cell)}&b=${encodeURIComponent(b.cell)}`;
    const paired = await get(`/compare/paired?${two}`).expect(200);
    expect(paired.body.paired.n).toBe(paired.body.paired.pairs.length);
    documented('get', '/compare/paired', paired);
    const difference = await get(`/compare/difference?${two}`).expect(200);
    expect([difference.body.sharpness.nA, difference.body.sharpness.nB]).toEqual([a.n, b.n]);
    documented('get', '/compare/difference', difference);
    const points = await get(`/compare/points?method=${method}&limit=50`).expect(200);
    expect(points.body.points.length).toBeGreaterThan(0);
    documented('get', '/compare/points', points);

    const badCell = await get(`/compare/cell?method=${method}&cell=${encodeURIComponent(`no-such-steel:cbn:${a.cell.split(':')[2]}`)}`).expect(400);
    expect(badCell.body.issues[0].path).toBe('cell');
    documented('get', '/compare/cell', badCell);
    const badMethod = await get('/compare?method=no-such-method').expect(400);
    expect(badMethod.body.issues[0].path).toBe('method');
    documented('get', '/compare', badMethod);
    documented('get', '/compare/paired', await get(`/compare/paired?method=${method}&a=${encodeURIComponent(a.cell)}`).expect(400));
  });

  it('search: every kind of hit, one kind only, and an empty query is a 400 naming q', async () => {
    const all = await get('/search?q=d2').expect(200);
    expect(new Set(all.body.hits.map((h: { type: string }) => h.type)).size).toBeGreaterThan(1);
    documented('get', '/search', all);
    const cells = await get('/search?q=d2&type=cell').expect(200);
    expect(cells.body.hits.length).toBeGreaterThan(0);
    expect(cells.body.hits.every((h: { type: string; cell?: object }) => h.type === 'cell' && h.cell)).toBe(true);
    documented('get', '/search', cells);
    documented('get', '/search', await get('/search?q=d2&type=result').expect(200));
    const bad = await get('/search?q=').expect(400);
    expect(bad.body.issues[0].path).toBe('q');
    documented('get', '/search', bad);
  });
});

describe('the tools’ answers hold to the document', () => {
  it('grit, hardness, both angle tools both ways, wear drift and retention; a bad figure is a 400 naming it', async () => {
    const grit = await get('/tools/grit?grade=F400').expect(200);
    expect(grit.body.standard).toBe('fepa-f');
    documented('get', '/tools/grit', grit);
    documented('get', '/tools/hardness', await get('/tools/hardness?value=60&scale=HRC').expect(200));
    const gap = await get('/tools/angle?wheelDiameterMm=250&barDiameterMm=12&projectionMm=140&perSideDeg=15').expect(200);
    expect(Object.keys(gap.body)).toEqual(['gapMm']);
    documented('get', '/tools/angle', gap);
    const angle = await get(`/tools/angle?wheelDiameterMm=250&barDiameterMm=12&projectionMm=140&gapMm=${gap.body.gapMm}`).expect(200);
    expect(Object.keys(angle.body).sort()).toEqual(['inclusiveDeg', 'perSideDeg']);
    documented('get', '/tools/angle', angle);
    documented('get', '/tools/side-angle', await get('/tools/side-angle?barDiameterMm=12&projectionMm=140&gapMm=20').expect(200));
    documented('get', '/tools/side-angle', await get('/tools/side-angle?barDiameterMm=12&projectionMm=140&perSideDeg=15').expect(200));
    documented('get', '/tools/wear-drift', await get('/tools/wear-drift?originalDiameterMm=200&currentDiameterMm=180&barDiameterMm=12&gapMm=130&projectionMm=180').expect(200));
    documented('post', '/tools/retention', await request(server.url).post('/api/v1/tools/retention').send({ cutsMm: [20, 18, 15, 12] }).expect(200));

    const bad = await get('/tools/hardness?value=-3&scale=HRC').expect(400);
    expect(bad.body.issues.map((i: { path: string }) => i.path)).toEqual(['value']);
    documented('get', '/tools/hardness', bad);
    const badCuts = await request(server.url).post('/api/v1/tools/retention').send({ cutsMm: [] }).expect(400);
    expect(badCuts.body.issues[0].path).toMatch(/^cutsMm/);
    documented('post', '/tools/retention', badCuts);
  });
});

describe('price reports', () => {
  it('a report (201), the summary, and the refusals: 401 unsigned, 400 naming the field, 404 for an unknown abrasive', async () => {
    const abrasive = 'sic-vitrified-wheel-200-f220';
    const report = { abrasive, price: 42, currency: 'EUR', paidOn: '2026-02-01', condition: 'new' };
    documented('post', '/price-reports', await send(member, 'post', '/price-reports', report).expect(201));
    documented('post', '/price-reports', await send(null, 'post', '/price-reports', report).expect(401));
    const bad = await send(member, 'post', '/price-reports', { ...report, condition: 'second-hand' }).expect(400);
    expect(bad.body.issues[0].path).toBe('condition');
    documented('post', '/price-reports', bad);
    const summary = await get(`/price-reports?abrasive=${abrasive}`).expect(200);
    expect(summary.body.groups.length).toBeGreaterThan(0);
    documented('get', '/price-reports', summary);
    documented('get', '/price-reports', await get('/price-reports?abrasive=no-such-abrasive').expect(404));
  });
});

describe('publishing and curation', () => {
  it('publishers; an application, its decision and the refusals (403 for a member, 409 twice)', async () => {
    documented('get', '/publishers', await get('/publishers').expect(200));
    const body = { workshop: 'Answers test workshop (invented)', instruments: 'A push-cut tester', link: 'https://answers.example.test' };
    const applied = await send(member, 'post', '/publishers/applications', body).expect(201);
    documented('post', '/publishers/applications', applied);
    documented('post', '/publishers/applications', await send(member, 'post', '/publishers/applications', body).expect(409));
    documented('get', '/publishers/applications', await get('/publishers/applications', member).expect(403));
    const list = await get('/publishers/applications?status=pending', admin).expect(200);
    expect(list.body.items.map((a: { id: number }) => a.id)).toContain(applied.body.id);
    documented('get', '/publishers/applications', list);
    const decide = (note: string) => send(admin, 'post', `/publishers/applications/${applied.body.id}/decision`, { decision: 'decline', note });
    const declined = await decide('Answers test: declined.').expect(200);
    expect(declined.body.decision.by.handle).toBe(admin.user.handle);
    documented('post', '/publishers/applications/{id}/decision', declined);
    documented('post', '/publishers/applications/{id}/decision', await decide('Again.').expect(409));
    documented('post', '/publishers/applications/{id}/decision', await send(admin, 'post', '/publishers/applications/999999/decision', { decision: 'decline', note: 'x' }).expect(404));
  });

  it('the site settings, for admins only', async () => {
    documented('get', '/publishers/settings', await get('/publishers/settings', admin).expect(200));
    documented('put', '/publishers/settings', await send(admin, 'put', '/publishers/settings', { trustPublisherImports: false }).expect(200));
    documented('put', '/publishers/settings', await send(moderator, 'put', '/publishers/settings', { trustPublisherImports: true }).expect(403));
    const bad = await send(admin, 'put', '/publishers/settings', { trustPublisherImports: 'yes' }).expect(400);
    expect(bad.body.issues[0].path).toBe('trustPublisherImports');
  });

  it('a flag, the open flags, its resolution, and the refusals (409 flagged twice or resolved twice)', async () => {
    const flag = await send(member, 'post', '/flags', { subjectType: 'steel', subject: 'aisi-d2', reason: 'duplicate' }).expect(201);
    documented('post', '/flags', flag);
    documented('post', '/flags', await send(member, 'post', '/flags', { subjectType: 'steel', subject: 'aisi-d2', reason: 'duplicate' }).expect(409));
    documented('get', '/flags', await get('/flags', member).expect(403));
    const open = await get('/flags', moderator).expect(200);
    expect(open.body.items.map((f: { id: number }) => f.id)).toContain(flag.body.id);
    documented('get', '/flags', open);
    const resolve = () => send(moderator, 'post', `/flags/${flag.body.id}/resolve`, { outcome: 'dismissed', note: 'Answers test.' });
    documented('post', '/flags/{id}/resolve', await resolve().expect(200));
    documented('post', '/flags/{id}/resolve', await resolve().expect(409));
  });

  it('the audit log with its Link header; an account changed by an admin', async () => {
    const audit = await get('/audit', moderator).expect(200);
    expect(audit.headers.link).toContain('rel="first"');
    expect(audit.body.items.length).toBeGreaterThan(0);
    documented('get', '/audit', audit);
    documented('get', '/audit', await get('/audit', member).expect(403));
    const other = await demoHandle(server.url, 'member', 3);
    const change = (banned: boolean) => send(admin, 'patch', `/admin/users/${other}`, { banned, reason: 'Answers test.' });
    const banned = await change(true).expect(200);
    expect(banned.body.banned).toBe(true);
    documented('patch', '/admin/users/{handle}', banned);
    documented('patch', '/admin/users/{handle}', await change(true).expect(409));
    documented('patch', '/admin/users/{handle}', await change(false).expect(200));
    const bad = await send(admin, 'patch', `/admin/users/${other}`, { banned: false }).expect(400);
    expect(bad.body.issues[0].path).toBe('reason');
    documented('patch', '/admin/users/{handle}', bad);
    documented('patch', '/admin/users/{handle}', await send(admin, 'patch', '/admin/users/no-such-handle', { banned: false, reason: 'x' }).expect(404));
  });

  it('API tokens: made (its secret once), listed; a member is refused', async () => {
    const made = await send(publisher, 'post', '/tokens', { name: 'answers test' }).expect(201);
    expect(made.body.token).toMatch(new RegExp(`^${made.body.prefix}`));
    documented('post', '/tokens', made);
    const list = await get('/tokens', publisher).expect(200);
    expect(list.body.items.some((t: { id: number; token?: string }) => t.id === made.body.id && t.token === undefined)).toBe(true);
    documented('get', '/tokens', list);
    documented('get', '/tokens', await get('/tokens', member).expect(403));
    documented('post', '/tokens', await send(publisher, 'post', '/tokens', { name: '' }).expect(400));
  });

  it('the mail catcher’s messages, for admins', async () => {
    const mail = await get('/dev/mail', admin).expect(200);
    expect(mail.body.length).toBeGreaterThan(0);
    documented('get', '/dev/mail', mail);
    documented('get', '/dev/mail', await get('/dev/mail').expect(401));
  });

  it('the review desk with every kind of item, and a bulk approval', async () => {
    const example = { steel: 'aisi-d2', hardness: { value: 61, scale: 'HRC' }, abrasive: 'cbn-electroplated-wheel-250-b126', edgeAngle: { perSideDeg: 15 }, sharpness: { method: 'push-cut-test-v2', readingsG: [181, 176, 189] } };
    const pending = await send(member, 'post', '/results', example).expect(201);
    await send(member, 'post', '/flags', { subjectType: 'method', subject: 'push-cut-test-v2', reason: 'missing-method', text: 'Answers test.' }).expect(201);
    const desk = await get('/review-desk', moderator).expect(200);
    expect(desk.body.items.map((r: { id: number }) => r.id)).toContain(pending.body.id);
    expect(desk.body.flags.length).toBeGreaterThan(0);
    documented('get', '/review-desk', desk);
    documented('get', '/review-desk', await get('/review-desk', member).expect(403));
    const approved = await send(moderator, 'post', '/review-desk/bulk-approve', { ids: [pending.body.id], note: 'Answers test.' }).expect(200);
    expect(approved.body.approved).toEqual([pending.body.id]);
    documented('post', '/review-desk/bulk-approve', approved);
    const bad = await send(moderator, 'post', '/review-desk/bulk-approve', {}).expect(400);
    expect(bad.body.issues[0].path).toBe('ids');
    documented('post', '/review-desk/bulk-approve', bad);
  });
});

describe('a member’s own settings, follows, duplicates and photos', () => {
  it('e-mail settings, a follow, the duplicate check, a photo and the photo list; an unsigned unsubscribe link is a 400 naming it', async () => {
    documented('put', '/me/notifications', await send(member, 'put', '/me/notifications', { digest: true }).expect(200));
    const badSetting = await send(member, 'put', '/me/notifications', { digest: 'yes' }).expect(400);
    expect(badSetting.body.issues[0].path).toBe('digest');
    documented('put', '/me/notifications', badSetting);
    documented('post', '/me/follows', await send(member, 'post', '/me/follows', { pageType: 'steel', slug: 'aisi-d2' }).expect(201));
    documented('post', '/me/follows', await send(null, 'post', '/me/follows', { pageType: 'steel', slug: 'aisi-d2' }).expect(401));

    const example = { steel: 'aisi-d2', hardness: { value: 61, scale: 'HRC' }, abrasive: 'cbn-electroplated-wheel-250-b126', edgeAngle: { perSideDeg: 15 }, sharpness: { method: 'push-cut-test-v2', readingsG: [183, 177, 188] } };
    const posted = await send(member, 'post', '/results/drafts', example).expect(201);
    const duplicates = await send(member, 'post', '/me/duplicate-check', example).expect(200);
    expect(duplicates.body.duplicates.map((d: { id: number }) => d.id)).toContain(posted.body.id);
    documented('post', '/me/duplicate-check', duplicates);

    const unsubscribe = await send(null, 'post', '/me/unsubscribe', { user: 1, topic: 'digest', sig: 'x'.repeat(30) }).expect(400);
    expect(unsubscribe.body.issues[0].path).toBe('sig');
    documented('post', '/me/unsubscribe', unsubscribe);

    // An invented image, made with sharp.
    const jpeg = await sharp({ create: { width: 64, height: 48, channels: 3, background: { r: 120, g: 120, b: 120 } } }).jpeg().toBuffer();
    const photo = await member.agent.post(`/api/v1/results/${posted.body.id}/photos`).set('X-CSRF-Token', member.csrf).field('alt', 'A test edge under the loupe').attach('photo', jpeg, { filename: 'edge.jpg', contentType: 'image/jpeg' }).expect(201);
    documented('post', '/results/{id}/photos', photo);
    const photos = await get(`/results/${posted.body.id}/photos`, member).expect(200);
    expect(photos.body.items).toHaveLength(1);
    documented('get', '/results/{id}/photos', photos);
    documented('get', '/results/{id}/photos', await get('/results/999999999/photos').expect(404));
  });
});

describe('the desk’s context, profiles, the import and the refusals that carry more than an error', () => {
  const example = { steel: 'aisi-d2', hardness: { value: 61, scale: 'HRC' }, abrasive: 'cbn-electroplated-wheel-250-b126', edgeAngle: { perSideDeg: 15 }, sharpness: { method: 'push-cut-test-v2', readingsG: [182, 178, 186] } };

  it('a pending result’s context on the desk; 403 for a member, 404 unknown, 409 once it is decided', async () => {
    const pending = await send(member, 'post', '/results', example).expect(201);
    const context = await get(`/review-desk/results/${pending.body.id}/context`, moderator).expect(200);
    expect(context.body.resultId).toBe(pending.body.id);
    documented('get', '/review-desk/results/{id}/context', context);
    documented('get', '/review-desk/results/{id}/context', await get(`/review-desk/results/${pending.body.id}/context`, member).expect(403));
    documented('get', '/review-desk/results/{id}/context', await get('/review-desk/results/999999999/context', moderator).expect(404));
    await send(moderator, 'post', '/review-desk/bulk-approve', { ids: [pending.body.id], note: 'Answers test.' }).expect(200);
    documented('get', '/review-desk/results/{id}/context', await get(`/review-desk/results/${pending.body.id}/context`, moderator).expect(409));
  });

  it('a member’s public profile, and 404 for an unknown handle', async () => {
    const profile = await get(`/profiles/${publisher.user.handle}`).expect(200);
    expect(profile.body.handle).toBe(publisher.user.handle);
    expect(profile.body.recent.length).toBeGreaterThan(0);
    documented('get', '/profiles/{handle}', profile);
    documented('get', '/profiles/{handle}', await get('/profiles/no-such-member').expect(404));
  });

  it('the import: the dry run’s report (200), the import (201), a refused file (400 with the report), a member refused (403)', async () => {
    const row = (readings: string): Record<string, string> => ({ steel: 'aisi-d2', hardness: '61', abrasive: 'cbn-electroplated-wheel-250-b126', grit_standard: 'iso6106', grit: 'B126', angle_per_side_deg: '15', sharpness_method: 'push-cut-test-v2', readings_g: readings, notes: 'Invented answers-test row.' });
    const file = (readings: string) => toCsv([[...IMPORT_COLUMNS], IMPORT_COLUMNS.map((c) => row(readings)[c] ?? '')]);
    const post = (who: Session, csv: string, query = '') =>
      who.agent.post(`/api/v1/import/results${query}`).set('X-CSRF-Token', who.csrf).attach('file', Buffer.from(csv, 'utf8'), { filename: 'results.csv', contentType: 'text/csv' });
    const dry = await post(publisher, file('181;176;189;170;165'), '?dryRun=1').expect(200);
    expect([dry.body.rows, dry.body.valid, dry.body.preview.length]).toEqual([1, 1, 1]);
    documented('post', '/import/results', dry);
    const imported = await post(publisher, file('181;176;189;170;165')).expect(201);
    expect(imported.body.imported).toBe(1);
    documented('post', '/import/results', imported);
    const refused = await post(publisher, file('181;x')).expect(400);
    expect(refused.body.errors[0].column).toBe('readings_g');
    documented('post', '/import/results', refused);
    documented('post', '/import/results', await post(publisher, file('181;176;189;170;165'), '?dryRun=maybe').expect(400));
    documented('post', '/import/results', await post(member, file('181;176;189;170;165'), '?dryRun=1').expect(403));
  });

  it('a stale page save and a proposal that conflicts with a later edit: 409 with the current revision and a suggested merge', async () => {
    type Page = Record<string, unknown> & { slug: string; revision: number; body: unknown };
    const steels = (await get('/steels').expect(200)).body.items as { slug: string }[];
    const [one, two] = steels.filter((p) => p.slug !== 'aisi-d2').map((p) => p.slug);
    const edit = (page: Page, summary: string, hardnessHrc: object) => ({
      ...Object.fromEntries(['name', 'category', 'designations', 'composition', 'citations', 'sources'].map((k) => [k, page[k]])),
      hardnessHrc,
      body: page.body,
      baseRevision: page.revision,
      summary,
    });
    const start = (await get(`/steels/${one}`).expect(200)).body as Page;
    await send(moderator, 'put', `/steels/${one}`, edit(start, 'Answers test: first', { min: 55, max: 59 })).expect(200);
    const stale = await send(admin, 'put', `/steels/${one}`, edit(start, 'Answers test: second', { min: 56, max: 60 })).expect(409);
    expect(stale.body.conflicts).toContain('hardnessHrc');
    documented('put', '/steels/{slug}', stale);

    const base = (await get(`/steels/${two}`).expect(200)).body as Page;
    const a = await send(member, 'put', `/steels/${two}`, edit(base, 'Answers test: A', { min: 55, max: 59 })).expect(202);
    const b = await send(member, 'put', `/steels/${two}`, edit(base, 'Answers test: B', { min: 56, max: 60 })).expect(202);
    documented('post', '/page-revisions/{id}/review', await send(moderator, 'post', `/page-revisions/${a.body.revision.id}/review`, { decision: 'approve' }).expect(200));
    const conflict = await send(moderator, 'post', `/page-revisions/${b.body.revision.id}/review`, { decision: 'approve' }).expect(409);
    expect(conflict.body.conflicts).toContain('hardnessHrc');
    documented('post', '/page-revisions/{id}/review', conflict);
    // A plain 409 (decided already) holds to the same answer.
    documented('post', '/page-revisions/{id}/review', await send(moderator, 'post', `/page-revisions/${a.body.revision.id}/review`, { decision: 'approve' }).expect(409));
  });
});
