import type { Topic } from './kinds';

/**
 * What each kept read and each kept answer follows: the topics whose commits drop it. A cache
 * names its row here (`keptUntil('accounts')`, `answers.keep('compare')`) instead of the events
 * it depends on; a new cache adds a row.
 */
export const KEPT = {
  /** Accounts by id (passport): a ban or a role takes effect on the next request. */
  accounts: ['account'],
  /** The pages a submission refers to, by slug. */
  pageRefs: ['page'],
  /** The comparison's page look-ups (a page enters the comparison through an approved result), and the abrasive names a result's progression steps show. */
  compareLookups: ['page', 'cells'],
  /** Figures over approved results: counts per page, a page's summary. */
  figures: ['cells'],
  /** Kept answers of the comparison: cells, page names, and accounts for the publishers-only view. */
  compare: ['cells', 'page', 'account'],
  /** Visitors' kept page and list answers (an abrasive page shows the prices members paid). */
  pages: ['page', 'cells', 'price'],
  /** Kept search answers: dropped once the search index has taken the change. */
  search: ['cells', 'page'],
} as const satisfies Record<string, readonly Topic[]>;

export type Kept = keyof typeof KEPT;
