import { Op, QueryTypes, type WhereOptions } from 'sequelize';
import { atLeast, can, type Actor } from '@shared/permissions';
import { limits } from '@shared/validations';
import type { z } from 'zod';
import type { resultListQuerySchema } from '@shared/schemas/result';
import { forbidden, notFound } from '../errors';
import { Abrasive, Method, Result, ResultEvent, Steel, User, type AccountFace, type SummarisableResult } from '../models';
import { resultIncludes } from '../search/documents';
import { approvedResults } from '../read-models/approved-results';
import { lookups } from './compare-lookups';
import { rawDate } from '../db/raw-values';

type ListRow = SummarisableResult & { steelId: number; abrasiveId: number; sharpnessMethodId: number };
/** A row as the list's read gives it: dates as the driver gives them, the author's face beside (null without an author). */
type RawListRow = Omit<ListRow, 'createdAt' | 'updatedAt' | 'author'> & { createdAt: Date | string; updatedAt: Date | string } & { [K in keyof AccountFace]: AccountFace[K] | null };

/**
 * The rows of a page of the public list, by primary key, with their authors' public faces: one
 * raw read of the columns a list item shows (presentResultSummary), no JSON column and no model
 * instance (building 25 instances with their JSON columns, and sending the notes, was most of
 * the list's CPU time at 100 000 results). By primary key alone: with `status` in the where,
 * SQLite took the status index and read every approved row; a row retracted since the ids were
 * taken is left out here.
 */
async function approvedListRows(ids: readonly number[]): Promise<ListRow[]> {
  if (!ids.length) return [];
  const rows = await Result.sequelize!.query<RawListRow>(
    `SELECT r."id", r."status", r."createdAt", r."updatedAt", r."authorId", r."material", r."gritUm", r."gritStandard", r."gritGrade", r."gritPhi",
       r."hrc", r."perSideDeg", r."inclusiveDeg", r."sharpnessMedianG", r."steelId", r."abrasiveId", r."sharpnessMethodId", u."handle", u."displayName", u."role"
     FROM "results" r LEFT JOIN "users" u ON u."id" = r."authorId" WHERE r."id" IN (${ids.map((id) => String(Math.trunc(id))).join(',')})`,
    // The ids written into the SQL (whole numbers from the read model): Sequelize's scan of the
    // statement for replacements cost a third of the read's CPU time (0.55 of 1.64 ms).
    { type: QueryTypes.SELECT },
  );
  // Each row built by name: spreading the driver's rows (rest and spread) took a fifth of the
  // read's CPU time.
  const list: ListRow[] = [];
  for (const r of rows) {
    if (r.status !== 'approved') continue;
    const { id, authorId, material, gritUm, gritStandard, gritGrade, gritPhi, hrc, perSideDeg, inclusiveDeg, sharpnessMedianG, steelId, abrasiveId, sharpnessMethodId } = r;
    const author = r.handle === null ? null : { handle: r.handle, displayName: r.displayName!, role: r.role! };
    const [createdAt, updatedAt] = [rawDate(r.createdAt), rawDate(r.updatedAt)];
    list.push({ id, status: 'approved', createdAt, updatedAt, authorId, author, material, gritUm, gritStandard, gritGrade, gritPhi, hrc, perSideDeg, inclusiveDeg, sharpnessMedianG, steelId, abrasiveId, sharpnessMethodId });
  }
  return list;
}

/** A result's pages, author and trail (each step with who took it): what presentResult shows. */
export const withTrail = [...resultIncludes, { model: ResultEvent, as: 'events', include: [{ model: User, as: 'actor' }] }];

/** One result, if the viewer may see it (approved ones are public; others only to their author and moderators). */
export async function findResult(id: number, viewer: Actor | null): Promise<Result> {
  const result = await Result.findByPk(id, { include: withTrail });
  if (!result || !can(viewer, 'read:result', { authorId: result.authorId, status: result.status })) throw notFound('Result');
  return result;
}

/**
 * A page of results, newest first. Visitors and members see approved results, plus all of
 * their own when they ask for `author=<own handle>`; moderators may ask for any state.
 */
export async function listResults(query: z.infer<typeof resultListQuerySchema>, viewer: Actor | null) {
  const where: WhereOptions<Result> & Record<string, unknown> = {};
  const author = query.author ? await User.findOne({ where: { handle: query.author } }) : null;
  if (query.author && !author) return { items: [], page: query.page, pageSize: limits.pageSize, total: 0 };
  const own = !!author && viewer?.id === author.id;
  const moderator = !!viewer && atLeast(viewer.role, 'moderator');
  if (query.status && query.status !== 'approved' && !own && !moderator) throw forbidden('Only moderators may list unapproved results of others.');
  if (query.status) where.status = query.status;
  else if (!own) where.status = 'approved';
  if (author) where.authorId = author.id;
  const slugFilter = async (model: typeof Steel | typeof Abrasive | typeof Method, slug?: string) => {
    if (!slug) return undefined;
    const page = await (model as typeof Steel).findOne({ where: { slug }, attributes: ['id'] });
    return page?.id ?? -1;
  };
  const steelId = await slugFilter(Steel, query.steel);
  const abrasiveId = await slugFilter(Abrasive, query.abrasive);
  const methodId = await slugFilter(Method, query.method);
  if (steelId !== undefined) where.steelId = steelId;
  if (abrasiveId !== undefined) where.abrasiveId = abrasiveId;
  if (methodId !== undefined) where[Op.or as unknown as string] = [{ sharpnessMethodId: methodId }, { retentionMethodId: methodId }];
  if (where.status === 'approved' && !author && methodId === undefined) {
    // The public list (the home page's): the page's ids from the approved results held in
    // memory, newest first, then those rows alone by primary key.
    const { ids, total } = await approvedResults.newest(query.page, limits.pageSize, { steelId, abrasiveId });
    const [found, look] = await Promise.all([approvedListRows(ids), lookups()]);
    for (const r of found) {
      // The pages from the kept lookups, as the includes would give them.
      r.steel = look.steels.get(r.steelId);
      r.abrasive = look.abrasives.get(r.abrasiveId);
      r.sharpnessMethod = look.methods.get(r.sharpnessMethodId);
    }
    // The trail, for the review note that only the author and moderators see (presentResultSummary).
    const insiderOf = found.filter((r) => viewer && (viewer.id === r.authorId || atLeast(viewer.role, 'moderator')));
    if (insiderOf.length) {
      const events = await ResultEvent.findAll({ where: { resultId: insiderOf.map((r) => r.id) }, include: [{ model: User, as: 'actor' }] });
      for (const r of insiderOf) r.events = events.filter((e) => e.resultId === r.id);
    }
    const byId = new Map(found.map((r) => [r.id, r]));
    return { items: ids.map((id) => byId.get(id)).filter((r) => r !== undefined), page: query.page, pageSize: limits.pageSize, total };
  }
  const { rows, count } = await Result.findAndCountAll({
    where,
    include: withTrail,
    order: [['createdAt', 'DESC'], ['id', 'DESC']],
    limit: limits.pageSize,
    offset: (query.page - 1) * limits.pageSize,
    distinct: true,
  });
  return { items: rows as SummarisableResult[], page: query.page, pageSize: limits.pageSize, total: count };
}

