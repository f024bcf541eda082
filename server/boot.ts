import { watchEventLoop } from './event-loop';
import path from 'node:path';
import type { AddressInfo } from 'node:net';
import type { Server } from 'node:http';
import type { Env } from './config/env';
import type { AppContext } from './context';
import { Database } from './db/database';
import { SearchIndex } from './search/search-index';
import { allSearchDocs } from './search/documents';
import { searchFollowsChanges } from './search/follow-changes';
import { approvedResults } from './read-models/approved-results';
import { Mailer } from './mail/mailer';
import { MailCatcher } from './mail/mail-catcher';
import { LocalS3 } from './storage/local-s3';
import { ObjectStorage } from './storage/object-storage';
import { LocalOAuthProvider } from './auth/local-provider';
import { createApp } from './app';
import { User } from './models';

/** What the process entry hands in from above the server. */
export interface BootOptions {
  /**
   * Loads the invented demo data into an empty database (seed/load.ts). seed/ sits above the
   * server, so the entry (server/index.ts) passes it in; without it, nothing is loaded.
   */
  demoData?: (db: Database) => Promise<{ loaded: boolean; results: number }>;
}

export interface Running {
  ctx: AppContext;
  server: Server;
  url: string;
  oauthUrl?: string;
  smtpPort?: number;
  mailCatcher?: MailCatcher;
  stop: () => Promise<void>;
}

/**
 * Starts the whole product in one process: the local stand-ins (OAuth2 provider, mail catcher)
 * unless the environment points at hosted ones, the database (migrated, demo data loaded into an
 * empty one), the search index (built before listening) and the HTTP server.
 */
export async function boot(env: Env, log: (line: string) => void = console.log, options: BootOptions = {}): Promise<Running> {
  const db = new Database({
    storage: path.join(env.dataDir, 'edgeledger.sqlite'),
    url: env.DATABASE_URL,
    synchronous: env.SQLITE_SYNCHRONOUS,
  });
  await db.migrate();
  // Production never loads the invented demo data (loadEnv refuses SEED_DEMO there too).
  if (env.SEED_DEMO === 'auto' && !env.isProduction && options.demoData) {
    const seeded = await options.demoData(db);
    if (seeded.loaded) log(`Loaded the demo data (${seeded.results} invented results).`);
  }

  let provider: LocalOAuthProvider | undefined;
  let oauthUrl: string | undefined;
  let mailCatcher: MailCatcher | undefined;
  let smtpPort = env.SMTP_PORT;
  if (env.localProviders) {
    // Without `as`, the local provider signs in the first demo member, as a hosted one would
    // sign in whoever is logged in there.
    const firstMember = await User.findOne({ where: { role: 'member', banned: false }, order: [['id', 'ASC']] });
    provider = new LocalOAuthProvider(() => firstMember?.oauthSubject);
    oauthUrl = await provider.start(env.OAUTH_PORT);
  }
  // Production fails closed: loadEnv has required the hosted settings, and no stand-in starts
  // there whatever the settings say.
  if (!env.SMTP_HOST && !env.isProduction) {
    mailCatcher = new MailCatcher(env.dataDir);
    smtpPort = await mailCatcher.start(env.SMTP_PORT);
  }
  let localS3: LocalS3 | undefined;
  let s3Endpoint = env.S3_ENDPOINT;
  if (!s3Endpoint && !env.isProduction) {
    localS3 = new LocalS3(env.dataDir, env.S3_BUCKET);
    s3Endpoint = await localS3.start(env.S3_PORT);
  }
  if (!s3Endpoint) throw new Error('S3_ENDPOINT: required in production');
  const storage = new ObjectStorage({ endpoint: s3Endpoint, bucket: env.S3_BUCKET, region: env.S3_REGION, accessKeyId: env.S3_ACCESS_KEY, secretAccessKey: env.S3_SECRET_KEY });

  // The followers in this process build from the tables now, so they start at the newest change
  // (read before they build: what commits meanwhile is handed to them once they follow).
  await db.changes.startAtNewest();
  const search = new SearchIndex();
  const started = Date.now();
  await search.rebuild(allSearchDocs());
  const indexMs = Date.now() - started;
  // The comparison's live filters scan the approved results in memory: built before listening.
  approvedResults.reset();
  await approvedResults.ready();

  const mailer = new Mailer({ host: env.SMTP_HOST ?? '127.0.0.1', port: smtpPort, user: env.SMTP_USER, password: env.SMTP_PASSWORD, from: env.MAIL_FROM, local: !env.SMTP_HOST });
  const ctx: AppContext = {
    env,
    db,
    search,
    mailer,
    storage,
    oauth: {
      authorizeUrl: env.OAUTH_AUTHORIZE_URL ?? `${oauthUrl}/authorize`,
      tokenUrl: env.OAUTH_TOKEN_URL ?? `${oauthUrl}/token`,
      userinfoUrl: env.OAUTH_USERINFO_URL ?? `${oauthUrl}/userinfo`,
      clientId: env.OAUTH_CLIENT_ID,
      clientSecret: env.OAUTH_CLIENT_SECRET,
    },
    baseUrl: '',
  };
  // The index follows the change feed from here on: pages, published results, comparison cells.
  const stopSearchFollow = searchFollowsChanges(ctx);
  // Other processes' commits (and the command-line tools'): read from the `changes` table and
  // handed to the same followers as this process's own.
  const stopFollowingOthers = db.changes.follow();
  const app = createApp(ctx, { clientDir: path.resolve('dist'), mailCatcher });
  const server = await new Promise<Server>((resolve, reject) => {
    const s = app.listen(env.PORT, env.HOST, () => resolve(s));
    s.once('error', reject);
  });
  // From here on a stall of the loop is a request's (or a follower's) doing: counted for /api/health.
  watchEventLoop();
  // A slow client may not hold a socket: its headers within 10 s, its whole request within 30 s
  // (Node's defaults are 60 s and 5 minutes).
  server.headersTimeout = 10_000;
  server.requestTimeout = 30_000;
  const { port } = server.address() as AddressInfo;
  const url = `http://${env.HOST}:${port}`;
  ctx.baseUrl = env.PUBLIC_URL ?? url;

  log(`Search index: ${search.size} documents in ${indexMs} ms.`);
  if (oauthUrl) log(`Local OAuth2 provider at ${oauthUrl}`);
  if (mailCatcher) log(`Local mail catcher (SMTP) on 127.0.0.1:${smtpPort}; messages in ${mailCatcher.file}`);
  if (localS3) log(`Local S3 fake at ${s3Endpoint}; objects in ${localS3.directory}`);
  log(`Edgeledger ready at ${url}`);

  let stopping: Promise<void> | undefined;
  const stop = () =>
    (stopping ??= (async () => {
      // Stop accepting, let the requests under way finish, and close each keep-alive
      // connection as soon as it falls idle (server.close() alone waits for their timeout);
      // after 10 s whatever is left is cut.
      await new Promise<void>((resolve) => {
        const idle = setInterval(() => server.closeIdleConnections(), 50);
        const deadline = setTimeout(() => server.closeAllConnections(), 10_000);
        server.close(() => {
          clearInterval(idle);
          clearTimeout(deadline);
          resolve();
        });
        server.closeIdleConnections();
      });
      await stopFollowingOthers();
      stopSearchFollow();
      await db.close();
      mailer.close();
      await provider?.stop();
      await mailCatcher?.stop();
      storage.close();
      await localS3?.stop();
    })());
  return { ctx, server, url, oauthUrl, smtpPort, mailCatcher, stop };
}
