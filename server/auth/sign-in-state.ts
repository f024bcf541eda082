import crypto from 'node:crypto';
import type { Request } from 'express';

const COOKIE = 'edgeledger_signin';
const TTL_MS = 10 * 60 * 1000;

interface Pending {
  verifier: string;
  returnTo: string;
  browser: string;
  expires: number;
}

declare module 'express-serve-static-core' {
  interface Request {
    /** Where to go after signing in: set by /auth/signin, restored on the callback. */
    signinReturnTo?: string;
  }
}

function cookieValue(req: Request, name: string): string | undefined {
  for (const part of (req.headers.cookie ?? '').split(/;\s*/)) {
    const eq = part.indexOf('=');
    if (eq > 0 && part.slice(0, eq) === name) return decodeURIComponent(part.slice(eq + 1));
  }
  return undefined;
}

/**
 * passport-oauth2's state store, kept in memory and bound to the browser by a short-lived
 * cookie rather than written into the session. The session is saved at the end of every request
 * that changed it, so a slower request that started before sign-in could overwrite the session
 * holding the state and make the callback fail; a store of its own has no such race. Each state
 * is single-use and expires after ten minutes.
 */
export class SignInStateStore {
  private readonly pending = new Map<string, Pending>();

  constructor(private readonly secureCookie: boolean) {}

  store(req: Request, verifier: string, _state: unknown, _meta: unknown, callback: (err: Error | null, handle?: string) => void): void {
    this.sweep();
    const handle = crypto.randomBytes(24).toString('base64url');
    const browser = crypto.randomBytes(24).toString('base64url');
    this.pending.set(handle, { verifier, returnTo: req.signinReturnTo ?? '/', browser, expires: Date.now() + TTL_MS });
    req.res?.cookie(COOKIE, browser, { httpOnly: true, sameSite: 'lax', secure: this.secureCookie, path: '/auth', maxAge: TTL_MS });
    callback(null, handle);
  }

  verify(req: Request, handle: string, callback: (err: Error | null, verifier: string | false, info?: { message: string }) => void): void {
    const entry = handle ? this.pending.get(handle) : undefined;
    if (entry) this.pending.delete(handle);
    req.res?.clearCookie(COOKIE, { path: '/auth' });
    if (!entry || entry.expires < Date.now() || cookieValue(req, COOKIE) !== entry.browser) {
      callback(null, false, { message: 'Unable to verify the sign-in request; please start again.' });
      return;
    }
    req.signinReturnTo = entry.returnTo;
    callback(null, entry.verifier);
  }

  private sweep() {
    const now = Date.now();
    for (const [k, v] of this.pending) if (v.expires < now) this.pending.delete(k);
  }
}
