import crypto from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { demoHandle, signIn, startTestServer } from '../setup/test-server';
import { ApiToken } from '../../server/models';

let server: Awaited<ReturnType<typeof startTestServer>>;
beforeAll(async () => {
  server = await startTestServer();
});
afterAll(async () => {
  await server?.stop();
});

const goodInput = () => ({
  steel: 'aisi-o1',
  hardness: { value: 62, scale: 'HRC' },
  abrasive: 'alox-vitrified-wheel-250-fine-dressed',
  edgeAngle: { perSideDeg: 14 },
  sharpness: { method: 'push-cut-test-v2', readingsG: [200, 205, 198, 210, 202] },
});

describe('API tokens', () => {
  it('are for publishers: a visitor gets 401, a member 403', async () => {
    await request(server.url).post('/api/tokens').send({ name: 'x' }).expect(401);
    const member = await signIn(server.url, await demoHandle(server.url, 'member'));
    await member.agent.post('/api/tokens').set('X-CSRF-Token', member.csrf).send({ name: 'x' }).expect(403);
    await member.agent.get('/api/tokens').expect(403);
  });

  it('are shown once, stored as a SHA-256 hash, act as the publisher without CSRF, and stop working when revoked', async () => {
    const publisher = await signIn(server.url, await demoHandle(server.url, 'publisher'));
    await publisher.agent.post('/api/tokens').set('X-CSRF-Token', publisher.csrf).send({ name: '' }).expect(400);
    const created = await publisher.agent.post('/api/tokens').set('X-CSRF-Token', publisher.csrf).send({ name: 'lab laptop' }).expect(201);
    const { id, token } = created.body as { id: number; token: string };
    expect(token).toMatch(/^elt_[A-Za-z0-9_-]{43}$/);

    // Only the hash is stored (sha256 of the token, per the brief), and the list never shows the token.
    const row = await ApiToken.findByPk(id);
    expect(row!.tokenHash).toBe(crypto.createHash('sha256').update(token).digest('hex'));
    expect(JSON.stringify(row!.toJSON())).not.toContain(token);
    const list = await publisher.agent.get('/api/tokens').expect(200);
    expect(JSON.stringify(list.body)).not.toContain(token);
    expect(list.body.items[0]).toMatchObject({ id, name: 'lab laptop', active: true });

    // The token acts as the publisher on the API, with no session cookie and no CSRF header.
    const session = await request(server.url).get('/api/session').set('Authorization', `Bearer ${token}`).expect(200);
    expect(session.body.user).toMatchObject({ handle: publisher.user.handle, role: 'publisher' });
    const posted = await request(server.url).post('/api/results').set('Authorization', `Bearer ${token}`).send(goodInput()).expect(201);
    expect(posted.body).toMatchObject({ status: 'pending', author: { handle: publisher.user.handle } });
    // Same rules as the session: a publisher may not review.
    await request(server.url).post(`/api/results/${posted.body.id}/review`).set('Authorization', `Bearer ${token}`).send({ decision: 'approve' }).expect(403);
    // A token cannot mint or revoke tokens.
    await request(server.url).post('/api/tokens').set('Authorization', `Bearer ${token}`).send({ name: 'more' }).expect(403);

    await publisher.agent.delete(`/api/tokens/${id}`).set('X-CSRF-Token', publisher.csrf).expect(204);
    const refused = await request(server.url).post('/api/results').set('Authorization', `Bearer ${token}`).send(goodInput()).expect(401);
    expect(refused.body.error).toMatch(/revoked/);
    await request(server.url).get('/api/session').set('Authorization', `Bearer ${token}`).expect(401);
    expect((await ApiToken.findByPk(id))!.revokedAt).not.toBeNull();
  });

  it('refuses unknown and malformed tokens with 401', async () => {
    await request(server.url).get('/api/results').set('Authorization', 'Bearer elt_nope').expect(401);
    const res = await request(server.url).get('/api/results').set('Authorization', 'Basic abc').expect(401);
    expect(res.headers['www-authenticate']).toMatch(/Bearer/);
  });

  it('imports results through the API with a token', async () => {
    const publisher = await signIn(server.url, await demoHandle(server.url, 'publisher', 1));
    const { token } = (await publisher.agent.post('/api/tokens').set('X-CSRF-Token', publisher.csrf).send({ name: 'import script' }).expect(201)).body;
    const template = await request(server.url).get('/api/import/template.csv').expect(200);
    const res = await request(server.url).post('/api/import/results').set('Authorization', `Bearer ${token}`).attach('file', Buffer.from(template.text), 'x.csv').expect(201);
    expect(res.body.imported).toBe(2);
  });

  it('stops working when the account is no longer a publisher', async () => {
    const publisher = await signIn(server.url, await demoHandle(server.url, 'publisher'));
    const { token } = (await publisher.agent.post('/api/tokens').set('X-CSRF-Token', publisher.csrf).send({ name: 'old' }).expect(201)).body;
    const { User } = await import('../../server/models');
    const user = (await User.findOne({ where: { handle: publisher.user.handle } }))!;
    await server.ctx.db.write((t) => user.update({ role: 'member' }, { transaction: t }));
    await request(server.url).get('/api/session').set('Authorization', `Bearer ${token}`).expect(403);
    await server.ctx.db.write((t) => user.update({ role: 'publisher' }, { transaction: t }));
  });
});
