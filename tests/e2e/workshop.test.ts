/**
 * Browser test of the workshop (issue 18): a member sets up a grinder, two wheels of one diameter
 * and a setup; both wheels share one setting; a worn diameter logged on the vitrified wheel moves
 * its setting; the result form takes its angle from the setup on that wheel; the kit's cost is read
 * against the machine's, and per sharpening for the whole kit; lengths switch to inches, on the result form's wheel setup too;
 * the decision view says where the trough changes between two options. Nothing overflows the page sideways.
 * Screenshots at 1280 × 900 and 390 × 844 go to /tmp/edgeledger-workshop-*.png for the report.
 * Needs `dist/` (npx vite build).
 *
 * Expected figures, worked by hand: 140 EUR over (250 − 180) mm / (4 mm / 40 sharpenings) = 700
 * sharpenings is 0.2 EUR a sharpening; 300 + 140 = 440 EUR of wheels against a 700 EUR machine is
 * 0.63 times; 250 mm is 9.843 in (250 / 25.4; NIST: 1 in = 25.4 mm exactly).
 */
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startE2eApp, type E2eApp } from '../setup/e2e-app';

let app: E2eApp;
let base = '';
let page: Page;

beforeAll(async () => {
  // This suite's ports: 4601–4609.
  app = await startE2eApp('workshop', [4601, 4609]);
  ({ base, page } = app);
}, 90_000);

afterAll(() => app?.stop(), 30_000);

/** How far the page is wider than the window (0 when nothing overflows sideways). */
const sidewaysOverflow = () => page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);

/** Full-page screenshots at both sizes, each checked for sideways overflow first. */
async function screenshots(name: string) {
  for (const [w, h] of [[1280, 900], [390, 844]] as const) {
    await page.setViewportSize({ width: w, height: h });
    await page.evaluate(() => new Promise((done) => requestAnimationFrame(() => requestAnimationFrame(done)))); // the new width laid out
    expect(await sidewaysOverflow(), `${name} at ${w} px`).toBeLessThanOrEqual(0);
    await page.screenshot({ path: `/tmp/edgeledger-workshop-${name}-${w}.png`, fullPage: true });
  }
  await page.setViewportSize({ width: 1280, height: 900 });
}

const form = (name: string) => page.getByRole('form', { name });

async function fill(formName: string, values: Record<string, string>) {
  const f = form(formName);
  for (const [label, value] of Object.entries(values)) {
    const box = f.getByLabel(label, { exact: true });
    if ((await box.evaluate((e) => e.tagName)) === 'SELECT') await box.selectOption(value);
    else await box.fill(value);
  }
}

/** The gap shown for the setup on the wheel named, as text ("80.6 mm"). */
async function gapFor(wheel: string): Promise<string> {
  const item = page.getByRole('article', { name: 'Setup Chef knife 15°' }).getByRole('listitem').filter({ hasText: wheel });
  return (await item.locator('strong').first().innerText()).trim();
}

