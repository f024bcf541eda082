/**
 * Browser test of the moderator's desk (issue 6): a publisher's import approved in one go, a
 * member's flag closed with a note, the queue filtered by author, a second moderator's decision
 * refused on screen, and the audit log showing both attempts. The built client is served by
 * the real server over a fresh data folder, in headless Debian Chromium; elements are found by
 * role and label. It builds nothing: `dist/` must exist.
 */
import type { Page } from 'playwright-core';
import { beforeAll, describe, expect, it } from 'vitest';
import { e2eSuite, type DemoAccount } from '../setup/e2e-app';
import { IMPORT_COLUMNS } from '../../shared/csv';
import { toCsv } from '../../shared/csv-writer';

async function api<T>(pathname: string, init?: RequestInit): Promise<{ status: number; body: T }> {
  const res = await fetch(`${base}${pathname}`, init);
  const text = await res.text();
  return { status: res.status, body: (text ? JSON.parse(text) : null) as T };
}

const suite = e2eSuite('moderator', [3660, 3679]); // this suite's ports
let base = '';
let page: Page;
beforeAll(() => void ({ base, page } = suite.app));
const { signInAs, signOut } = suite;

/** Makes a token on one's own page and reads it off the screen. */
async function makeToken(name: string): Promise<string> {
  const tokens = page.getByRole('region', { name: 'API tokens' });
  await tokens.getByLabel('Token name').fill(name);
  await tokens.getByRole('button', { name: 'Create token' }).click();
  // The new token has the focus, with a button to copy it.
  const field = tokens.getByLabel('New token');
  expect(await field.evaluate((el) => el === document.activeElement)).toBe(true);
  expect(await tokens.getByRole('button', { name: 'Copy token' }).isVisible()).toBe(true);
  return (await field.inputValue()).trim();
}

const bearer = (token: string) => ({ Authorization: `Bearer ${token}` });

