import { execFile } from 'node:child_process';
import { promisify } from 'node:util';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { simpleParser } from 'mailparser';
import { demoHandle, signIn, startTestServer } from '../setup/test-server';
import type { CaughtMessage } from '../../server/mail/mail-catcher';
import { renderEmail } from '../../server/mail/templates';
import { User } from '../../server/models';
import { unsubscribeQuery } from '../../server/mail/unsubscribe';

const run = promisify(execFile);

let server: Awaited<ReturnType<typeof startTestServer>>;
let admin: Awaited<ReturnType<typeof signIn>>;
let moderator: Awaited<ReturnType<typeof signIn>>;
beforeAll(async () => {
  server = await startTestServer();
  admin = await signIn(server.url, await demoHandle(server.url, 'admin'));
  moderator = await signIn(server.url, await demoHandle(server.url, 'moderator'));
});
afterAll(async () => {
  await server?.stop();
});

const emailOf = async (handle: string) => (await User.findOne({ where: { handle } }))!.email!;

/** Waits until the local mail catcher holds a message to `to` whose subject matches. */
async function waitForMail(to: string, subject: RegExp, timeoutMs = 8000): Promise<CaughtMessage> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const found = (await admin.agent.get('/api/dev/mail').expect(200)).body.find((m: CaughtMessage) => m.to.includes(to) && subject.test(m.subject));
    if (found) return found;
    if (Date.now() > until) throw new Error(`no message to ${to} matching ${subject}`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

const input = (readings: number[]) => ({
  steel: 'aisi-d2',
  hardness: { value: 60, scale: 'HRC' },
  abrasive: 'alox-bench-stone-jis1000',
  edgeAngle: { perSideDeg: 17 },
  sharpness: { method: 'push-cut-test-v2', readingsG: readings },
});

/** The query of the unsubscribe link in a message's text part. */
const unsubscribeLink = (text: string) => new URL(/Unsubscribe \(no sign-in needed\): (\S+)/.exec(text)![1]);

describe('e-mail', () => {
  it('renders every message with a plain-text and an HTML part that mailparser reads back', async () => {
    const { subject, text, html } = renderEmail(
      { subject: 'S', greeting: 'Hello <Ana>,', paragraphs: ['One & two.'], quote: { label: 'Note', text: 'a\nb' }, action: { label: 'Go', url: 'http://x.test/a?b=1&c=2' } },
      { topicLabel: 'Decisions', url: 'http://x.test/unsubscribe?u=1', settingsUrl: 'http://x.test/me' },
    );
    const raw = `Subject: ${subject}\r\nMIME-Version: 1.0\r\nContent-Type: multipart/alternative; boundary=b\r\n\r\n--b\r\nContent-Type: text/plain; charset=utf-8\r\n\r\n${text}\r\n--b\r\nContent-Type: text/html; charset=utf-8\r\n\r\n${html}\r\n--b--\r\n`;
    const parsed = await simpleParser(raw);
    expect(parsed.text).toContain('> a');
    expect(parsed.html).toContain('Hello &#60;Ana&#62;,');
    expect(parsed.html).toContain('href="http://x.test/a?b=1&#38;c=2"');
    expect(text).toContain('Unsubscribe (no sign-in needed): http://x.test/unsubscribe?u=1');
  });

  it('tells the author of a decision, with both parts and an unsubscribe link that works without signing in', async () => {
    const author = await signIn(server.url, await demoHandle(server.url, 'member'));
    const address = await emailOf(author.user.handle);
    const id = (await author.agent.post('/api/results').set('X-CSRF-Token', author.csrf).send(input([120, 125, 122])).expect(201)).body.id;
    await moderator.agent.post(`/api/results/${id}/review`).set('X-CSRF-Token', moderator.csrf).send({ decision: 'return', note: 'Say which hardness tester.' }).expect(200);
    const mail = await waitForMail(address, new RegExp(`#${id}: Changes asked`));
    // The catcher parsed the SMTP message with mailparser: both parts are there.
    expect(mail.text).toContain('Say which hardness tester.');
    expect(mail.html).toContain('<blockquote');
    expect(mail.html).toContain('Say which hardness tester.');
    expect(mail.unsubscribe).toMatch(/\/api\/me\/unsubscribe\?user=\d+&topic=review&sig=/);

    const link = unsubscribeLink(mail.text);
    expect(link.pathname).toBe('/unsubscribe');
    const params = Object.fromEntries(link.searchParams);
    // A forged signature is refused; the real one works with no session at all.
    await request(server.url).post('/api/me/unsubscribe').send({ ...params, sig: 'x'.repeat(43) }).expect(400);
    await request(server.url).post('/api/me/unsubscribe').send({ ...params, topic: 'digest' }).expect(400);
    const done = await request(server.url).post('/api/me/unsubscribe').send(params).expect(200);
    expect(done.body).toMatchObject({ topic: 'review', unsubscribed: true });
    // The one-click address of the List-Unsubscribe header (RFC 8058) works too.
    const oneClick = new URL(mail.unsubscribe!);
    await request(server.url).post(`${oneClick.pathname}${oneClick.search}`).type('form').send('List-Unsubscribe=One-Click').expect(200);
    const me = await author.agent.get('/api/me').expect(200);
    expect(me.body.notifications).toEqual({ review: false, application: true, digest: true });

    // No more decision mail now.
    const id2 = (await author.agent.post('/api/results').set('X-CSRF-Token', author.csrf).send(input([130, 135, 132])).expect(201)).body.id;
    await moderator.agent.post(`/api/results/${id2}/review`).set('X-CSRF-Token', moderator.csrf).send({ decision: 'approve' }).expect(200);
    await new Promise((r) => setTimeout(r, 500));
    const all = (await admin.agent.get('/api/dev/mail').expect(200)).body as CaughtMessage[];
    expect(all.some((m) => m.subject.includes(`#${id2}:`))).toBe(false);
    await author.agent.put('/api/me/notifications').set('X-CSRF-Token', author.csrf).send({ review: true }).expect(200);
  });

  it('answers 404 to a correctly signed unsubscribe link for a member who does not exist', async () => {
    const query = unsubscribeQuery(server.ctx.env, 987_654, 'review');
    const res = await request(server.url).post(`/api/me/unsubscribe?${query}`).expect(404);
    expect(res.body.error).toMatch(/member was not found/);
  });

  it('tells an applicant the outcome of their publisher application', async () => {
    const applicant = await signIn(server.url, await demoHandle(server.url, 'member', 2));
    const address = await emailOf(applicant.user.handle);
    const body = { workshop: 'Marsh Road Grinding (invented)', instruments: 'A push-cut tester with a 2 kg cell; a bench Rockwell tester.', link: 'https://marsh-road.example.test' };
    await applicant.agent.post('/api/publishers/applications').set('X-CSRF-Token', applicant.csrf).send({ ...body, link: 'javascript:alert(1)' }).expect(400);
    const app = await applicant.agent.post('/api/publishers/applications').set('X-CSRF-Token', applicant.csrf).send(body).expect(201);
    await applicant.agent.post('/api/publishers/applications').set('X-CSRF-Token', applicant.csrf).send(body).expect(409);
    await moderator.agent.post(`/api/publishers/applications/${app.body.id}/decision`).set('X-CSRF-Token', moderator.csrf).send({ decision: 'approve' }).expect(403);
    await admin.agent.post(`/api/publishers/applications/${app.body.id}/decision`).set('X-CSRF-Token', admin.csrf).send({ decision: 'decline' }).expect(400);
    const list = await admin.agent.get('/api/publishers/applications?status=pending').expect(200);
    expect(list.body.items.map((a: { id: number }) => a.id)).toContain(app.body.id);
    expect(JSON.stringify(list.body)).not.toContain('@');
    await admin.agent.post(`/api/publishers/applications/${app.body.id}/decision`).set('X-CSRF-Token', admin.csrf).send({ decision: 'approve', note: 'Welcome.' }).expect(200);
    await admin.agent.post(`/api/publishers/applications/${app.body.id}/decision`).set('X-CSRF-Token', admin.csrf).send({ decision: 'decline', note: 'late' }).expect(409);
    const mail = await waitForMail(address, /publisher now/);
    expect(mail.text).toContain('Marsh Road Grinding');
    expect(mail.html).toContain('Welcome.');
    expect((await User.findOne({ where: { handle: applicant.user.handle } }))!.role).toBe('publisher');
    const profile = await request(server.url).get(`/api/profiles/${applicant.user.handle}`).expect(200);
    expect(profile.body.badge).toMatchObject({ label: 'Publisher', workshop: 'Marsh Road Grinding (invented)' });
    const audit = await moderator.agent.get('/api/audit?action=publisher-application').expect(200);
    expect(audit.body.items.map((e: { outcome: string }) => e.outcome)).toEqual(['refused', 'done']);
  });

  it('sends the weekly digest to followers when `npm run digest` runs', async () => {
    const follower = await signIn(server.url, await demoHandle(server.url, 'member', 3));
    const address = await emailOf(follower.user.handle);
    await follower.agent.post('/api/me/follows').set('X-CSRF-Token', follower.csrf).send({ pageType: 'steel', slug: 'aisi-d2' }).expect(201);
    await follower.agent.post('/api/me/follows').set('X-CSRF-Token', follower.csrf).send({ pageType: 'steel', slug: 'no-such-steel' }).expect(404);
    const author = await signIn(server.url, await demoHandle(server.url, 'member', 4));
    const id = (await author.agent.post('/api/results').set('X-CSRF-Token', author.csrf).send(input([140, 141, 142])).expect(201)).body.id;
    await moderator.agent.post(`/api/results/${id}/review`).set('X-CSRF-Token', moderator.csrf).send({ decision: 'approve' }).expect(200);

    const env = { ...process.env, NODE_ENV: 'test', DATA_DIR: server.dataDir, ...(server.ctx.env.DATABASE_URL && { DATABASE_URL: server.ctx.env.DATABASE_URL }), SMTP_PORT: String(server.smtpPort), PUBLIC_URL: server.url, LOG_LEVEL: 'silent' };
    const first = await run('npm', ['run', '--silent', 'digest'], { env, cwd: process.cwd(), timeout: 60_000 });
    expect(first.stdout).toMatch(/Digest: \d+ followers, [1-9]\d* messages sent/);
    const mail = await waitForMail(address, /digest/);
    expect(mail.text).toContain(`#${id}: AISI D2`);
    expect(mail.html).toContain(`/results/${id}`);
    expect(mail.text).toMatch(/Unsubscribe \(no sign-in needed\): \S+topic=digest/);

    // A second run the same week has nothing new for this follower.
    const before = ((await admin.agent.get('/api/dev/mail').expect(200)).body as CaughtMessage[]).filter((m) => m.to.includes(address)).length;
    await run('npm', ['run', '--silent', 'digest'], { env, cwd: process.cwd(), timeout: 60_000 });
    await new Promise((r) => setTimeout(r, 300));
    const after = ((await admin.agent.get('/api/dev/mail').expect(200)).body as CaughtMessage[]).filter((m) => m.to.includes(address)).length;
    expect(after).toBe(before);
  }, 90_000);

  it('shows the mail catcher to admins only', async () => {
    const member = await signIn(server.url, await demoHandle(server.url, 'member'));
    await member.agent.get('/api/dev/mail').expect(403);
    await request(server.url).get('/api/dev/mail').expect(401);
    const list = (await admin.agent.get('/api/dev/mail').expect(200)).body as CaughtMessage[];
    const dates = list.map((m) => Date.parse(m.date));
    expect([...dates].sort((a, b) => b - a)).toEqual(dates);
  });
});
