/**
 * Browser test of the decision view (issue 16) at 1280 × 900 and 390 × 844: open one steel's
 * view from its steel page, choose two options, read the difference in words and as a drawing;
 * nothing overflows the page sideways and no two labels of the drawing overlap (bounding boxes).
 * Screenshots go to /tmp/edgeledger-decision-*.png for the report. Needs `dist/` (npx vite build).
 */
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startE2eApp, type E2eApp } from '../setup/e2e-app';
import { overlaps as overlapsOn, sidewaysOverflow as overflowOf } from '../setup/layout';

const overlaps = (selector: string) => overlapsOn(page, selector);
const sidewaysOverflow = () => overflowOf(page);

let app: E2eApp;
let base = '';
let page: Page;

beforeAll(async () => {
  // This suite's ports: 3700–3719.
  app = await startE2eApp('decision', [3700, 3719]);
  ({ base, page } = app);
}, 90_000);

afterAll(() => app?.stop(), 30_000);

describe.each([
  ['desktop', 1280, 900],
  ['phone', 390, 844],
])('the decision view on a %s (%d × %d)', (name, width, height) => {
  it('walks from the steel page to the difference of two options', async () => {
    await page.setViewportSize({ width, height });
    await page.goto(`${base}/steels/aisi-d2`);
    await page.getByRole('link', { name: /Choose an abrasive for/ }).click();
    await page.waitForURL(/\/steels\/aisi-d2\/decide/);
    const options = page.getByRole('list', { name: 'Options' }).getByRole('listitem');
    await options.first().waitFor();
    expect(await options.count()).toBeGreaterThan(1);
    // grit bands labelled in the chosen notation beside the µm
    await page.getByLabel('Grit written as').selectOption('fepa-f');
    await page.waitForURL(/notation=fepa-f/);
    await expect.poll(() => options.first().innerText()).toMatch(/µm · (≈ FEPA F\d|outside FEPA F)/);
    await options.nth(0).getByRole('button', { name: /^Choose/ }).click();
    await page.waitForURL(/a=/);
    await options.nth(1).getByRole('button', { name: /^Choose/ }).click();
    await page.waitForURL(/b=/);
    const panel = page.getByRole('region', { name: 'The difference between the two' });
    await expect.poll(async () => panel.getByRole('status').innerText(), { timeout: 20_000 }).toMatch(/shift B − A|no results/);
    const words = await panel.getByRole('status').innerText();
    expect(words).toMatch(/95 % interval|no 95 % interval exists/);
    await panel.getByRole('img').first().waitFor();
    expect(await overlaps('[role="region"] svg text')).toEqual([]);
    expect(await sidewaysOverflow()).toBeLessThanOrEqual(0);
    await page.screenshot({ path: `/tmp/edgeledger-decision-${name}.png`, fullPage: true });
  }, 60_000);

  it('shows the comparison (screenshot for the report)', async () => {
    await page.setViewportSize({ width, height });
    await page.goto(`${base}/compare?method=push-cut-test-v2`);
    await page.getByRole('region', { name: 'Comparison table' }).getByRole('row').nth(1).waitFor();
    await page.screenshot({ path: `/tmp/edgeledger-compare-${name}.png`, fullPage: true });
  }, 60_000);
});
