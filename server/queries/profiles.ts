import { Op, fn, col } from 'sequelize';
import { can } from '@shared/permissions';
import type { ResultStatus } from '@shared/schemas/result';
import { notFound } from '../errors';
import { ApiToken, Follow, ImportBatch, ImportBatchResult, Method, NotificationSetting, PublisherApplication, Result, ResultEvent, Steel, Abrasive, User } from '../models';
import { resultIncludes } from '../search/documents';

const withTrail = [...resultIncludes, { model: ResultEvent, as: 'events', include: [{ model: User, as: 'actor' }] }];

/** A publisher's badge: the workshop or lab named in their approved application. */
export async function badgeOf(user: User): Promise<{ label: string; workshop: string | null; link: string | null } | null> {
  if (user.role !== 'publisher') return null;
  const application = await PublisherApplication.findOne({ where: { userId: user.id, status: 'approved' }, order: [['decidedAt', 'DESC']] });
  return { label: 'Publisher', workshop: application?.workshop ?? null, link: application?.link ?? null };
}

/** Counts of a member's results by method (or steel), approved only, most used first. */
async function approvedBy(userId: number, column: 'sharpnessMethodId' | 'steelId') {
  return (await Result.findAll({
    where: { authorId: userId, status: 'approved' },
    attributes: [column, [fn('COUNT', col('id')), 'n']],
    group: [column],
    raw: true,
  })) as unknown as ({ n: number } & Record<typeof column, number>)[];
}

/**
 * A member's public profile: handle, name, role and badge, bio, when they joined, counts of
 * their published results, the methods they measure with and the steels they test, and their
 * newest published results (presentProfile shows them).
 */
export async function publicProfile(handle: string) {
  const user = await User.findOne({ where: { handle } });
  if (!user || user.banned) throw notFound('Member');
  const [methodCounts, steelCounts, published, retracted, recent] = await Promise.all([
    approvedBy(user.id, 'sharpnessMethodId'),
    approvedBy(user.id, 'steelId'),
    Result.count({ where: { authorId: user.id, status: 'approved' } }),
    Result.count({ where: { authorId: user.id, status: 'retracted' } }),
    Result.findAll({ where: { authorId: user.id, status: 'approved' }, include: withTrail, order: [['approvedAt', 'DESC'], ['id', 'DESC']], limit: 10 }),
  ]);
  const methods = await Method.findAll({ where: { id: methodCounts.map((m) => m.sharpnessMethodId) }, attributes: ['id', 'slug', 'name'] });
  const steels = await Steel.findAll({ where: { id: steelCounts.map((s) => s.steelId) }, attributes: ['id', 'slug', 'name'] });
  return {
    user,
    bio: user.bio,
    joinedAt: user.createdAt,
    badge: await badgeOf(user),
    counts: { published, withdrawn: retracted, methods: methods.length, steels: steels.length },
    methods: methodCounts
      .map((m) => ({ slug: methods.find((x) => x.id === m.sharpnessMethodId)?.slug ?? '', name: methods.find((x) => x.id === m.sharpnessMethodId)?.name ?? '', results: Number(m.n) }))
      .sort((a, b) => b.results - a.results),
    steels: steelCounts
      .map((s) => ({ slug: steels.find((x) => x.id === s.steelId)?.slug ?? '', name: steels.find((x) => x.id === s.steelId)?.name ?? '', results: Number(s.n) }))
      .sort((a, b) => b.results - a.results)
      .slice(0, 12),
    recent,
  };
}

/** All of a member's results for their own export (every state), or only published ones for others. */
export async function resultsForExport(userId: number, own: boolean): Promise<Result[]> {
  return Result.findAll({ where: own ? { authorId: userId } : { authorId: userId, status: 'approved' }, order: [['id', 'ASC']] });
}

const LIST = 50;

/**
 * The member's own page: their account and badge, counts by state, drafts, pending and
 * returned results (with the moderator's notes), recent decisions, followed pages, e-mail
 * settings, tokens (publishers), their publisher application and their imports (presentOwnPage
 * shows them).
 */
export async function ownPage(user: User) {
  const actor = user.asActor();
  const byStatus = (status: ResultStatus) =>
    Result.findAll({ where: { authorId: user.id, status }, include: withTrail, order: [['updatedAt', 'DESC'], ['id', 'DESC']], limit: LIST });
  const counts = (await Result.findAll({ where: { authorId: user.id }, attributes: ['status', [fn('COUNT', col('id')), 'n']], group: ['status'], raw: true })) as unknown as {
    status: ResultStatus;
    n: number;
  }[];
  const [drafts, pending, returned, rejected] = await Promise.all([byStatus('draft'), byStatus('pending'), byStatus('returned'), byStatus('rejected')]);
  const follows = await Follow.findAll({ where: { userId: user.id }, order: [['createdAt', 'ASC']] });
  const followedSteels = await Steel.findAll({ where: { id: follows.filter((f) => f.pageType === 'steel').map((f) => f.pageId) }, attributes: ['id', 'slug', 'name'] });
  const followedAbrasives = await Abrasive.findAll({ where: { id: follows.filter((f) => f.pageType === 'abrasive').map((f) => f.pageId) }, attributes: ['id', 'slug', 'name'] });
  const settings = await NotificationSetting.findByPk(user.id);
  const application = await PublisherApplication.findOne({ where: { userId: user.id }, include: ['applicant', 'decidedBy'], order: [['createdAt', 'DESC']] });
  const tokens = can(actor, 'manage:tokens') ? await ApiToken.findAll({ where: { userId: user.id }, order: [['createdAt', 'DESC']] }) : [];
  const imports = await ImportBatch.findAll({ where: { publisherId: user.id }, order: [['createdAt', 'DESC']], limit: 20 });
  const pendingPerImport = imports.length
    ? ((await ImportBatchResult.findAll({
        where: { batchId: { [Op.in]: imports.map((b) => b.id) } },
        attributes: ['batchId', [fn('COUNT', col('resultId')), 'n']],
        include: [{ model: Result, as: 'result', attributes: [], where: { status: 'pending' } }],
        group: ['batchId'],
        raw: true,
      })) as unknown as { batchId: number; n: number }[])
    : [];
  return {
    user,
    badge: await badgeOf(user),
    counts: Object.fromEntries(counts.map((c) => [c.status, Number(c.n)])) as Partial<Record<ResultStatus, number>>,
    drafts,
    pending,
    returned,
    rejected,
    following: [
      ...followedSteels.map((s) => ({ pageType: 'steel' as const, slug: s.slug, name: s.name })),
      ...followedAbrasives.map((a) => ({ pageType: 'abrasive' as const, slug: a.slug, name: a.name })),
    ],
    notifications: { review: settings?.review ?? true, application: settings?.application ?? true, digest: settings?.digest ?? true },
    tokens,
    application,
    imports: imports.map((b) => ({ id: b.id, rows: b.rows, createdAt: b.createdAt, pending: Number(pendingPerImport.find((p) => p.batchId === b.id)?.n ?? 0) })),
    can: {
      import: can(actor, 'import:results'),
      tokens: can(actor, 'manage:tokens'),
      apply: can(actor, 'apply:publisher') && application?.status !== 'pending',
    },
  };
}
