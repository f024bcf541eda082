import type { z } from 'zod';
import type { comparePairedQuerySchema } from '@shared/schemas/compare';
import { cellDifference } from '@shared/compare-difference';
import { Result } from '../models';
import { twoCells } from './compare-paired';

/**
 * GET /api/compare/difference: cells A and B of one method as two independent samples of
 * results: the shift B − A of their median readings (Hodges–Lehmann, exact Mann–Whitney 95 %
 * interval), the same for retention where both have it, and the method's within-edge spread
 * over their results (shared/compare-difference.ts), with both cells' figures.
 */
export async function compareDifference(query: z.infer<typeof comparePairedQuerySchema>) {
  const { view, membersA, membersB, row } = await twoCells(query);
  const a = row(membersA);
  const b = row(membersB);
  // The readings live in what was entered; only these results' are read.
  const ids = [...membersA, ...membersB].map((m) => m.id);
  const inputs = ids.length ? await Result.findAll({ where: { id: ids }, attributes: ['id', 'input'] }) : [];
  const readings = new Map(inputs.map((r) => [r.id, r.input.sharpness.readingsG]));
  const sample = (members: typeof membersA) =>
    members.map((m) => ({ sharpnessMedianG: m.sharpnessMedianG, retentionCuts: m.retentionCuts, readingsG: readings.get(m.id) ?? [] }));
  return {
    method: { slug: view.method.slug, name: view.method.name, version: view.method.version },
    a,
    b,
    ...cellDifference(sample(membersA), sample(membersB)),
  };
}
