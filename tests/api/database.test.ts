import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Op, QueryTypes } from 'sequelize';
import sqlite3 from 'sqlite3';
import { Database } from '../../server/db/database';
import { GroupCommit } from '../../server/db/group-commit';
import { insertRows } from '../../server/db/insert-rows';
import { AuditEntry, User } from '../../server/models';
import { follow, record } from '../../server/changes';
import { ChangeRow } from '../../server/changes/change-row';

let dir: string;
let db: Database;
beforeAll(async () => {
  dir = fs.mkdtempSync(path.join(os.tmpdir(), 'edgeledger-db-'));
  db = new Database({ storage: path.join(dir, 'edgeledger.sqlite'), synchronous: 'NORMAL', busyTimeoutMs: 4321 });
  await db.migrate();
});
afterAll(async () => {
  await db.close();
  fs.rmSync(dir, { recursive: true, force: true });
});

const pragma = async (name: string, transaction?: Parameters<Parameters<Database['write']>[0]>[0]) => {
  const rows = await db.sequelize.query<Record<string, unknown>>(`PRAGMA ${name}`, { type: QueryTypes.SELECT, transaction });
  return Object.values(rows[0])[0];
};

describe('the SQLite connection set-up', () => {
  it('applies WAL, synchronous, busy_timeout and foreign keys on the connection of a transaction', async () => {
    const inside = await db.write(async (t) => ({
      journal: await pragma('journal_mode', t),
      synchronous: await pragma('synchronous', t),
      busy: await pragma('busy_timeout', t),
      fk: await pragma('foreign_keys', t),
    }));
    // SQLite documents synchronous NORMAL as 1 and FULL as 2 (sqlite.org/pragma.html#pragma_synchronous).
    expect(inside).toEqual({ journal: 'wal', synchronous: 1, busy: 4321, fk: 1 });
    expect(await pragma('synchronous')).toBe(1);
  });

  it('runs 40 concurrent write transactions without SQLITE_BUSY, and keeps every one', async () => {
    const writes = Array.from({ length: 40 }, (_, i) =>
      db.write(async (transaction) => {
        const n = await User.count({ transaction });
        return User.create({ handle: `writer-${i}`, displayName: `Writer ${i} of ${n}`, email: null, role: 'member', oauthSubject: `writer-${i}`, bio: null }, { transaction });
      }),
    );
    const settled = await Promise.allSettled(writes);
    expect(settled.filter((s) => s.status === 'rejected')).toEqual([]);
    expect(await User.count({ where: {} })).toBe(40);
  });

  it('holds the write lock from the start of a write (BEGIN IMMEDIATE) until its commit', async () => {
    const other = new sqlite3.Database(path.join(dir, 'edgeledger.sqlite'));
    const tryBegin = () =>
      new Promise<string>((resolve) => other.exec('BEGIN IMMEDIATE; ROLLBACK;', (err) => resolve(err ? String((err as { code?: string }).code) : 'began')));
    try {
      // Without a busy timeout, a second writer is refused at once while the lock is held.
      await new Promise((r) => other.exec('PRAGMA busy_timeout = 0', r));
      const during = await db.write(async () => tryBegin());
      expect(during).toBe('SQLITE_BUSY');
      expect(await tryBegin()).toBe('began');
    } finally {
      await new Promise((r) => other.close(r));
    }
  });

  it('rolls a failed write back and goes on with the next', async () => {
    const before = await User.count();
    await expect(
      db.write(async (transaction) => {
        await User.create({ handle: 'doomed', displayName: 'Doomed', email: null, role: 'member', oauthSubject: 'doomed', bio: null }, { transaction });
        throw new Error('boom');
      }),
    ).rejects.toThrow('boom');
    expect(await User.count()).toBe(before);
    await db.write((transaction) => User.create({ handle: 'after', displayName: 'After', email: null, role: 'member', oauthSubject: 'after', bio: null }, { transaction }));
    expect(await User.count()).toBe(before + 1);
  });
});

