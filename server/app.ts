import fs from 'node:fs';
import path from 'node:path';
import express, { type Express } from 'express';
import session from 'express-session';
import helmet from 'helmet';
import ConnectSessionSequelize from 'connect-session-sequelize';
import { DataTypes } from 'sequelize';
import type { AppContext } from './context';
import { configurePassport } from './auth/passport';
import { authRouter } from './routes/auth';
import { apiRouter } from './routes/api';
import { errorHandler } from './middleware/error-handler';
import type { MailCatcher } from './mail/mail-catcher';

export interface AppOptions {
  /** Folder of the built client; served with an SPA fallback when it exists. */
  clientDir?: string;
  mailCatcher?: MailCatcher;
  log?: (err: unknown) => void;
}

/** Builds the Express app (without listening), so tests can drive it with supertest. */
export function createApp(ctx: AppContext, options: AppOptions = {}): Express {
  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', false);
  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          defaultSrc: ["'self'"],
          scriptSrc: ["'self'"],
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
  app.use(express.json({ limit: '256kb' }));

  const SessionStore = ConnectSessionSequelize(session.Store);
  ctx.db.sequelize.define(
    'Session',
    { sid: { type: DataTypes.STRING(36), primaryKey: true }, expires: DataTypes.DATE, data: DataTypes.TEXT },
    { tableName: 'sessions' },
  );
  const store = new SessionStore({ db: ctx.db.sequelize, table: 'Session', checkExpirationInterval: 15 * 60 * 1000, expiration: 7 * 24 * 3600 * 1000 });
  app.use(
    session({
      name: ctx.env.isProduction ? '__Host-edgeledger' : 'edgeledger',
      secret: ctx.env.SESSION_SECRET ?? 'edgeledger-local-development-secret',
      store,
      resave: false,
      saveUninitialized: false,
      rolling: true,
      cookie: { httpOnly: true, sameSite: 'lax', secure: ctx.env.isProduction, path: '/', maxAge: 7 * 24 * 3600 * 1000 },
    }),
  );
  const auth = configurePassport(ctx);
  app.use(auth.initialize());
  app.use(auth.session());

  app.use('/auth', authRouter(ctx, auth));
  app.use('/api', apiRouter(ctx, options.mailCatcher));

  const clientDir = options.clientDir;
  if (clientDir && fs.existsSync(path.join(clientDir, 'index.html'))) {
    app.use(express.static(clientDir, { index: false, maxAge: '1h' }));
    app.get('/{*splat}', (_req, res) => res.sendFile(path.join(clientDir, 'index.html')));
  }

  app.use(errorHandler(options.log ?? ((err) => console.error(err))));
  return app;
}
