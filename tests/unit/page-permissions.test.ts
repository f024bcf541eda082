import { describe, expect, it } from 'vitest';
import { can, type Actor, type Role } from '@shared/permissions';

const actor = (role: Role, id = 1, banned = false): Actor => ({ id, role, banned });

describe('who may do what with reference pages', () => {
  // Rows: role → [edit, edit protected, publish, publish protected, revert, protect, merge].
  const table: [Role, boolean[]][] = [
    ['member', [true, false, false, false, false, false, false]],
    ['publisher', [true, false, true, false, false, false, false]],
    ['moderator', [true, true, true, true, true, true, true]],
    ['admin', [true, true, true, true, true, true, true]],
  ];
  it.each(table)('%s', (role, expected) => {
    const a = actor(role);
    expect([
      can(a, 'edit:page', { isProtected: false }),
      can(a, 'edit:page', { isProtected: true }),
      can(a, 'publish:page', { isProtected: false }),
      can(a, 'publish:page', { isProtected: true }),
      can(a, 'revert:page'),
      can(a, 'protect:page'),
      can(a, 'merge:page'),
    ]).toEqual(expected);
  });

  it('refuses visitors and banned accounts every write', () => {
    for (const action of ['edit:page', 'publish:page', 'revert:page', 'protect:page', 'merge:page', 'review:page-revision'] as const) {
      expect(can(null, action, { isProtected: false })).toBe(false);
      expect(can(actor('moderator', 1, true), action, { isProtected: false })).toBe(false);
    }
  });

  it('shows live revisions to everyone, proposals and declined ones to their author and moderators', () => {
    for (const status of ['proposed', 'declined']) {
      expect(can(null, 'read:page-revision', { authorId: 5, status })).toBe(false);
      expect(can(actor('member', 6), 'read:page-revision', { authorId: 5, status })).toBe(false);
      expect(can(actor('member', 5), 'read:page-revision', { authorId: 5, status })).toBe(true);
      expect(can(actor('moderator', 7), 'read:page-revision', { authorId: 5, status })).toBe(true);
    }
    expect(can(null, 'read:page-revision', { authorId: 5, status: 'live' })).toBe(true);
  });

  it('lets moderators review others’ proposals, never their own', () => {
    expect(can(actor('moderator', 7), 'review:page-revision', { authorId: 5, status: 'proposed' })).toBe(true);
    expect(can(actor('moderator', 5), 'review:page-revision', { authorId: 5, status: 'proposed' })).toBe(false);
    expect(can(actor('publisher', 7), 'review:page-revision', { authorId: 5, status: 'proposed' })).toBe(false);
  });
});
