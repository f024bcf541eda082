import type { RequestHandler } from 'express';
import { atLeast } from '@shared/permissions';
import type { AppContext } from '../context';
import { forbidden, HttpError } from '../errors';
import { ApiToken, User } from '../models';
import { hashToken } from '../auth/api-token';

declare module 'express-serve-static-core' {
  interface Request {
    /** How the request's user was authenticated: the session cookie, or an API token (no CSRF then). */
    authenticatedBy?: 'session' | 'token';
  }
}

const BEARER = /^Bearer\s+(\S+)\s*$/i;
/** Writing lastUsedAt on every call would put a write in every read; once a minute is enough. */
const LAST_USED_RESOLUTION_MS = 60_000;

/**
 * `Authorization: Bearer <token>` authenticates the request as the token's publisher, with the
 * same rules as their session, instead of any session cookie. An unknown or revoked token is
 * refused with 401, as is any token of a banned account (a ban ends its tokens); an account that
 * is no longer a publisher gets 403.
 * Such requests need no CSRF token: a browser never attaches this header by itself.
 */
export function bearerToken(ctx: AppContext): RequestHandler {
  return async (req, res, next) => {
    const header = req.get('authorization');
    if (!header) {
      if (req.user) req.authenticatedBy = 'session';
      return next();
    }
    const match = BEARER.exec(header);
    const unauthorizedToken = (message: string) => {
      res.set('WWW-Authenticate', 'Bearer realm="edgeledger"');
      return new HttpError(401, 'unauthorized', message);
    };
    if (!match) throw unauthorizedToken('The Authorization header must be "Bearer <token>".');
    const token = await ApiToken.findOne({ where: { tokenHash: hashToken(match[1]) } });
    if (!token || token.revokedAt) throw unauthorizedToken('This API token is unknown or was revoked.');
    const user = await User.findByPk(token.userId);
    if (!user) throw unauthorizedToken('This API token is unknown or was revoked.');
    if (user.banned) throw unauthorizedToken('This account is suspended; its API tokens no longer work.');
    if (!atLeast(user.role, 'publisher')) throw forbidden('API tokens work for publishers only.');
    req.user = user;
    req.authenticatedBy = 'token';
    if (!token.lastUsedAt || Date.now() - token.lastUsedAt.getTime() > LAST_USED_RESOLUTION_MS) {
      ctx.db.write((transaction) => token.update({ lastUsedAt: new Date() }, { transaction })).catch(() => undefined);
    }
    next();
  };
}
