import { Op } from 'sequelize';
import type { ResultInput, ResultStatus } from '@shared/schemas/result';
import type { GritStandard } from '@shared/grit';
import { deriveResult } from '@shared/derive-result';
import { Abrasive, Result, Steel } from '../models';

const sameReadings = (a: number[], b: number[]) => {
  if (a.length !== b.length) return false;
  const x = [...a].sort((p, q) => p - q);
  const y = [...b].sort((p, q) => p - q);
  return x.every((v, i) => Math.abs(v - y[i]) < 1e-9);
};

/**
 * The author's earlier results that a new one repeats: same steel, same final abrasive, same
 * grit (after conversion), the same angle per side (to 0.05°) and the same readings in any
 * order. Rejected and withdrawn results are left out. Pointed out before submitting.
 */
export async function findDuplicates(authorId: number, input: ResultInput): Promise<{ id: number; status: ResultStatus; createdAt: Date }[]> {
  const [steel, abrasive] = await Promise.all([Steel.findOne({ where: { slug: input.steel }, attributes: ['id'] }), Abrasive.findOne({ where: { slug: input.abrasive } })]);
  if (!steel || !abrasive) return [];
  const derived = deriveResult(input, { standard: abrasive.gritStandard as GritStandard, grade: abrasive.gritGrade });
  const candidates = await Result.findAll({
    where: {
      authorId,
      steelId: steel.id,
      abrasiveId: abrasive.id,
      gritGrade: derived.gritGrade,
      perSideDeg: { [Op.between]: [derived.perSideDeg - 0.05, derived.perSideDeg + 0.05] },
      status: { [Op.notIn]: ['rejected', 'retracted'] },
    },
    attributes: ['id', 'status', 'createdAt', 'input'],
    order: [['id', 'ASC']],
    limit: 200,
  });
  return candidates.filter((r) => sameReadings(r.input.sharpness.readingsG, input.sharpness.readingsG)).map((r) => ({ id: r.id, status: r.status, createdAt: r.createdAt }));
}
