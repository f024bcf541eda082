import { Op, fn, col, type WhereOptions } from 'sequelize';
import type { ReviewDeskQuery } from '@shared/schemas/publishing';
import { Abrasive, Flag, ImportBatch, ImportBatchResult, Method, Result, ResultEvent, Steel, User } from '../models';
import { resultIncludes } from '../search/documents';

const withTrail = [...resultIncludes, { model: ResultEvent, as: 'events', include: [{ model: User, as: 'actor' }] }];
const DESK_LIMIT = 200;

/** Pending results for the desk, oldest first, filtered by author handle, steel slug or import. */
export async function pendingResults(filters: ReviewDeskQuery): Promise<{ results: Result[]; importOf: Map<number, number> }> {
  const where: WhereOptions<Result> & Record<string, unknown> = { status: 'pending' };
  if (filters.author) {
    const author = await User.findOne({ where: { handle: filters.author }, attributes: ['id'] });
    where.authorId = author?.id ?? -1;
  }
  if (filters.steel) {
    const steel = await Steel.findOne({ where: { slug: filters.steel }, attributes: ['id'] });
    where.steelId = steel?.id ?? -1;
  }
  if (filters.importId) {
    const members = await ImportBatchResult.findAll({ where: { batchId: filters.importId }, attributes: ['resultId'] });
    where.id = { [Op.in]: members.map((m) => m.resultId) };
  }
  const results = await Result.findAll({ where, include: withTrail, order: [['createdAt', 'ASC'], ['id', 'ASC']], limit: DESK_LIMIT });
  const links = await ImportBatchResult.findAll({ where: { resultId: { [Op.in]: results.map((r) => r.id) } } });
  return { results, importOf: new Map(links.map((l) => [l.resultId, l.batchId])) };
}

/** A short title and a client path for what a flag is about. */
async function flagSubjects(flags: Flag[]): Promise<Map<number, { title: string; path: string } | null>> {
  const out = new Map<number, { title: string; path: string } | null>();
  const ids = (type: string) => flags.filter((f) => f.subjectType === type).map((f) => f.subjectId);
  const results = await Result.findAll({ where: { id: ids('result') }, include: [{ model: Steel, as: 'steel' }, { model: Abrasive, as: 'abrasive' }] });
  const pages = {
    steel: await Steel.findAll({ where: { id: ids('steel') }, attributes: ['id', 'slug', 'name'] }),
    abrasive: await Abrasive.findAll({ where: { id: ids('abrasive') }, attributes: ['id', 'slug', 'name'] }),
    method: await Method.findAll({ where: { id: ids('method') }, attributes: ['id', 'slug', 'name'] }),
  };
  const section = { steel: 'steels', abrasive: 'abrasives', method: 'methods' } as const;
  for (const f of flags) {
    if (f.subjectType === 'result') {
      const r = results.find((x) => x.id === f.subjectId);
      out.set(f.id, r ? { title: `#${r.id}: ${r.steel?.name ?? ''} on ${r.abrasive?.name ?? ''}`, path: `/results/${r.id}` } : null);
    } else {
      const page = (pages[f.subjectType] as { id: number; slug: string; name: string }[]).find((p) => p.id === f.subjectId);
      out.set(f.id, page ? { title: page.name, path: `/${section[f.subjectType]}/${page.slug}` } : null);
    }
  }
  return out;
}

/** Open flags, oldest first, each with what it is about (a title and a client path, or null when gone). */
export async function openFlags(filters: ReviewDeskQuery = {}) {
  const where: Record<string, unknown> = { status: 'open' };
  if (filters.author) {
    const reporter = await User.findOne({ where: { handle: filters.author }, attributes: ['id'] });
    where.reporterId = reporter?.id ?? -1;
  }
  const flags = await Flag.findAll({ where, include: [{ model: User, as: 'reporter' }], order: [['createdAt', 'ASC'], ['id', 'ASC']], limit: DESK_LIMIT });
  const subjects = await flagSubjects(flags);
  return flags.map((flag) => ({ flag, subject: subjects.get(flag.id) ?? null }));
}

/** Imports that still have pending results, oldest first, with the count still pending. */
export async function pendingImports() {
  const rows = (await ImportBatchResult.findAll({
    attributes: ['batchId', [fn('COUNT', col('resultId')), 'pending']],
    include: [{ model: Result, as: 'result', attributes: [], where: { status: 'pending' } }],
    group: ['batchId'],
    raw: true,
  })) as unknown as { batchId: number; pending: number }[];
  const batches = await ImportBatch.findAll({ where: { id: rows.map((r) => r.batchId) }, include: [{ model: User, as: 'publisher' }], order: [['createdAt', 'ASC']] });
  return batches.map((batch) => ({ batch, pending: Number(rows.find((r) => r.batchId === batch.id)?.pending ?? 0) }));
}
