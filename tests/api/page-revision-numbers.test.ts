/**
 * Migration 0014: page revisions numbered per page. A database migrated up to 0013 is given
 * interleaved edits of several pages (as an older Edgeledger stored them, numbered only by id),
 * then migrated: each page's revisions read 1, 2, 3… in the order saved, the summaries the server
 * wrote name the same revisions by their new numbers, and a new revision takes the next number.
 * Runs on SQLite, and on PostgreSQL with TEST_DATABASE=postgres.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { QueryTypes } from 'sequelize';
import { Database } from '../../server/db/database';
import { PageRevision } from '../../server/models';
import { onCluster } from '../setup/test-server';

const clusterUrl = inject('postgresUrl');
const dbName = `edgeledger_numbers_${process.pid}`;
let dir: string;
let db: Database;

beforeAll(async () => {
  dir = fs.mkdtempSync(path.join(os.tmpdir(), 'edgeledger-numbers-'));
  if (clusterUrl) await onCluster(clusterUrl, `CREATE DATABASE "${dbName}"`);
  db = new Database({ storage: path.join(dir, 'edgeledger.sqlite'), url: clusterUrl ? `${clusterUrl}${dbName}` : undefined });
  await db.migrate({ to: '0013-shared-process-state' });
});
afterAll(async () => {
  await db?.close();
  if (clusterUrl) await onCluster(clusterUrl, `DROP DATABASE IF EXISTS "${dbName}" WITH (FORCE)`);
  fs.rmSync(dir, { recursive: true, force: true });
});

describe('migration 0014: a number per page for every page revision', () => {
  it('numbers interleaved edits of several pages from 1 per page, in the order saved, and rewrites the server’s own summaries', async () => {
    const qi = db.sequelize.getQueryInterface();
    const now = new Date('2026-11-02T10:00:00Z');
    // A fresh table numbers its rows from 1 on both dialects; ids are left to the database so its sequence follows.
    await qi.bulkInsert('users', [{ handle: 'numbering-test', displayName: 'Numbering test', email: null, role: 'moderator', banned: false, oauthSubject: 'numbering-test', bio: null, createdAt: now, updatedAt: now }]);
    // id → page, in the order saved: steel 1 and steel 2 edited in turns, an abrasive 1 between them.
    const saved: [number, string, number, string, Partial<{ kind: string; baseRevisionId: number; revertedFromId: number; appliedFromId: number; status: string }>][] = [
      [1, 'steel', 1, 'First text', {}],
      [2, 'steel', 2, 'First text', {}],
      [3, 'abrasive', 1, 'First text', {}],
      [4, 'steel', 1, 'Harder range', { baseRevisionId: 1 }],
      [5, 'steel', 2, 'A proposal', { baseRevisionId: 2, status: 'proposed' }],
      [6, 'steel', 1, 'Typo', { baseRevisionId: 4 }],
      [7, 'steel', 2, 'Reverted to revision 2', { kind: 'revert', baseRevisionId: 2, revertedFromId: 2 }],
      [8, 'steel', 1, 'Reverted to revision 4', { kind: 'revert', baseRevisionId: 6, revertedFromId: 4 }],
      [9, 'steel', 1, 'Back to the text of revision 4, which read better', { kind: 'revert', baseRevisionId: 8, revertedFromId: 4 }],
      [10, 'steel', 2, 'A proposal (merged with revision 7)', { kind: 'merge', baseRevisionId: 7, appliedFromId: 5 }],
    ];
    await qi.bulkInsert(
      'page_revisions',
      saved.map(([, pageType, pageId, summary, more]) => ({ pageType, pageId, authorId: 1, summary, fields: '{}', body: null, status: 'live', kind: 'edit', createdAt: now, updatedAt: now, ...more })),
    );

    await db.migrate();

    const rows = await db.sequelize.query<{ id: number; number: number; summary: string }>('SELECT id, "number", summary FROM page_revisions ORDER BY id', { type: QueryTypes.SELECT });
    expect(rows.map((r) => [Number(r.id), Number(r.number)])).toEqual([
      [1, 1], [2, 1], [3, 1], [4, 2], [5, 2], [6, 3], [7, 3], [8, 4], [9, 5], [10, 4],
    ]);
    expect(rows.map((r) => r.summary)).toEqual([
      'First text',
      'First text',
      'First text',
      'Harder range',
      'A proposal',
      'Typo',
      'Reverted to revision 1', // id 2 is revision 1 of steel 2
      'Reverted to revision 2', // id 4 is revision 2 of steel 1
      'Back to the text of revision 4, which read better', // typed by someone: left as it was
      'A proposal (merged with revision 3)', // id 7 is revision 3 of steel 2
    ]);
  });

  it('gives a new revision the next number of its page, and the database refuses a number twice on one page', async () => {
    const created = await db.write((transaction) =>
      PageRevision.create({ pageType: 'steel', pageId: 1, authorId: 1, summary: 'Next', fields: {}, body: null, status: 'live' }, { transaction }),
    );
    expect(created.number).toBe(6);
    const other = await db.write((transaction) =>
      PageRevision.create({ pageType: 'method', pageId: 1, authorId: 1, summary: 'First of its page', fields: {}, body: null, status: 'live' }, { transaction }),
    );
    expect(other.number).toBe(1);
    await expect(
      db.write((transaction) => PageRevision.create({ pageType: 'steel', pageId: 1, number: 6, authorId: 1, summary: 'Twice', fields: {}, body: null, status: 'live' }, { transaction })),
    ).rejects.toThrow();
  });
});
