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
import { Result, Steel, User } from '../../server/models';
import { toCsv } from '../../shared/csv-writer';
import { applyForPublisher } from '../../server/commands/apply-for-publisher';
import { bulkApproveResults } from '../../server/commands/bulk-approve-results';
import { createToken } from '../../server/commands/create-token';
import { decidePublisherApplication } from '../../server/commands/decide-publisher-application';
import { flagItem, resolveFlag } from '../../server/commands/flag-item';
import { followPage, unfollowPage } from '../../server/commands/follow-page';
import { importResults, templateRows } from '../../server/commands/import-results';
import { addWheel, measureWheel } from '../../server/commands/log-wheel';
import { addGrinder, addJig, addWorkshopWheel, reportPrice, retireWheel, saveSetup } from '../../server/commands/equip-workshop';
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

  it('the workshop: grinders, jigs, setups and wheels are the member\'s own rows; a price report is public and its own kind', async () => {
    const actor = member.asActor();
    let grinderId = 0;
    let jigId = 0;
    let wheelId = 0;
    const grinder = { name: 'Feed grinder', spindleRpm: 90, barDiameterMm: 12, barMount: 'with-rotation' as const };
    expect(kinds(await changesOf(async () => void (grinderId = (await addGrinder(server.ctx, actor, grinder)).id)))).toEqual(['wheel']);
    expect(kinds(await changesOf(async () => void (jigId = (await addJig(server.ctx, actor, { name: 'Feed jig', offsetMm: 0 })).id)))).toEqual(['wheel']);
    expect(kinds(await changesOf(() => saveSetup(server.ctx, actor, { name: 'Feed setup', jigId, projectionMm: 140, perSideDeg: 15 })))).toEqual(['wheel']);
    const wheel = { name: 'Feed CBN', abrasive: 'cbn-electroplated-wheel-250-b126', grinderId, originalDiameterMm: 250, ratedSpeedMps: 20 };
    expect(kinds(await changesOf(async () => void (wheelId = (await addWorkshopWheel(server.ctx, actor, wheel)).id)))).toEqual(['wheel']);
    expect(kinds(await changesOf(() => retireWheel(server.ctx, actor, wheelId, { retiredOn: '2026-11-03', retiredAfterSharpenings: 800 })))).toEqual(['wheel']);
    const price = { abrasive: 'cbn-electroplated-wheel-250-b126', price: 180, currency: 'EUR', paidOn: '2026-10-01', condition: 'new' as const };
    expect(kinds(await changesOf(() => reportPrice(server.ctx, actor, price)))).toEqual(['price-report']);
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
      'uploadPhoto', 'removePhoto', 'addGrinder', 'addJig', 'saveSetup', 'addWorkshopWheel', 'retireWheel', 'reportPrice',
    ]);
    const helpers = new Set([
      'hashToken', 'decodeCsv', 'checkImport', 'templateRows', 'resultRow', 'applyContent', 'recordPageChange', 'refuseIfMerged', 'recordAudit',
      'notifyReviewOutcome', 'ImportRefused', 'TOKENS_PER_PUBLISHER', 'TOKEN_PREFIX', 'RESULT_VISIBLE_FIELDS',
      'editedColumns', 'applyRevision', 'resolveReferences',
    ]);
    // Writes merged from other work whose followers are checked in their own files, not yet here
    // (each through the models, so the feed records them): result edits and corrections
    // (result-revisions.test.ts: cells and search follow an approved correction), the wheel log's
    // corrections (wheels.test.ts) and admin user management (admin-users.test.ts: a ban
    // reaches the account cache on the next request).
    const testedElsewhere = new Set([
      'editResult', 'saveDraft', 'reviewResultRevision',
      'editMeasurement', 'deleteMeasurement', 'manageUser',
    ]);
    const dir = path.resolve('server/commands');
    const untested: string[] = [];
    for (const file of fs.readdirSync(dir).filter((f) => f.endsWith('.ts'))) {
      const module = (await import(path.join(dir, file))) as Record<string, unknown>;
      for (const name of Object.keys(module)) if (!tested.has(name) && !helpers.has(name) && !testedElsewhere.has(name)) untested.push(`${file}: ${name}`);
    }
    expect(untested).toEqual([]);
  });
});
