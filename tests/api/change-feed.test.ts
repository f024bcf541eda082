/**
 * The change feed: a write through every command records its changes in the `changes` table
 * (in its transaction) and every follower that should takes them before the command resolves:
 * the search index, the comparison cells and their cache, kept reads (accounts) and kept answers.
 */
import fs from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import sharp from 'sharp';
import { Op } from 'sequelize';
import { demoHandle, signIn, startTestServer } from '../setup/test-server';
import { ChangeRow } from '../../server/changes/change-row';
import { Abrasive, Result, ResultRevision, Steel, User, WheelMeasurement } from '../../server/models';
import { toCsv } from '../../shared/csv-writer';
import { applyForPublisher } from '../../server/commands/apply-for-publisher';
import { bulkApproveResults } from '../../server/commands/bulk-approve-results';
import { createToken } from '../../server/commands/create-token';
import { decidePublisherApplication } from '../../server/commands/decide-publisher-application';
import { flagItem, resolveFlag } from '../../server/commands/flag-item';
import { followPage, unfollowPage } from '../../server/commands/follow-page';
import { importResults, templateRows } from '../../server/commands/import-results';
import { addWheel, deleteMeasurement, editMeasurement, measureWheel } from '../../server/commands/log-wheel';
import { editResult, saveDraft } from '../../server/commands/edit-result';
import { reviewResultRevision } from '../../server/commands/review-result-revision';
import { addGrinder, addJig, addWorkshopWheel, reportPrice, retireWheel, saveSetup } from '../../server/commands/equip-workshop';
import { manageUser } from '../../server/commands/manage-user';
import { grantRoleFromCommandLine } from '../../server/commands/grant-role';

import { createPage } from '../../server/commands/create-page';
import { mergePages } from '../../server/commands/merge-pages';
import { protectPage } from '../../server/commands/protect-page';
import { recordRefusal } from '../../server/commands/record-audit';
import { retractResult } from '../../server/commands/retract-result';
import { revertPage } from '../../server/commands/revert-page';
import { reviewPageRevision } from '../../server/commands/review-page-revision';
import { reviewResult } from '../../server/commands/review-result';
import { revisePage } from '../../server/commands/revise-page';
import { revokeToken } from '../../server/commands/revoke-token';
import { sendDigest } from '../../server/commands/send-digest';
import { signInFromProvider } from '../../server/commands/sign-in-from-provider';
import { submitResult } from '../../server/commands/submit-result';
import { updateNotificationSettings } from '../../server/commands/update-notification-settings';
import { updateSiteSettings } from '../../server/commands/update-site-settings';
import { removePhoto, uploadPhoto } from '../../server/commands/upload-photo';
import type { PageEdit } from '../../shared/schemas/pages';

let server: Awaited<ReturnType<typeof startTestServer>>;
let member: User;
let moderator: User;
let admin: User;
let publisher: User;

beforeAll(async () => {
  server = await startTestServer();
  const user = async (role: string) => (await User.findOne({ where: { handle: await demoHandle(server.url, role) } }))!;
  [member, moderator, admin, publisher] = [await user('member'), await user('moderator'), await user('admin'), await user('publisher')];
});
afterAll(async () => {
  await server?.stop();
});

/** Runs `write` and returns what it recorded in the `changes` table: each row's kind and keys. */
async function changesOf(write: () => Promise<unknown>): Promise<{ kind: string; keys: Record<string, unknown> }[]> {
  const before = ((await ChangeRow.max('id')) as number | null) ?? 0;
  await write();
  const rows = await ChangeRow.findAll({ where: { id: { [Op.gt]: before } }, order: [['id', 'ASC']], raw: true });
  return rows.map((r) => ({ kind: r.kind, keys: JSON.parse(r.keys) as Record<string, unknown> }));
}
const kinds = (rows: { kind: string }[]) => [...new Set(rows.map((r) => r.kind))].sort();

const resultInput = {
  steel: 'aisi-m2',
  hardness: { value: 64, scale: 'HRC' as const },
  abrasive: 'cbn-electroplated-wheel-250-b126',
  grit: { standard: 'iso6106' as const, grade: 'B126' },
  edgeAngle: { perSideDeg: 16 },
  sharpness: { method: 'push-cut-test-v2', readingsG: [181, 176, 191, 171, 186] },
};

