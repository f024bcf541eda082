/**
 * Issue 15: a production site can be filled. Moderators and admins start steel, abrasive and
 * method pages (POST /api/{section}); the new page is in its list and in search at once, and
 * members can post a result against it. Runs on SQLite, and on PostgreSQL with
 * TEST_DATABASE=postgres.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { demoHandle, signIn, startTestServer } from '../setup/test-server';
import { AuditEntry, PageRevision, Steel, User } from '../../server/models';

let server: Awaited<ReturnType<typeof startTestServer>>;
type Session = Awaited<ReturnType<typeof signIn>>;
let member: Session;
let publisher: Session;
let moderator: Session;
let admin: Session;

beforeAll(async () => {
  server = await startTestServer();
  member = await signIn(server.url, await demoHandle(server.url, 'member'));
  publisher = await signIn(server.url, await demoHandle(server.url, 'publisher'));
  moderator = await signIn(server.url, await demoHandle(server.url, 'moderator'));
  admin = await signIn(server.url, await demoHandle(server.url, 'admin'));
});
afterAll(async () => {
  await server?.stop();
});

const post = (who: Session, path: string, body: unknown) => who.agent.post(path).set('X-CSRF-Token', who.csrf).send(body as object);
const paragraph = (text: string) => ({ type: 'doc', content: [{ type: 'paragraph', content: [{ type: 'text', text }] }] });

// An invented test grade: its limits are made up for the test, and no published figure is checked.
const newSteel = (changes: Record<string, unknown> = {}) => ({
  name: 'Testgrade PM 15V',
  category: 'tool',
  designations: [{ system: 'AISI', code: 'TG15V' }],
  composition: [{ element: 'C', min: 2.3, max: 2.5 }, { element: 'V', min: 14.5, max: 15.5 }],
  hardnessHrc: { min: 60, max: 64 },
  body: paragraph('An invented powder steel for the test suite.'),
  summary: 'New page for an invented test grade.',
  ...changes,
});

describe('POST /api/{steels,abrasives,methods}: a new reference page', () => {
  it('a moderator starts a steel page: slug from the name, revision 1 live, in the list, in search, audited; a member posts a result against it', async () => {
    const res = await post(moderator, '/api/v1/steels', newSteel()).expect(201);
    // The slug rule: lower case, every run of other characters one hyphen.
    expect(res.headers.location).toBe('/api/v1/steels/testgrade-pm-15v');
    expect(res.body).toMatchObject({ status: 'live', revision: { number: 1, status: 'live' }, page: { slug: 'testgrade-pm-15v', name: 'Testgrade PM 15V', revisionNumber: 1 } });

    const list = await request(server.url).get('/api/v1/steels').expect(200);
    expect((list.body.items as { slug: string }[]).map((s) => s.slug)).toContain('testgrade-pm-15v');
    const page = await request(server.url).get('/api/v1/steels/testgrade-pm-15v').expect(200);
    expect(page.body).toMatchObject({ designations: [{ system: 'AISI', code: 'TG15V' }], hardnessHrc: { min: 60, max: 64 } });
    const history = await request(server.url).get('/api/v1/steels/testgrade-pm-15v/revisions').expect(200);
    expect(history.body.items).toHaveLength(1);

    const found = await request(server.url).get('/api/v1/search?q=TG15V&type=steel').expect(200);
    expect(found.body.hits[0]?.slug).toBe('testgrade-pm-15v');

    const steel = (await Steel.findOne({ where: { slug: 'testgrade-pm-15v' } }))!;
    const audit = await AuditEntry.findOne({ where: { action: 'page.create', subjectType: 'steel', subjectId: steel.id } });
    expect(audit?.actorId).toBe((await User.findOne({ where: { handle: moderator.user.handle } }))!.id);

    const result = await post(member, '/api/v1/results', {
      steel: 'testgrade-pm-15v',
      hardness: { value: 62, scale: 'HRC' },
      abrasive: 'cbn-electroplated-wheel-250-b126',
      grit: { standard: 'iso6106', grade: 'B126' },
      edgeAngle: { perSideDeg: 15 },
      sharpness: { method: 'push-cut-test-v2', readingsG: [180, 175, 190] },
    }).expect(201);
    expect(result.body.steel).toBe('testgrade-pm-15v');
  });

  it('an admin starts an abrasive page and a method page (version 1) under the slug given', async () => {
    const abrasive = await post(admin, '/api/v1/abrasives', {
      name: 'Test silicon carbide stone F320',
      slug: 'test-sic-stone-f320',
      material: 'silicon-carbide',
      bond: 'vitrified',
      form: 'bench-stone',
      grit: { standard: 'fepa-f', grade: 'F320' },
      wheelDiameterMm: null,
      widthMm: 50,
      wears: true,
      coolant: 'water',
      sideUsable: false,
      body: null,
    }).expect(201);
    expect(abrasive.body.page).toMatchObject({ slug: 'test-sic-stone-f320', material: 'silicon-carbide' });
    const abrasives = await request(server.url).get('/api/v1/abrasives').expect(200);
    expect((abrasives.body.items as { slug: string }[]).map((a) => a.slug)).toContain('test-sic-stone-f320');

    const method = await post(admin, '/api/v1/methods', {
      name: 'Test thread-cut sharpness',
      instrument: 'A hanging-weight rig (invented for the test)',
      medium: 'Cotton thread',
      readingsPerEdge: 3,
      retentionMedium: null,
      thresholdG: null,
      body: paragraph('An invented method for the test suite.'),
    }).expect(201);
    expect(method.body.page).toMatchObject({ slug: 'test-thread-cut-sharpness', version: 1 });
  });

  it('refuses members and publishers (403), visitors (401), and stores nothing', async () => {
    const before = await Steel.count();
    for (const who of [member, publisher]) {
      const res = await post(who, '/api/v1/steels', newSteel({ name: 'Refused grade', designations: [{ system: 'AISI', code: 'RFG1' }] })).expect(403);
      expect(res.body.error).toMatch(/moderators and admins/);
    }
    await request(server.url).post('/api/v1/steels').send(newSteel()).expect(401);
    expect(await Steel.count()).toBe(before);
  });

  it('answers bad input with 400 naming the field: a bad slug, a missing category, a name with no slug in it, a designation another page holds', async () => {
    const before = { steels: await Steel.count(), revisions: await PageRevision.count() };
    const paths = async (body: unknown) => ((await post(moderator, '/api/v1/steels', body).expect(400)).body.issues as { path: string }[]).map((i) => i.path);
    expect(await paths(newSteel({ slug: 'Not A Slug' }))).toContain('slug');
    const { category: _c, ...noCategory } = newSteel({ name: 'Another grade', designations: [{ system: 'AISI', code: 'AG2' }] });
    expect(await paths(noCategory)).toContain('category');
    expect(await paths(newSteel({ name: '———', designations: [{ system: 'AISI', code: 'AG3' }] }))).toContain('slug');
    expect(await paths(newSteel({ name: 'New', designations: [{ system: 'AISI', code: 'AG4' }] }))).toContain('slug');
    // AISI D2 is a demo page's designation (a standard grade, AISI).
    expect(await paths(newSteel({ name: 'Second D2', designations: [{ system: 'AISI', code: 'D2' }] }))).toContain('designations.0.code');
    expect({ steels: await Steel.count(), revisions: await PageRevision.count() }).toEqual(before);
  });

  it('refuses a slug a page of the type already holds with 409, and changes nothing', async () => {
    const before = await request(server.url).get('/api/v1/steels/aisi-d2').expect(200);
    const res = await post(moderator, '/api/v1/steels', newSteel({ name: 'Another', slug: 'aisi-d2', designations: [{ system: 'AISI', code: 'AN9' }] })).expect(409);
    expect(res.body.error).toMatch(/aisi-d2/);
    const after = await request(server.url).get('/api/v1/steels/aisi-d2').expect(200);
    expect(after.body.revision).toBe(before.body.revision);
  });
});
