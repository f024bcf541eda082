/**
 * Browser test of issue 17's loops: a moderator returns a member's result with a note, the
 * member edits and resubmits it, the moderator approves it; the member corrects the published
 * result and the moderator approves the correction from its diff; an admin bans a member and
 * changes a role from the members screen and reads it in the audit log; a publisher's import
 * with several bad fields in a row gets every one reported; a moderator edits a page, reads its
 * history numbered per page, a diff, and reverts. Built client, real server, headless Debian Chromium.
 * Screenshots go to $LOOPS_SHOTS when set (1280x900 and 390x844).
 */
import type { Page } from 'playwright-core';
import { beforeAll, describe, expect, it } from 'vitest';
import { e2eSuite, type DemoAccount } from '../setup/e2e-app';
import { IMPORT_COLUMNS } from '../../shared/csv';
import { toCsv } from '../../shared/csv-writer';

const shots = process.env.LOOPS_SHOTS;

const suite = e2eSuite('loops', [3700, 3719]); // this suite's ports
let base = '';
let page: Page;
beforeAll(() => void ({ base, page } = suite.app));
const { signInAs, signOut } = suite;

/** Full-page screenshots at the desktop and phone sizes, when asked for. */
async function screenshot(name: string) {
  if (!shots) return;
  for (const [w, h] of [[1280, 900], [390, 844]] as const) {
    await page.setViewportSize({ width: w, height: h });
    await page.screenshot({ path: `${shots}/${name}-${w}.png`, fullPage: true });
  }
  await page.setViewportSize({ width: 1280, height: 900 });
}

/** The demo accounts the sign-in page offers. */
const demoAccounts = async () => (await (await fetch(`${base}/auth/demo-accounts`)).json()) as DemoAccount[];

/** The signed-in browser's own API call (session cookie and CSRF token). */
async function browserPost<T>(url: string, body: unknown): Promise<T> {
  return page.evaluate(
    async ([u, b]) => {
      const session = await (await fetch('/api/session')).json();
      const res = await fetch(u as string, { method: 'POST', headers: { 'Content-Type': 'application/json', 'X-CSRF-Token': session.csrfToken }, body: JSON.stringify(b) });
      return res.json();
    },
    [url, body] as const,
  ) as Promise<T>;
}

