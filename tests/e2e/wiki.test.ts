/**
 * Browser test of the reference wiki (issue 4) on the real stack: the built client served by the
 * real server (local OAuth2 provider, mail catcher) over a fresh data folder, in headless Debian
 * Chromium. A member proposes an edit of a steel page, a moderator approves it on the review
 * desk, and the page’s history shows the change side by side; a moderator starts a new page from
 * a list (issue 15). Elements are found by role and label.
 *
 * It builds nothing: `dist/` must exist (`npx vite build`). Ports are taken from 3400–3499.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import net from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { chromium, type BrowserContext, type Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';

const CHROMIUM = '/usr/bin/chromium';
// Without the background-networking flags Chromium keeps dialling out on a closed network.
const CHROMIUM_ARGS = ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'];

/** A free loopback port in 3400–3499, the range this test may use. */
async function freePortInRange(taken: number[]): Promise<number> {
  for (let port = 3400 + Math.floor(Math.random() * 50); port < 3500; port++) {
    if (taken.includes(port)) continue;
    const free = await new Promise<boolean>((resolve) => {
      const srv = net.createServer();
      srv.once('error', () => resolve(false));
      srv.listen(port, '127.0.0.1', () => srv.close(() => resolve(true)));
    });
    if (free) return port;
  }
  throw new Error('no free port in 3400–3499');
}

/** Letters only, so the search index and the diff keep it as one word. */
const randomWord = (n: number) => Array.from({ length: n }, () => String.fromCharCode(97 + Math.floor(Math.random() * 26))).join('');

let server: ChildProcess | undefined;
let serverOutput = '';
let dataDir = '';
let profileDir = '';
let base = '';
let context: BrowserContext | undefined;
let page: Page;

interface Account {
  handle: string;
  displayName?: string;
  role: string;
}

async function api<T>(pathname: string): Promise<T> {
  const res = await fetch(`${base}${pathname}`);
  if (!res.ok) throw new Error(`GET ${pathname} answered ${res.status}`);
  return (await res.json()) as T;
}

/** Signs `handle` in through the OAuth2 round trip and lands on `returnTo`. */
async function signInAs(handle: string, returnTo: string) {
  await page.waitForLoadState('networkidle');
  await page.goto(`${base}/auth/signin?as=${encodeURIComponent(handle)}&returnTo=${encodeURIComponent(returnTo)}`);
  await page.waitForURL((url) => url.pathname === returnTo);
}

async function signOut() {
  await page.getByRole('button', { name: 'Sign out' }).click();
  await page.getByRole('banner').getByRole('link', { name: 'Sign in' }).waitFor();
}

beforeAll(async () => {
  if (!fs.existsSync(path.resolve('dist/index.html'))) throw new Error('dist/index.html is missing: build the client first (npx vite build); this test builds nothing');
  if (!fs.existsSync(CHROMIUM)) throw new Error(`${CHROMIUM} is missing: apt-get install -y chromium`);
  const port = await freePortInRange([]);
  const oauthPort = await freePortInRange([port]);
  const smtpPort = await freePortInRange([port, oauthPort]);
  dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'edgeledger-wiki-e2e-data-'));
  base = `http://127.0.0.1:${port}`;
  server = spawn('npx', ['tsx', 'server/index.ts'], {
    cwd: process.cwd(),
    env: { ...process.env, NODE_ENV: 'test', LOG_LEVEL: 'info', PORT: String(port), OAUTH_PORT: String(oauthPort), SMTP_PORT: String(smtpPort), DATA_DIR: dataDir },
    // Its own process group, so npx, tsx and node stop together by this one id.
    detached: true,
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  await new Promise<void>((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error(`the server did not get ready in 60 s:\n${serverOutput}`)), 60_000);
    server!.stdout!.on('data', (chunk: Buffer) => {
      serverOutput += chunk.toString();
      if (serverOutput.includes('Edgeledger ready at')) {
        clearTimeout(timer);
        resolve();
      }
    });
    server!.stderr!.on('data', (chunk: Buffer) => (serverOutput += chunk.toString()));
    server!.once('exit', (code) => {
      clearTimeout(timer);
      reject(new Error(`the server exited (${code}) before it was ready:\n${serverOutput}`));
    });
  });
  profileDir = fs.mkdtempSync(path.join(os.tmpdir(), 'edgeledger-wiki-e2e-chromium-'));
  context = await chromium.launchPersistentContext(profileDir, { executablePath: CHROMIUM, headless: true, args: CHROMIUM_ARGS, viewport: { width: 1280, height: 900 } });
  page = context.pages()[0] ?? (await context.newPage());
  page.setDefaultTimeout(15_000);
}, 90_000);