describe('group commit', () => {
  const userRow = (n: number, tag: string) => ({ handle: `group-${tag}-${n}`, displayName: `Group ${n}`, role: 'member' as const, oauthSubject: `group-${tag}-${n}` });

  it('writes items that arrive together in one transaction, each settled after the commit', async () => {
    const batches: number[] = [];
    const group = new GroupCommit(db, async (rows: ReturnType<typeof userRow>[], transaction) => {
      batches.push(rows.length);
      return insertRows(User, rows, transaction);
    });
    // A slow write ahead of them, so that the twelve queue up behind it.
    const ahead = db.write(() => new Promise((r) => setTimeout(r, 50)));
    const users = await Promise.all(Array.from({ length: 12 }, (_, i) => group.add(userRow(i, 'a'))));
    await ahead;
    expect(batches).toEqual([12]);
    expect(users.map((u) => u.handle)).toEqual(Array.from({ length: 12 }, (_, i) => `group-a-${i}`));
    for (const u of users) expect((await User.findByPk(u.id))?.handle).toBe(u.handle);
  });

  it('lets a bad item fail alone: the others of its batch still go in', async () => {
    const group = new GroupCommit(db, (rows: ReturnType<typeof userRow>[], transaction) => insertRows(User, rows, transaction));
    const ahead = db.write(() => new Promise((r) => setTimeout(r, 50)));
    // Two rows with the same handle: the unique index refuses the second.
    const outcomes = await Promise.allSettled([group.add(userRow(1, 'b')), group.add(userRow(2, 'b')), group.add({ ...userRow(1, 'b'), oauthSubject: 'other' }), group.add(userRow(3, 'b'))]);
    await ahead;
    expect(outcomes.map((o) => o.status)).toEqual(['fulfilled', 'fulfilled', 'rejected', 'fulfilled']);
    expect((await User.findAll({ where: { handle: ['group-b-1', 'group-b-2', 'group-b-3'] } })).length).toBe(3);
  });

  it('stores text with a NUL character exactly (bound, not written into the SQL)', async () => {
    const [user] = await db.write((t) => insertRows(User, [{ ...userRow(1, 'c'), displayName: 'before\0after' }], t));
    expect((await User.findByPk(user.id))?.displayName).toBe('before\0after');
  });
});

