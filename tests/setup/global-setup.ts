import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { TestProject } from 'vitest/node';
import { Database } from '../../server/db/database';
import { loadDemoData } from '../../seed/load';

declare module 'vitest' {
  export interface ProvidedContext {
    /** A migrated SQLite file with the demo data, copied by each test that needs a database. */
    baseDatabase: string;
  }
}

/** Migrates and seeds one base database for the whole run; each test copies it. */
export default async function setup(project: TestProject) {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'edgeledger-base-'));
  const file = path.join(dir, 'edgeledger.sqlite');
  const db = new Database({ storage: file });
  await db.migrate();
  await loadDemoData(db, new Date('2026-11-01T12:00:00Z'));
  await db.sequelize.query('PRAGMA wal_checkpoint(TRUNCATE)');
  await db.close();
  project.provide('baseDatabase', file);
  return () => fs.rmSync(dir, { recursive: true, force: true });
}