describe('edit and resubmit, corrections, members', () => {
  let accounts: DemoAccount[] = [];
  let member: DemoAccount;
  let moderator: DemoAccount;
  let id = 0;

  it('a moderator returns a result with a note; the member edits and resubmits it', async () => {
    accounts = await demoAccounts();
    member = accounts.filter((a) => a.role === 'member')[1];
    moderator = accounts.find((a) => a.role === 'moderator')!;

    await signInAs(member.handle, '/me');
    const posted = await browserPost<{ id: number }>('/api/results', {
      steel: 'aisi-o1',
      hardness: { value: 62, scale: 'HRC' },
      abrasive: 'alox-vitrified-wheel-250-fine-dressed',
      edgeAngle: { perSideDeg: 14 },
      sharpness: { method: 'push-cut-test-v2', readingsG: [200, 205, 198] },
    });
    id = posted.id;
    await signOut();

    await signInAs(moderator.handle, `/review?open=${id}`);
    // The desk's context: the cell and place in it, the outlier rule with its source, the method's readings, duplicates, the record.
    const context = page.getByRole('region', { name: 'Context' });
    await context.getByText('Cell it would join').waitFor();
    await context.getByText(/percentile rank|first/).first().waitFor();
    await context.getByText(/Tukey's fences.*Exploratory Data Analysis/).waitFor();
    await context.getByText('The method asks for 5 readings per edge; this result has 3 (2 short).').waitFor();
    await context.getByText(/Near-duplicate: another pending or published result/).waitFor();
    await context.getByText(/published, \d+ pending/).waitFor();
    await page.getByRole('heading', { name: 'Keyboard shortcuts' }).waitFor();
    await screenshot('desk-context');
    const decision = page.getByRole('form', { name: `Decision on result ${id}` });
    await decision.getByLabel('Note to the author').fill('Add two more readings.');
    await decision.getByRole('button', { name: 'Return with note' }).click();
    await page.getByRole('status').getByText(`Result ${id} returned to its author. Saved.`).waitFor();
    await signOut();

    await signInAs(member.handle, `/results/${id}`);
    await page.getByText('Add two more readings.').first().waitFor();
    await page.getByRole('link', { name: 'Edit and resubmit' }).click();
    const form = page.getByRole('form', { name: `Edit result ${id}` });
    await form.getByLabel(/Readings/).fill('200, 205, 198, 210, 202');
    await screenshot('edit-form');
    await form.getByRole('button', { name: 'Resubmit for review' }).click();
    await page.getByText('Saved as version 2. The result is back on the review desk.').waitFor();
    await page.getByText('Awaiting review').first().waitFor();
    await signOut();
  }, 120_000);

  it('the moderator approves the resubmission; the member corrects it; the correction is approved from its diff', async () => {
    await signInAs(moderator.handle, `/review?open=${id}`);
    await page.getByRole('form', { name: `Decision on result ${id}` }).getByRole('button', { name: 'Approve' }).click();
    await page.getByRole('status').getByText(`Result ${id} approved. Saved.`).waitFor();
    await signOut();

    await signInAs(member.handle, `/results/${id}`);
    await page.getByRole('link', { name: 'Correct' }).click();
    const form = page.getByRole('form', { name: `Edit result ${id}` });
    await form.getByLabel(/Readings/).fill('200, 205, 198, 210, 204');
    await form.getByRole('button', { name: 'Send correction for review' }).click();
    await page.getByText('Correction sent as version 3.', { exact: false }).waitFor();
    // The published version is unchanged until the correction is approved.
    const published = (await (await fetch(`${base}/api/results/${id}`)).json()) as { sharpness: { readingsG: number[] } };
    expect(published.sharpness.readingsG).toEqual([200, 205, 198, 210, 202]);
    await signOut();

    await signInAs(moderator.handle, '/review');
    const corrections = page.getByRole('region', { name: /Corrections of published results/ });
    await corrections.getByRole('table', { name: 'Changes against the published version' }).getByText('200, 205, 198, 210, 204').waitFor();
    await screenshot('desk-correction');
    await corrections.getByRole('form', { name: `Decision on the correction of result ${id}` }).getByRole('button', { name: 'Approve' }).click();
    await page.getByRole('status').getByText(`Correction (version 3) of result ${id} approved. Saved.`).waitFor();
    const after = (await (await fetch(`${base}/api/results/${id}`)).json()) as { sharpness: { readingsG: number[] } };
    expect(after.sharpness.readingsG).toEqual([200, 205, 198, 210, 204]);
    await signOut();
  }, 120_000);

  it('an admin bans a member and changes a role from the members screen, both audited', async () => {
    const admin = accounts.find((a) => a.role === 'admin')!;
    const target = accounts.filter((a) => a.role === 'member')[2];
    await signInAs(admin.handle, '/me');
    await page.getByRole('navigation', { name: 'Staff' }).getByRole('link', { name: 'Members' }).click();
    await page.getByLabel('Find a member by handle or name').fill(target.handle);
    await page.getByRole('button', { name: 'Search' }).click();
    let change = page.getByRole('form', { name: `Change @${target.handle}` });
    await change.getByLabel('Role').selectOption('publisher');
    await change.getByLabel('Reason (kept in the audit log)').fill('Runs a test bench.');
    await change.getByRole('button', { name: 'Save' }).click();
    await page.getByText(`Saved: @${target.handle} is now publisher.`).waitFor();
    change = page.getByRole('form', { name: `Change @${target.handle}` });
    await change.getByLabel('Banned').check();
    await change.getByLabel('Reason (kept in the audit log)').fill('Copied readings.');
    await change.getByRole('button', { name: 'Save' }).click();
    await page.getByText(`Saved: @${target.handle} is now publisher, banned`, { exact: false }).waitFor();
    await page.getByLabel('Find a member by handle or name').fill('');
    await page.getByRole('button', { name: 'Search' }).click();
    await screenshot('admin-members');
    await page.getByRole('navigation', { name: 'Staff' }).getByRole('link', { name: 'Audit log' }).click();
    await page.getByText('Copied readings.').first().waitFor();
    await screenshot('audit-log');
    await signOut();
  }, 120_000);
});

describe('an import report that says everything', () => {
  it('a publisher checks a file whose rows have several bad fields and a near-miss slug: every problem is listed, with the nearest slug', async () => {
    const accounts = await demoAccounts();
    const good: Record<string, string> = {
      steel: 'aisi-d2', hardness: '61', abrasive: 'cbn-electroplated-wheel-250-b126', grit_standard: 'iso6106', grit: 'B126',
      angle_per_side_deg: '15', sharpness_method: 'push-cut-test-v2', readings_g: '180;175;190', notes: 'Invented browser-test row.',
    };
    const rowOf = (overrides: Record<string, string>) => IMPORT_COLUMNS.map((c) => ({ ...good, ...overrides })[c] ?? '');
    const csv = toCsv([[...IMPORT_COLUMNS], rowOf({}), rowOf({ hardness: '95', readings_g: 'abc' }), rowOf({ steel: 'aisi-d3' })]);
    await signInAs(accounts.find((a) => a.role === 'publisher')!.handle, '/import');
    await page.getByLabel('CSV file of results').setInputFiles({ name: 'several.csv', mimeType: 'text/csv', buffer: Buffer.from(csv) });
    await page.getByRole('button', { name: 'Check the file' }).click();
    const problems = page.getByRole('table').filter({ hasText: 'Problems by row' });
    await problems.waitFor();
    // Row 3 (the file's second data row) has two bad fields: both are listed.
    expect(await problems.getByRole('row').filter({ hasText: /^3hardness/ }).count()).toBe(1);
    expect(await problems.getByRole('row').filter({ hasText: /^3readings_g/ }).count()).toBe(1);
    await problems.getByText('did you mean "aisi-d2"?', { exact: false }).waitFor();
    await screenshot('import-report');
    await signOut();
  }, 60_000);
});

describe('a page edit, its history numbered per page, a diff and a revert', () => {
  it('a moderator edits a steel page twice; the history names revisions 1, 2 and 3 of this page; a diff; a revert makes revision 4', async () => {
    const accounts = await demoAccounts();
    const moderator = accounts.find((a) => a.role === 'moderator')!;
    const slug = 'aisi-440a';
    await signInAs(moderator.handle, `/steels/${slug}/edit`);
    for (const [to, summary] of [['57', 'Upper hardness as tempered'], ['56', 'Upper hardness for a tougher edge']] as const) {
      if (!page.url().endsWith('/edit')) await page.goto(`${base}/steels/${slug}/edit`);
      await page.getByLabel('To (HRC)').fill(to);
      await page.getByLabel('Summary of your changes').fill(summary);
      await page.getByRole('button', { name: 'Save and publish' }).click();
      await page.waitForURL(new RegExp(`/steels/${slug}$`));
    }
    await page.getByRole('link', { name: 'History' }).click();
    const history = page.getByRole('table', { name: /Revisions of/ });
    for (const n of [1, 2, 3]) await history.getByRole('link', { name: `Revision ${n}`, exact: true }).waitFor();
    await screenshot('page-history');
    await page.getByRole('button', { name: 'Compare the selected revisions' }).click();
    await page.getByRole('heading', { name: /revision 2 against 3/ }).waitFor();
    expect(await page.getByRole('table', { name: 'Changes to Typical hardness (HRC)' }).locator('ins').allTextContents()).toContain('56');
    await screenshot('page-diff');
    await page.getByRole('link', { name: 'Back to the history' }).click();
    await history.getByRole('row', { name: /Revision 1\b/ }).getByRole('button', { name: 'Revert to this' }).click();
    await page.getByText('Make revision 1 current again, as a new revision?').waitFor();
    await page.getByRole('button', { name: 'Yes, revert' }).click();
    const reverted = history.getByRole('row', { name: /Revision 4\b/ });
    await reverted.getByText('restores revision 1').waitFor();
    expect(await reverted.textContent()).toContain('Reverted to revision 1');
    await screenshot('page-reverted');
    await signOut();
  }, 90_000);
});

describe('small things found by walking it (issue 17, item 6)', () => {
  it('the sign-in page lets a visitor choose whom to sign in as, rather than signing in a default member', async () => {
    await page.goto(`${base}/sign-in`);
    await page.getByRole('heading', { name: 'Demo accounts' }).waitFor();
    await page.getByText('choose whom to sign in as', { exact: false }).waitFor();
    expect(await page.getByRole('link', { name: 'Continue to sign in' }).count()).toBe(0);
  }, 60_000);

  it("an unknown steel's page says there is no such steel, with ways on", async () => {
    await page.goto(`${base}/steels/aisi-d3x`);
    await page.getByRole('heading', { name: 'No such steel' }).waitFor();
    expect(await page.getByRole('link', { name: 'All steels' }).count()).toBe(1);
    expect(await page.getByRole('link', { name: 'Search for “aisi d3x”' }).count()).toBe(1);
    expect(await page.getByText('could not be loaded').count()).toBe(0);
  }, 60_000);

  it('the new-result page logs no "NaN cannot be parsed" warning, and offers no retention method for sharpness', async () => {
    const accounts = await demoAccounts();
    const messages: string[] = [];
    const listen = (m: { text: () => string }) => messages.push(m.text());
    page.on('console', listen);
    await signInAs(accounts.filter((a) => a.role === 'member')[0].handle, '/results/new');
    const form = page.getByRole('form', { name: 'New result' });
    await form.getByLabel('Sharpness method').waitFor();
    await form.getByRole('button', { name: /Add a step/ }).click();
    page.off('console', listen);
    expect(messages.filter((m) => /NaN/.test(m))).toEqual([]);
    const options = await form.getByLabel('Sharpness method').locator('option').allTextContents();
    expect(options.some((o) => /retention/i.test(o))).toBe(false);
    expect(options.some((o) => /Push-cut/.test(o))).toBe(true);
    await signOut();
  }, 60_000);
});
