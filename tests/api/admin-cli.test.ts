/**
 * Issue 15: the first administrator without raw SQL. `npm run admin -- grant <handle> <role>`
 * (server/db/admin.ts, run here as a function on the test server's database) changes the role
 * through the models, audits it as a command-line change, and refuses an unknown handle or role.
 * The running server sees the new role on the member's next request. Runs on SQLite, and on
 * PostgreSQL with TEST_DATABASE=postgres.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoHandle, signIn, startTestServer } from '../setup/test-server';
import { runAdmin } from '../../server/db/admin';
import { AuditEntry, User } from '../../server/models';

let server: Awaited<ReturnType<typeof startTestServer>>;

beforeAll(async () => {
  server = await startTestServer();
});
afterAll(async () => {
  await server?.stop();
});

describe('npm run admin -- grant <handle> <role>', () => {
  it('makes a member an admin, audited as a command-line change; the running server lets them manage members at once', async () => {
    const handle = await demoHandle(server.url, 'member', 2);
    const member = await signIn(server.url, handle);
    await member.agent.get('/api/v1/admin/users').expect(403);

    const out = await runAdmin(server.ctx, ['grant', handle, 'admin']);
    expect(out).toEqual({ code: 0, message: `@${handle} is now admin (was member); recorded in the audit log.` });

    const user = (await User.findOne({ where: { handle } }))!;
    expect(user.role).toBe('admin');
    const audit = (await AuditEntry.findOne({ where: { action: 'user.role', subjectId: user.id }, order: [['id', 'DESC']] }))!;
    expect(audit.details).toMatchObject({ handle, from: { role: 'member' }, to: { role: 'admin' }, via: 'command line' });
    await member.agent.get('/api/v1/admin/users').expect(200);
  });

  it('refuses an unknown handle, an unknown role, the role already held and wrong usage, changing nothing', async () => {
    const handle = await demoHandle(server.url, 'publisher');
    const before = { users: await User.findAll({ attributes: ['handle', 'role'], order: [['id', 'ASC']], raw: true }), audit: await AuditEntry.count() };

    const unknownHandle = await runAdmin(server.ctx, ['grant', 'nobody-by-this-name', 'admin']);
    expect(unknownHandle.code).toBe(1);
    expect(unknownHandle.message).toMatch(/"nobody-by-this-name" was not found[\s\S]*signed in/);

    const unknownRole = await runAdmin(server.ctx, ['grant', handle, 'superuser']);
    expect(unknownRole).toEqual({ code: 1, message: expect.stringMatching(/role: "superuser" is not a role; one of member, publisher, moderator, admin/) });

    expect(await runAdmin(server.ctx, ['grant', handle, 'publisher'])).toEqual({ code: 1, message: expect.stringMatching(/already publisher/) });
    for (const args of [[], ['grant', handle], ['revoke', handle, 'admin'], ['grant', handle, 'admin', 'extra']]) {
      expect((await runAdmin(server.ctx, args)).code, args.join(' ')).toBe(2);
    }

    expect({ users: await User.findAll({ attributes: ['handle', 'role'], order: [['id', 'ASC']], raw: true }), audit: await AuditEntry.count() }).toEqual(before);
  });
});
