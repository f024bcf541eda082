import type {} from 'express-session';
import type { RequestHandler } from 'express';
import { logEvent } from '../logging';

declare module 'express-session' {
  interface SessionData {
    /** When the session (or the current sign-in) started and when it was last used, ms since epoch. */
    life?: { startedAt: number; seenAt: number; user: number | null };
    passport?: { user?: number };
  }
}

export interface SessionLifetimeOptions {
  /** Idle timeout: a session unused this long ends (ms). */
  idleMs: number;
  /** Absolute timeout: a session ends this long after sign-in, however busy (ms). */
  absoluteMs: number;
}

/**
 * Enforces the idle and absolute timeouts on the server, whatever the cookie says: a session
 * past either is destroyed in the store and the request goes on as a visitor's. Mount between
 * express-session and passport.session(), so an expired session never authenticates.
 *
 * The last-seen time is written back at most every min(60 s, idle / 4), so a busy client does
 * not cost one session write per request; a session can therefore end up to that much early.
 */
export function sessionLifetime({ idleMs, absoluteMs }: SessionLifetimeOptions): RequestHandler {
  const refreshMs = Math.min(60_000, idleMs / 4);
  return (req, _res, next) => {
    const session = req.session;
    if (!session) return next();
    const now = Date.now();
    const user = session.passport?.user ?? null;
    const life = session.life;
    if (!life) {
      // Only a session that holds something is timed; stamping an empty one would save a
      // session (and set a cookie) for every visitor's request.
      if (Object.keys(session).some((k) => k !== 'cookie')) session.life = { startedAt: now, seenAt: now, user };
      return next();
    }
    const reason = now - life.seenAt > idleMs ? 'idle' : now - life.startedAt > absoluteMs ? 'absolute' : null;
    if (reason) {
      logEvent('session_expired', req, { reason, ...(life.user !== null ? { userId: life.user } : {}) });
      session.regenerate((err) => next(err));
      return;
    }
    // A sign-in (or a change of account) starts the absolute timer again.
    if (life.user !== user) session.life = { startedAt: now, seenAt: now, user };
    else if (now - life.seenAt > refreshMs) life.seenAt = now;
    next();
  };
}
