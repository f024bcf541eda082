import fs from 'node:fs';
import path from 'node:path';
import express, { type Express, type Request } from 'express';
import session from 'express-session';
import helmet from 'helmet';
import ConnectSessionSequelize from 'connect-session-sequelize';
import { DataTypes } from 'sequelize';
import type { AppContext } from './context';
import { CachedSessionStore } from './auth/cached-session-store';
import { configurePassport } from './auth/passport';
import { authRouter } from './routes/auth';
import { apiRouter } from './routes/api';
import { apiReference } from './openapi/reference';
import { AnswerCache } from './middleware/answer-cache';
import { bearerToken } from './middleware/bearer-token';
import { errorHandler, SIGN_IN_FAILED_PATH } from './middleware/error-handler';
import { rateLimits } from './middleware/rate-limit';
import { requestLog, signInOutcomeLog } from './middleware/request-log';
import { sessionLifetime } from './middleware/session-lifetime';
import { configureLogging, logError, logger } from './logging';
import type { MailCatcher } from './mail/mail-catcher';

/** Where the API is mounted: its versioned paths first, then the unversioned alias. */
export const API_MOUNTS = ['/api/v1', '/api'];

export interface AppOptions {
  /** Folder of the built client; served with an SPA fallback when it exists. */
  clientDir?: string;
  mailCatcher?: MailCatcher;
  /** Where unexpected errors go; the pino logger's `server_error` line by default. */
  log?: (err: unknown) => void;
}

/** The session cookie's name: `__Host-` in production (secure, whole site, no Domain). */
export function sessionCookieName(isProduction: boolean): string {
  return isProduction ? '__Host-edgeledger' : 'edgeledger';
}

/**
 * Whether a request needs its session loaded (or started). A visitor's read, a GET or HEAD
 * without a session cookie, does not: express-session would draw an id, hash the empty session
 * and then drop it, about a sixth of such a request's time under load (measured with --cpu-prof). The session endpoint (which
 * issues the CSRF token) and the sign-in routes always get one.
 */
export function needsSession(req: Request, cookieName: string): boolean {
  if (req.method !== 'GET' && req.method !== 'HEAD') return true;
  if (req.path === '/api/v1/session' || req.path === '/api/session' || req.path.startsWith('/auth/')) return true;
  return (req.headers.cookie ?? '').split(';').some((c) => c.trimStart().startsWith(`${cookieName}=`));
}

/** Builds the Express app (without listening), so tests can drive it with supertest. */
export function createApp(ctx: AppContext, options: AppOptions = {}): Express {
  if (logger().level !== ctx.env.LOG_LEVEL) configureLogging({ level: ctx.env.LOG_LEVEL });
  const app = express();
  app.disable('x-powered-by');
  // Off by default: req.ip is the socket's peer, so X-Forwarded-For from a client changes
  // nothing (rate limits key on it). Behind N reverse proxies, TRUST_PROXY=N.
  app.set('trust proxy', ctx.env.TRUST_PROXY > 0 ? ctx.env.TRUST_PROXY : false);
  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          defaultSrc: ["'self'"],
          scriptSrc: ["'self'"],
          // Scripts are strict (no inline, no eval); styles allow inline because TipTap injects
          // its base <style> element (checked in headless Chromium: blocked under style-src 'self').
          styleSrc: ["'self'", "'unsafe-inline'"],
          imgSrc: ["'self'", 'data:'],
          fontSrc: ["'self'"],
          connectSrc: ["'self'"],
          objectSrc: ["'none'"],
          baseUri: ["'none'"],
          frameAncestors: ["'none'"],
          formAction: ["'self'"],
          upgradeInsecureRequests: ctx.env.isProduction ? [] : null,
        },
      },
    }),
  );
  app.use(requestLog());
  const cookieName = sessionCookieName(ctx.env.isProduction);
  // A visitor's read with a kept answer ends here: no session, body parsing or routing.
  const answers = new AnswerCache({ enabled: ctx.env.ANSWER_CACHE === 'on' });
  app.use(answers.serveVisitors((req) => !needsSession(req, cookieName) && !req.headers.authorization));
  app.use(express.json({ limit: '256kb' }));

  const SessionStore = ConnectSessionSequelize(session.Store);
  ctx.db.sequelize.define(
    'Session',
    { sid: { type: DataTypes.STRING(36), primaryKey: true }, expires: DataTypes.DATE, data: DataTypes.TEXT },
    { tableName: 'sessions' },
  );
  const idleMs = ctx.env.SESSION_IDLE_MINUTES * 60_000;
  const absoluteMs = ctx.env.SESSION_ABSOLUTE_HOURS * 3_600_000;
  // disableTouch: the lifetime middleware writes the last-seen time back at most once a
  // minute, instead of the store updating the row on every request.
  const storeOptions = { db: ctx.db.sequelize, table: 'Session', checkExpirationInterval: 15 * 60 * 1000, expiration: idleMs, disableTouch: true };
  // On SQLite (one process owns the database) kept in memory in front of the table: a
  // signed-in request then reads no session row. On PostgreSQL, where several processes may
  // serve one database, every request reads its row, so a sign-out anywhere counts everywhere.
  const tableStore = new SessionStore(storeOptions);
  const store = ctx.db.isSqlite ? new CachedSessionStore(tableStore as never, (write) => ctx.db.queue.run(write)) : tableStore;
  const auth = configurePassport(ctx);
  const withSession = express.Router();
  withSession.use(
    session({
      name: cookieName,
      secret: ctx.env.SESSION_SECRET ?? 'edgeledger-local-development-secret',
      store,
      resave: false,
      saveUninitialized: false,
      rolling: false,
      // SameSite=Lax, not Strict: the provider's redirect back to /auth/callback is a cross-site
      // navigation, and the state check needs the session cookie on it. Writes are covered by
      // the CSRF token and the Sec-Fetch-Site check.
      cookie: { httpOnly: true, sameSite: 'lax', secure: ctx.env.isProduction, path: '/', maxAge: idleMs },
    }),
    sessionLifetime({ idleMs, absoluteMs }),
    auth.initialize(),
    auth.session(),
  );
  app.use((req, res, next) => (needsSession(req, cookieName) ? withSession(req, res, next) : next()));

  // API tokens authenticate before the other rate limits, so a token's calls count against its
  // account; refused tokens count against the address first.
  const limits = rateLimits(ctx.env, ctx.db);
  app.use('/api', limits.tokenGuesses, bearerToken(ctx));
  app.use('/auth/signin', limits.signin);
  app.use('/auth/callback', signInOutcomeLog(SIGN_IN_FAILED_PATH));
  app.use('/api', limits.posts, limits.uploads);

  app.use('/auth', authRouter(ctx, auth));
  // The API is versioned: /api/v1/… are its paths; the unversioned /api/… answers the same
  // (an alias kept for scripts written before the version, README "API").
  app.use('/api/v1/reference', apiReference());
  app.use(API_MOUNTS, apiRouter(ctx, { mailCatcher: options.mailCatcher, answers, searchLimit: limits.search }));

  const clientDir = options.clientDir;
  if (clientDir && fs.existsSync(path.join(clientDir, 'index.html'))) {
    app.use(express.static(clientDir, { index: false, maxAge: '1h' }));
    app.get('/{*splat}', (_req, res) => res.sendFile(path.join(clientDir, 'index.html')));
  }

  app.use(errorHandler(options.log ?? logError));
  return app;
}
