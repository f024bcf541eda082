import fs from 'node:fs';
import http from 'node:http';
import type net from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { chromium, type BrowserContext, type Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it, inject } from 'vitest';
import { copyBaseDatabase, testRateLimits } from '../setup/test-server';
import { signingInThrough, startServerProcess, type ServerProcess } from '../setup/server-process';
import { CHROMIUM, CHROMIUM_ARGS } from '../setup/e2e-app';

/**
 * With TEST_DATABASE=postgres (`npm run test:postgres`), as an operator runs it: two server
 * processes (A and B) on one PostgreSQL database behind a load balancer, here a small proxy that
 * hands each request to the next process in turn, and a person in headless Chromium who signs in,
 * posts a result, signs out; a moderator who approves it; the comparison counting it; sign-out.
 * Every page's requests alternate between A and B, so each step works only if either process can
 * serve any request. Builds nothing: `dist/` must exist (`npx vite build`).
 */
const clusterUrl = inject('postgresUrl');

/** A round-robin proxy in front of `targets`: request i goes to target i mod n; `served` counts each target's requests. */
function roundRobin(targets: string[]): Promise<{ url: string; served: number[]; close: () => Promise<void> }> {
  const served = targets.map(() => 0);
  let next = 0;
  const proxy = http.createServer((req, res) => {
    const i = next++ % targets.length;
    served[i] += 1;
    const target = new URL(targets[i]);
    const upstream = http.request({ host: target.hostname, port: target.port, method: req.method, path: req.url, headers: req.headers }, (answer) => {
      res.writeHead(answer.statusCode ?? 502, answer.headers);
      answer.pipe(res);
    });
    upstream.on('error', (err) => res.headersSent ? res.destroy(err) : res.writeHead(502).end(String(err)));
    req.pipe(upstream);
  });
  const sockets = new Set<net.Socket>();
  proxy.on('connection', (s) => (sockets.add(s), s.on('close', () => sockets.delete(s))));
  return new Promise((resolve) =>
    proxy.listen(0, '127.0.0.1', () => {
      const { port } = proxy.address() as net.AddressInfo;
      const close = () => new Promise<void>((done) => (sockets.forEach((s) => s.destroy()), proxy.close(() => done())));
      resolve({ url: `http://127.0.0.1:${port}`, served, close });
    }),
  );
}

interface CompareRow {
  gritBand: { loUm: number; hiUm: number };
  n: number;
}

/** Same wording as the client's formatMicrometres, so a grit band can be found on the page. */
const um = (x: number) => (x < 1 ? x.toFixed(2) : x < 100 ? x.toFixed(1) : Math.round(x).toString());

