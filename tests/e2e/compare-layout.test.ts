/**
 * Browser test of the comparison's layout (issue 16, part 4) at 1280 × 900 and 390 × 844: the
 * table fits its frame with no sideways scroll (each row a card on the phone), the row's steel,
 * material and grit band stay in view when its results open, the filters are typed choosers
 * with chips (no native multiple list, nothing asks for Ctrl-click), and no two labels of a chart
 * overlap (bounding boxes of tick labels, axis titles and legend entries). Then the result form's
 * progression steps are added, reordered and removed with the keyboard alone. Screenshots go to
 * /tmp/edgeledger-compare-layout-*.png for the report. Needs `dist/` (npx vite build).
 */
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startE2eApp, type E2eApp } from '../setup/e2e-app';
import { overlaps, sidewaysOverflow } from '../setup/layout';
import { limits } from '../../shared/validations';

let app: E2eApp;
let base = '';
let page: Page;

beforeAll(async () => {
  // This suite's ports: 4301–4309.
  app = await startE2eApp('compare-layout', [4301, 4309]);
  ({ base, page } = app);
}, 90_000);

afterAll(() => app?.stop(), 30_000);

const frame = () => page.getByRole('region', { name: 'Comparison table' });

/** How far the comparison's frame is wider inside than it shows (0: no sideways scroll). */
const frameOverflow = () => frame().evaluate((el) => el.scrollWidth - el.clientWidth);

/** Everything a chart writes: axis tick labels, axis titles, legend entries. */
const CHART_LABELS = '.recharts-cartesian-axis-tick text, .recharts-label, .recharts-legend-item';

