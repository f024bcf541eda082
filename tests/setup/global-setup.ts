import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { TestProject } from 'vitest/node';
import { Database } from '../../server/db/database';
import { loadDemoData } from '../../seed/load';
import { startCluster } from './postgres-cluster';

declare module 'vitest' {
  export interface ProvidedContext {
    /** A migrated SQLite file with the demo data, copied by each test that needs a database. */
    baseDatabase: string;
    /**
     * With TEST_DATABASE=postgres: the throwaway cluster's URL (without a database name); its
     * database `edgeledger_base` is migrated and seeded, and each test server gets a copy.
     */
    postgresUrl: string | null;
  }
}

const demoClock = new Date('2026-11-01T12:00:00Z');

/**
 * Migrates and seeds one base database for the whole run; each test copies it. With
 * TEST_DATABASE=postgres the base is a database of a throwaway PostgreSQL cluster started here
 * (`CREATE DATABASE … TEMPLATE edgeledger_base` copies it), stopped and removed at the end.
 */
export default async function setup(project: TestProject) {
  if (process.env.TEST_DATABASE === 'postgres') {
    const cluster = await startCluster();
    try {
      const admin = new Database({ storage: '', url: `${cluster.url}postgres` });
      await admin.sequelize.query('CREATE DATABASE edgeledger_base');
      await admin.close();
      const db = new Database({ storage: '', url: `${cluster.url}edgeledger_base` });
      await db.migrate();
      await loadDemoData(db, demoClock);
      await db.close();
    } catch (err) {
      cluster.stop();
      throw err;
    }
    project.provide('postgresUrl', cluster.url);
    project.provide('baseDatabase', '');
    return () => cluster.stop();
  }
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'edgeledger-base-'));
  const file = path.join(dir, 'edgeledger.sqlite');
  const db = new Database({ storage: file });
  await db.migrate();
  await loadDemoData(db, demoClock);
  await db.sequelize.query('PRAGMA wal_checkpoint(TRUNCATE)');
  await db.close();
  project.provide('baseDatabase', file);
  project.provide('postgresUrl', null);
  return () => fs.rmSync(dir, { recursive: true, force: true });
}
