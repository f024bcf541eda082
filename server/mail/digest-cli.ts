import path from 'node:path';
import { loadEnv } from '../config/env';
import { Database } from '../db/database';
import { Mailer } from './mailer';
import { sendDigest } from '../commands/send-digest';

/**
 * `npm run digest`: sends the weekly digest to followers. Outside production it sends to the
 * local mail catcher of the running server (SMTP_PORT); run it weekly from cron or a scheduler.
 */
const env = loadEnv();
const db = new Database({ storage: path.join(env.dataDir, 'edgeledger.sqlite'), url: env.DATABASE_URL, synchronous: env.SQLITE_SYNCHRONOUS });
const mailer = new Mailer({ host: env.SMTP_HOST ?? '127.0.0.1', port: env.SMTP_PORT, user: env.SMTP_USER, password: env.SMTP_PASSWORD, from: env.MAIL_FROM, local: !env.SMTP_HOST });
try {
  await db.migrate();
  const run = await sendDigest({ env, db, mailer, baseUrl: env.PUBLIC_URL ?? `http://${env.HOST}:${env.PORT}` });
  console.log(`Digest: ${run.followers} followers, ${run.sent} messages sent, ${run.results} results listed.`);
} catch (err) {
  const refused = (err as { code?: string }).code === 'ECONNREFUSED' || (err as { code?: string }).code === 'ESOCKET';
  console.error(refused ? `Could not reach the SMTP server at ${env.SMTP_HOST ?? '127.0.0.1'}:${env.SMTP_PORT}; is the server (and its local mail catcher) running?` : err);
  process.exitCode = 1;
} finally {
  mailer.close();
  await db.close();
}
