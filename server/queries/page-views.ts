import type { z } from 'zod';
import { gritBandPhi } from '@shared/grit';
import { matchesComposition, parseCompositionFilter } from '@shared/composition-filter';
import type { abrasiveListQuerySchema, PageType, steelListQuerySchema } from '@shared/schemas/pages';
import { can, type Actor } from '@shared/permissions';
import type { Abrasive, Method, Steel } from '../models';
import {
  approvedCounts,
  eventsOf,
  findPageOfType,
  linkCheckerFor,
  listAbrasives,
  listSteels,
  methodsWithoutBodies,
  proposalCounts,
  abrasiveResults,
  steelResults,
  revisionNumberOf,
  revisionsOf,
  survivorOf,
  type PageModel,
} from './pages';

/** The steels a list query keeps, each with its count of approved results. */
export async function steelsMatching(q: z.output<typeof steelListQuerySchema>): Promise<{ steel: Steel; resultCount: number }[]> {
  const filters = q.composition ? parseCompositionFilter(q.composition) : [];
  const [steels, counts] = await Promise.all([listSteels(), approvedCounts('steelId')]);
  return steels
    .filter(
      (s) =>
        (!q.category || s.category === q.category) &&
        matchesComposition(s.composition, filters) &&
        // A hardness filter keeps steels whose typical range overlaps it.
        (q.hrcMin === undefined || (s.hardnessMaxHrc ?? -Infinity) >= q.hrcMin) &&
        (q.hrcMax === undefined || (s.hardnessMinHrc ?? Infinity) <= q.hrcMax),
    )
    .map((steel) => ({ steel, resultCount: counts.get(steel.id) ?? 0 }));
}

/** The abrasives a list query keeps, each with its count of approved results. */
export async function abrasivesMatching(q: z.output<typeof abrasiveListQuerySchema>): Promise<{ abrasive: Abrasive; resultCount: number }[]> {
  const [abrasives, counts] = await Promise.all([listAbrasives(), approvedCounts('abrasiveId')]);
  return abrasives
    .filter((a) => (!q.material || a.material === q.material) && (!q.bond || a.bond === q.bond) && (!q.form || a.form === q.form) && (q.gritPhi === undefined || gritBandPhi(a.gritUm) === q.gritPhi))
    .map((abrasive) => ({ abrasive, resultCount: counts.get(abrasive.id) ?? 0 }));
}

/** Every method that is a version of the same protocol as `method` (linked by `replacesId`), oldest first. */
export function versionsOf(method: Method, all: Method[]): Method[] {
  const byId = new Map(all.map((m) => [m.id, m]));
  let first = method;
  for (let hops = 0; first.replacesId && byId.has(first.replacesId) && hops < 50; hops++) first = byId.get(first.replacesId)!;
  const chain = [first];
  for (let next = all.find((m) => m.replacesId === first.id); next && chain.length < 50; next = all.find((m) => m.replacesId === chain[chain.length - 1].id)) {
    chain.push(next);
  }
  return chain.filter((m) => !m.mergedIntoId || m.id === method.id);
}

/** What a whole page is shown with: which site links exist, its open proposals, and per type its results' summary or its version chain. */
export type PageView = { linkExists: (href: string) => boolean; proposals: number; revisionNumber: number | null } & (
  | { type: 'steel'; page: Steel; results: Awaited<ReturnType<typeof steelResults>> }
  | { type: 'abrasive'; page: Abrasive; results: Awaited<ReturnType<typeof abrasiveResults>> }
  | { type: 'method'; page: Method; slugById: Map<number, string>; versions: Method[] }
);

/** Reads what a whole page of `type` is shown with (GET /api/{section}/:slug and the answers of its edits). */
export async function pageView(type: PageType, page: PageModel): Promise<PageView> {
  const [linkExists, proposalsByPage, revisionNumber] = await Promise.all([linkCheckerFor([page.body]), proposalCounts(type), revisionNumberOf(page.currentRevisionId)]);
  const common = { linkExists, proposals: proposalsByPage.get(page.id) ?? 0, revisionNumber };
  if (type === 'steel') return { ...common, type, page: page as Steel, results: await steelResults(page.id) };
  if (type === 'abrasive') return { ...common, type, page: page as Abrasive, results: await abrasiveResults(page.id) };
  // Every method, for the version chain and the slugs it names: without their bodies.
  const methods = await methodsWithoutBodies();
  return { ...common, type, page: page as Method, slugById: new Map(methods.map((m) => [m.id, m.slug])), versions: versionsOf(page as Method, methods) };
}

/** A page's history as `viewer` may see it: the revisions they may read, its events, and the page it was merged into (if any). */
export async function pageHistory(type: PageType, slug: string, viewer: Actor | null) {
  const page = await findPageOfType(type, slug);
  const [revisions, events, mergedInto] = await Promise.all([revisionsOf(type, page.id), eventsOf(type, page.id), survivorOf(type, page)]);
  return { page, mergedInto, events, revisions: revisions.filter((r) => can(viewer, 'read:page-revision', { authorId: r.authorId, status: r.status })) };
}
