/**
 * Browser test of issue 2's four journeys, on the real stack: the built client served by the real
 * server (with its local OAuth2 provider and mail catcher) over a fresh data folder, driven in
 * headless Debian Chromium. Elements are found by role and label, as a person would find them.
 *
 * It builds nothing: `dist/` must exist (`npx vite build`, which `npm start` also does).
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
const CHROMIUM_ARGS = [
  '--headless',
  '--no-sandbox',
  '--disable-gpu',
  '--disable-quic',
  '--no-first-run',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
];

interface Account {
  handle: string;
  displayName?: string;
  role: string;
}
interface Method {
  slug: string;
  name: string;
  retentionMedium: string | null;
}
interface Abrasive {
  slug: string;
  name: string;
  material: string;
}
interface CompareRow {
  method: string;
  steel: string;
  material: string;
  gritBand: { loUm: number; hiUm: number };
  n: number;
}

/** A free loopback port, found by letting the OS pick one. */
function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const srv = net.createServer();
    srv.once('error', reject);
    srv.listen(0, '127.0.0.1', () => {
      const { port } = srv.address() as net.AddressInfo;
      srv.close(() => resolve(port));
    });
  });
}

/** Same wording as the client's formatMicrometres, so a grit band can be found on the page. */
function um(x: number): string {
  if (x < 1) return x.toFixed(2);
  if (x < 100) return x.toFixed(1);
  return Math.round(x).toString();
}

/** Letters only, so the search index keeps it as one word. */
function randomWord(length: number): string {
  return Array.from({ length }, () => String.fromCharCode(97 + Math.floor(Math.random() * 26))).join('');
}

let server: ChildProcess | undefined;
let serverOutput = '';
let dataDir = '';
let profileDir = '';
let base = '';
let context: BrowserContext | undefined;
let page: Page;

/**
 * Waits until the page has no requests in flight. Starting a sign-in while the previous page's
 * requests are still being answered can lose the OAuth state saved in the session (a concurrent
 * request saves its older copy of the session over it), and the round trip then fails.
 */
async function settle() {
  await page.waitForLoadState('networkidle');
}

async function api<T>(pathname: string): Promise<T> {
  const res = await fetch(`${base}${pathname}`);
  if (!res.ok) throw new Error(`GET ${pathname} answered ${res.status}`);
  return (await res.json()) as T;
}

beforeAll(async () => {
  if (!fs.existsSync(path.resolve('dist/index.html'))) {
    throw new Error('dist/index.html is missing: build the client first (npx vite build); this test builds nothing');
  }
  if (!fs.existsSync(CHROMIUM)) throw new Error(`${CHROMIUM} is missing: apt-get install -y chromium`);

  const [port, oauthPort, smtpPort] = [await freePort(), await freePort(), await freePort()];
  dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'edgeledger-e2e-data-'));
  base = `http://127.0.0.1:${port}`;
  server = spawn('npx', ['tsx', 'server/index.ts'], {
    cwd: process.cwd(),
    env: {
      ...process.env,
      NODE_ENV: 'test',
      LOG_LEVEL: 'info',
      PORT: String(port),
      OAUTH_PORT: String(oauthPort),
      SMTP_PORT: String(smtpPort),
      DATA_DIR: dataDir,
    },
    // Its own process group, so npx, tsx and node can be stopped together by this one id.
    detached: true,
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  await new Promise<void>((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error(`the server did not get ready in 60 s:\n${serverOutput}`)), 60_000);
    const onData = (chunk: Buffer) => {
      serverOutput += chunk.toString();
      if (serverOutput.includes('Edgeledger ready at')) {
        clearTimeout(timer);
        resolve();
      }
    };
    server!.stdout!.on('data', onData);
    server!.stderr!.on('data', (chunk: Buffer) => (serverOutput += chunk.toString()));
    server!.once('exit', (code) => {
      clearTimeout(timer);
      reject(new Error(`the server exited (${code}) before it was ready:\n${serverOutput}`));
    });
  });

  profileDir = fs.mkdtempSync(path.join(os.tmpdir(), 'edgeledger-e2e-chromium-'));
  context = await chromium.launchPersistentContext(profileDir, {
    executablePath: CHROMIUM,
    headless: true,
    args: CHROMIUM_ARGS,
    viewport: { width: 1280, height: 900 },
  });
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
    const timeout = new Promise((resolve) => setTimeout(resolve, 10_000, 'timeout'));
    if ((await Promise.race([exited, timeout])) === 'timeout') {
      try {
        process.kill(-server.pid, 'SIGKILL');
      } catch {
        // already gone
      }
    }
  }
  for (const dir of [profileDir, dataDir]) if (dir) fs.rmSync(dir, { recursive: true, force: true });
}, 30_000);

