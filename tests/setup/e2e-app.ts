import { spawn, type ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import net from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { chromium, type BrowserContext, type Page } from 'playwright-core';
import { afterAll, beforeAll } from 'vitest';

export const CHROMIUM = '/usr/bin/chromium';
// Without the background-networking flags Chromium keeps dialling out on a closed network.
export const CHROMIUM_ARGS = ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'];

/** A free loopback port in [from, to], found by trying to listen. */
async function portIn(from: number, to: number): Promise<number> {
  for (let port = from; port <= to; port += 1) {
    const free = await new Promise<boolean>((resolve) => {
      const srv = net.createServer();
      srv.once('error', () => resolve(false));
      srv.listen(port, '127.0.0.1', () => srv.close(() => resolve(true)));
    });
    if (free) return port;
  }
  throw new Error(`no free port in ${from}–${to}`);
}

/** The real server (built client, fresh data folder) and a headless Chromium pointed at it. */
export interface E2eApp {
  base: string;
  context: BrowserContext;
  page: Page;
  /** Signs `handle` in through the OAuth2 round trip and waits to land on `returnTo`. */
  signInAs: (handle: string, returnTo: string) => Promise<void>;
  /** Signs out with the header's button and waits for its "Sign in" link. */
  signOut: () => Promise<void>;
  /** Everything the server printed so far, for failure messages. */
  output: () => string;
  stop: () => Promise<void>;
}

/**
 * Starts `npx tsx server/index.ts` on free ports within `ports` (each suite has its own range,
 * so suites can run side by side), waits for its ready line, and opens Chromium. Builds nothing:
 * `dist/` must exist (`npm test` builds it first).
 */
export async function startE2eApp(name: string, ports: [number, number], viewport = { width: 1280, height: 900 }): Promise<E2eApp> {
  if (!fs.existsSync(path.resolve('dist/index.html'))) throw new Error('dist/index.html is missing: build the client first (npx vite build); this test builds nothing');
  if (!fs.existsSync(CHROMIUM)) throw new Error(`${CHROMIUM} is missing: apt-get install -y chromium`);
  const [from, to] = ports;
  const port = await portIn(from, to);
  const oauthPort = await portIn(port + 1, to);
  const smtpPort = await portIn(oauthPort + 1, to);
  const s3Port = await portIn(smtpPort + 1, to);
  const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), `edgeledger-e2e-${name}-`));
  let output = '';
  const server: ChildProcess = spawn('npx', ['tsx', 'server/index.ts'], {
    cwd: process.cwd(),
    env: { ...process.env, NODE_ENV: 'test', LOG_LEVEL: 'info', PORT: String(port), OAUTH_PORT: String(oauthPort), SMTP_PORT: String(smtpPort), S3_PORT: String(s3Port), DATA_DIR: dataDir },
    detached: true,
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  await new Promise<void>((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error(`the server did not get ready in 60 s:\n${output}`)), 60_000);
    server.stdout!.on('data', (chunk: Buffer) => {
      output += chunk.toString();
      if (output.includes('Edgeledger ready at')) {
        clearTimeout(timer);
        resolve();
      }
    });
    server.stderr!.on('data', (chunk: Buffer) => (output += chunk.toString()));
    server.once('exit', (code) => {
      clearTimeout(timer);
      reject(new Error(`the server exited (${code}) before it was ready:\n${output}`));
    });
  });
  const profileDir = fs.mkdtempSync(path.join(os.tmpdir(), 'edgeledger-e2e-chromium-'));
  const context = await chromium.launchPersistentContext(profileDir, { executablePath: CHROMIUM, headless: true, args: CHROMIUM_ARGS, viewport, acceptDownloads: true });
  const page = context.pages()[0] ?? (await context.newPage());
  page.setDefaultTimeout(20_000);

  const stop = async () => {
    await context.close().catch(() => undefined);
    if (server.pid && server.exitCode === null) {
      const exited = new Promise((resolve) => server.once('exit', resolve));
      const kill = (signal: NodeJS.Signals) => {
        try {
          process.kill(-server.pid!, signal);
        } catch {
          // already gone
        }
      };
      kill('SIGTERM');
      if ((await Promise.race([exited, new Promise((r) => setTimeout(r, 10_000, 'timeout'))])) === 'timeout') kill('SIGKILL');
    }
    for (const dir of [profileDir, dataDir]) fs.rmSync(dir, { recursive: true, force: true });
  };
  const base = `http://127.0.0.1:${port}`;
  const signInAs = async (handle: string, returnTo: string) => {
    await page.waitForLoadState('networkidle');
    await page.goto(`${base}/auth/signin?as=${encodeURIComponent(handle)}&returnTo=${encodeURIComponent(returnTo)}`);
    await page.waitForURL(new RegExp(`${returnTo.replace(/[?]/g, '\\?')}$`));
  };
  const signOut = async () => {
    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.getByRole('banner').getByRole('link', { name: 'Sign in' }).waitFor();
  };
  return { base, context, page, signInAs, signOut, output: () => output, stop };
}

/** A demo account as GET /auth/demo-accounts lists it. */
export interface DemoAccount {
  handle: string;
  role: string;
  displayName?: string;
}

/**
 * A suite's app, started before its tests on the suite's own port range and stopped after them:
 * call once at the top of a suite and read `suite.app` (its page, base URL) inside the tests.
 */
export function e2eSuite(name: string, ports: [number, number]) {
  const suite = {
    app: undefined as unknown as E2eApp,
    signInAs: (handle: string, returnTo: string) => suite.app.signInAs(handle, returnTo),
    signOut: () => suite.app.signOut(),
  };
  beforeAll(async () => {
    suite.app = await startE2eApp(name, ports);
  }, 90_000);
  afterAll(() => suite.app?.stop(), 30_000);
  return suite;
}
