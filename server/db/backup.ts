import fs from 'node:fs';
import path from 'node:path';
import sqlite3 from 'sqlite3';

/**
 * Backups and restores of the SQLite database file. This module is the one place with
 * SQLite-only statements for them (VACUUM INTO, PRAGMA locking_mode); a PostgreSQL deployment
 * uses that database's own tools (pg_dump, pg_restore) instead.
 */

/** The table umzug records applied migrations in (server/db/database.ts). */
export const MIGRATIONS_TABLE = 'migrations_applied';

function open(file: string, mode: number): Promise<sqlite3.Database> {
  return new Promise((resolve, reject) => {
    const db = new sqlite3.Database(file, mode, (err) => (err ? reject(err) : resolve(db)));
  });
}
const run = (db: sqlite3.Database, sql: string, params: unknown[] = []) =>
  new Promise<void>((resolve, reject) => db.run(sql, params, (err) => (err ? reject(err) : resolve())));
const all = <T>(db: sqlite3.Database, sql: string, params: unknown[] = []) =>
  new Promise<T[]>((resolve, reject) => db.all(sql, params, (err, rows) => (err ? reject(err) : resolve(rows as T[]))));
const close = (db: sqlite3.Database) => new Promise<void>((resolve, reject) => db.close((err) => (err ? reject(err) : resolve())));

/** A file name with the UTC date and time: edgeledger-2026-11-02T14-05-09Z.sqlite. */
export function backupFileName(now: Date, label = 'edgeledger'): string {
  return `${label}-${now.toISOString().slice(0, 19).replace(/:/g, '-')}Z.sqlite`;
}

function freePath(dir: string, name: string): string {
  let candidate = path.join(dir, name);
  for (let i = 2; fs.existsSync(candidate); i += 1) candidate = path.join(dir, name.replace(/\.sqlite$/, `-${i}.sqlite`));
  return candidate;
}

/** What a backup file holds, after checking it: integrity and the migrations it has applied. */
export interface BackupCheck {
  file: string;
  bytes: number;
  migrations: string[];
}

/**
 * Checks that `file` is a sound Edgeledger database: SQLite's `PRAGMA integrity_check` answers
 * "ok" and the migrations table exists with at least one entry. Throws with the reason.
 */
export async function checkBackup(file: string): Promise<BackupCheck> {
  if (!fs.existsSync(file)) throw new Error(`${file}: no such file`);
  let db: sqlite3.Database;
  try {
    db = await open(file, sqlite3.OPEN_READONLY);
  } catch (err) {
    throw new Error(`${file}: not a database SQLite can open (${(err as Error).message})`, { cause: err });
  }
  try {
    let integrity: { integrity_check: string }[];
    try {
      integrity = await all<{ integrity_check: string }>(db, 'PRAGMA integrity_check');
    } catch (err) {
      throw new Error(`${file}: not a sound SQLite database (${(err as Error).message})`, { cause: err });
    }
    const verdict = integrity.map((r) => r.integrity_check).join('; ');
    if (verdict !== 'ok') throw new Error(`${file}: integrity check failed: ${verdict}`);
    const tables = await all<{ name: string }>(db, "SELECT name FROM sqlite_master WHERE type = 'table' AND name = ?", [MIGRATIONS_TABLE]);
    if (!tables.length) throw new Error(`${file}: has no ${MIGRATIONS_TABLE} table, so it is not an Edgeledger database`);
    const migrations = (await all<{ name: string }>(db, `SELECT name FROM ${MIGRATIONS_TABLE} ORDER BY name`)).map((r) => r.name);
    if (!migrations.length) throw new Error(`${file}: no migrations were ever applied to it`);
    return { file, bytes: fs.statSync(file).size, migrations };
  } finally {
    await close(db);
  }
}

/**
 * Whether another connection (a running server, a backup under way) has the database open.
 * In WAL mode every open connection holds a shared lock on the wal-index; a connection in
 * exclusive locking mode cannot read while any other is open, and says SQLITE_BUSY at once
 * with a zero busy timeout. Works across processes and within one.
 */
export async function databaseInUse(file: string): Promise<boolean> {
  if (!fs.existsSync(file)) return false;
  const db = await open(file, sqlite3.OPEN_READWRITE);
  try {
    await run(db, 'PRAGMA busy_timeout = 0');
    await run(db, 'PRAGMA locking_mode = EXCLUSIVE');
    await all(db, 'SELECT count(*) FROM sqlite_master');
    await run(db, 'BEGIN EXCLUSIVE');
    await run(db, 'COMMIT');
    return false;
  } catch (err) {
    if ((err as { code?: string }).code === 'SQLITE_BUSY' || /SQLITE_BUSY|locked/.test(String(err))) return true;
    throw err;
  } finally {
    await close(db);
  }
}

/**
 * Writes a consistent copy of the database at `source` into `backupsDir` with VACUUM INTO
 * (a transactionally consistent snapshot, safe while the server runs), named with the UTC date
 * and time, then checks the copy. Returns the copy's check.
 */
export async function backupDatabase(source: string, backupsDir: string, now = new Date(), label = 'edgeledger'): Promise<BackupCheck> {
  if (!fs.existsSync(source)) throw new Error(`${source}: no database to back up`);
  fs.mkdirSync(backupsDir, { recursive: true });
  const target = freePath(backupsDir, backupFileName(now, label));
  const db = await open(source, sqlite3.OPEN_READWRITE);
  try {
    // A busy server may hold the write lock for a moment; VACUUM INTO only reads, but waits for
    // a consistent snapshot.
    await run(db, 'PRAGMA busy_timeout = 10000');
    await run(db, 'VACUUM INTO ?', [target]);
  } finally {
    await close(db);
  }
  return checkBackup(target);
}

/**
 * Replaces the database at `target` with the backup `file`, after checking the backup and that
 * nothing holds the database open. The database being replaced is first copied into
 * `backupsDir` (label "before-restore"), so a restore can itself be undone. The new file is
 * written beside the old one and renamed over it; the old WAL and shared-memory files go.
 */
export async function restoreDatabase(file: string, target: string, backupsDir: string, now = new Date()): Promise<{ restored: BackupCheck; previous: string | null }> {
  const restored = await checkBackup(file);
  if (path.resolve(file) === path.resolve(target)) throw new Error(`${file} is the database itself; name a backup file`);
  if (await databaseInUse(target)) {
    throw new Error(`${target} is open in another process (a running server?); stop it, then restore again`);
  }
  let previous: string | null = null;
  if (fs.existsSync(target)) previous = (await backupDatabase(target, backupsDir, now, 'before-restore')).file;
  const staging = `${target}.restoring`;
  fs.copyFileSync(file, staging);
  const fd = fs.openSync(staging, 'r+');
  fs.fsyncSync(fd);
  fs.closeSync(fd);
  for (const extra of [`${target}-wal`, `${target}-shm`, `${target}-journal`]) fs.rmSync(extra, { force: true });
  fs.renameSync(staging, target);
  return { restored, previous };
}