/** The comparison's result count for the method, through its kept answer (asked twice: the second is the kept one). */
async function compared(): Promise<number> {
  await request(server.url).get('/api/compare?method=push-cut-test-v2').expect(200);
  return (await request(server.url).get('/api/compare?method=push-cut-test-v2').expect(200)).body.totalResults as number;
}
const approvedCount = () => Result.count({ where: { status: 'approved' } });
const inIndex = (key: string) => server.ctx.search.has(key);

/** A steel page as a visitor gets it (asked twice: the second answer is the kept one). */
async function steelPage(slug: string) {
  await request(server.url).get(`/api/steels/${slug}`);
  return (await request(server.url).get(`/api/steels/${slug}`)).body as Record<string, unknown> & { revision: number; body: unknown; name: string; isProtected: boolean };
}
function editOf(page: Awaited<ReturnType<typeof steelPage>>, changes: Record<string, unknown>): PageEdit {
  const keys = ['name', 'category', 'designations', 'composition', 'hardnessHrc', 'citations', 'sources'];
  return { ...Object.fromEntries(keys.map((k) => [k, page[k]])), body: page.body, baseRevision: page.revision, summary: 'Feed test', ...changes } as unknown as PageEdit;
}

describe('a write through every command', () => {
  let resultId: number;

  it('submitResult: a pending result, recorded, public views unchanged', async () => {
    const total = await compared();
    const rows = await changesOf(async () => {
      resultId = (await submitResult(server.ctx, member, resultInput)).id;
    });
    expect(rows).toEqual([{ kind: 'result', keys: { ids: [resultId], published: [], cells: [] } }]);
    expect(inIndex(`result:${resultId}`)).toBe(false);
    expect(await compared()).toBe(total);
  });

  it('reviewResult: approval refreshes the cell, the index and the kept comparison', async () => {
    const total = await compared();
    const rows = await changesOf(() => reviewResult(server.ctx, moderator, resultId, { decision: 'approve' }));
    expect(kinds(rows)).toEqual(['audit', 'result']);
    expect(rows.find((r) => r.kind === 'result')!.keys).toMatchObject({ ids: [resultId], published: [resultId], cells: [expect.objectContaining({ material: 'cbn' })] });
    expect(inIndex(`result:${resultId}`)).toBe(true);
    expect(await compared()).toBe(total + 1);
  });

  it('recordRefusal: a refused second decision is recorded', async () => {
    const rows = await changesOf(() => reviewResult(server.ctx, moderator, resultId, { decision: 'reject' }).catch(() => undefined));
    expect(kinds(rows)).toEqual(['audit']);
    const direct = await changesOf(() => recordRefusal(server.ctx, moderator.asActor(), { action: 'result.reject', subjectType: 'result', subjectId: resultId }, 'already decided'));
    expect(kinds(direct)).toEqual(['audit']);
  });

  it('uploadPhoto and removePhoto', async () => {
    const jpeg = await sharp({ create: { width: 64, height: 48, channels: 3, background: { r: 90, g: 90, b: 90 } } }).jpeg().toBuffer();
    let photoId = 0;
    expect(kinds(await changesOf(async () => void (photoId = (await uploadPhoto(server.ctx, member.asActor(), resultId, jpeg, 'Edge under the loupe')).id)))).toEqual(['photo']);
    expect(kinds(await changesOf(() => removePhoto(server.ctx, member.asActor(), photoId)))).toEqual(['photo']);
  });

  it('flagItem and resolveFlag', async () => {
    let flagId = 0;
    expect(kinds(await changesOf(async () => void (flagId = (await flagItem(server.ctx, member.asActor(), { subjectType: 'result', subject: resultId, reason: 'spam' } as never)).id)))).toEqual(['flag']);
    expect(kinds(await changesOf(() => resolveFlag(server.ctx, moderator.asActor(), flagId, { outcome: 'dismissed', note: 'Looks fine.' } as never)))).toEqual(['audit', 'flag']);
  });

  it('followPage, sendDigest and unfollowPage', async () => {
    expect(kinds(await changesOf(() => followPage(server.ctx, member.asActor(), 'steel', 'aisi-m2')))).toEqual(['follow']);
    let sent = 0;
    const digest = await changesOf(async () => void (sent = (await sendDigest(server.ctx, new Date())).sent));
    expect(sent).toBeGreaterThan(0);
    expect(kinds(digest)).toEqual(['mail-settings']);
    expect(kinds(await changesOf(() => unfollowPage(server.ctx, member.asActor(), 'steel', 'aisi-m2')))).toEqual(['follow']);
  });

  it('updateNotificationSettings', async () => {
    expect(await changesOf(() => updateNotificationSettings(server.ctx, member.id, { digest: false }))).toEqual([{ kind: 'mail-settings', keys: { ids: [member.id] } }]);
  });

  it('retractResult: the result leaves the cell, the index and the kept comparison', async () => {
    const total = await compared();
    const rows = await changesOf(() => retractResult(server.ctx, member.asActor(), resultId, 'Measured on the wrong edge.'));
    expect(rows).toEqual([{ kind: 'result', keys: expect.objectContaining({ ids: [resultId], published: [resultId] }) }]);
    expect(inIndex(`result:${resultId}`)).toBe(false);
    expect(await compared()).toBe(total - 1);
  });

  it('importResults and bulkApproveResults', async () => {
    let importId = 0;
    let ids: number[] = [];
    const imported = await changesOf(async () => {
      importId = (await importResults(server.ctx, publisher.asActor(), Buffer.from(toCsv(templateRows())))).importId;
      ids = (await Result.findAll({ where: { id: { [Op.gt]: resultId } }, order: [['id', 'ASC']] })).map((r) => r.id);
    });
    expect(kinds(imported)).toEqual(['import', 'result']);
    expect(imported.find((r) => r.kind === 'result')!.keys).toMatchObject({ ids, published: [] });
    const approvedBefore = await approvedCount();
    const approved = await changesOf(() => bulkApproveResults(server.ctx, moderator.asActor(), { importId }));
    expect(kinds(approved)).toEqual(['audit', 'import', 'result']);
    expect(approved.find((r) => r.kind === 'result')!.keys).toMatchObject({ ids, published: ids });
    for (const id of ids) expect(inIndex(`result:${id}`)).toBe(true);
    expect(await approvedCount()).toBe(approvedBefore + ids.length);
  });

  it('createPage: the new page is in the index and its list at once, audited', async () => {
    const input = {
      name: 'Feed test method', instrument: 'An invented rig', medium: 'Paper', readingsPerEdge: 3, retentionMedium: null, thresholdG: null,
      citations: [], sources: {}, summary: 'First version.', body: null,
    };
    const rows = await changesOf(() => createPage(server.ctx, moderator.asActor(), 'method', input));
    expect(kinds(rows)).toEqual(['audit', 'page']);
    expect(inIndex('method:feed-test-method')).toBe(true);
    const list = (await request(server.url).get('/api/methods').expect(200)).body.items as { slug: string }[];
    expect(list.map((m) => m.slug)).toContain('feed-test-method');
  });

  it('revisePage: a renamed page is found by its new name, and its kept answer follows', async () => {
    const page = await steelPage('aisi-o1');
    const rows = await changesOf(() => revisePage(server.ctx, moderator.asActor(), 'steel', 'aisi-o1', editOf(page, { name: 'AISI O1 oil-hardening' })));
    expect(rows).toEqual([{ kind: 'page', keys: { pageType: 'steel', ids: [expect.any(Number)], renamed: true } }]);
    expect((await steelPage('aisi-o1')).name).toBe('AISI O1 oil-hardening');
    expect(server.ctx.search.search('oil-hardening', 'steel').hits.map((h) => h.slug)).toContain('aisi-o1');
  });

  it('revisePage as a proposal, then reviewPageRevision', async () => {
    let revisionId = 0;
    const proposed = await changesOf(async () => {
      const outcome = await revisePage(server.ctx, member.asActor(), 'steel', 'aisi-o1', editOf(await steelPage('aisi-o1'), { name: 'AISI O1 (proposed)' }));
      revisionId = outcome.outcome === 'proposed' ? outcome.revision.id : 0;
    });
    expect(revisionId).toBeGreaterThan(0);
    expect(kinds(proposed)).toEqual(['page']);
    const reviewed = await changesOf(() => reviewPageRevision(server.ctx, moderator.asActor(), revisionId, { decision: 'decline', note: 'Keep the name.' }));
    expect(kinds(reviewed)).toEqual(['page']);
  });

  it('revertPage: the page and its kept answer go back', async () => {
    const first = (await Steel.findOne({ where: { slug: 'aisi-o1' } }))!;
    const page = await steelPage('aisi-o1');
    const original = (await request(server.url).get('/api/steels/aisi-o1/revisions').expect(200)).body.items.at(-1) as { id: number };
    const rows = await changesOf(() => revertPage(server.ctx, moderator.asActor(), 'steel', 'aisi-o1', { toRevision: original.id, baseRevision: page.revision } as never));
    expect(rows).toEqual([{ kind: 'page', keys: { pageType: 'steel', ids: [first.id], renamed: true } }]);
    expect((await steelPage('aisi-o1')).name).not.toBe('AISI O1 oil-hardening');
  });

  it('protectPage', async () => {
    expect((await steelPage('aisi-o1')).isProtected).toBe(false);
    expect(kinds(await changesOf(() => protectPage(server.ctx, moderator.asActor(), 'steel', 'aisi-o1', { protected: true })))).toEqual(['page']);
    expect((await steelPage('aisi-o1')).isProtected).toBe(true);
  });

  it('mergePages: the duplicate leaves the index, its results move with their cells', async () => {
    expect(inIndex('steel:aisi-o1')).toBe(true);
    const rows = await changesOf(() => mergePages(server.ctx, moderator.asActor(), 'steel', 'aisi-o1', { into: 'aisi-d2' } as never));
    expect(kinds(rows)).toEqual(['page', 'result']);
    expect(inIndex('steel:aisi-o1')).toBe(false);
    const moved = rows.find((r) => r.kind === 'result')!.keys as { published: number[] };
    for (const id of moved.published) expect(inIndex(`result:${id}`)).toBe(true);
  });

  it('applyForPublisher and decidePublisherApplication: the kept account follows the new role', async () => {
    const applicant = await signIn(server.url, member.handle);
    expect((await applicant.agent.get('/api/session').expect(200)).body.user.role).toBe('member');
    let applicationId = 0;
    const applied = await changesOf(async () => void (applicationId = (await applyForPublisher(server.ctx, member.asActor(), { workshop: 'Feed test workshop', instruments: 'A push-cut tester', link: 'https://example.org/workshop' })).id));
    expect(kinds(applied)).toEqual(['application']);
    const decided = await changesOf(() => decidePublisherApplication(server.ctx, admin.asActor(), applicationId, { decision: 'approve' }));
    expect(kinds(decided)).toEqual(['account', 'application', 'audit']);
    expect((await applicant.agent.get('/api/session').expect(200)).body.user.role).toBe('publisher');
  });

  it('createToken and revokeToken', async () => {
    let tokenId = 0;
    expect(kinds(await changesOf(async () => void (tokenId = (await createToken(server.ctx, publisher.asActor(), 'Feed test')).record.id)))).toEqual(['token']);
    expect(await changesOf(() => revokeToken(server.ctx, publisher.asActor(), tokenId))).toEqual([{ kind: 'token', keys: { ids: [tokenId] } }]);
  });

  it('addWheel and measureWheel', async () => {
    let wheelId = 0;
    const wheel = { name: 'Feed test wheel', abrasive: 'cbn-electroplated-wheel-250-b126', wears: true, originalDiameterMm: 250, barDiameterMm: 12, projectionMm: 95, usualAnglesDeg: [15] };
    expect(kinds(await changesOf(async () => void (wheelId = (await addWheel(server.ctx, member.asActor(), wheel as never)).id)))).toEqual(['wheel']);
    expect(kinds(await changesOf(() => measureWheel(server.ctx, member.asActor(), wheelId, { measuredOn: '2026-11-02', diameterMm: 249 } as never)))).toEqual(['wheel']);
  });

  it('saveDraft and editResult: a draft stays off the public views, a submitted edit goes on the desk', async () => {
    const total = await compared();
    let draftId = 0;
    const saved = await changesOf(async () => void (draftId = (await saveDraft(server.ctx, member, resultInput)).id));
    expect(saved).toEqual([{ kind: 'result', keys: { ids: [draftId], published: [], cells: [] } }]);
    const edited = await changesOf(() => editResult(server.ctx, member.asActor(), draftId, { ...resultInput, edgeAngle: { perSideDeg: 17 } }));
    expect(edited).toEqual([{ kind: 'result', keys: { ids: [draftId], published: [], cells: [] } }]);
    expect((await Result.findByPk(draftId))!.status).toBe('pending');
    expect(inIndex(`result:${draftId}`)).toBe(false);
    expect(await compared()).toBe(total);
  });

  it('editResult on a published result, then reviewResultRevision: the cell and the index follow only the approval', async () => {
    const id = (await submitResult(server.ctx, member, resultInput)).id;
    await reviewResult(server.ctx, moderator, id, { decision: 'approve' });
    const median = async () => (await request(server.url).get(`/api/results/${id}`).expect(200)).body.derived.sharpnessMedianG as number;
    expect(await median()).toBe(181);
    // The correction moves the result to another steel: the published version keeps its cell until approval.
    const proposed = await changesOf(() => editResult(server.ctx, member.asActor(), id, { ...resultInput, steel: 'aisi-d2', sharpness: { method: 'push-cut-test-v2', readingsG: [150, 152, 154] } }));
    expect(proposed).toEqual([{ kind: 'result', keys: { ids: [id], published: [], cells: [] } }]);
    expect(await median()).toBe(181);
    const titleOf = (q: string) => server.ctx.search.search(q, 'result', 10_000).hits.find((h) => h.id === id)?.title;
    expect(titleOf('M2')).toMatch(/M2/);
    expect((await Result.findByPk(id))!.status).toBe('approved');
    const number = (await ResultRevision.max('number', { where: { resultId: id } })) as number;
    const approved = await changesOf(() => reviewResultRevision(server.ctx, moderator, id, number, { decision: 'approve' }));
    expect(kinds(approved)).toEqual(['audit', 'result']);
    const cells = approved.find((r) => r.kind === 'result')!.keys as { published: number[]; cells: { steelId: number }[] };
    expect(cells.published).toEqual([id]);
    const steels = await Steel.findAll({ where: { slug: ['aisi-m2', 'aisi-d2'] } });
    expect(cells.cells.map((c) => c.steelId).sort()).toEqual(steels.map((s) => s.id).sort());
    expect(await median()).toBe(152);
    expect(titleOf('D2')).toMatch(/D2/);
    expect(titleOf('M2')).toBeUndefined();
  });

  it('the workshop: addGrinder, addJig, saveSetup, addWorkshopWheel, editMeasurement, deleteMeasurement, retireWheel, reportPrice', async () => {
    let grinderId = 0;
    let jigId = 0;
    let wheelId = 0;
    const mine = [{ kind: 'workshop', keys: { ids: [member.id] } }];
    expect(await changesOf(async () => void (grinderId = (await addGrinder(server.ctx, member.asActor(), { name: 'Feed grinder', spindleRpm: 90, barDiameterMm: 12, barMount: 'against-rotation' } as never)).id))).toEqual(mine);
    expect(await changesOf(async () => void (jigId = (await addJig(server.ctx, member.asActor(), { name: 'Feed jig', offsetMm: 0 })).id))).toEqual(mine);
    expect(await changesOf(() => saveSetup(server.ctx, member.asActor(), { name: 'Feed knife', jigId, projectionMm: 140, perSideDeg: 15 } as never))).toEqual(mine);
    const add = () => addWorkshopWheel(server.ctx, member.asActor(), { name: 'Feed CBN', abrasive: 'cbn-electroplated-wheel-250-b126', grinderId, originalDiameterMm: 250, ratedSpeedMps: 20 } as never);
    expect(kinds(await changesOf(async () => void (wheelId = (await add()).id)))).toEqual(['wheel']);
    await measureWheel(server.ctx, member.asActor(), wheelId, { measuredOn: '2026-11-02', diameterMm: 249 } as never);
    const measurementId = (await WheelMeasurement.max('id', { where: { wheelId } })) as number;
    expect(kinds(await changesOf(() => editMeasurement(server.ctx, member.asActor(), wheelId, measurementId, { measuredOn: '2026-11-02', diameterMm: 248.5 } as never)))).toEqual(['wheel']);
    expect(kinds(await changesOf(() => deleteMeasurement(server.ctx, member.asActor(), wheelId, measurementId)))).toEqual(['wheel']);
    expect(kinds(await changesOf(() => retireWheel(server.ctx, member.asActor(), wheelId, { retiredOn: '2026-11-20', retiredAfterSharpenings: 400 } as never)))).toEqual(['wheel']);
    const cbn = (await Abrasive.findOne({ where: { slug: 'cbn-electroplated-wheel-250-b126' } }))!;
    expect(await changesOf(() => reportPrice(server.ctx, member.asActor(), { abrasive: cbn.slug, price: 310, currency: 'EUR', paidOn: '2026-10-01', condition: 'new' } as never))).toEqual([{ kind: 'price', keys: { ids: [cbn.id] } }]);
  });

  it('manageUser: a role change and a ban reach the kept account on the next request', async () => {
    const target = await signIn(server.url, await demoHandle(server.url, 'member', 1));
    expect((await target.agent.get('/api/session').expect(200)).body.user.role).toBe('member');
    const promoted = await changesOf(() => manageUser(server.ctx, admin.asActor(), target.user.handle, { role: 'moderator', reason: 'Feed test' } as never));
    expect(kinds(promoted)).toEqual(['account', 'audit']);
    expect((await target.agent.get('/api/session').expect(200)).body.user.role).toBe('moderator');
    expect(kinds(await changesOf(() => manageUser(server.ctx, admin.asActor(), target.user.handle, { banned: true, reason: 'Feed test' } as never)))).toEqual(['account', 'audit']);
    await target.agent.get('/api/me').expect(401);
  });

  it('grantRoleFromCommandLine: the new role reaches the kept account on the next request', async () => {
    const target = await signIn(server.url, await demoHandle(server.url, 'publisher', 1));
    expect((await target.agent.get('/api/session').expect(200)).body.user.role).toBe('publisher');
    expect(kinds(await changesOf(() => grantRoleFromCommandLine(server.ctx, target.user.handle, 'moderator')))).toEqual(['account', 'audit']);
    expect((await target.agent.get('/api/session').expect(200)).body.user.role).toBe('moderator');
  });

  it('updateSiteSettings', async () => {
    expect(kinds(await changesOf(() => updateSiteSettings(server.ctx, admin.asActor(), { trustPublisherImports: true })))).toEqual(['audit', 'setting']);
  });

  it('signInFromProvider: a first sign-in records the new account', async () => {
    const rows = await changesOf(() => signInFromProvider(server.ctx, { sub: 'feed-test-subject', preferredUsername: 'feed-tester', name: 'Feed Tester' } as never));
    const created = (await User.findOne({ where: { oauthSubject: 'feed-test-subject' } }))!;
    expect(rows).toEqual([{ kind: 'account', keys: { ids: [created.id] } }]);
  });

  it('leaves no command out', async () => {
    // Every function the command modules export is one of the writes above, or a helper named
    // here that runs inside a caller's write (or writes nothing).
    const tested = new Set([
      'applyForPublisher', 'bulkApproveResults', 'createToken', 'decidePublisherApplication', 'flagItem', 'resolveFlag', 'followPage', 'unfollowPage',
      'importResults', 'addWheel', 'measureWheel', 'mergePages', 'protectPage', 'recordRefusal', 'retractResult', 'revertPage', 'reviewPageRevision',
      'reviewResult', 'revisePage', 'revokeToken', 'sendDigest', 'signInFromProvider', 'submitResult', 'updateNotificationSettings', 'updateSiteSettings',
      'uploadPhoto', 'removePhoto', 'saveDraft', 'editResult', 'reviewResultRevision', 'addGrinder', 'addJig', 'saveSetup', 'addWorkshopWheel',
      'editMeasurement', 'deleteMeasurement', 'retireWheel', 'reportPrice', 'manageUser', 'createPage', 'grantRoleFromCommandLine',
    ]);
    const helpers = new Set([
      'hashToken', 'decodeCsv', 'checkImport', 'templateRows', 'resultRow', 'applyContent', 'recordPageChange', 'refuseIfMerged', 'recordAudit',
      'notifyReviewOutcome', 'ImportRefused', 'TOKENS_PER_PUBLISHER', 'TOKEN_PREFIX', 'RESULT_VISIBLE_FIELDS',
      'editedColumns', 'applyRevision', 'resolveReferences', 'columnsOf', 'checkDesignationsFree',
    ]);
    const dir = path.resolve('server/commands');
    const untested: string[] = [];
    for (const file of fs.readdirSync(dir).filter((f) => f.endsWith('.ts'))) {
      const module = (await import(path.join(dir, file))) as Record<string, unknown>;
      for (const name of Object.keys(module)) if (!tested.has(name) && !helpers.has(name)) untested.push(`${file}: ${name}`);
    }
    expect(untested).toEqual([]);
  });
});
