/**
 * Browser test of the publisher's journey (issue 6): sign in, download the template, dry-run a
 * file with a bad row (every problem listed, the error report downloadable), import 1 000 rows
 * in one go, see the import on one's own page, make an API token and use it, add a photo.
 * The built client is served by the real server over a fresh data folder, in headless Debian
 * Chromium; elements are found by role and label. It builds nothing: `dist/` must exist.
 */
import fs from 'node:fs';
import type { Page } from 'playwright-core';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startE2eApp, type E2eApp } from '../setup/e2e-app';
import { IMPORT_COLUMNS } from '../../shared/csv';
import { toCsv } from '../../shared/csv-writer';

let app: E2eApp;
let base = '';
let page: Page;

async function api<T>(pathname: string, init?: RequestInit): Promise<{ status: number; body: T }> {
  const res = await fetch(`${base}${pathname}`, init);
  const text = await res.text();
  return { status: res.status, body: (text ? JSON.parse(text) : null) as T };
}

beforeAll(async () => {
  // This suite's ports: 3640–3659.
  app = await startE2eApp('publisher', [3640, 3659]);
  ({ base, page } = app);
}, 90_000);

afterAll(() => app?.stop(), 30_000);

const row = (i: number, overrides: Partial<Record<(typeof IMPORT_COLUMNS)[number], string>> = {}) => {
  const cells: Record<string, string> = {
    steel: i % 2 ? 'D2' : 'aisi-d2',
    hardness: String(60 + (i % 3)),
    abrasive: 'cbn-electroplated-wheel-250-b126',
    grit_standard: 'iso6106',
    grit: 'B126',
    angle_per_side_deg: String(12 + (i % 6)),
    sharpness_method: 'push-cut-test-v2',
    readings_g: `${150 + (i % 40)};${160 + (i % 30)};170`,
    notes: `Invented browser-test row ${i}.`,
    ...overrides,
  };
  return IMPORT_COLUMNS.map((c) => cells[c] ?? '');
};
const csvFile = (name: string, rows: string[][]) => ({ name, mimeType: 'text/csv', buffer: Buffer.from(toCsv([[...IMPORT_COLUMNS], ...rows])) });

