import crypto from 'node:crypto';
import type { Request } from 'express';
import { Op } from 'sequelize';
import type { Database } from '../db/database';
import { SignInState } from '../models';

const COOKIE = 'edgeledger_signin';
const TTL_MS = 10 * 60 * 1000;

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
 * passport-oauth2's state store, kept in the database (table `sign_in_states`, so a sign-in begun
 * on one app process finishes on any other) and bound to the browser by a short-lived cookie
 * rather than written into the session. The session is saved at the end of every request that
 * changed it, so a slower request that started before sign-in could overwrite the session
 * holding the state and make the callback fail; a store of its own has no such race. Each state
 * is single-use (taken and removed in one write) and expires after ten minutes; expired ones are
 * removed when a new sign-in begins.
 */
export class SignInStateStore {
  constructor(
    private readonly db: Database,
    private readonly secureCookie: boolean,
  ) {}

  store(req: Request, verifier: string, _state: unknown, _meta: unknown, callback: (err: Error | null, handle?: string) => void): void {
    const handle = crypto.randomBytes(24).toString('base64url');
    const browser = crypto.randomBytes(24).toString('base64url');
    const now = Date.now();
    this.db
      .write(async (transaction) => {
        await SignInState.destroy({ where: { expiresAt: { [Op.lt]: new Date(now) } }, transaction });
        await SignInState.create({ handle, verifier, returnTo: req.signinReturnTo ?? '/', browser, expiresAt: new Date(now + TTL_MS) }, { transaction });
      })
      .then(() => {
        req.res?.cookie(COOKIE, browser, { httpOnly: true, sameSite: 'lax', secure: this.secureCookie, path: '/auth', maxAge: TTL_MS });
        callback(null, handle);
      }, callback);
  }

  verify(req: Request, handle: string, callback: (err: Error | null, verifier: string | false, info?: { message: string }) => void): void {
    const take = async (): Promise<SignInState | null> => {
      if (!handle || typeof handle !== 'string') return null;
      return this.db.write(async (transaction) => {
        const entry = await SignInState.findByPk(handle, { transaction });
        if (entry) await entry.destroy({ transaction });
        return entry;
      });
    };
    take().then((entry) => {
      req.res?.clearCookie(COOKIE, { path: '/auth' });
      if (!entry || entry.expiresAt.getTime() < Date.now() || cookieValue(req, COOKIE) !== entry.browser) {
        callback(null, false, { message: 'Unable to verify the sign-in request; please start again.' });
        return;
      }
      req.signinReturnTo = entry.returnTo;
      callback(null, entry.verifier);
    }, (err: Error) => callback(err, false));
  }
}
