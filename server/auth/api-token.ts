import crypto from 'node:crypto';

/** What every token starts with, so a leaked one is easy to recognise. */
export const TOKEN_PREFIX = 'elt_';

/** SHA-256 of a token, hex: what the database keeps instead of the token (made by a command, checked by middleware). */
export function hashToken(token: string): string {
  return crypto.createHash('sha256').update(token).digest('hex');
}
