/**
 * Shapes of what the wiki's endpoints send back: a page's history, one revision, the outcome of
 * a save, and the review desk's page edits. Inputs are typed by shared/schemas/pages.ts.
 */
import type { RichTextNode } from '@shared/rich-text';
import type { PageType } from '@shared/schemas/pages';

/** The URL section of each page type ("/steels/…"). */
export type WikiSection = 'steels' | 'abrasives' | 'methods';

export const SECTION_TYPES: Record<WikiSection, PageType> = { steels: 'steel', abrasives: 'abrasive', methods: 'method' };
export const SECTION_LABELS: Record<WikiSection, { one: string; many: string }> = {
  steels: { one: 'steel', many: 'Steels' },
  abrasives: { one: 'abrasive', many: 'Abrasives' },
  methods: { one: 'method', many: 'Methods' },
};

/** Whether a URL segment names a wiki section. */
export function isWikiSection(value: string | undefined): value is WikiSection {
  return value === 'steels' || value === 'abrasives' || value === 'methods';
}

/** What the viewer may do with a page (sent by the server with the page). */
export interface PageActions {
  edit: boolean;
  publish: boolean;
  revert: boolean;
  protect: boolean;
  merge: boolean;
}

/** The wiki parts every page has in GET /api/{section}/:slug. */
export interface WikiParts {
  slug: string;
  name: string;
  body: RichTextNode | null;
  bodyHtml: string;
  citations: WikiCitation[];
  sources: Record<string, number>;
  /** The current revision's id (what an edit names as its base) and its number on the page (what people read). */
  revision: number;
  revisionNumber: number;
  isProtected: boolean;
  proposals: number;
  can: PageActions;
}

/** A page with its wiki parts and its type's fields (which the editor reads by name). */
export type WikiPage = WikiParts & Record<string, unknown>;

export interface WikiCitation {
  title: string;
  organisation: string;
  year: number | null;
  standard?: string;
  url?: string;
  supports: string;
}

export type RevisionStatus = 'live' | 'proposed' | 'declined';

/**
 * One revision in a page's history. `id` is what links and writes take; `number` (1, 2, 3… on
 * its page) is what the screens call it, and so for the revisions it names.
 */
export interface RevisionSummary {
  id: number;
  number: number;
  author: { handle: string } | null;
  createdAt: string;
  summary: string;
  status: RevisionStatus;
  kind: 'edit' | 'revert' | 'merge';
  current: boolean;
  baseRevisionId: number | null;
  baseRevisionNumber: number | null;
  revertedFromId: number | null;
  revertedFromNumber: number | null;
  appliedFromId: number | null;
  appliedFromNumber: number | null;
  review: { by: { handle: string } | null; at: string; note: string | null } | null;
}

/** A revision whole. */
export interface Revision extends RevisionSummary {
  pageType: PageType;
  page: { slug: string; name: string; section: WikiSection };
  fields: Record<string, unknown>;
  body: RichTextNode | null;
  bodyHtml: string;
  can: { review: boolean; revert: boolean };
}

/** A page-level action in the history. */
export interface PageEventItem {
  id: number;
  action: 'protect' | 'unprotect' | 'merged-into' | 'absorbed';
  by: { handle: string } | null;
  at: string;
  note: string | null;
  detail: { into?: string; intoName?: string; from?: string; fromName?: string; resultIds?: number[] } | null;
}

/** GET /api/{section}/:slug/revisions. */
export interface History {
  page: { slug: string; name: string; currentRevisionId: number; currentRevisionNumber: number; isProtected: boolean; mergedInto: string | null };
  items: RevisionSummary[];
  events: PageEventItem[];
}

/** PUT /api/{section}/:slug: live (200) or proposed (202). */
export interface SaveOutcome {
  status: 'live' | 'proposed';
  revision: Revision;
  page?: WikiPage;
}

/** A proposed revision on the review desk (GET /api/review-desk, `revisions`). */
export interface DeskRevision {
  kind: 'page-revision';
  id: number;
  pageType: PageType;
  page: { slug: string; name: string; section: WikiSection; currentRevisionId: number; currentRevisionNumber: number | null; isProtected: boolean } | null;
  number: number;
  author: { handle: string } | null;
  createdAt: string;
  summary: string;
  baseRevisionId: number | null;
  baseRevisionNumber: number | null;
  stale: boolean;
  changed: string[];
  can: { review: boolean };
}