describe.runIf(clusterUrl)('a member’s and a moderator’s journeys through two processes behind a round-robin proxy', () => {
  const dirs: string[] = [];
  let database: Awaited<ReturnType<typeof copyBaseDatabase>>;
  let a: ServerProcess;
  let b: ServerProcess;
  let proxy: Awaited<ReturnType<typeof roundRobin>>;
  let context: BrowserContext;
  let page: Page;
  const api = async <T,>(pathname: string) => (await (await fetch(`${proxy.url}${pathname}`)).json()) as T;

  beforeAll(async () => {
    if (!fs.existsSync(path.resolve('dist/index.html'))) throw new Error('dist/index.html is missing: build the client first (npx vite build); this test builds nothing');
    const dataDir = () => {
      const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'edgeledger-rr-'));
      dirs.push(dir);
      return dir;
    };
    const first = dataDir();
    database = await copyBaseDatabase(first);
    const env = { LOG_LEVEL: 'error', ...testRateLimits, ...database.env };
    a = await startServerProcess({ ...env, DATA_DIR: first });
    b = await startServerProcess({ ...env, DATA_DIR: dataDir(), ...signingInThrough(a) });
    proxy = await roundRobin([a.url, b.url]);
    context = await chromium.launchPersistentContext(dataDir(), { executablePath: CHROMIUM, headless: true, args: CHROMIUM_ARGS, viewport: { width: 1280, height: 900 } });
    page = context.pages()[0] ?? (await context.newPage());
    page.setDefaultTimeout(20_000);
  }, 200_000);
  afterAll(async () => {
    await context?.close().catch(() => undefined);
    await proxy?.close();
    await b?.stop();
    await a?.stop();
    await database?.drop();
    for (const dir of dirs) fs.rmSync(dir, { recursive: true, force: true });
  });

  it('signs in, posts a result, approves it as a moderator, finds it on the comparison, signs out', async () => {
    const accounts = await api<{ handle: string; displayName?: string; role: string }[]>('/auth/demo-accounts');
    const member = accounts.find((x) => x.role === 'member')!;
    const moderator = accounts.find((x) => x.role === 'moderator')!;
    const method = (await api<{ items: { slug: string; retentionMedium: string | null }[] }>('/api/methods')).items.find((m) => !m.retentionMedium)!;
    const cbn = (await api<{ items: { slug: string; material: string }[] }>('/api/abrasives')).items.find((x) => x.material === 'cbn')!;
    const comparePath = `/compare?method=${method.slug}&steel=aisi-d2&material=cbn`;
    const baseline = (await api<{ rows: CompareRow[] }>(`/api${comparePath}`)).rows;

    // A member signs in from the sign-in page and posts a result.
    await page.goto(`${proxy.url}/sign-in?returnTo=${encodeURIComponent('/results/new')}`);
    await page.getByRole('link', { name: `Sign in as ${member.displayName ?? member.handle}` }).click();
    await page.waitForURL(/\/results\/new$/);
    await page.getByLabel('Steel', { exact: true }).selectOption('aisi-d2');
    await page.getByLabel('Hardness', { exact: true }).fill('61');
    await page.getByLabel('Hardness scale').selectOption('HRC');
    await page.getByLabel('Final abrasive', { exact: true }).selectOption(cbn.slug);
    await page.getByLabel('Grit grade').fill('B46');
    await page.getByLabel('Degrees per side').check();
    await page.getByLabel('Angle per side (°)').fill('15');
    await page.getByLabel('Sharpness method').selectOption(method.slug);
    await page.getByLabel('Readings (g)').fill('142, 150, 138');
    await page.getByRole('button', { name: 'Submit for review' }).click();
    await page.waitForURL(/\/results\/\d+$/);
    const resultId = Number(new URL(page.url()).pathname.split('/').pop());
    await page.getByText('Awaiting review').first().waitFor();
    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.getByRole('banner').getByRole('link', { name: 'Sign in' }).waitFor();
    // Signed out through one process, the cookie is signed out on both: two requests in a row reach A and B.
    for (let i = 0; i < 2; i += 1) expect(((await (await page.request.get(`${proxy.url}/api/session`)).json()) as { user: unknown }).user).toBeNull();

    // A moderator approves it at the review desk.
    await page.waitForLoadState('networkidle');
    await page.goto(`${proxy.url}/auth/signin?as=${encodeURIComponent(moderator.handle)}&returnTo=${encodeURIComponent('/review')}`);
    await page.waitForURL(/\/review$/);
    const item = page.getByRole('link', { name: new RegExp(`#${resultId} `) });
    await item.click();
    const opened = page.getByRole('region', { name: new RegExp(`^Result ${resultId}:`) });
    await opened.getByRole('button', { name: 'Approve' }).click();
    await item.waitFor({ state: 'detached' });

    // The comparison counts it, on whichever process answers: reloaded until it does (the other
    // process follows the approval from the changes table), then twice more, so A and B both answer.
    const stored = await api<{ status: string; derived: { gritBand: { loUm: number; hiUm: number } } }>(`/api/results/${resultId}`);
    expect(stored.status).toBe('approved');
    const band = stored.derived.gritBand;
    const before = baseline.find((r) => Math.abs(r.gritBand.loUm - band.loUm) < 1e-9)?.n ?? 0;
    const counted = async () => {
      await page.goto(`${proxy.url}${comparePath}`);
      const row = page.getByRole('region', { name: 'Comparison table' }).getByRole('row').filter({ hasText: `${um(band.loUm)}–${um(band.hiUm)}` });
      await row.waitFor();
      return Number((await row.locator('td[data-label="n"]').textContent())?.replace(/\D+/g, ''));
    };
    await expect.poll(counted, { timeout: 10_000 }).toBe(before + 1);
    for (let i = 0; i < 2; i += 1) expect(await counted()).toBe(before + 1);

    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.getByRole('banner').getByRole('link', { name: 'Sign in' }).waitFor();
    // Both processes served the journey's requests.
    expect(Math.min(...proxy.served)).toBeGreaterThan(10);
    console.log(`round-robin proxy: ${proxy.served[0]} requests to A, ${proxy.served[1]} to B`);
  }, 180_000);
});
