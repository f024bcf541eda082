/**
 * Browser test of the comparison page (issue 5): filters set on screen land in the URL, a
 * reload reproduces the same view, the grid and the charts (a chunk loaded on demand) show, a
 * cell opens its results, two cells pair, and the CSV export downloads and parses with
 * papaparse. The built client is served by the real server over a fresh data folder, in
 * headless Debian Chromium; elements are found by role and label. It builds nothing: `dist/`
 * must exist (`npx vite build`).
 */
import fs from 'node:fs';
import Papa from 'papaparse';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startE2eApp, type E2eApp } from '../setup/e2e-app';

let app: E2eApp;
let base = '';
let page: Page;

beforeAll(async () => {
  // This suite's ports: 3580–3599.
  app = await startE2eApp('compare', [3580, 3599], { width: 1400, height: 1000 });
  ({ base, page } = app);
}, 90_000);

afterAll(() => app?.stop(), 30_000);

const table = () => page.getByRole('region', { name: 'Comparison table' });
/** The table's cells' rows (a cell's results or a pair open in a row of their own under it). */
const cellRows = () => table().locator('tbody tr:has([data-row-button="results"])');

/** The table's body rows as text, to compare one view with another. */
async function rowsText(): Promise<string[]> {
  await table().getByRole('row').nth(1).waitFor();
  return cellRows().allInnerTexts();
}

describe('the comparison in a browser', () => {
  let before: string[] = [];

  it('1. filters set on screen go into the URL', async () => {
    await page.goto(`${base}/compare`);
    await rowsText();
    await page.getByLabel('Method version').selectOption('push-cut-test-v2');
    await page.waitForURL(/method=push-cut-test-v2/);
    // The steel chooser: type, Enter on the option found; each choice becomes a chip.
    const steel = page.getByRole('combobox', { name: /^Steel\b/ });
    for (const [typed, name] of [['d2', 'AISI D2'], ['52100', 'AISI 52100'], ['O1', 'AISI O1']]) {
      await steel.fill(typed);
      await page.getByRole('option', { name, exact: true }).waitFor();
      await steel.press('Enter');
      await page.getByRole('button', { name: `Remove ${name}` }).waitFor();
    }
    await page.waitForURL(/steel=.*aisi-o1/);
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
    // The sorted rows arrive with the refetch after the URL changes: poll rather than read once.
    const medians = () => cellRows().evaluateAll((rows) => rows.map((r) => Number((r.querySelector('td[data-label="Median g"]') as HTMLElement).innerText.replace(/[^\d.]/g, ''))));
    await expect.poll(async () => {
      const m = await medians();
      return m.length > 1 && m.every((v, i) => i === 0 || v <= m[i - 1]);
    }).toBe(true);
    before = await rowsText();
  }, 60_000);

  it('2. a reload reproduces the same view', async () => {
    const url = page.url();
    await page.reload();
    await rowsText();
    expect(page.url()).toBe(url);
    expect(await page.getByLabel('Method version').inputValue()).toBe('push-cut-test-v2');
    const chips = await page.getByRole('list', { name: 'Steel: chosen' }).getByRole('button').evaluateAll((bs) => bs.map((b) => b.getAttribute('aria-label')).sort());
    expect(chips).toEqual(['Remove AISI 52100', 'Remove AISI D2', 'Remove AISI O1']);
    expect(await page.getByLabel('Hardness from').inputValue()).toBe('57');
    expect(await table().getByRole('columnheader', { name: /Median g/ }).getAttribute('aria-sort')).toBe('descending');
    expect(await rowsText()).toEqual(before);
  }, 60_000);

  it('3. marks thin cells in words, opens a cell’s results and pairs two cells', async () => {
    // demo data has cells of one or two results on these steels
    await page.getByLabel('Hardness from').fill('');
    await page.waitForURL((u) => !u.searchParams.has('hrcMin'));
    await expect.poll(() => table().getByText('few results').count()).toBeGreaterThan(0);

    const firstRow = cellRows().first();
    await firstRow.getByRole('button', { name: /^Results of/ }).click();
    await page.waitForURL(/cell=/);
    const cell = page.locator('section[aria-labelledby="cell-results-title"]');
    await cell.getByRole('table').waitFor();
    const links = await cell.getByRole('link').evaluateAll((as) => as.map((a) => a.getAttribute('href') ?? ''));
    expect(links.some((h) => h.startsWith('/members/'))).toBe(true);
    expect(links.some((h) => h.startsWith('/methods/push-cut-test-v2'))).toBe(true);
    expect(links.some((h) => /^\/results\/\d+$/.test(h))).toBe(true);

    const rows = cellRows();
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
    const shown = await cellRows().count();
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
