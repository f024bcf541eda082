import crypto from 'node:crypto';
import type { EmailTopic } from '@shared/schemas/publishing';
import type { Env } from '../config/env';

/** The key of unsubscribe links, derived from the session secret so that no link table is needed. */
function key(env: Pick<Env, 'SESSION_SECRET'>): Buffer {
  return crypto.createHash('sha256').update(`edgeledger-unsubscribe:${env.SESSION_SECRET ?? 'edgeledger-local-development-secret'}`).digest();
}

/** The signature of an unsubscribe link for one member and one kind of mail (HMAC-SHA256, base64url). */
export function unsubscribeSignature(env: Pick<Env, 'SESSION_SECRET'>, userId: number, topic: EmailTopic): string {
  return crypto.createHmac('sha256', key(env)).update(`${userId}:${topic}`).digest('base64url');
}

/** Whether `sig` is the signature for that member and kind of mail (compared in constant time). */
export function verifyUnsubscribe(env: Pick<Env, 'SESSION_SECRET'>, userId: number, topic: EmailTopic, sig: string): boolean {
  const expected = Buffer.from(unsubscribeSignature(env, userId, topic));
  const given = Buffer.from(sig);
  return given.length === expected.length && crypto.timingSafeEqual(given, expected);
}

/** The query string of an unsubscribe link. */
export function unsubscribeQuery(env: Pick<Env, 'SESSION_SECRET'>, userId: number, topic: EmailTopic): string {
  return new URLSearchParams({ user: String(userId), topic, sig: unsubscribeSignature(env, userId, topic) }).toString();
}
