import { atLeast, can, type Actor } from '@shared/permissions';
import { PAGE_SECTIONS, type PageType } from '@shared/schemas/pages';
import { renderRichText, type RenderOptions } from '../rich-text/render';
import type { Abrasive, Method, PageEvent, PageRevision, Steel } from '../models';
import type { PageModel } from '../models/reference-pages';

/** What a page's presenter may add beyond the page itself. */
export interface PageExtras {
  viewer?: Actor | null;
  /** Marks broken site links in the body (see renderRichText). */
  linkExists?: RenderOptions['linkExists'];
  /** Proposed revisions waiting for review on this page. */
  proposals?: number;
  /** The number on this page of its current revision (`revision` is its id). */
  revisionNumber?: number | null;
  /** Approved results on this page, grouped (see queries/pages steelResults and abrasiveResults). */
  results?: unknown;
}

/** What the viewer may do with a page, so the client shows only the controls the server would accept. */
export function pageActions(page: Pick<PageModel, 'isProtected' | 'mergedIntoId'>, viewer: Actor | null | undefined) {
  const subject = { isProtected: page.isProtected };
  return {
    edit: can(viewer ?? null, 'edit:page', subject) && !page.mergedIntoId,
    publish: can(viewer ?? null, 'publish:page', subject),
    revert: can(viewer ?? null, 'revert:page'),
    protect: can(viewer ?? null, 'protect:page'),
    merge: can(viewer ?? null, 'merge:page'),
  };
}

/** The wiki parts every full page has: body, references, revision, protection, permissions. */
function wikiParts(page: PageModel, extras: PageExtras) {
  return {
    body: page.body,
    bodyHtml: renderRichText(page.body, { linkExists: extras.linkExists }),
    citations: page.citations,
    sources: page.sources ?? {},
    revision: page.currentRevisionId,
    revisionNumber: extras.revisionNumber ?? null,
    isProtected: page.isProtected,
    proposals: extras.proposals ?? 0,
    can: pageActions(page, extras.viewer),
    ...(extras.results !== undefined ? { results: extras.results } : {}),
  };
}

/** A steel in a list (with its composition, so lists can filter and chart it). */
export function presentSteelSummary(steel: Steel, resultCount: number) {
  return {
    slug: steel.slug,
    name: steel.name,
    category: steel.category,
    designations: steel.designations,
    composition: steel.composition,
    hardnessHrc: steel.hardnessMinHrc !== null && steel.hardnessMaxHrc !== null ? { min: steel.hardnessMinHrc, max: steel.hardnessMaxHrc } : null,
    resultCount,
  };
}

/** A steel's whole page. */
export function presentSteel(steel: Steel, resultCount: number, extras: PageExtras = {}) {
  return { ...presentSteelSummary(steel, resultCount), ...wikiParts(steel, extras) };
}

/** An abrasive in a list. */
export function presentAbrasiveSummary(a: Abrasive, resultCount: number) {
  return {
    slug: a.slug,
    name: a.name,
    material: a.material,
    bond: a.bond,
    form: a.form,
    grit: { standard: a.gritStandard, grade: a.gritGrade },
    gritUm: a.gritUm,
    wheelDiameterMm: a.wheelDiameterMm,
    wears: a.wears,
    coolant: a.coolant,
    sideUsable: a.sideUsable,
    resultCount,
  };
}

/** An abrasive's whole page. */
export function presentAbrasive(a: Abrasive, resultCount: number, extras: PageExtras = {}) {
  return {
    ...presentAbrasiveSummary(a, resultCount),
    gritRange: a.gritRange,
    widthMm: a.widthMm,
    priceNote: a.priceNote ?? null,
    ...wikiParts(a, extras),
  };
}

/** A method in a list; `replacesSlug` links a version to the one it replaces. */
export function presentMethodSummary(m: Method, slugById: Map<number, string>) {
  return {
    slug: m.slug,
    name: m.name,
    version: m.version,
    replacesSlug: m.replacesId ? (slugById.get(m.replacesId) ?? null) : null,
    instrument: m.instrument,
    medium: m.medium,
    readingsPerEdge: m.readingsPerEdge,
    retentionMedium: m.retentionMedium,
    thresholdG: m.thresholdG,
  };
}