describe('the workshop, as a member sets it up', () => {
  it('a grinder, two wheels of one diameter and a setup: one shared setting', async () => {
    const accounts = (await (await fetch(`${base}/auth/demo-accounts`)).json()) as { handle: string; role: string }[];
    const member = accounts.filter((a) => a.role === 'member')[2];
    await app.signInAs(member.handle, '/workshop');
    await page.getByRole('heading', { name: 'What to set today' }).waitFor();

    await fill('A grinder', { Name: 'Wet grinder', 'Spindle speed (rpm)': '90', 'Support bar diameter (mm)': '12', 'Price paid (optional)': '700', 'Currency, e.g. EUR': 'EUR' });
    await form('A grinder').getByRole('button', { name: 'Add' }).click();
    await form('A wheel').waitFor();

    const wheel = { 'Diameter when new (mm)': '250', 'Rated maximum speed (m/s, on the wheel)': '20', 'Currency, e.g. EUR': 'EUR' };
    await fill('A wheel', { Name: 'CBN fine', 'Abrasive page': 'cbn-electroplated-wheel-250-b126', ...wheel, 'Price paid (optional)': '300' });
    await form('A wheel').getByRole('button', { name: 'Add' }).click();
    await page.getByRole('heading', { name: 'CBN fine' }).waitFor();
    await fill('A wheel', { Name: 'Vitrified', 'Abrasive page': 'sic-vitrified-wheel-200-f220', ...wheel, 'Minimum usable diameter (mm, from the maker)': '180', 'Price paid (optional)': '140' });
    await form('A wheel').getByRole('button', { name: 'Add' }).click();
    await page.getByRole('heading', { name: 'Vitrified' }).waitFor();

    await fill('A setup', { 'Name, e.g. “chef knife at 15°”': 'Chef knife 15°', 'Projection (mm)': '140', 'Angle per side (°)': '15' });
    await form('A setup').getByRole('button', { name: 'Add' }).click();
    const setup = page.getByRole('article', { name: 'Setup Chef knife 15°' });
    await setup.waitFor();
    await expect.poll(() => setup.innerText()).toMatch(/CBN fine, Vitrified · 250(\.0)?\s?mm today: these wheels have the same diameter and share this one setting/);
  }, 90_000);

  it('a worn diameter logged on the vitrified wheel moves its setting', async () => {
    const before = await gapFor('CBN fine');
    const card = page.getByRole('article', { name: 'Vitrified' });
    const log = card.getByRole('form', { name: 'Log a measurement' });
    await log.getByLabel('Date').fill('2026-01-01');
    await log.getByLabel('Diameter (mm)').fill('250');
    await log.getByRole('button', { name: 'Log measurement' }).click();
    await card.getByRole('cell', { name: '1 Jan 2026' }).waitFor();
    await log.getByLabel('Date').fill('2026-03-01');
    await log.getByLabel('Diameter (mm)').fill('246');
    await log.getByLabel('Sharpenings since').fill('40');
    await log.getByRole('button', { name: 'Log measurement' }).click();
    await card.getByRole('cell', { name: '1 Mar 2026' }).waitFor();

    const setup = page.getByRole('article', { name: 'Setup Chef knife 15°' });
    await expect.poll(() => setup.innerText()).toMatch(/Vitrified has worn: the setting moved \+\d/);
    expect(await gapFor('CBN fine')).toBe(before);
    expect(await gapFor('Vitrified')).not.toBe(before);
    // the kit's cost: per sharpening on the worn wheel, and the wheels against the machine
    await expect.poll(() => card.innerText()).toMatch(/0\.2\s?EUR over about 700 sharpenings/);
    expect(await card.innerText()).toMatch(/Only 2 measurements: a rough estimate/);
    const kit = page.getByRole('region', { name: 'The kit' });
    expect(await kit.innerText()).toMatch(/2 wheels: 440\s?EUR against 700\s?EUR for the machine \(0\.63 times\)/);
    expect(await kit.innerText()).toMatch(/change water with corrosion inhibitor for water|change water for water with corrosion inhibitor/);
    // the whole kit per sharpening: the vitrified wheel's 0.2 EUR; the CBN wheel has no reported life, so it is named and the sum is a floor
    expect(await kit.innerText()).toMatch(/At least 0\.2\s?EUR a sharpening, from 1 of 2 wheels \(Vitrified 0\.2\s?EUR\)\. A rough estimate/);
    expect(await kit.innerText()).toMatch(/Not counted: CBN fine \(no member has reported the life of a wheel of its abrasive yet\)/);
    await screenshots('page');
  }, 90_000);

  it('lengths switch to inches and back', async () => {
    await page.getByLabel('Lengths in').selectOption('in');
    await expect.poll(() => page.getByRole('article', { name: 'CBN fine' }).innerText()).toMatch(/9\.843\s?in/);
    await page.goto(`${base}/tools/side-angle`);
    await expect.poll(() => page.getByLabel('Support bar diameter (in)').inputValue()).toBe('0.4724'); // 12 / 25.4
    // the same setup as 12 mm bar, 24 mm gap, 120 mm projection: asin(30 / 120) = 14.48°
    expect(await page.getByText('14.48°').first().isVisible()).toBe(true);
    await screenshots('side-angle-inches');
    await page.getByLabel('Lengths in').selectOption('mm');
    await expect.poll(() => page.getByLabel('Support bar diameter (mm)').inputValue()).toBe('12');
  }, 60_000);

  it('the result form takes its angle from the setup on a wheel', async () => {
    await page.goto(`${base}/results/new`);
    const group = page.getByRole('group', { name: /From my workshop/ });
    await group.getByLabel('Saved setup').selectOption({ label: 'Chef knife 15° (15° per side)' });
    await group.getByLabel('On wheel').selectOption({ label: 'Vitrified' });
    await expect.poll(() => page.getByLabel('Angle per side (°)').inputValue()).toBe('15');
    expect(await group.innerText()).toMatch(/15° per side, from your setup “Chef knife 15°” on “Vitrified”: gap [\d.]+\s?mm to the rim at its diameter today of 246(\.0)?\s?mm/);
    expect(await page.getByLabel('Final abrasive', { exact: true }).inputValue()).toBe('sic-vitrified-wheel-200-f220');
    // a progression step on the CBN wheel (inhibitor) before the vitrified one (plain water): one change of the trough
    await page.getByRole('button', { name: 'Add a step' }).click();
    await page.getByLabel('Step 1: abrasive').selectOption('cbn-electroplated-wheel-250-b126');
    const coolant = page.getByLabel('Coolant along the progression');
    await expect.poll(() => coolant.innerText()).toMatch(/Change it once: after step 1, from water with corrosion inhibitor to water\./);
    expect(await coolant.innerText()).toMatch(/safety data sheet/);
    await group.scrollIntoViewIfNeeded();
    await screenshots('result-form');
  }, 60_000);

  it('the result form\'s wheel setup boxes follow mm/inch, and give back exactly what was typed', async () => {
    await page.getByLabel('From my wheel setup').check();
    await page.getByLabel('Lengths in').selectOption('mm');
    const typed = { 'Wheel diameter': '250', 'Support bar diameter': '12', 'Gap, bar to rim': '80.25', Projection: '140' };
    for (const [label, value] of Object.entries(typed)) await page.getByLabel(`${label} (mm)`).fill(value);
    const preview = page.locator('#result-setup-preview');
    await expect.poll(() => preview.innerText()).toMatch(/Angle from this setup: [\d.]+° per side/);
    const angle = await preview.innerText();
    await page.getByLabel('Lengths in').selectOption('in');
    // 250 / 25.4 = 9.84252…, 80.25 / 25.4 = 3.15944… (NIST: 1 in = 25.4 mm exactly), four decimals in the box
    await expect.poll(() => page.getByLabel('Wheel diameter (in)').inputValue()).toBe('9.8425');
    expect(await page.getByLabel('Gap, bar to rim (in)').inputValue()).toBe('3.1594');
    expect(await preview.innerText()).toBe(angle);
    await screenshots('result-setup-inches');
    await page.getByLabel('Lengths in').selectOption('mm');
    for (const [label, value] of Object.entries(typed)) expect(await page.getByLabel(`${label} (mm)`).inputValue()).toBe(value);
    // typed in inches: 0.5 in is 12.7 mm, and back in inches it reads as typed
    await page.getByLabel('Lengths in').selectOption('in');
    await page.getByLabel('Support bar diameter (in)').fill('0.5');
    await page.getByLabel('Lengths in').selectOption('mm');
    await expect.poll(() => page.getByLabel('Support bar diameter (mm)').inputValue()).toBe('12.7');
    await page.getByLabel('Lengths in').selectOption('in');
    await expect.poll(() => page.getByLabel('Support bar diameter (in)').inputValue()).toBe('0.5');
    await page.getByLabel('Lengths in').selectOption('mm');
  }, 60_000);

  it('the decision view says where the trough must change between two options', async () => {
    // demo data (invented): on AISI D2, CBN in the φ 4–5 band (the B46 resin wheel's page: water with inhibitor)
    // and aluminium oxide in φ 6–7 (JIS 1000 wheel and stone pages: water)
    await page.goto(`${base}/steels/aisi-d2/decide?method=push-cut-test-v2&a=aisi-d2:cbn:4&b=aisi-d2:aluminium-oxide:6`);
    const trough = page.getByLabel('Coolant between the two');
    await expect.poll(() => trough.innerText()).toMatch(/Going from CBN, 31\.3\s?–\s?62\.5\s?µm to Aluminium oxide, 7\.8\s?–\s?15\.6\s?µm, the trough must change between them: from water with corrosion inhibitor to water\./);
    expect(await trough.innerText()).toMatch(/safety data sheet.*makers’ instructions.*local regulations/s);
    await screenshots('decide');
  }, 60_000);

  it('a price reported on the abrasive page shows as a median with n', async () => {
    await page.goto(`${base}/abrasives/cbn-electroplated-wheel-250-b126`);
    await fill('Report a price you paid', { 'Price paid': '310', 'Currency, e.g. EUR': 'EUR', 'Paid on': '2026-02-01' });
    await form('Report a price you paid').getByRole('button', { name: 'Report the price' }).click();
    const prices = page.getByRole('region', { name: 'Prices members paid' });
    await expect.poll(() => prices.innerText()).toMatch(/310\s?EUR/);
    expect(await prices.innerText()).toMatch(/New: 310\s?EUR median, n = 1 \(one report: one person’s price, not a typical one\)/);
    await screenshots('prices');
  }, 60_000);
});
