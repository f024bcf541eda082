import { Op } from 'sequelize';
import { cellPosition, deskCell, isNearDuplicate, nearDuplicateMedianRange, readingsCheck, tukeyOutlier, NEAR_DUPLICATE } from '@shared/desk-context';
import { conflict, notFound } from '../errors';
import { Method, Result, ResultEvent, User } from '../models';
import { resultCountsByAuthor } from './users';

const NEAR_DUPLICATE_LIMIT = 20;

/**
 * What the desk shows beside one pending result: the cell it would join (the approved results of
 * the same sharpness method, steel, abrasive material and whole-φ grit band, as the comparison
 * groups them) and its place there, the outlier hint, the method's required readings, pending and
 * published near-duplicates, and the author's record.
 */
export async function deskContext(id: number) {
  const result = await Result.findByPk(id, { include: [{ model: Method, as: 'sharpnessMethod' }] });
  if (!result) throw notFound(`Result ${id}`);
  if (result.status !== 'pending') throw conflict(`Result ${id} is not awaiting review (it is ${result.status}).`);

  const cellWhere = { status: 'approved', sharpnessMethodId: result.sharpnessMethodId, steelId: result.steelId, material: result.material, gritPhi: result.gritPhi } as const;
  const members = (await Result.findAll({ where: cellWhere, attributes: ['sharpnessMedianG'], raw: true })) as unknown as { sharpnessMedianG: number }[];
  const medians = members.map((m) => m.sharpnessMedianG);
  const x = result.sharpnessMedianG;

  const [lo, hi] = nearDuplicateMedianRange(x);
  const candidates = await Result.findAll({
    where: {
      id: { [Op.ne]: result.id },
      status: ['pending', 'approved'],
      steelId: result.steelId,
      abrasiveId: result.abrasiveId,
      gritGrade: result.gritGrade,
      sharpnessMethodId: result.sharpnessMethodId,
      perSideDeg: { [Op.between]: [result.perSideDeg - NEAR_DUPLICATE.angleDeg - 1e-9, result.perSideDeg + NEAR_DUPLICATE.angleDeg + 1e-9] },
      sharpnessMedianG: { [Op.between]: [lo - 1e-9, hi + 1e-9] },
    },
    include: [{ model: User, as: 'author' }],
    order: [['id', 'ASC']],
  });
  const nearDuplicates = candidates.filter((c) => isNearDuplicate(result, c)).slice(0, NEAR_DUPLICATE_LIMIT);

  const countOf = await resultCountsByAuthor([result.authorId]);
  const everReturned = await Result.count({
    where: { authorId: result.authorId },
    include: [{ model: ResultEvent, as: 'events', where: { toStatus: 'returned' }, attributes: [] }],
    distinct: true,
    col: 'id',
  });

  return {
    result,
    cell: {
      key: { method: result.sharpnessMethod?.slug ?? null, steelId: result.steelId, material: result.material, gritPhi: result.gritPhi },
      figures: deskCell(medians),
      position: cellPosition(medians, x),
      outlier: tukeyOutlier(medians, x),
    },
    readings: readingsCheck(result.sharpnessMethod?.readingsPerEdge ?? 0, result.input.sharpness.readingsG.length),
    nearDuplicates,
    authorRecord: {
      published: countOf(result.authorId, 'approved'),
      pending: countOf(result.authorId, 'pending'),
      returnedNow: countOf(result.authorId, 'returned'),
      everReturned,
      rejected: countOf(result.authorId, 'rejected'),
    },
  };
}