describe.each([
  ['desktop', 1280, 900],
  ['phone', 390, 844],
])('the comparison on a %s (%d × %d)', (name, width, height) => {
  it('fits its frame, keeps the row named when its results open, and filters with choosers', async () => {
    await page.setViewportSize({ width, height });
    await page.goto(`${base}/compare?method=push-cut-test-v2`);
    // the table's own rows (a panel's inner table has rows too)
    const rows = frame().locator(':scope > table > tbody > tr');
    await rows.first().waitFor();
    expect(await frameOverflow()).toBeLessThanOrEqual(0);
    expect(await sidewaysOverflow(page)).toBeLessThanOrEqual(0);
    // every default figure is inside the frame: the median and the row's buttons included
    const box = (await frame().boundingBox())!;
    for (const cell of [rows.first().locator('td').first(), rows.first().getByRole('button', { name: /^Results of/ })]) {
      const b = (await cell.boundingBox())!;
      expect(b.x).toBeGreaterThanOrEqual(box.x - 0.5);
      expect(b.x + b.width).toBeLessThanOrEqual(box.x + box.width + 0.5);
    }
    await page.screenshot({ path: `/tmp/edgeledger-compare-layout-table-${name}.png`, fullPage: true });

    // The row's results open; its steel, material and grit band are in view and in the panel's title.
    const identity = (await rows.first().locator('td').nth(0).innerText()).replace(/\(choose\)/, '').trim();
    await rows.first().getByRole('button', { name: /^Results of/ }).click();
    await page.waitForURL(/cell=/);
    const panel = page.locator('section[aria-labelledby="cell-results-title"]');
    await panel.getByRole('table').waitFor();
    expect(await panel.getByRole('heading').first().innerText()).toContain(identity);
    // The panel opens under its row: its top below the row's bottom, the row's steel, material
    // and grit band in the window, the panel inside the table's own next row (one cell across).
    const firstRow = rows.first();
    const rowBox = (await firstRow.boundingBox())!;
    const panelBox = (await panel.boundingBox())!;
    expect(panelBox.y).toBeGreaterThanOrEqual(rowBox.y + rowBox.height - 0.5);
    for (const identityCell of await firstRow.locator('td').all().then((tds) => tds.slice(0, 3))) {
      const b = (await identityCell.boundingBox())!;
      expect(b.x).toBeGreaterThanOrEqual(0);
      expect(b.x + b.width).toBeLessThanOrEqual(width);
      expect(b.y).toBeGreaterThanOrEqual(0);
      expect(b.y + b.height).toBeLessThanOrEqual(height);
    }
    expect(await rows.nth(1).locator('td[colspan] section[aria-labelledby="cell-results-title"]').count()).toBe(1);
    expect(await frameOverflow()).toBeLessThanOrEqual(0);
    expect(await sidewaysOverflow(page)).toBeLessThanOrEqual(0);
    // The focus moved into the panel; Escape closes it and gives the focus back to the row's button.
    const focusedName = () => page.evaluate(() => document.activeElement?.getAttribute('aria-label') ?? document.activeElement?.id ?? '');
    expect(await focusedName()).toBe('cell-results-title');
    await page.keyboard.press('Escape');
    await page.waitForURL((url) => !url.searchParams.has('cell'));
    await expect.poll(() => panel.count()).toBe(0);
    await expect.poll(focusedName).toMatch(/^Results of /);
    expect(await firstRow.getByRole('button', { name: /^Results of/ }).evaluate((b) => b === document.activeElement)).toBe(true);

    // The pair opens under its second row, and its close button gives the focus back to that row's Pair.
    await rows.nth(0).getByRole('button', { name: /^Pair / }).click();
    await rows.nth(2).getByRole('button', { name: /^Pair / }).click();
    const pairPanel = page.locator('section[aria-labelledby="paired-title"]');
    await pairPanel.waitFor();
    const pairRow = (await rows.nth(2).boundingBox())!;
    expect((await pairPanel.boundingBox())!.y).toBeGreaterThanOrEqual(pairRow.y + pairRow.height - 0.5);
    expect(pairRow.y).toBeGreaterThanOrEqual(0);
    expect(await rows.nth(3).locator('td[colspan] section[aria-labelledby="paired-title"]').count()).toBe(1);
    expect(await focusedName()).toBe('paired-title');
    expect(await sidewaysOverflow(page)).toBeLessThanOrEqual(0);
    await page.screenshot({ path: `/tmp/edgeledger-compare-layout-pair-${name}.png` });
    await pairPanel.getByRole('button', { name: 'Clear the pair' }).click();
    await page.waitForURL((url) => !url.searchParams.has('b'));
    await expect.poll(focusedName).toMatch(/^Pair /);
    expect(await rows.nth(2).getByRole('button', { name: /^Pair / }).evaluate((b) => b === document.activeElement)).toBe(true);

    // Filters: no native multiple-choice list, no Ctrl-click; on the phone they fold away first.
    expect(await page.locator('select[multiple]').count()).toBe(0);
    expect(await page.getByText(/Ctrl-click/).count()).toBe(0);
    const steel = page.getByRole('combobox', { name: /^Steel\b/ });
    if (name === 'phone') {
      expect(await steel.isVisible()).toBe(false);
      await page.getByRole('button', { name: /^Filters/ }).click();
    }
    await steel.fill('D2');
    await page.getByRole('option', { name: 'AISI D2' }).waitFor();
    await steel.press('Enter');
    await page.waitForURL(/steel=aisi-d2/);
    await page.getByRole('button', { name: 'Remove AISI D2' }).waitFor();
    await expect.poll(async () => (await rows.allInnerTexts()).every((t) => t.includes('AISI D2'))).toBe(true);
    expect(await sidewaysOverflow(page)).toBeLessThanOrEqual(0);
    await page.screenshot({ path: `/tmp/edgeledger-compare-layout-filters-${name}.png` });
  }, 60_000);

  it('sorts from a visible control where the headers are hidden (the phone’s cards)', async () => {
    await page.setViewportSize({ width, height });
    await page.goto(`${base}/compare?method=push-cut-test-v2`);
    const rows = frame().locator(':scope > table > tbody > tr');
    await rows.first().waitFor();
    const sortBy = page.getByRole('combobox', { name: 'Sort by' });
    // The header row is drawn, or kept one pixel wide for screen readers only (the cards).
    const headersDrawn = async () => ((await frame().locator(':scope > table > thead').boundingBox())?.width ?? 0) > 1;
    if (name === 'desktop') {
      // the headers sort here, and the list is not drawn
      expect(await headersDrawn()).toBe(true);
      expect(await sortBy.isVisible()).toBe(false);
      return;
    }
    expect(await headersDrawn()).toBe(false);
    expect(await sortBy.isVisible()).toBe(true);
    const medians = () => rows.locator('td[data-label="Median g"]').allInnerTexts().then((t) => t.map((x) => Number(x.replace(/[^\d.]/g, ''))));
    const before = await medians();
    expect(before.length).toBeGreaterThan(3);
    await sortBy.selectOption({ label: 'Median g, low to high' });
    await page.waitForURL(/sort=median(&|$)/);
    const ascending = (m: number[]) => m.every((x, i) => i === 0 || m[i - 1] <= x);
    await expect.poll(async () => ascending(await medians())).toBe(true);
    const up = await medians();
    expect(up).not.toEqual(before);
    await sortBy.selectOption({ label: 'Median g, high to low' });
    await page.waitForURL(/sort=-median(&|$)/);
    await expect.poll(async () => (await medians())[0]).toBeGreaterThan(up[0]);
    const down = await medians();
    expect(down).toEqual([...down].sort((a, b) => b - a));
    await page.screenshot({ path: '/tmp/edgeledger-compare-layout-sort-phone.png' });
  }, 60_000);

  it('draws the charts with no two labels overlapping', async () => {
    await page.setViewportSize({ width, height });
    await page.goto(`${base}/compare?method=push-cut-test-v2&view=charts&cs=aisi-d2`);
    await page.getByRole('heading', { name: 'Spread per abrasive, for one steel' }).waitFor();
    await expect.poll(() => page.locator('.recharts-symbols').count()).toBeGreaterThan(5);
    const charts = page.locator('section:has(.recharts-wrapper)');
    expect(await charts.count()).toBe(3);
    for (let i = 0; i < 3; i++) {
      const scope = `section:has(.recharts-wrapper) >> nth=${i}`;
      const labels = await page.locator(scope).locator(CHART_LABELS).count();
      expect(labels).toBeGreaterThan(4);
      const ids = await page.locator(scope).locator(CHART_LABELS).evaluateAll((els) => els.map((e, k) => e.setAttribute('data-label-check', String(k))));
      expect(ids.length).toBe(labels);
      expect(await overlaps(page, '[data-label-check]'), `chart ${i + 1}`).toEqual([]);
      await page.locator('[data-label-check]').evaluateAll((els) => els.forEach((e) => e.removeAttribute('data-label-check')));
    }
    // A shortened abrasive name is whole on focus (its accessible name) and in the data table.
    const ticks = page.locator('section:has(.recharts-wrapper) >> nth=1').locator('svg g[tabindex="0"][aria-label]');
    expect(await ticks.count()).toBeGreaterThan(1);
    for (const tick of await ticks.all()) expect((await tick.getAttribute('aria-label'))!.length).toBeGreaterThanOrEqual((await tick.locator('text').textContent())!.replace('…', '').length);
    expect(await sidewaysOverflow(page)).toBeLessThanOrEqual(0);
    await page.screenshot({ path: `/tmp/edgeledger-compare-layout-charts-${name}.png`, fullPage: true });
  }, 60_000);
});