describe('the publisher’s journey in a browser', () => {
  let publisherHandle = '';

  it('1. a publisher checks a file with a bad row, reads every problem, and downloads the error report', async () => {
    const accounts = (await api<{ handle: string; role: string; displayName?: string }[]>('/auth/demo-accounts')).body;
    const publisher = accounts.find((a) => a.role === 'publisher')!;
    publisherHandle = publisher.handle;
    await page.goto(`${base}/auth/signin?as=${encodeURIComponent(publisher.handle)}&returnTo=${encodeURIComponent('/import')}`);
    await page.waitForURL(/\/import$/);
    await page.getByRole('heading', { name: 'Import results', level: 1 }).waitFor();
    // The header offers the import to publishers.
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Import' }).waitFor();
    expect(await page.getByRole('link', { name: 'Download the template (CSV)' }).getAttribute('href')).toBe('/api/v1/import/template.csv');

    await page.getByLabel('CSV file of results').setInputFiles(csvFile('mixed.csv', [row(0), row(1), row(2, { steel: 'no-such-steel' }), row(3, { readings_g: '' })]));
    await page.getByRole('button', { name: 'Check the file' }).click();
    await page.getByText('4 rows read, 2 valid, 2 problems found').waitFor();
    const problems = page.getByRole('table').filter({ hasText: 'Problems by row' });
    expect(await problems.getByRole('row').filter({ hasText: 'no steel page matches' }).textContent()).toMatch(/^4steel/);
    expect(await problems.getByRole('row').filter({ hasText: 'readings_g' }).first().textContent()).toMatch(/^5readings_g/);
    expect(await page.getByRole('button', { name: /^Import \d+ result/ }).count()).toBe(0);

    const download = page.waitForEvent('download');
    await page.getByRole('button', { name: 'Download the error report (CSV)' }).click();
    const file = await (await download).path();
    const report = fs.readFileSync(file!, 'utf8');
    expect(report.split('\r\n')[0]).toBe('row,column,message');
    expect(report).toMatch(/^4,steel,/m);
    expect(report).toMatch(/^5,readings_g,/m);
  }, 60_000);

  it('2. imports 1 000 good rows in one go and sees the import on their page', async () => {
    await page.getByLabel('CSV file of results').setInputFiles(csvFile('good.csv', Array.from({ length: 1000 }, (_, i) => row(i))));
    await page.getByRole('button', { name: 'Check the file' }).click();
    await page.getByText('1000 rows read, 1000 valid: every row is ready to import.').waitFor();
    // The preview shows how rows will be stored: D2 matched by designation, grit converted to µm.
    const preview = page.getByRole('table', { name: /How the first rows will be stored/ });
    expect(await preview.getByRole('row').nth(2).textContent()).toContain('AISI D2');
    await page.getByRole('button', { name: 'Import 1000 results' }).click();
    const done = page.getByText(/Imported 1000 results \(import #(\d+)\)/);
    await done.waitFor({ timeout: 60_000 });
    const importId = /import #(\d+)/.exec((await done.textContent()) ?? '')![1];

    await page.getByRole('link', { name: 'Your page' }).click();
    await page.waitForURL(/\/me$/);
    const imports = page.getByRole('region', { name: 'Your imports' });
    expect(await imports.getByText(`Import #${importId}`).textContent()).toContain('1000 awaiting review');
  }, 90_000);

  it('3. makes an API token, uses it from a script, and revokes it', async () => {
    const tokens = page.getByRole('region', { name: 'API tokens' });
    await tokens.getByLabel('Token name').fill('bench script');
    await tokens.getByRole('button', { name: 'Create token' }).click();
    const token = (await tokens.getByLabel('New token').inputValue()).trim();
    expect(token).toMatch(/^elt_/);

    const input = { steel: 'aisi-o1', hardness: { value: 62, scale: 'HRC' }, abrasive: 'alox-vitrified-wheel-250-fine-dressed', edgeAngle: { perSideDeg: 14 }, sharpness: { method: 'push-cut-test-v2', readingsG: [200, 205, 198] } };
    const posted = await api<{ id: number; author: { handle: string } }>('/api/results', { method: 'POST', headers: { Authorization: `Bearer ${token}`, 'Content-Type': 'application/json' }, body: JSON.stringify(input) });
    expect(posted.status).toBe(201);
    expect(posted.body.author.handle).toBe(publisherHandle);

    await tokens.getByRole('button', { name: 'Revoke token bench script' }).click();
    await tokens.getByText(/Revoked/).waitFor();
    const refused = await api('/api/results', { method: 'POST', headers: { Authorization: `Bearer ${token}`, 'Content-Type': 'application/json' }, body: JSON.stringify(input) });
    expect(refused.status).toBe(401);
  }, 60_000);

  it('4. adds a photo with alt text to one of their results, and its GPS position is not served', async () => {
    await page.getByRole('region', { name: /^Awaiting review/ }).getByRole('link').first().click();
    await page.waitForURL(/\/results\/\d+$/);
    const photos = page.getByRole('region', { name: /^Photos/ });
    const jpeg = await sharp({ create: { width: 320, height: 240, channels: 3, background: { r: 90, g: 90, b: 100 } } })
      .jpeg()
      .withExif({ IFD3: { GPSLatitudeRef: 'N', GPSLatitude: '51/1 30/1 0/1', GPSLongitudeRef: 'W', GPSLongitude: '0/1 7/1 0/1' } })
      .toBuffer();
    await photos.getByLabel('Photo', { exact: true }).setInputFiles({ name: 'bevel.jpg', mimeType: 'image/jpeg', buffer: jpeg });
    await photos.getByRole('button', { name: 'Upload photo' }).click();
    await photos.getByText('Describe the photo for people who cannot see it').waitFor();
    await photos.getByLabel('Description (alt text)').fill('Bevel at 50× after the B126 wheel');
    await photos.getByRole('button', { name: 'Upload photo' }).click();
    const img = photos.getByRole('img', { name: 'Bevel at 50× after the B126 wheel' });
    await img.waitFor();
    await expect.poll(() => img.evaluate((el) => (el as HTMLImageElement).naturalWidth)).toBe(320);
    const src = await img.getAttribute('src');
    const served = await page.evaluate(async (url) => Array.from(new Uint8Array(await (await fetch(url!)).arrayBuffer())), src);
    expect(Buffer.from(served).includes(Buffer.from('GPS'))).toBe(false);
  }, 60_000);
});
