import type { Response } from 'express';
import type { Actor } from '@shared/permissions';
import type { PageType } from '@shared/schemas/pages';
import { findPageOfType, linkCheckerFor, survivorOf, type PageModel } from '../../../queries/pages';
import { pageView } from '../../../queries/page-views';
import { pageActions, presentAbrasive, presentMethod, presentRevision, presentSteel } from '../../../presenters/pages';
import type { ReviseOutcome } from '../../../commands/revise-page';

// The answers of the reference-page routes (./index.ts) that more than one route gives.

/** A page whole, as GET /api/{section}/:slug answers it, for `viewer`. */
export async function presentPage(type: PageType, page: PageModel, viewer: Actor | null) {
  const view = await pageView(type, page);
  const extras = { viewer, linkExists: view.linkExists, proposals: view.proposals, revisionNumber: view.revisionNumber };
  if (view.type === 'steel') return presentSteel(view.page, view.results.count, { ...extras, results: view.results });
  if (view.type === 'abrasive') return presentAbrasive(view.page, view.results.count, { ...extras, results: view.results });
  return presentMethod(view.page, view.slugById, { ...extras, versions: view.versions });
}

/**
 * A page's answer apart from what the viewer may do: the JSON of everything else (its closing
 * brace left off) and what the allowed actions depend on; or where a merged page now lives.
 */
export type SharedPage = { moved: PageModel } | { head: string; subject: Pick<PageModel, 'isProtected' | 'mergedIntoId'> };

export async function sharedPage(type: PageType, slug: string): Promise<SharedPage> {
  const page = await findPageOfType(type, slug);
  const survivor = await survivorOf(type, page);
  if (survivor) return { moved: survivor };
  const { can: _visitors, ...rest } = await presentPage(type, page, null);
  return { head: JSON.stringify(rest).slice(0, -1), subject: { isProtected: page.isProtected, mergedIntoId: page.mergedIntoId } };
}

/** The whole answer for `viewer`: the shared part, then their allowed actions (`can`, last). */
export const withActions = (shared: Extract<SharedPage, { head: string }>, viewer: Actor | null) => `${shared.head},"can":${JSON.stringify(pageActions(shared.subject, viewer))}}`;

/** Sends a refused stale save: 409 with the current revision, the conflicting fields and a suggested merge. */
export async function sendStale(res: Response, outcome: Extract<ReviseOutcome, { outcome: 'stale' }>, viewer: Actor) {
  const linkExists = await linkCheckerFor([outcome.current.body]);
  const author = outcome.current.author?.handle;
  res.status(409).json({
    error: `Someone saved this page while you were editing: revision ${outcome.current.number}${author ? ` by ${author}` : ''} is now current. Nothing was saved; review their changes, merge yours into the current revision and save again.`,
    current: presentRevision(outcome.current, outcome.page, viewer, linkExists),
    conflicts: outcome.conflicts,
    merged: outcome.merged,
  });
}