describe('the progression steps of the result form, by keyboard', () => {
  it('adds, reorders and removes steps with Enter on real buttons, the focus following the step', async () => {
    await page.setViewportSize({ width: 1280, height: 900 });
    const accounts = (await (await fetch(`${base}/auth/demo-accounts`)).json()) as { handle: string; role: string }[];
    await app.signInAs(accounts.find((a) => a.role === 'member')!.handle, '/results/new');
    const add = page.getByRole('button', { name: /^Add a step/ });
    const focused = () => page.evaluate(() => document.activeElement?.id ?? '');
    const stepValues = () => page.locator('select[id^="step-"][id$="-abrasive"]').evaluateAll((els) => els.map((e) => (e as HTMLSelectElement).value));

    await add.focus();
    await page.keyboard.press('Enter');
    await expect.poll(focused).toBe('step-0-abrasive');
    const firstTwo = await page.locator('#step-0-abrasive option').evaluateAll((os) => os.map((o) => (o as HTMLOptionElement).value).filter(Boolean).slice(0, 2));
    await page.locator('#step-0-abrasive').selectOption(firstTwo[0]);
    await add.focus();
    await page.keyboard.press('Enter');
    await expect.poll(focused).toBe('step-1-abrasive');
    await page.locator('#step-1-abrasive').selectOption(firstTwo[1]);
    expect(await stepValues()).toEqual(firstTwo);

    // Step 2 moves earlier: it becomes step 1, whose "earlier" is disabled, so the focus goes to its abrasive.
    await page.getByRole('button', { name: 'Move step 2 earlier' }).focus();
    await page.keyboard.press('Enter');
    await expect.poll(stepValues).toEqual([firstTwo[1], firstTwo[0]]);
    await expect.poll(focused).toBe('step-0-abrasive');
    // and back later with Space, the focus staying on the moved step
    await page.getByRole('button', { name: 'Move step 1 later' }).focus();
    await page.keyboard.press('Space');
    await expect.poll(stepValues).toEqual(firstTwo);
    await expect.poll(focused).toBe('step-1-abrasive');

    await page.getByRole('button', { name: 'Remove step 1' }).focus();
    await page.keyboard.press('Enter');
    await expect.poll(stepValues).toEqual([firstTwo[1]]);
    await expect.poll(focused).toBe('step-0-abrasive');
    await page.getByRole('button', { name: 'Remove step 1' }).focus();
    await page.keyboard.press('Enter');
    await expect.poll(stepValues).toEqual([]);
    await expect.poll(focused).toBe('progression-add');
  }, 60_000);
});

