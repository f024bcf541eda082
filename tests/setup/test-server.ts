import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { inject } from 'vitest';
import request from 'supertest';
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

/**
 * Starts the real server (with the real local OAuth2 provider and mail catcher) on free
 * loopback ports, over a fresh copy of the migrated demo database.
 */
export async function startTestServer(envOverrides: Record<string, string> = {}): Promise<Running & { dataDir: string }> {
  const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'edgeledger-test-'));
  fs.copyFileSync(inject('baseDatabase'), path.join(dataDir, 'edgeledger.sqlite'));
  const env = loadEnv({ NODE_ENV: 'test', PORT: '0', OAUTH_PORT: '0', SMTP_PORT: '0', DATA_DIR: dataDir, SEED_DEMO: 'never', ...testRateLimits, ...envOverrides });
  const running = await boot(env, () => undefined);
  return {
    ...running,
    dataDir,
    stop: async () => {
      await running.stop();
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
