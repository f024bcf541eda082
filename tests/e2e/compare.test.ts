/**
 * Browser test of the comparison page (issue 5): filters set on screen land in the URL, a
 * reload reproduces the same view, the grid and the charts (a chunk loaded on demand) show, a
 * cell opens its results, two cells pair, and the CSV export downloads and parses with
 * papaparse. The built client is served by the real server over a fresh data folder, in
 * headless Debian Chromium; elements are found by role and label. It builds nothing: `dist/`
 * must exist (`npx vite build`).
 */
import { spawn, type ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import net from 'node:net';
import os from 'node:os';
import path from 'node:path';
import Papa from 'papaparse';
import { chromium, type BrowserContext, type Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';

const CHROMIUM = '/usr/bin/chromium';
// Without the background-networking flags Chromium keeps dialling out on a closed network.
const CHROMIUM_ARGS = ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'];

/** A free loopback port in [from, to] (this suite's range), found by trying to listen. */
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

let server: ChildProcess | undefined;
let serverOutput = '';
let dataDir = '';
let profileDir = '';
let base = '';
let context: BrowserContext;
let page: Page;

beforeAll(async () => {
  if (!fs.existsSync(path.resolve('dist/index.html'))) throw new Error('dist/index.html is missing: build the client first (npx vite build); this test builds nothing');
  // This suite's ports: 3580–3599.
  const port = await portIn(3580, 3599);
  const oauthPort = await portIn(port + 1, 3599);
  const smtpPort = await portIn(oauthPort + 1, 3599);
  const s3Port = await portIn(smtpPort + 1, 3599);
  dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'edgeledger-e2e-compare-'));
  base = `http://127.0.0.1:${port}`;
  server = spawn('npx', ['tsx', 'server/index.ts'], {
    cwd: process.cwd(),
    env: { ...process.env, NODE_ENV: 'test', LOG_LEVEL: 'info', PORT: String(port), OAUTH_PORT: String(oauthPort), SMTP_PORT: String(smtpPort), S3_PORT: String(s3Port), DATA_DIR: dataDir },
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
  profileDir = fs.mkdtempSync(path.join(os.tmpdir(), 'edgeledger-e2e-chromium-'));
  context = await chromium.launchPersistentContext(profileDir, { executablePath: CHROMIUM, headless: true, args: CHROMIUM_ARGS, viewport: { width: 1400, height: 1000 }, acceptDownloads: true });
  page = context.pages()[0] ?? (await context.newPage());
  page.setDefaultTimeout(20_000);
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

const table = () => page.getByRole('region', { name: 'Comparison table' });

/** The table's body rows as text, to compare one view with another. */
async function rowsText(): Promise<string[]> {
  await table().getByRole('row').nth(1).waitFor();
  return table().locator('tbody tr').allInnerTexts();
}

describe('the comparison in a browser', () => {
  let before: string[] = [];

  it('1. filters set on screen go into the URL', async () => {
    await page.goto(`${base}/compare`);
    await rowsText();
    await page.getByLabel('Method version').selectOption('push-cut-test-v2');
    await page.waitForURL(/method=push-cut-test-v2/);
    await page.getByLabel('Steel').first().selectOption(['aisi-d2', 'aisi-52100', 'aisi-o1']);
    await page.waitForURL(/steel=/);
    await page.getByLabel('Hardness from').fill('57');
    await page.waitForURL(/hrcMin=57/);
    // sort by the median, descending (two presses: ascending, then descending)
    const medianHeader = table().getByRole('button', { name: /Median g/ });
    await medianHeader.click();
    await page.waitForURL(/sort=median/);
    await table().getByRole('button', { name: /Median g/ }).click();
    await page.waitForURL(/sort=-median/);

    const url = new URL(page.url());
    expect(url.searchParams.get('method')).toBe('push-cut-test-v2');
    expect(url.searchParams.get('steel')?.split(',').sort()).toEqual(['aisi-52100', 'aisi-d2', 'aisi-o1']);
    expect(url.searchParams.get('hrcMin')).toBe('57');
    expect(url.searchParams.get('sort')).toBe('-median');

    // the table follows: only the chosen steels, medians descending, the live-path notice shown
    await expect.poll(async () => (await rowsText()).every((t) => /AISI D2|AISI 52100|AISI O1/.test(t))).toBe(true);
    await page.getByText(/hardness filter needs each result/).waitFor();
    const medians = await table().locator('tbody tr').evaluateAll((rows) => rows.map((r) => Number((r.children[6] as HTMLElement).innerText.replace(/[^\d.]/g, ''))));
    expect(medians.length).toBeGreaterThan(1);
    for (let i = 1; i < medians.length; i++) expect(medians[i]).toBeLessThanOrEqual(medians[i - 1]);
    before = await rowsText();
  }, 60_000);

  it('2. a reload reproduces the same view', async () => {
    const url = page.url();
    await page.reload();
    await rowsText();
    expect(page.url()).toBe(url);
    expect(await page.getByLabel('Method version').inputValue()).toBe('push-cut-test-v2');
    const chosen = await page.getByLabel('Steel').first().evaluate((el) => [...(el as HTMLSelectElement).selectedOptions].map((o) => o.value).sort());
    expect(chosen).toEqual(['aisi-52100', 'aisi-d2', 'aisi-o1']);
    expect(await page.getByLabel('Hardness from').inputValue()).toBe('57');
    expect(await table().getByRole('columnheader', { name: /Median g/ }).getAttribute('aria-sort')).toBe('descending');
    expect(await rowsText()).toEqual(before);
  }, 60_000);

  it('3. marks thin cells in words, opens a cell’s results and pairs two cells', async () => {
    // demo data has cells of one or two results on these steels
    await page.getByLabel('Hardness from').fill('');
    await page.waitForURL((u) => !u.searchParams.has('hrcMin'));
    await expect.poll(() => table().getByText('few results').count()).toBeGreaterThan(0);

    const firstRow = table().locator('tbody tr').first();
    await firstRow.getByRole('button', { name: /^Results of/ }).click();
    await page.waitForURL(/cell=/);
    const cell = page.locator('section[aria-labelledby="cell-results-title"]');
    await cell.getByRole('table').waitFor();
    const links = await cell.getByRole('link').evaluateAll((as) => as.map((a) => a.getAttribute('href') ?? ''));
    expect(links.some((h) => h.startsWith('/members/'))).toBe(true);
    expect(links.some((h) => h.startsWith('/methods/push-cut-test-v2'))).toBe(true);
    expect(links.some((h) => /^\/results\/\d+$/.test(h))).toBe(true);

    const rows = table().locator('tbody tr');
    await rows.nth(0).getByRole('button', { name: /^Pair/ }).click();
    await page.waitForURL(/[?&]a=/);
    await rows.nth(1).getByRole('button', { name: /^Pair/ }).click();
    await page.waitForURL(/[?&]b=/);
    const paired = page.locator('section[aria-labelledby="paired-title"]');
    await paired.getByText(/subtract their own median in B from their own median in A/).waitFor();
    await paired.getByRole('status').waitFor();
  }, 60_000);

  it('4. shows the grid and, on demand, the charts', async () => {
    await page.getByRole('button', { name: 'Steel × grit grid' }).click();
    await page.waitForURL(/view=grid/);
    const grid = page.getByRole('region', { name: /^Grid of median grams/ });
    await grid.getByRole('rowheader', { name: 'AISI D2' }).waitFor();
    await page.getByRole('figure', { name: 'Shading legend' }).getByText(/g and above/).waitFor();
    // every shaded cell carries its number as text
    const labels = await grid.locator('tbody button').allInnerTexts();
    expect(labels.length).toBeGreaterThan(0);
    expect(labels.every((t) => /^\d+\s*n \d+/.test(t.trim()))).toBe(true);

    await page.getByRole('button', { name: 'Charts' }).click();
    await page.waitForURL(/view=charts/);
    await page.getByRole('heading', { name: 'Sharpness and particle size' }).waitFor();
    await page.getByRole('heading', { name: 'Spread per abrasive, for one steel' }).waitFor();
    await page.getByRole('heading', { name: 'Retention and hardness' }).waitFor();
    await expect.poll(() => page.locator('.recharts-symbols').count()).toBeGreaterThan(5);
    await page.getByText('The same data as a table').first().click();
    await page.getByRole('region', { name: 'Chart data' }).first().waitFor();
  }, 60_000);

  it('5. exports the view as a CSV that papaparse reads, with licence and citation', async () => {
    await page.getByRole('button', { name: 'Table of cells' }).click();
    await rowsText();
    const shown = await table().locator('tbody tr').count();
    const [download] = await Promise.all([page.waitForEvent('download'), page.getByRole('link', { name: 'Export CSV' }).click()]);
    const file = await download.path();
    const text = fs.readFileSync(file!, 'utf8');
    expect(text).toMatch(/^# Edgeledger comparison export\. Licence: CC BY 4\.0/);
    const cite = /Retrieved (\d{4}-\d{2}-\d{2}) from (\S+)\. Licence/.exec(text);
    expect(cite).not.toBeNull();
    const cited = new URL(cite![2]);
    expect(cited.pathname).toBe('/compare');
    expect(cited.searchParams.get('method')).toBe('push-cut-test-v2');
    expect(cited.searchParams.get('steel')?.split(',').sort()).toEqual(['aisi-52100', 'aisi-d2', 'aisi-o1']);
    expect(text).toContain('# Method versions: push-cut-test-v2');
    const parsed = Papa.parse<Record<string, string>>(text, { header: true, comments: '#', skipEmptyLines: true });
    expect(parsed.errors).toEqual([]);
    expect(parsed.data.length).toBe(shown);
    expect(new Set(parsed.data.map((r) => r.steel))).toEqual(new Set(['aisi-d2', 'aisi-52100', 'aisi-o1']));
    // the file is in the page's order (by median, descending)
    const medians = parsed.data.map((r) => Number(r.median_g));
    for (let i = 1; i < medians.length; i++) expect(medians[i]).toBeLessThanOrEqual(medians[i - 1]);
  }, 60_000);
});
