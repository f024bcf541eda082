import type { User } from '../models';

/** The public face of an account: never its e-mail address or provider subject. */
export function presentAccount(user: User) {
  return { handle: user.handle, displayName: user.displayName, role: user.role };
}
