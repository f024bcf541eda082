import type { Actor } from '@shared/permissions';
import type { Flag, ImportBatch, PageRevision, Result } from '../models';
import type { PageModel } from '../models/reference-pages';
import { presentResult, type AbrasiveNames } from './result';
import { presentFlag } from './publishing';
import { presentAccount } from './user';
import { presentDeskRevision } from './pages';
import { NEAR_DUPLICATE_RULE, type CellPosition, type DeskCell, type OutlierHint, type readingsCheck } from '@shared/desk-context';
import { ABRASIVE_MATERIALS } from '@shared/vocabulary';
import type { deskContextSchema, Presented } from '@shared/schemas/responses';

/** The desk's result items: the presented result, marked as a result, with the import it came in. */
export function presentDeskResults({ results, importOf }: { results: Result[]; importOf: Map<number, number> }, viewer: Actor, names: AbrasiveNames) {
  return results.map((r) => ({ kind: 'result' as const, ...presentResult(r, viewer, names), importId: importOf.get(r.id) ?? null }));
}

/** Proposed page edits as `kind: 'page-revision'` items: the page, the author, the fields changed, whether the page moved on. */
export function presentDeskRevisions(queue: { revision: PageRevision; page: PageModel | null; changed: string[]; currentNumber: number | null }[], viewer: Actor) {
  return queue.map(({ revision, page, changed, currentNumber }) => presentDeskRevision(revision, page, changed, currentNumber, viewer));
}

/** Open flags as `kind: 'flag'` items with what each is about. */
export function presentOpenFlags(rows: { flag: Flag; subject: { title: string; path: string } | null }[]) {
  return rows.map(({ flag, subject }) => ({ kind: 'flag' as const, ...presentFlag(flag, subject) }));
}

/** Imports with results still pending. */
export function presentPendingImports(rows: { batch: ImportBatch; pending: number }[]) {
  return rows.map(({ batch, pending }) => ({ id: batch.id, publisher: batch.publisher ? presentAccount(batch.publisher) : null, rows: batch.rows, pending, createdAt: batch.createdAt }));
}

/** What the desk-context query read and computed for one pending result. */
export interface DeskContextRead {
  result: Result;
  cell: { key: { method: string | null; steelId: number; material: string; gritPhi: number }; figures: DeskCell | null; position: CellPosition | null; outlier: OutlierHint };
  readings: ReturnType<typeof readingsCheck>;
  nearDuplicates: Result[];
  authorRecord: { published: number; pending: number; returnedNow: number; everReturned: number; rejected: number };
}

/** A pending result's context on the desk (figures in g; the rules' words beside them). */
export function presentDeskContext(ctx: DeskContextRead): Presented<typeof deskContextSchema> {
  const { result, cell, readings, nearDuplicates, authorRecord } = ctx;
  return {
    resultId: result.id,
    cell: { ...cell.key, materialLabel: ABRASIVE_MATERIALS[cell.key.material as keyof typeof ABRASIVE_MATERIALS] ?? cell.key.material, figures: cell.figures, position: cell.position, outlier: cell.outlier },
    sharpnessMedianG: result.sharpnessMedianG,
    readings,
    nearDuplicateRule: NEAR_DUPLICATE_RULE,
    nearDuplicates: nearDuplicates.map((d) => ({
      id: d.id,
      status: d.status,
      author: d.author ? presentAccount(d.author) : null,
      sameAuthor: d.authorId === result.authorId,
      perSideDeg: d.perSideDeg,
      sharpnessMedianG: d.sharpnessMedianG,
      createdAt: d.createdAt,
    })),
    authorRecord,
  };
}
