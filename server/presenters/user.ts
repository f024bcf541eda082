import type { AccountFace, User } from '../models';

/** The public face of an account: never its e-mail address or provider subject. */
export function presentAccount(user: AccountFace) {
  return { handle: user.handle, displayName: user.displayName, role: user.role };
}

/** An account as the admins' screen shows it: its public face, its standing and when it joined. */
export function presentManagedAccount(user: User, counts: { published: number; returned: number; pending: number }) {
  return { ...presentAccount(user), banned: user.banned, createdAt: user.createdAt, ...counts };
}
