import type { Request, RequestHandler, Response } from 'express';
import { rateLimit, ipKeyGenerator } from 'express-rate-limit';
import type { Env } from '../config/env';
import type { Database } from '../db/database';
import { DatabaseRateLimitStore } from './rate-limit-store';
import { logEvent } from '../logging';

const MINUTE_MS = 60_000;
const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

/**
 * The client a count belongs to: the account when signed in (so one person cannot spread their
 * writes over addresses), otherwise the address. The address is the socket's peer (or, with
 * TRUST_PROXY hops, the address the trusted proxies saw), so a client cannot reset its count
 * by sending its own X-Forwarded-For. IPv6 addresses count per /56, as one household would.
 */
export function clientKey(req: Request): string {
  const user = req.user as { id?: number } | undefined;
  if (user?.id !== undefined) return `user:${user.id}`;
  return `ip:${ipKeyGenerator(req.ip ?? req.socket.remoteAddress ?? 'unknown')}`;
}

/** Whether a request carries a file upload (multipart form). */
export function isUpload(req: Request): boolean {
  return !!req.is('multipart/form-data');
}

interface LimiterOptions {
  key?: (req: Request) => string;
  skip?: (req: Request) => boolean;
  counts?: (res: Response) => boolean;
}

function limiterOf(db: Database, name: string, perMinute: number, options: LimiterOptions): RequestHandler {
  const limit = rateLimit({
    // One process owns a SQLite database, so its counts stay in its memory (the library's
    // MemoryStore); on PostgreSQL several processes may serve, so they count in the database.
    ...(db.isSqlite ? {} : { store: new DatabaseRateLimitStore(db, name) }),
    // `counts`: only requests whose answer it picks count (the rest are handed back).
    ...(options.counts ? { skipSuccessfulRequests: true, requestWasSuccessful: (_req: Request, res: Response) => !options.counts!(res) } : {}),
    windowMs: MINUTE_MS,
    limit: perMinute,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    identifier: name,
    keyGenerator: options.key ?? clientKey,
    // We read the peer address on purpose (trust proxy off unless TRUST_PROXY says how many
    // hops to trust); the library's warning about a present X-Forwarded-For is then noise.
    validate: { xForwardedForHeader: false },
    handler: (req, res, _next, opts) => {
      logEvent('excess_rate_limit_exceeded', req, { limit: name, max: opts.limit, windowS: 60 });
      res.status(429).json({ error: `Too many requests (${name}): at most ${perMinute} a minute. Try again after the number of seconds in Retry-After.` });
    },
  });
  // A request the limit skips passes straight on, without the library's asynchronous round
  // (about 2 % of a read's time under load, for each limit it passes).
  const skip = options.skip;
  return skip ? (req, res, next) => (skip(req) ? next() : limit(req, res, next)) : limit;
}

/**
 * The rate limits: sign-in (and guessed API tokens), posting (any write under /api), uploads and
 * search, per client per minute, counted across every process of the database.
 */
export function rateLimits(env: Env, db: Database) {
  const limiter = (name: string, perMinute: number, options: LimiterOptions) => limiterOf(db, name, perMinute, options);
  return {
    /** Sign-in starts, per address (nobody is signed in yet). */
    signin: limiter('sign-in', env.RATE_LIMIT_SIGNIN_PER_MIN, { key: (req) => `ip:${ipKeyGenerator(req.ip ?? 'unknown')}` }),
    /**
     * Guessed API tokens: requests whose `Authorization` header is refused with 401 (an unknown,
     * revoked or malformed token), per address, at the sign-in rate. A valid token is not counted.
     */
    tokenGuesses: limiter('api-token', env.RATE_LIMIT_SIGNIN_PER_MIN, {
      key: (req) => `ip:${ipKeyGenerator(req.ip ?? 'unknown')}`,
      skip: (req) => !req.get('authorization'),
      counts: (res) => res.statusCode === 401,
    }),
    /**
     * Writes under /api other than uploads. The calculators (/api/tools/*) compute and store
     * nothing, so a form that recalculates on every change is not counted as posting.
     */
    posts: limiter('posting', env.RATE_LIMIT_POSTS_PER_MIN, {
      skip: (req) => SAFE_METHODS.has(req.method) || isUpload(req) || req.path.startsWith('/tools/'),
    }),
    /** Multipart uploads anywhere under /api. */
    uploads: limiter('uploads', env.RATE_LIMIT_UPLOADS_PER_MIN, { skip: (req) => SAFE_METHODS.has(req.method) || !isUpload(req) }),
    /** Search queries. */
    search: limiter('search', env.RATE_LIMIT_SEARCH_PER_MIN, {}),
  };
}