describe('the whole loop in a browser', () => {
  // Shared between the journeys, which follow one another as on a real site.
  const marker = `whetmark${randomWord(8)}`;
  let resultId = 0;
  let sharpnessMethod: Method;
  let cbnAbrasive: Abrasive;
  let baseline: CompareRow[] = [];

  it('1. a visitor sees the latest published results and finds steels, abrasives and results by search', async () => {
    await page.goto(`${base}/`);
    await page.getByRole('heading', { name: 'Latest published results' }).waitFor();
    expect(await page.getByText(/invented/).first().isVisible()).toBe(true);
    const latest = page.getByRole('region', { name: 'Latest published results' });
    await latest.getByRole('row').nth(1).waitFor();

    await page.getByLabel('Search steels, abrasives, methods and results').fill('d2');
    await page.getByRole('button', { name: 'Search' }).click();
    await page.waitForURL(/\/search\?q=d2/);
    const steels = page.getByRole('region', { name: /^Steels/ });
    await steels.getByRole('link', { name: 'AISI D2' }).waitFor();
    const results = page.getByRole('region', { name: /^Results/ });
    expect(await results.getByRole('link').count()).toBeGreaterThan(0);

    // Instant search: typing replaces the hits without pressing anything.
    const box = page.getByLabel('Search steels, abrasives, methods and results');
    await box.fill('cbn');
    const abrasives = page.getByRole('region', { name: /^Abrasives/ });
    await abrasives.getByRole('link', { name: /CBN/ }).first().waitFor();
    await page.waitForURL(/q=cbn/);

    await box.fill('1.2379');
    await page.getByRole('region', { name: /^Steels/ }).getByRole('link', { name: 'AISI D2' }).waitFor();
  }, 60_000);

  it('2. a member signs in, fills the new-result form with notes, and the result awaits review', async () => {
    const accounts = await api<Account[]>('/auth/demo-accounts');
    const member = accounts.find((a) => a.role === 'member');
    expect(member).toBeDefined();
    const methods = (await api<{ items: Method[] }>('/api/methods')).items;
    sharpnessMethod = methods.find((m) => !m.retentionMedium) ?? methods[0];
    const retentionMethod = methods.find((m) => m.retentionMedium);
    cbnAbrasive = (await api<{ items: Abrasive[] }>('/api/abrasives')).items.find((a) => a.material === 'cbn')!;
    expect(cbnAbrasive).toBeDefined();
    baseline = (
      await api<{ rows: CompareRow[] }>(`/api/compare?method=${sharpnessMethod.slug}&steel=aisi-d2&material=cbn`)
    ).rows;

    // The sign-in page lists the demo accounts; each one starts the OAuth2 round trip.
    await page.goto(`${base}/sign-in?returnTo=${encodeURIComponent('/results/new')}`);
    await page.getByRole('link', { name: `Sign in as ${member!.displayName ?? member!.handle}` }).click();
    await page.waitForURL(/\/results\/new$/);

    const hardness = page.getByLabel('Hardness', { exact: true });
    await hardness.waitFor();
    // The form checks as one types: a hardness below zero is marked at once, and cleared when fixed.
    await hardness.fill('-3');
    await page.getByText('Must be above 0').waitFor();
    expect(await hardness.getAttribute('aria-invalid')).toBe('true');
    await hardness.fill('61');
    await page.getByText('Must be above 0').waitFor({ state: 'detached' });
    expect(await hardness.getAttribute('aria-invalid')).toBeNull();

    await page.getByLabel('Steel', { exact: true }).selectOption('aisi-d2');
    await page.getByLabel('Hardness scale').selectOption('HRC');
    await page.getByLabel('Final abrasive', { exact: true }).selectOption(cbnAbrasive.slug);
    await page.getByLabel('Grit grade').fill('B46');
    await page.getByText(/B46 ≈ 41\.5 µm/).waitFor();
    await page.getByLabel('Degrees per side').check();
    await page.getByLabel('Angle per side (°)').fill('15');
    await page.getByLabel('Sharpness method').selectOption(sharpnessMethod.slug);
    await page.getByLabel('Readings (g)').fill('142, 150, 138');
    await page.getByText('3 readings, median 142 g').waitFor();
    if (retentionMethod) {
      await page.getByLabel('Retention method').selectOption(retentionMethod.slug);
      await page.getByLabel('Cuts until dull').fill('240');
    }

    const notes = page.getByRole('textbox', { name: 'Notes' });
    await notes.click();
    await page.getByRole('button', { name: 'Heading 2' }).click();
    await page.keyboard.type('How the edge was made');
    await page.keyboard.press('Enter');
    await page.getByRole('button', { name: 'Bulleted list' }).click();
    await page.keyboard.type('Coarse CBN wheel to set the bevel');
    await page.keyboard.press('Enter');
    await page.keyboard.type('Final passes on the B46 wheel');
    await page.keyboard.press('Enter');
    await page.keyboard.press('Enter');
    await page.getByRole('button', { name: 'Bold' }).click();
    await page.keyboard.type('Deburred on card');
    await page.getByRole('button', { name: 'Bold' }).click();
    await page.keyboard.type(` (${marker}), protocol at `);
    await page.getByRole('button', { name: 'Link' }).click();
    await page.getByLabel('Link address').fill('https://example.org/push-cut-protocol');
    await page.getByLabel('Link address').press('Enter');

    await page.getByRole('button', { name: 'Submit for review' }).click();
    await page.waitForURL(/\/results\/\d+$/);
    resultId = Number(new URL(page.url()).pathname.split('/').pop());
    expect(resultId).toBeGreaterThan(0);
    await page.getByText('Awaiting review').first().waitFor();
    await page.getByRole('heading', { name: 'How the edge was made' }).waitFor();

    // Their own list shows it with its state.
    await page.goto(`${base}/me`);
    const mine = page.getByRole('region', { name: 'My results' });
    const row = mine.getByRole('row').filter({ has: page.getByRole('link', { name: new RegExp(`^Result ${resultId},`) }) });
    expect(await row.textContent()).toContain('Awaiting review');

    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.getByRole('banner').getByRole('link', { name: 'Sign in' }).waitFor();
  }, 60_000);

  it('3. a moderator reads the pending result with its notes rendered and approves it', async () => {
    const accounts = await api<Account[]>('/auth/demo-accounts');
    const moderator = accounts.find((a) => a.role === 'moderator');
    expect(moderator).toBeDefined();
    await settle();
    await page.goto(`${base}/auth/signin?as=${encodeURIComponent(moderator!.handle)}&returnTo=${encodeURIComponent('/review')}`);
    await page.waitForURL(/\/review$/);
    await page.getByRole('heading', { name: /^Awaiting review/ }).waitFor();

    const item = page.getByRole('link', { name: new RegExp(`#${resultId} `) });
    await item.click();
    const opened = page.getByRole('region', { name: new RegExp(`^Result ${resultId}:`) });
    await opened.getByRole('heading', { name: 'How the edge was made' }).waitFor();
    expect(await opened.getByRole('listitem').filter({ hasText: 'Coarse CBN wheel to set the bevel' }).count()).toBe(1);
    expect(await opened.locator('strong', { hasText: 'Deburred on card' }).count()).toBe(1);
    expect(await opened.getByRole('link', { name: 'https://example.org/push-cut-protocol' }).getAttribute('href')).toBe(
      'https://example.org/push-cut-protocol',
    );

    await opened.getByRole('button', { name: 'Approve' }).click();
    await item.waitFor({ state: 'detached' });
    // The desk confirms the decision and offers the next result rather than jumping to it.
    await page.getByRole('link', { name: /^Open the next result/ }).click();

    // A returned result shows its state and the note to its author.
    const next = page.getByRole('region', { name: /^Result \d+:/ });
    await next.getByRole('button', { name: 'Return with note' }).click();
    await next.getByText(/or why it is rejected/i).waitFor(); // a note is required to return
    const returnedHeading = await next.getByRole('heading', { level: 2 }).first().textContent();
    const returnedId = Number(/Result (\d+)/.exec(returnedHeading ?? '')?.[1]);
    const authorHandle = /\(@([a-z0-9-]+)\)/.exec((await next.getByText(/posted .* by /).first().textContent()) ?? '')?.[1];
    await next.getByLabel('Note to the author').fill('Please add the hardness you measured and the number of passes.');
    await next.getByRole('button', { name: 'Return with note' }).click();
    await page.getByRole('link', { name: new RegExp(`#${returnedId} `) }).waitFor({ state: 'detached' });
    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.getByRole('banner').getByRole('link', { name: 'Sign in' }).waitFor();

    expect(authorHandle).toBeTruthy();
    await settle();
    await page.goto(`${base}/auth/signin?as=${encodeURIComponent(authorHandle!)}&returnTo=${encodeURIComponent(`/results/${returnedId}`)}`);
    await page.waitForURL(new RegExp(`/results/${returnedId}$`));
    await page.getByText('Changes asked').first().waitFor();
    await page.getByText('Please add the hardness you measured and the number of passes.').first().waitFor();
    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.getByRole('banner').getByRole('link', { name: 'Sign in' }).waitFor();
  }, 60_000);

  it('4. the comparison counts the approved result and search finds it', async () => {
    const stored = await api<{ status: string; derived: { gritBand: { loUm: number; hiUm: number } } }>(`/api/results/${resultId}`);
    expect(stored.status).toBe('approved');
    const band = stored.derived.gritBand;
    const before = baseline.find((r) => Math.abs(r.gritBand.loUm - band.loUm) < 1e-9)?.n ?? 0;

    await page.goto(`${base}/compare?method=${sharpnessMethod.slug}&steel=aisi-d2&material=cbn`);
    // The filters are form controls bound to the URL.
    const chosen = (filter: string) => page.getByRole('list', { name: `${filter}: chosen` }).getByRole('button').evaluateAll((bs) => bs.map((b) => b.getAttribute('aria-label')));
    await expect.poll(() => chosen('Steel')).toEqual(['Remove AISI D2']);
    await expect.poll(() => chosen('Abrasive material')).toEqual(['Remove CBN']);
    const table = page.getByRole('region', { name: 'Comparison table' });
    const row = table.getByRole('row').filter({ hasText: `${um(band.loUm)}–${um(band.hiUm)}` });
    await row.waitFor();
    const nCell = row.locator('td[data-label="n"]');
    expect((await nCell.textContent())?.replace(/\D+/g, '')).toBe(String(before + 1));

    await page.goto(`${base}/search?q=${marker}`);
    const results = page.getByRole('region', { name: /^Results/ });
    await results.getByRole('link').first().waitFor();
    const hrefs = await results.getByRole('link').evaluateAll((links) => links.map((a) => a.getAttribute('href')));
    expect(hrefs).toContain(`/results/${resultId}`);
  }, 60_000);
});
