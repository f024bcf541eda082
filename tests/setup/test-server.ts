import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { inject } from 'vitest';
import request from 'supertest';
import pg from 'pg';
import { loadEnv } from '../../server/config/env';
import { boot, type Running } from '../../server/boot';

/** Rate limits high enough that a test file's many sign-ins and posts never meet them; tests of the limits pass their own. */
export const testRateLimits = {
  RATE_LIMIT_SIGNIN_PER_MIN: '100000',
  RATE_LIMIT_POSTS_PER_MIN: '100000',
  RATE_LIMIT_UPLOADS_PER_MIN: '100000',
  RATE_LIMIT_SEARCH_PER_MIN: '100000',
};

/**
 * Every setting production requires, pointing at addresses where nothing listens (the server
 * reaches them only when someone signs in, sends mail or uploads a photo).
 */
export const productionEnv: Record<string, string> = {
  NODE_ENV: 'production',
  SESSION_SECRET: 'a-production-secret-for-tests-only-0123456789',
  PUBLIC_URL: 'https://edgeledger.example',
  OAUTH_AUTHORIZE_URL: 'https://id.edgeledger.example/authorize',
  OAUTH_TOKEN_URL: 'https://id.edgeledger.example/token',
  OAUTH_USERINFO_URL: 'https://id.edgeledger.example/userinfo',
  OAUTH_CLIENT_ID: 'edgeledger-tests',
  OAUTH_CLIENT_SECRET: 'a-client-secret-for-tests-only',
  SMTP_HOST: 'smtp.edgeledger.example',
  S3_ENDPOINT: 'https://s3.edgeledger.example',
  S3_ACCESS_KEY: 'tests-access-key',
  S3_SECRET_KEY: 'tests-secret-key',
};

/** Runs one statement on the cluster's maintenance database (TEST_DATABASE=postgres). */
export async function onCluster(clusterUrl: string, sql: string): Promise<void> {
  const client = new pg.Client({ connectionString: `${clusterUrl}postgres` });
  await client.connect();
  try {
    await client.query(sql);
  } finally {
    await client.end();
  }
}

let copies = 0;

/**
 * A fresh copy of the migrated demo database for one server: on SQLite the base file copied into
 * `dataDir`; with TEST_DATABASE=postgres a new database of the run's cluster made from the base
 * (`CREATE DATABASE … TEMPLATE`), named in the returned environment (DATABASE_URL). `drop`
 * removes it once the server has stopped.
 */
export async function copyBaseDatabase(dataDir: string): Promise<{ env: Record<string, string>; drop: () => Promise<void> }> {
  const clusterUrl = inject('postgresUrl');
  if (!clusterUrl) {
    fs.copyFileSync(inject('baseDatabase'), path.join(dataDir, 'edgeledger.sqlite'));
    return { env: {}, drop: async () => undefined };
  }
  const name = `edgeledger_${process.pid}_${(copies += 1)}`;
  // Two copies begun at the same moment can meet on the template; the second one tries again.
  for (let attempt = 1; ; attempt += 1) {
    try {
      await onCluster(clusterUrl, `CREATE DATABASE "${name}" TEMPLATE edgeledger_base`);
      break;
    } catch (err) {
      if (attempt >= 20 || !/being accessed by other users/.test((err as Error).message)) throw err;
      await new Promise((resolve) => setTimeout(resolve, 50 * attempt));
    }
  }
  return { env: { DATABASE_URL: `${clusterUrl}${name}` }, drop: () => onCluster(clusterUrl, `DROP DATABASE IF EXISTS "${name}" WITH (FORCE)`) };
}

/**
 * Starts the real server (with the real local OAuth2 provider and mail catcher) on free
 * loopback ports, over a fresh copy of the migrated demo database.
 */
export async function startTestServer(envOverrides: Record<string, string> = {}): Promise<Running & { dataDir: string }> {
  const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'edgeledger-test-'));
  const database = await copyBaseDatabase(dataDir);
  const env = loadEnv({ NODE_ENV: 'test', PORT: '0', OAUTH_PORT: '0', SMTP_PORT: '0', DATA_DIR: dataDir, SEED_DEMO: 'never', ...testRateLimits, ...database.env, ...envOverrides });
  const running = await boot(env, () => undefined);
  return {
    ...running,
    dataDir,
    stop: async () => {
      await running.stop();
      await database.drop();
      fs.rmSync(dataDir, { recursive: true, force: true });
    },
  };
}

/** A demo account's handle for a role, read from the server's own list. */
export async function demoHandle(url: string, role: string, skip = 0): Promise<string> {
  const res = await request(url).get('/auth/demo-accounts').expect(200);
  const match = (res.body as { handle: string; role: string }[]).filter((a) => a.role === role)[skip];
  if (!match) throw new Error(`no demo account with role ${role}`);
  return match.handle;
}

/**
 * Signs `handle` in through the whole authorization-code round trip (app → provider → app) and
 * returns a cookie-keeping agent with the session's CSRF token.
 */
export async function signIn(url: string, handle: string) {
  const agent = request.agent(url);
  const start = await agent.get(`/auth/signin?as=${encodeURIComponent(handle)}`).expect(302);
  const authorize = await fetch(start.headers.location, { redirect: 'manual' });
  const callback = new URL(authorize.headers.get('location')!);
  await agent.get(`${callback.pathname}${callback.search}`).expect(302);
  const session = await agent.get('/api/session').expect(200);
  return { agent, csrf: session.body.csrfToken as string, user: session.body.user as { handle: string; role: string } };
}
