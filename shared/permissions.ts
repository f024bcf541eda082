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
  | 'read:dev-mail';

/** A subject is what the action is about; for results, its author and status. */
export interface ResultSubject {
  authorId: number;
  status: string;
}

const rank: Record<Role, number> = { member: 1, publisher: 2, moderator: 3, admin: 4 };

/** True when `role` is at least `min` in the order member < publisher < moderator < admin. */
export function atLeast(role: Role, min: Role): boolean {
  return rank[role] >= rank[min];
}

/** Whether `actor` (null for a visitor) may perform `action` on `subject`. */
export function can(actor: Actor | null, action: Action, subject?: ResultSubject): boolean {
  if (action === 'read:result') {
    if (subject?.status === 'approved') return true;
    if (!actor || actor.banned) return false;
    return subject?.authorId === actor.id || atLeast(actor.role, 'moderator');
  }
  if (!actor || actor.banned) return false;
  switch (action) {
    case 'create:result':
      return true;
    case 'retract:result':
      return subject?.authorId === actor.id && subject.status === 'approved';
    case 'review:result':
      return atLeast(actor.role, 'moderator') && subject?.authorId !== actor.id;
    case 'read:review-desk':
      return atLeast(actor.role, 'moderator');
    case 'read:dev-mail':
      return actor.role === 'admin';
  }
}
