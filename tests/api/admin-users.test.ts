/** Admin user management (issue 17): find, change a role, ban; each at once and audited. */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { demoHandle, signIn, startTestServer } from '../setup/test-server';
import { AuditEntry } from '../../server/models';

let server: Awaited<ReturnType<typeof startTestServer>>;
type Session = Awaited<ReturnType<typeof signIn>>;
let admin: Session;
let mod: Session;

beforeAll(async () => {
  server = await startTestServer();
  admin = await signIn(server.url, await demoHandle(server.url, 'admin'));
  mod = await signIn(server.url, await demoHandle(server.url, 'moderator'));
});
afterAll(async () => {
  await server?.stop();
});

const patch = (who: Session, handle: string, body: object) => who.agent.patch(`/api/admin/users/${handle}`).set('X-CSRF-Token', who.csrf).send(body);

const result = () => ({
  steel: 'aisi-o1',
  hardness: { value: 62, scale: 'HRC' },
  abrasive: 'alox-vitrified-wheel-250-fine-dressed',
  edgeAngle: { perSideDeg: 14 },
  sharpness: { method: 'push-cut-test-v2', readingsG: [200, 205, 198] },
});

describe('admin user management', () => {
  it('lists accounts matching a search, for admins only, without e-mail addresses', async () => {
    const handle = await demoHandle(server.url, 'member');
    const list = await admin.agent.get(`/api/admin/users?q=${handle.slice(0, 4).toUpperCase()}`).expect(200);
    expect(list.body.items.map((u: { handle: string }) => u.handle)).toContain(handle);
    expect(list.body.items[0]).toEqual(expect.objectContaining({ role: expect.any(String), banned: expect.any(Boolean), published: expect.any(Number) }));
    expect(JSON.stringify(list.body)).not.toContain('@');
    await mod.agent.get('/api/admin/users').expect(403);
    await request(server.url).get('/api/admin/users').expect(401);
  });

  it('a ban ends the member’s session and API token on their very next request (401), revokes the token, and is audited', async () => {
    const publisher = await signIn(server.url, await demoHandle(server.url, 'publisher', 1));
    const { token } = (await publisher.agent.post('/api/tokens').set('X-CSRF-Token', publisher.csrf).send({ name: 'before the ban' }).expect(201)).body as { token: string };
    // Both work before: warm the session and account caches.
    await publisher.agent.get('/api/me').expect(200);
    await request(server.url).get('/api/me').set('Authorization', `Bearer ${token}`).expect(200);

    await patch(admin, publisher.user.handle, { banned: true }).expect(400); // no reason
    const banned = await patch(admin, publisher.user.handle, { banned: true, reason: 'Posted copied readings again.' }).expect(200);
    expect(banned.body).toMatchObject({ handle: publisher.user.handle, banned: true });

    await publisher.agent.get('/api/me').expect(401);
    await publisher.agent.post('/api/results').set('X-CSRF-Token', publisher.csrf).send(result()).expect(401);
    expect((await publisher.agent.get('/api/session').expect(200)).body.user).toBeNull();
    await request(server.url).get('/api/me').set('Authorization', `Bearer ${token}`).expect(401);

    // Lifting the ban does not bring the token back.
    await patch(admin, publisher.user.handle, { banned: false, reason: 'Appeal accepted.' }).expect(200);
    await request(server.url).get('/api/me').set('Authorization', `Bearer ${token}`).expect(401);

    const audit = await AuditEntry.findAll({ where: { subjectType: 'user' }, order: [['id', 'ASC']] });
    expect(audit.map((a) => `${a.action}:${a.reason}`)).toEqual(['user.ban:Posted copied readings again.', 'user.unban:Appeal accepted.']);
    expect(audit[0].details).toMatchObject({ handle: publisher.user.handle, tokensRevoked: 1 });
  });

  it('a role change applies on the member’s next request', async () => {
    const member = await signIn(server.url, await demoHandle(server.url, 'member', 4));
    await member.agent.get('/api/review-desk').expect(403);
    await patch(admin, member.user.handle, { role: 'moderator', reason: 'Trusted reviewer.' }).expect(200);
    await member.agent.get('/api/review-desk').expect(200);
    expect((await member.agent.get('/api/session').expect(200)).body.user.role).toBe('moderator');
    await patch(admin, member.user.handle, { role: 'member', reason: 'Back to member.' }).expect(200);
    await member.agent.get('/api/review-desk').expect(403);
    const audit = await AuditEntry.findOne({ where: { action: 'user.role' }, order: [['id', 'DESC']] });
    expect(audit!.details).toMatchObject({ from: { role: 'moderator' }, to: { role: 'member' } });
  });

  it('refuses: a moderator (403), an admin changing themself (409), an unknown member (404), an unknown role (400)', async () => {
    const handle = await demoHandle(server.url, 'member', 3);
    await patch(mod, handle, { banned: true, reason: 'x' }).expect(403);
    await patch(admin, admin.user.handle, { role: 'member', reason: 'x' }).expect(409);
    await patch(admin, 'nobody-here', { banned: true, reason: 'x' }).expect(404);
    const bad = await patch(admin, handle, { role: 'owner', reason: 'x' }).expect(400);
    expect(bad.body.issues[0].path).toBe('role');
    await patch(admin, handle, { reason: 'x' }).expect(400);
    const extra = await patch(admin, handle, { banned: true, reason: 'x', email: 'a@b.test' }).expect(400);
    expect(extra.body.issues[0].path).toBe('email');
  });
});
