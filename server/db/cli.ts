import path from 'node:path';
import { loadEnv } from '../config/env';
import { Database } from './database';
import { rebuildAllCells } from '../aggregates/comparison-cells';
import { loadDemoData } from '../../seed/load';

/** `npm run migrate | seed | reaggregate`: database chores from the command line. */
const command = process.argv[2];
const env = loadEnv();
const db = new Database({ storage: path.join(env.dataDir, 'edgeledger.sqlite'), url: env.DATABASE_URL, synchronous: env.SQLITE_SYNCHRONOUS });
await db.migrate();
if (command === 'seed') {
  const r = await loadDemoData(db);
  console.log(r.loaded ? `Loaded ${r.results} demo results.` : 'The database already has accounts; demo data not loaded.');
} else if (command === 'reaggregate') {
  console.log(`Rebuilt ${await rebuildAllCells(db)} comparison cells.`);
} else if (command !== 'migrate') {
  console.error('usage: cli.ts migrate | seed | reaggregate');
  process.exitCode = 2;
}
await db.close();
