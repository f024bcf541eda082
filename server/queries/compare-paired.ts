import type { z } from 'zod';
import type { comparePairedQuerySchema } from '@shared/schemas/compare';
import { pairedComparison } from '@shared/compare-paired';
import { median } from '@shared/stats';
import { cellsOf } from '../aggregates/comparison-cells';
import { methodCells } from '../aggregates/cell-cache';
import { presentCell, resolveView } from './compare-view';
import { cellMembers, handlesOf } from './compare-cell';

/**
 * The view of a two-cell query (paired, difference), each cell's results under its filters,
 * and a function that gives a set of them as the cell row the API shows.
 */
export async function twoCells(query: z.infer<typeof comparePairedQuerySchema>) {
  const { a: refA, b: refB, ...filters } = query;
  const view = await resolveView(filters);
  const [membersA, membersB] = await Promise.all([cellMembers(view, refA, 'a'), cellMembers(view, refB, 'b')]);
  const overall = (await methodCells(view.method.id, view.step)).overallMedianG;
  const row = (members: typeof membersA) => {
    const [c] = cellsOf(members, [view.step]);
    return c ? presentCell(view, c, overall) : null;
  };
  return { view, membersA, membersB, row };
}

/**
 * GET /api/compare/paired: the tester-adjusted comparison of cells A and B of one method: for
 * each tester who measured both, their own median in A minus their own median in B; the median
 * of those differences with a distribution-free 95 % interval (shared/compare-paired.ts), beside
 * the plain difference of the two cells' medians.
 */
export async function comparePaired(query: z.infer<typeof comparePairedQuerySchema>) {
  const { view, membersA, membersB, row } = await twoCells(query);
  const paired = pairedComparison(membersA, membersB);
  const handles = await handlesOf(paired.pairs.map((p) => p.authorId));
  return {
    method: { slug: view.method.slug, name: view.method.name, version: view.method.version },
    a: row(membersA),
    b: row(membersB),
    /** Difference of the two cells' medians, A − B, g, ignoring who measured what. */
    unpairedMedianDiffG: membersA.length && membersB.length ? median(membersA.map((m) => m.sharpnessMedianG)) - median(membersB.map((m) => m.sharpnessMedianG)) : null,
    paired: {
      ...paired,
      pairs: paired.pairs.map(({ authorId, ...p }) => ({ tester: handles.get(authorId) ?? `#${authorId}`, ...p })),
    },
  };
}
