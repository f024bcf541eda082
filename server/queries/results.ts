import { Op, type WhereOptions } from 'sequelize';
import { atLeast, can, type Actor } from '@shared/permissions';
import { limits } from '@shared/validations';
import type { z } from 'zod';
import type { resultListQuerySchema } from '@shared/schemas/result';
import { forbidden, notFound } from '../errors';
import { Abrasive, Method, Result, ResultEvent, Steel, User } from '../models';
import { resultIncludes } from '../search/documents';
import { approvedResults } from '../read-models/approved-results';
import { lookups } from './compare-lookups';

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
    // By primary key alone: with `status` in the where, SQLite took the status index and read
    // every approved row (0.1 s at 100 000 results); a row retracted meanwhile is left out here.
    // The rows without includes: each joined page cost about 2 ms of CPU a page of 25 (Sequelize
    // building the nested instances); the pages' names come from the kept lookups instead, the
    // authors from one read by id.
    const [rows, look] = await Promise.all([ids.length ? Result.findAll({ where: { id: ids } }) : [], lookups()]);
    const found = rows.filter((r) => r.status === 'approved');
    const authors = new Map((found.length ? await User.findAll({ where: { id: [...new Set(found.map((r) => r.authorId))] } }) : []).map((u) => [u.id, u]));
    for (const r of found) {
      // What presentResult reads of the joined pages (names, bond), as the include would give it.
      Object.assign(r, {
        author: authors.get(r.authorId),
        steel: look.steels.get(r.steelId),
        abrasive: look.abrasives.get(r.abrasiveId),
        sharpnessMethod: look.methods.get(r.sharpnessMethodId),
        retentionMethod: r.retentionMethodId === null ? undefined : look.methods.get(r.retentionMethodId),
      } as unknown as Partial<Result>);
    }
    // The trail only for those who see it (presentResult): the author and moderators.
    const insiderOf = found.filter((r) => viewer && (viewer.id === r.authorId || atLeast(viewer.role, 'moderator')));
    if (insiderOf.length) {
      const events = await ResultEvent.findAll({ where: { resultId: insiderOf.map((r) => r.id) }, include: [{ model: User, as: 'actor' }] });
      for (const r of insiderOf) r.events = events.filter((e) => e.resultId === r.id);
    }
    const byId = new Map(found.map((r) => [r.id, r]));
    return { items: ids.map((id) => byId.get(id)).filter((r): r is Result => r !== undefined), page: query.page, pageSize: limits.pageSize, total };
  }
  const { rows, count } = await Result.findAndCountAll({
    where,
    include: withTrail,
    order: [['createdAt', 'DESC'], ['id', 'DESC']],
    limit: limits.pageSize,
    offset: (query.page - 1) * limits.pageSize,
    distinct: true,
  });
  return { items: rows, page: query.page, pageSize: limits.pageSize, total: count };
}

