import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { QueryTypes } from 'sequelize';
import { Database } from '../../server/db/database';
import { User } from '../../server/models';

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