/** A method's whole page, with every version of the protocol (oldest first). */
export function presentMethod(m: Method, slugById: Map<number, string>, extras: PageExtras & { versions?: Method[] } = {}) {
  return {
    ...presentMethodSummary(m, slugById),
    versions: (extras.versions ?? []).map((v) => ({ slug: v.slug, name: v.name, version: v.version, current: v.id === m.id })),
    ...wikiParts(m, extras),
  };
}

/** Whether the viewer may see the review of a revision (its author and moderators). */
const insiderOf = (r: PageRevision, viewer: Actor | null | undefined) => !!viewer && (viewer.id === r.authorId || atLeast(viewer.role, 'moderator'));

/** One revision in a page's history: who, when, why, its state and how it came about. */
export function presentRevisionSummary(r: PageRevision, currentRevisionId: number | null, viewer: Actor | null | undefined) {
  return {
    id: r.id,
    // Its number on its page; the ids below stay what every route and write takes, the numbers name them.
    number: r.number,
    author: r.author ? { handle: r.author.handle } : null,
    createdAt: r.createdAt,
    summary: r.summary,
    status: r.status,
    kind: r.kind,
    current: r.id === currentRevisionId,
    baseRevisionId: r.baseRevisionId,
    baseRevisionNumber: r.base?.number ?? null,
    revertedFromId: r.revertedFromId,
    revertedFromNumber: r.revertedFrom?.number ?? null,
    appliedFromId: r.appliedFromId,
    appliedFromNumber: r.appliedFrom?.number ?? null,
    // Who reviewed is public history; the note is for the author and moderators.
    review: r.reviewedAt ? { by: r.reviewer ? { handle: r.reviewer.handle } : null, at: r.reviewedAt, note: insiderOf(r, viewer) ? r.reviewNote : null } : null,
  };
}

/** A revision whole: its fields and body as saved, with the page it belongs to. */
export function presentRevision(r: PageRevision, page: PageModel, viewer: Actor | null | undefined, linkExists?: RenderOptions['linkExists']) {
  return {
    ...presentRevisionSummary(r, page.currentRevisionId, viewer),
    pageType: r.pageType,
    page: { slug: page.slug, name: page.name, section: PAGE_SECTIONS[r.pageType] },
    fields: r.fields,
    body: r.body,
    bodyHtml: renderRichText(r.body, { linkExists }),
    can: {
      review: r.status === 'proposed' && can(viewer ?? null, 'review:page-revision', { authorId: r.authorId, status: r.status }),
      revert: r.status === 'live' && r.id !== page.currentRevisionId && can(viewer ?? null, 'revert:page'),
    },
  };
}

/** A page-level action in a page's history (protect, unprotect, merge). */
export function presentPageEvent(e: PageEvent) {
  return { id: e.id, action: e.action, by: e.actor ? { handle: e.actor.handle } : null, at: e.createdAt, note: e.note, detail: e.detail };
}

/**
 * A proposed revision as the review desk lists it: `kind: 'page-revision'`, the page, the
 * author, what changed against the revision it started from, and whether the page has moved
 * on since (then approving merges the two, or refuses on a conflict).
 */
export function presentDeskRevision(r: PageRevision, page: PageModel | null, changed: string[], currentNumber: number | null, viewer: Actor) {
  const type: PageType = r.pageType;
  return {
    kind: 'page-revision' as const,
    id: r.id,
    number: r.number,
    pageType: type,
    page: page
      ? { slug: page.slug, name: page.name, section: PAGE_SECTIONS[type], currentRevisionId: page.currentRevisionId, currentRevisionNumber: currentNumber, isProtected: page.isProtected }
      : null,
    author: r.author ? { handle: r.author.handle } : null,
    createdAt: r.createdAt,
    summary: r.summary,
    baseRevisionId: r.baseRevisionId,
    baseRevisionNumber: r.base?.number ?? null,
    stale: !!page && r.baseRevisionId !== page.currentRevisionId,
    changed,
    can: { review: can(viewer, 'review:page-revision', { authorId: r.authorId, status: r.status }) },
  };
}