describe('insertRows', () => {
  const stored = async (table: string, id: number) => (await db.sequelize.query<Record<string, unknown>>(`SELECT * FROM ${table} WHERE id = ?`, { replacements: [id], type: QueryTypes.SELECT }))[0];
  const withoutIds = ({ id: _id, createdAt: _c, updatedAt: _u, ...rest }: Record<string, unknown>) => rest;

  it('stores each row exactly as a create stores it (defaults, booleans, JSON, nulls, dates)', async () => {
    const user = { handle: 'rows-user', displayName: 'Rows “User” — ünïcode', role: 'member' as const, oauthSubject: 'rows-user', email: null, bio: 'line\nbreak' };
    const created = await db.write((t) => User.create({ ...user, handle: 'create-user', oauthSubject: 'create-user' }, { transaction: t }));
    const [inserted] = await db.write((t) => insertRows(User, [user], t));
    const [a, b] = [await stored('users', created.id), await stored('users', inserted.id)];
    expect(withoutIds(b)).toEqual({ ...withoutIds(a), handle: 'rows-user', oauthSubject: 'rows-user' });
    // The same format of date as a create writes (Sequelize's SQLite date text).
    expect(String(b.createdAt)).toMatch(/^\d{4}-\d\d-\d\d \d\d:\d\d:\d\d\.\d{3} \+00:00$/);
    expect(String(a.createdAt)).toMatch(/^\d{4}-\d\d-\d\d \d\d:\d\d:\d\d\.\d{3} \+00:00$/);

    const audit = { actorId: created.id, action: 'rows-check', outcome: 'done' as const, subjectType: 'user', subjectId: null, reason: null, details: { list: [1, 2.5, 'three'], nested: { ok: true, none: null } } };
    const auditCreated = await db.write((t) => AuditEntry.create(audit, { transaction: t }));
    const [auditInserted] = await db.write((t) => insertRows(AuditEntry, [audit], t));
    expect(withoutIds(await stored('audit_entries', auditInserted.id))).toEqual(withoutIds(await stored('audit_entries', auditCreated.id)));
    expect((await AuditEntry.findByPk(auditInserted.id))?.details).toEqual(audit.details);
    // What insertRows hands back reads as the row does.
    expect(inserted.isNewRecord).toBe(false);
    expect({ handle: inserted.handle, banned: inserted.banned, role: inserted.role }).toEqual({ handle: 'rows-user', banned: false, role: 'member' });
  });

  it('gives every row its own id, past the bound values one statement can hold', async () => {
    // Seven columns bound per user: 5 000 rows need more than one statement.
    const rows = Array.from({ length: 5_000 }, (_, i) => ({ handle: `many-${i}`, displayName: `Many ${i}`, role: 'member' as const, oauthSubject: `many-${i}` }));
    const users = await db.write((t) => insertRows(User, rows, t));
    expect(new Set(users.map((u) => u.id)).size).toBe(5_000);
    const byId = new Map((await User.findAll({ where: { id: users.map((u) => u.id) }, raw: true })).map((u) => [u.id, u.handle]));
    for (const u of users) expect(byId.get(u.id)).toBe(u.handle);
  });

  it('writes a batch’s recorded changes in its transaction and tells followers after the commit, not before', async () => {
    const heard: number[][] = [];
    const stop = follow(['account'], (batch) => void heard.push(batch.changes.flatMap(({ change }) => ('ids' in change ? change.ids : []))));
    try {
      const before = ((await ChangeRow.max('id')) as number | null) ?? 0;
      const users = await db.write(async (t) => {
        // insertRows runs the model's bulk-create hooks, which record the change.
        const rows = await insertRows(User, [{ handle: 'rows-event', displayName: 'Event', role: 'member' as const, oauthSubject: 'rows-event' }], t);
        expect(heard).toEqual([]);
        return rows;
      });
      expect(heard).toEqual([[users[0].id]]);
      const rows = await ChangeRow.findAll({ where: { id: { [Op.gt]: before } }, raw: true });
      expect(rows.map((r) => [r.kind, JSON.parse(r.keys)])).toEqual([['account', { ids: [users[0].id] }]]);
      expect(db.changes.lastDispatchedId).toBe(rows[0].id);
      // A rolled-back write leaves no change and tells no one.
      await expect(
        db.write(async (t) => {
          await users[0].update({ displayName: 'Never' }, { transaction: t });
          record(t, { kind: 'cells', all: true });
          throw new Error('rolled back');
        }),
      ).rejects.toThrow('rolled back');
      expect(await ChangeRow.count({ where: { id: { [Op.gt]: before } } })).toBe(1);
      expect(heard).toHaveLength(1);
    } finally {
      stop();
    }
  });
});

describe('following the changes other processes wrote (ChangeFeed.poll)', () => {
  it('hands them on in one batch each poll, a change that became visible after a newer one too, and never this process’s own again', async () => {
    const heard: number[][] = [];
    const stop = follow(['account'], (batch) => void heard.push(batch.changes.map((c) => c.id)));
    try {
      await db.changes.startAtNewest();
      const newest = ((await ChangeRow.max('id')) as number | null) ?? 0;
      // Another process's rows, written as its feed writes them (raw rows: this process records nothing).
      const theirs = (id: number) => db.write((t) => ChangeRow.create({ id, kind: 'account', keys: JSON.stringify({ ids: [1] }) }, { transaction: t }));
      await db.changes.poll();
      expect(heard).toEqual([]);
      // On PostgreSQL an id becomes visible at its commit: here the newer one commits first.
      await theirs(newest + 2);
      await db.changes.poll();
      expect(heard).toEqual([[newest + 2]]);
      await theirs(newest + 1);
      await theirs(newest + 3);
      await db.changes.poll();
      expect(heard).toEqual([[newest + 2], [newest + 1, newest + 3]]);
      // This process's own write is handed on at its commit, once: the poller passes it by.
      await db.write((t) => insertRows(User, [{ handle: 'poll-own', displayName: 'Own', role: 'member' as const, oauthSubject: 'poll-own' }], t));
      expect(heard).toHaveLength(3); // the two batches above and this one
      await db.changes.poll();
      expect(heard).toHaveLength(3);
      await db.changes.poll();
      expect(heard).toHaveLength(3);
    } finally {
      stop();
    }
  });
});
