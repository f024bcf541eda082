/**
 * Who may do what. One function, used by the server before every write and every read of
 * unapproved data, and by the client only to hide controls it would refuse anyway.
 */
export const ROLES = ['member', 'publisher', 'moderator', 'admin'] as const;
export type Role = (typeof ROLES)[number];

export interface Actor {
  id: number;
  role: Role;
  banned?: boolean;
}

export type Action =
  | 'create:result'
  | 'read:result'
  | 'review:result'
  | 'read:review-desk'
  | 'retract:result'
  | 'edit:result'
  | 'manage:users'
  | 'read:dev-mail'
  | 'create:page'
  | 'edit:page'
  | 'publish:page'
  | 'read:page-revision'
  | 'review:page-revision'
  | 'revert:page'
  | 'protect:page'
  | 'merge:page'
  | 'apply:publisher'
  | 'decide:publisher-application'
  | 'import:results'
  | 'manage:tokens'
  | 'upload:photo'
  | 'create:flag'
  | 'resolve:flag'
  | 'read:audit'
  | 'manage:site-settings'
  | 'bulk-approve:results';

/** A subject is what the action is about; for results, its author and status. */
export interface ResultSubject {
  authorId: number;
  status: string;
}

/**
 * A reference page or one of its revisions: whether the page is protected, and for a
 * revision its author and status ('live', 'proposed', 'declined').
 */
export interface PageSubject {
  isProtected?: boolean;
  authorId?: number;
  status?: string;
}

const rank: Record<Role, number> = { member: 1, publisher: 2, moderator: 3, admin: 4 };

/** True when `role` is at least `min` in the order member < publisher < moderator < admin. */
export function atLeast(role: Role, min: Role): boolean {
  return rank[role] >= rank[min];
}

/** Whether `actor` (null for a visitor) may perform `action` on `subject`. */
export function can(actor: Actor | null, action: Action, subject?: ResultSubject | PageSubject): boolean {
  if (action === 'read:result') {
    if (subject?.status === 'approved') return true;
    if (!actor || actor.banned) return false;
    return subject?.authorId === actor.id || atLeast(actor.role, 'moderator');
  }
  if (action === 'read:page-revision') {
    // Accepted revisions are public history; proposals and declined ones only to their author and moderators.
    if (subject?.status === 'live') return true;
    if (!actor || actor.banned) return false;
    return subject?.authorId === actor.id || atLeast(actor.role, 'moderator');
  }
  if (!actor || actor.banned) return false;
  switch (action) {
    case 'create:result':
      return true;
    case 'retract:result':
      return subject?.authorId === actor.id && subject.status === 'approved';
    case 'edit:result':
      // The author edits a result not yet decided, or one sent back; a published one is corrected
      // through a revision a moderator approves. Rejected and withdrawn results stay as they are.
      return subject?.authorId === actor.id && ['draft', 'pending', 'returned', 'approved'].includes(subject.status ?? '');
    case 'review:result':
      return atLeast(actor.role, 'moderator') && subject?.authorId !== actor.id;
    case 'read:review-desk':
      return atLeast(actor.role, 'moderator');
    case 'read:dev-mail':
      return actor.role === 'admin';
    case 'edit:page':
      // Any member may propose an edit; a protected page takes edits from moderators only.
      return !(subject as PageSubject | undefined)?.isProtected || atLeast(actor.role, 'moderator');
    case 'publish:page':
      // A publisher's or moderator's edit goes live at once; a member's waits on the review desk.
      return atLeast(actor.role, 'publisher') && (!(subject as PageSubject | undefined)?.isProtected || atLeast(actor.role, 'moderator'));
    case 'review:page-revision':
      return atLeast(actor.role, 'moderator') && subject?.authorId !== actor.id;
    // A new reference page is staff work for now (decision 039): members propose edits only.
    case 'create:page':
    case 'revert:page':
    case 'protect:page':
    case 'merge:page':
      return atLeast(actor.role, 'moderator');
    case 'apply:publisher':
      // Only members apply; publishers and staff already have what a publisher has.
      return actor.role === 'member';
    case 'decide:publisher-application':
    case 'manage:site-settings':
    case 'manage:users':
      return actor.role === 'admin';
    case 'import:results':
    case 'manage:tokens':
      return atLeast(actor.role, 'publisher');
    case 'upload:photo':
      // The author adds photos while the result is still theirs to change or once published.
      return subject?.authorId === actor.id && ['draft', 'pending', 'returned', 'approved'].includes(subject.status ?? '');
    case 'create:flag':
      return true;
    case 'resolve:flag':
    case 'read:audit':
    case 'bulk-approve:results':
      return atLeast(actor.role, 'moderator');
  }
}
