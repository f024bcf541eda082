/**
 * Production fails closed: with NODE_ENV=production the server refuses to start without each
 * hosted setting, naming it, refuses every development credential, and never starts a local
 * stand-in (OAuth2 provider, mail catcher, S3 fake) or loads the invented demo data.
 */
import fs from 'node:fs';
import net from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { loadEnv } from '../../server/config/env';
import { boot, type Running } from '../../server/boot';
import { User } from '../../server/models';
import { productionEnv } from '../setup/test-server';

describe('production start-up refuses each missing or unsafe setting, naming it', () => {
  it('starts with every setting given', () => {
    expect(loadEnv(productionEnv).isProduction).toBe(true);
    expect(loadEnv(productionEnv).localProviders).toBe(false);
  });

  const required = ['SESSION_SECRET', 'PUBLIC_URL', 'OAUTH_AUTHORIZE_URL', 'OAUTH_TOKEN_URL', 'OAUTH_USERINFO_URL', 'OAUTH_CLIENT_ID', 'OAUTH_CLIENT_SECRET', 'SMTP_HOST', 'S3_ENDPOINT', 'S3_ACCESS_KEY', 'S3_SECRET_KEY'];
  it.each(required)('refuses to start without %s', (name) => {
    const env = { ...productionEnv };
    delete env[name];
    expect(() => loadEnv(env)).toThrow(new RegExp(`^Refusing to start with NODE_ENV=production:\\n(.*\\n)*  ${name}: required in production`));
  });

  it.each([
    ['SESSION_SECRET', 'short-but-16-chars', /SESSION_SECRET: at least 32 characters/],
    ['PUBLIC_URL', 'http://edgeledger.example', /PUBLIC_URL: must be an https:\/\/ address/],
    ['OAUTH_CLIENT_ID', 'edgeledger-local', /OAUTH_CLIENT_ID: the development value is refused/],
    ['OAUTH_CLIENT_SECRET', 'edgeledger-local-secret', /OAUTH_CLIENT_SECRET: the development value is refused/],
    ['S3_ACCESS_KEY', 'S3RVER', /S3_ACCESS_KEY: the development value is refused/],
    ['S3_SECRET_KEY', 'S3RVER', /S3_SECRET_KEY: the development value is refused/],
    ['SEED_DEMO', 'auto', /SEED_DEMO: the invented demo data is never loaded in production/],
  ])('refuses %s=%s', (name, value, message) => {
    expect(() => loadEnv({ ...productionEnv, [name]: value })).toThrow(message);
  });

  it('names every problem at once', () => {
    let message = '';
    try {
      loadEnv({ NODE_ENV: 'production' });
    } catch (err) {
      message = (err as Error).message;
    }
    for (const name of required) expect(message).toContain(`  ${name}: `);
  });
});

/** Whether anything accepts a TCP connection on 127.0.0.1:port. */
function listening(port: number): Promise<boolean> {
  return new Promise((resolve) => {
    const socket = net.connect(port, '127.0.0.1');
    socket.once('connect', () => (socket.destroy(), resolve(true)));
    socket.once('error', () => resolve(false));
  });
}

/** A free loopback port (bound, read, released). */
function freePort(): Promise<number> {
  return new Promise((resolve) => {
    const probe = net.createServer().listen(0, '127.0.0.1', () => {
      const { port } = probe.address() as net.AddressInfo;
      probe.close(() => resolve(port));
    });
  });
}

describe('a production server on an empty database', () => {
  let running: Running;
  let dataDir: string;
  let oauthPort: number;
  let smtpPort: number;
  beforeAll(async () => {
    dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'edgeledger-production-'));
    [oauthPort, smtpPort] = [await freePort(), await freePort()];
    running = await boot(loadEnv({ ...productionEnv, PORT: '0', OAUTH_PORT: String(oauthPort), SMTP_PORT: String(smtpPort), DATA_DIR: dataDir, LOG_LEVEL: 'silent' }), () => undefined);
  });
  afterAll(async () => {
    await running?.stop();
    fs.rmSync(dataDir, { recursive: true, force: true });
  });

  it('starts no stand-in: nothing listens on the OAuth2 or SMTP ports, no S3 fake runs', async () => {
    expect(running.oauthUrl).toBeUndefined();
    expect(running.mailCatcher).toBeUndefined();
    expect(await listening(oauthPort)).toBe(false);
    expect(await listening(smtpPort)).toBe(false);
    expect(fs.existsSync(path.join(dataDir, 's3'))).toBe(false);
  });

  it('loads no demo data and offers no demo account', async () => {
    expect(await User.count()).toBe(0);
    await request(running.url).get('/auth/demo-accounts').expect(404);
  });

  it('sends sign-in to the hosted provider with a redirect_uri from PUBLIC_URL, whatever the Host header says', async () => {
    const res = await request(running.url).get('/auth/signin').set('Host', 'attacker.example').expect(302);
    const location = new URL(res.headers.location);
    expect(location.origin + location.pathname).toBe('https://id.edgeledger.example/authorize');
    expect(location.searchParams.get('redirect_uri')).toBe('https://edgeledger.example/auth/callback');
  });

  it('holds no slow client for a minute: headers within 10 s, a whole request within 30 s', () => {
    expect(running.server.headersTimeout).toBe(10_000);
    expect(running.server.requestTimeout).toBe(30_000);
  });
});