describe('the moderator’s desk in a browser', () => {
  let accounts: DemoAccount[] = [];
  let moderatorToken = '';
  let publisher: DemoAccount;
  let importId = 0;
  let singleId = 0;

  it('0. a publisher imports five results and posts one more; a member flags a published result', async () => {
    accounts = (await api<DemoAccount[]>('/auth/demo-accounts')).body;
    const mod2 = accounts.filter((a) => a.role === 'moderator')[1];
    publisher = accounts.find((a) => a.role === 'publisher')!;
    const member = accounts.find((a) => a.role === 'member')!;
    expect(mod2).toBeDefined();

    await signInAs(mod2.handle, '/me');
    moderatorToken = await makeToken('second moderator');
    await signOut();

    await signInAs(publisher.handle, '/me');
    const publisherToken = await makeToken('import script');
    await signOut();
    const rows = Array.from({ length: 5 }, (_, i) => IMPORT_COLUMNS.map((c) => ({ steel: 'aisi-52100', hardness: String(61 + (i % 2)), abrasive: 'diamond-electroplated-wheel-250-d46', angle_per_side_deg: '15', sharpness_method: 'push-cut-test-v2', readings_g: `${120 + i};125;130` })[c as string] ?? ''));
    const form = new FormData();
    form.append('file', new Blob([toCsv([[...IMPORT_COLUMNS], ...rows])], { type: 'text/csv' }), 'batch.csv');
    const imported = await api<{ importId: number; imported: number }>('/api/import/results', { method: 'POST', headers: bearer(publisherToken), body: form });
    expect(imported.status).toBe(201);
    importId = imported.body.importId;
    const single = { steel: 'aisi-o1', hardness: { value: 62, scale: 'HRC' }, abrasive: 'alox-vitrified-wheel-250-fine-dressed', edgeAngle: { perSideDeg: 14 }, sharpness: { method: 'push-cut-test-v2', readingsG: [200, 205, 198] } };
    const posted = await api<{ id: number }>('/api/results', { method: 'POST', headers: { ...bearer(publisherToken), 'Content-Type': 'application/json' }, body: JSON.stringify(single) });
    expect(posted.status).toBe(201);
    singleId = posted.body.id;

    const published = (await api<{ items: { id: number }[] }>('/api/results')).body.items[0].id;
    await signInAs(member.handle, `/results/${published}`);
    await page.getByRole('button', { name: 'Flag this result…' }).click();
    const flagForm = page.getByRole('form', { name: 'Flag this result' });
    await flagForm.getByLabel('What is wrong').selectOption('implausible-figures');
    await flagForm.getByLabel('Details').fill('The median is below what this tester can read.');
    await flagForm.getByRole('button', { name: 'Send flag' }).click();
    await page.getByText('Thank you: the moderators will look at your flag.').waitFor();
    await signOut();
  }, 90_000);

  it('1. a moderator approves the whole import at once and closes the flag with a note', async () => {
    const mod1 = accounts.filter((a) => a.role === 'moderator')[0];
    await signInAs(mod1.handle, '/review');
    const imports = page.getByRole('region', { name: /^Imports awaiting review/ });
    const batch = imports.getByRole('listitem').filter({ hasText: `Import #${importId}` });
    expect(await batch.textContent()).toContain('5 of 5 awaiting review');
    await batch.getByRole('button', { name: 'Approve all 5' }).click();
    await page.getByText('Approved 5.').waitFor();
    const batchState = (await api<{ items: { author: { handle: string } }[] }>(`/api/results?author=${publisher.handle}`)).body.items;
    expect(batchState.length).toBeGreaterThan(0);

    const flags = page.getByRole('region', { name: /^Flags/ });
    const flag = flags.getByRole('listitem').filter({ hasText: 'The median is below what this tester can read.' });
    await flag.getByLabel('Outcome').selectOption('dismissed');
    await flag.getByLabel('Note').fill('Within the tester’s range per its method page.');
    await flag.getByRole('button', { name: 'Close flag' }).click();
    await flag.waitFor({ state: 'detached' });
  }, 60_000);

  it('2. filters the queue by author, and sees a second decision refused when another moderator decided first', async () => {
    await page.getByLabel('Author (handle)').fill(publisher.handle);
    await page.getByRole('button', { name: 'Filter', exact: true }).click();
    await page.waitForURL(new RegExp(`author=${publisher.handle}`));
    const queue = page.getByRole('region', { name: /^Awaiting review/ });
    // Only the publisher's pending results are left in the queue.
    const single = queue.getByRole('link', { name: new RegExp(`#${singleId} `) });
    await single.waitFor();
    await expect.poll(async () => (await queue.getByRole('listitem').allTextContents()).every((t) => t.includes(publisher.displayName ?? publisher.handle))).toBe(true);
    await single.click();
    const opened = page.getByRole('region', { name: new RegExp(`^Result ${singleId}:`) });
    await opened.getByRole('button', { name: 'Approve' }).waitFor();
    await page.waitForLoadState('networkidle');
    expect(page.url()).toContain(`author=${publisher.handle}`);

    // Meanwhile the second moderator approves it through the API.
    const other = await api(`/api/results/${singleId}/review`, { method: 'POST', headers: { ...bearer(moderatorToken), 'Content-Type': 'application/json' }, body: JSON.stringify({ decision: 'approve' }) });
    expect(other.status).toBe(200);
    await opened.getByLabel('Note to the author').fill('Not enough readings.');
    await opened.getByRole('button', { name: 'Reject' }).click();
    await page.getByText('Another moderator has already decided on this result; it has left the queue.').waitFor();
  }, 60_000);

  it('3. the audit log shows both attempts, the bulk approval and the closed flag', async () => {
    await page.goto(`${base}/review`);
    await page.getByRole('navigation', { name: 'Staff' }).getByRole('link', { name: 'Audit log' }).click();
    await page.waitForURL(/\/audit$/);
    const log = page.getByRole('table').filter({ hasText: 'Every moderator and admin action' });
    const forSingle = log.getByRole('row').filter({ hasText: new RegExp(`result ${singleId}(?!\\d)`) });
    await expect.poll(() => forSingle.count()).toBe(2);
    const [refused, done] = [forSingle.nth(0), forSingle.nth(1)];
    expect(await refused.textContent()).toMatch(/rejected result.*Refused.*Not enough readings\..*already decided/);
    expect(await done.textContent()).toMatch(/approved result.*Done/);
    expect(await log.getByRole('row').filter({ hasText: 'dismissed flag' }).textContent()).toContain('Within the tester’s range');
    await page.getByLabel('Action starts with').fill('result.approve');
    await page.getByRole('button', { name: 'Filter' }).click();
    await page.waitForURL(/action=result.approve/);
    await expect.poll(() => log.getByRole('row').filter({ hasText: 'approved result' }).count()).toBeGreaterThanOrEqual(6);
  }, 60_000);
});