afterAll(async () => {
  await context?.close().catch(() => undefined);
  if (server?.pid && server.exitCode === null) {
    const exited = new Promise((resolve) => server!.once('exit', resolve));
    try {
      process.kill(-server.pid, 'SIGTERM');
    } catch {
      // already gone
    }
    if ((await Promise.race([exited, new Promise((r) => setTimeout(r, 10_000, 'timeout'))])) === 'timeout') {
      try {
        process.kill(-server.pid, 'SIGKILL');
      } catch {
        // already gone
      }
    }
  }
  for (const dir of [profileDir, dataDir]) if (dir) fs.rmSync(dir, { recursive: true, force: true });
}, 30_000);

describe('the reference wiki in a browser', () => {
  const marker = `wikimark${randomWord(8)}`;
  const summary = `Upper hardness and a note (${marker})`;

  it('a member proposes an edit, a moderator approves it on the review desk, and the history shows the diff', async () => {
    const accounts = await api<Account[]>('/auth/demo-accounts');
    const member = accounts.find((a) => a.role === 'member')!;
    const moderator = accounts.find((a) => a.role === 'moderator')!;
    const before = await api<{ revision: number; revisionNumber: number; hardnessHrc: { min: number; max: number } }>('/api/steels/aisi-d2');

    // The member opens the page and its edit form.
    await signInAs(member.handle, '/steels/aisi-d2');
    await page.getByRole('link', { name: 'Propose an edit' }).click();
    await page.waitForURL(/\/steels\/aisi-d2\/edit$/);
    const upper = page.getByLabel('To (HRC)');
    await upper.waitFor();
    expect(await upper.inputValue()).toBe(String(before.hardnessHrc.max));
    // The form checks as one types, with the server's schema.
    await upper.fill('90');
    await upper.blur();
    await page.getByText('At most 72 HRC').waitFor();
    await upper.fill('63');
    await page.getByText('At most 72 HRC').waitFor({ state: 'detached' });

    const text = page.getByRole('textbox', { name: 'Notes' });
    await text.click();
    await page.keyboard.press('Control+End');
    await page.keyboard.press('Enter');
    await page.keyboard.type(`Edges ground on CBN hold up well; ${marker} noted on the bench.`);
    await page.getByLabel('Summary of your changes').fill(summary);
    await page.getByRole('button', { name: 'Propose this edit' }).click();
    await page.getByText('Thank you: your edit is waiting for review.').waitFor();

    // Not live yet.
    expect((await api<{ revision: number }>('/api/steels/aisi-d2')).revision).toBe(before.revision);
    await signOut();

    // The moderator finds it on the review desk, reads the diff and approves.
    await signInAs(moderator.handle, '/review');
    const desk = page.getByRole('region', { name: /^Page edits awaiting review/ });
    await desk.getByRole('button', { name: new RegExp(marker) }).click();
    const hardnessDiff = page.getByRole('table', { name: 'Changes to Typical hardness (HRC)' });
    await hardnessDiff.waitFor();
    expect(await hardnessDiff.locator('del').allTextContents()).toContain(String(before.hardnessHrc.max));
    expect(await hardnessDiff.locator('ins').allTextContents()).toContain('63');
    const textDiff = page.getByRole('table', { name: 'Changes to the text' });
    expect((await textDiff.locator('ins').allTextContents()).join(' ')).toContain(marker);
    await page.getByRole('button', { name: 'Approve edit' }).click();
    await desk.getByRole('button', { name: new RegExp(marker) }).waitFor({ state: 'detached' });

    // Live at once: the page shows it, and search finds it without a restart.
    const after = await api<{ revision: number; hardnessHrc: { max: number }; bodyHtml: string }>('/api/steels/aisi-d2');
    expect(after.revision).toBeGreaterThan(before.revision);
    expect(after.hardnessHrc.max).toBe(63);
    expect(after.bodyHtml).toContain(marker);
    const hits = await api<{ hits: { slug?: string }[] }>(`/api/search?q=${marker}`);
    expect(hits.hits.map((h) => h.slug)).toContain('aisi-d2');

    // The history lists both revisions, and comparing them shows the change side by side.
    await page.goto(`${base}/steels/aisi-d2`);
    await page.getByText(marker).first().waitFor();
    await page.getByRole('link', { name: 'History' }).click();
    await page.waitForURL(/\/steels\/aisi-d2\/history$/);
    const history = page.getByRole('table', { name: /Revisions of AISI D2/ });
    await history.getByRole('row', { name: new RegExp(marker) }).waitFor();
    expect(await history.getByRole('row', { name: new RegExp(marker) }).textContent()).toContain(member.handle);
    await page.getByRole('button', { name: 'Compare the selected revisions' }).click();
    await page.waitForURL(new RegExp(`/history/compare\\?from=${before.revision}&to=${after.revision}$`));
    const compared = page.getByRole('table', { name: 'Changes to the text' });
    await compared.waitFor();
    expect((await compared.locator('ins').allTextContents()).join(' ')).toContain(marker);
    expect(await page.getByRole('table', { name: 'Changes to Typical hardness (HRC)' }).locator('ins').allTextContents()).toContain('63');
    // The old revision is still there, whole.
    // Links keep the revision's id; the page names it by its number on the page.
    await page.goto(`${base}/steels/aisi-d2/revisions/${before.revision}`);
    await page.getByRole('heading', { name: `AISI D2, revision ${before.revisionNumber}` }).waitFor();
    expect(await page.getByText(marker).count()).toBe(0);
    await signOut();
  }, 90_000);

  it('a second save of the same page is refused with the other edit shown, and carries on merged', async () => {
    const accounts = await api<Account[]>('/auth/demo-accounts');
    const moderator = accounts.find((a) => a.role === 'moderator')!;
    await signInAs(moderator.handle, '/methods/push-cut-test-v2/edit');
    const readings = page.getByLabel('Readings per edge');
    await readings.waitFor();
    // Someone else (here the same person in a second tab) saves first.
    const other = await context!.newPage();
    await other.goto(`${base}/methods/push-cut-test-v2/edit`);
    await other.getByLabel('Retention threshold (g)').fill('321');
    await other.getByLabel('Summary of your changes').fill('Threshold from the other tab');
    await other.getByRole('button', { name: 'Save and publish' }).click();
    await other.waitForURL(/\/methods\/push-cut-test-v2$/);
    await other.close();

    await readings.fill('7');
    await page.getByLabel('Summary of your changes').fill('Seven readings');
    await page.getByRole('button', { name: 'Save and publish' }).click();
    const stale = page.getByRole('alert').filter({ hasText: 'saved this page while you were editing' });
    await stale.waitFor();
    expect(await stale.textContent()).toContain('merge cleanly');
    expect(await page.getByRole('table', { name: 'Changes to Retention threshold (g)' }).first().locator('ins').allTextContents()).toContain('321');
    await stale.getByRole('button', { name: /Carry on from revision/ }).click();
    await page.getByRole('button', { name: 'Save and publish' }).click();
    await page.waitForURL(/\/methods\/push-cut-test-v2$/);
    const saved = await api<{ readingsPerEdge: number; thresholdG: number }>('/api/methods/push-cut-test-v2');
    expect(saved).toMatchObject({ readingsPerEdge: 7, thresholdG: 321 });
    await signOut();
  }, 60_000);
  it('a moderator starts a method page from the list: the empty form checks as one types, saves, and shows the new page', async () => {
    const accounts = await api<Account[]>('/auth/demo-accounts');
    const moderator = accounts.find((a) => a.role === 'moderator')!;
    const name = `Thread cut ${randomWord(6)}`;
    await signInAs(moderator.handle, '/methods');
    await page.getByRole('link', { name: 'New method page' }).click();
    await page.waitForURL(/\/methods\/new$/);
    await page.getByRole('button', { name: 'Create the page' }).click();
    await page.getByText('Some entries need a look; they are marked above.').waitFor();
    await page.getByLabel('Name').fill(name);
    await page.getByLabel('Instrument').fill('A hanging-weight rig (invented for the test)');
    await page.getByLabel('Test medium').fill('Cotton thread');
    await page.getByLabel('Readings per edge').fill('3');
    await page.getByRole('button', { name: 'Create the page' }).click();
    const slug = name.toLowerCase().replaceAll(' ', '-');
    await page.waitForURL(new RegExp(`/methods/${slug}$`));
    await page.getByRole('heading', { level: 1, name }).waitFor();
    const created = await api<{ revisionNumber: number; readingsPerEdge: number; version: number }>(`/api/methods/${slug}`);
    expect(created).toMatchObject({ revisionNumber: 1, readingsPerEdge: 3, version: 1 });
    await signOut();
  }, 60_000);
});
