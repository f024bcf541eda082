import type { BadgeTone } from '@/components/ui/badge';
import type { PageEventItem, RevisionSummary } from '../types';

/** Words for a revision's state, as shown to people. */
export const REVISION_STATUS: Record<RevisionSummary['status'], { text: string; tone: BadgeTone }> = {
  live: { text: 'Accepted', tone: 'accent' },
  proposed: { text: 'Awaiting review', tone: 'caution' },
  declined: { text: 'Declined', tone: 'danger' },
};

/** How a revision came about, in a few words. */
export function revisionOrigin(r: RevisionSummary): string | null {
  if (r.kind === 'revert' && r.revertedFromNumber) return `restores revision ${r.revertedFromNumber}`;
  if (r.kind === 'merge' && r.appliedFromNumber) return `applies proposed revision ${r.appliedFromNumber} over revision ${r.baseRevisionNumber}`;
  return null;
}

/** A page-level action in words. */
export function describeEvent(e: PageEventItem): string {
  switch (e.action) {
    case 'protect':
      return 'protected the page (only moderators edit it)';
    case 'unprotect':
      return 'released the page for everyone to edit';
    case 'merged-into':
      return `merged this page into ${e.detail?.intoName ?? e.detail?.into ?? 'another page'}, moving ${e.detail?.resultIds?.length ?? 0} results`;
    case 'absorbed':
      return `merged ${e.detail?.fromName ?? e.detail?.from ?? 'a duplicate'} into this page, with ${e.detail?.resultIds?.length ?? 0} results`;
  }
}