describe('search’s All view', () => {
  it('gives each kind its true count and a “show all N” link where it shows fewer', async () => {
    await page.setViewportSize({ width: 1280, height: 900 });
    await page.goto(`${base}/search?q=wheel`);
    const sections = page.locator('section[aria-labelledby^="hits-"]');
    await sections.first().waitFor();
    const kinds = page.getByRole('navigation', { name: 'Kinds of hits' }).getByRole('link');
    // The counts the kinds' links announce, e.g. "Results (61)".
    const announced = new Map<string, number>();
    for (const text of await kinds.allInnerTexts()) {
      const m = /^(.+) \((\d+)\)$/.exec(text.trim());
      if (m && Number(m[2]) > 0) announced.set(m[1], Number(m[2]));
    }
    expect(announced.size).toBeGreaterThan(1);
    // Every kind with matches has its section, with the same count; fewer shown → a link to all of them.
    expect(await sections.count()).toBe(announced.size);
    let links = 0;
    for (const section of await sections.all()) {
      const heading = (await section.getByRole('heading').first().innerText()).trim();
      const [, name, count] = /^(.+) \((\d+)\)$/.exec(heading)!;
      expect(Number(count)).toBe(announced.get(name));
      const shown = await section.getByRole('listitem').count();
      // each kind shows its own best few, even when none of them is among the best overall
      expect(shown).toBe(Math.min(Number(count), limits.searchSectionBest));
      if (shown < Number(count)) {
        const all = section.getByRole('link', { name: `Show all ${count} ${name.toLowerCase()}` });
        expect(await all.getAttribute('href')).toMatch(/type=/);
        links++;
      }
    }
    expect(links).toBeGreaterThan(0);
    await page.screenshot({ path: '/tmp/edgeledger-compare-layout-search-desktop.png', fullPage: true });
  }, 60_000);
});
