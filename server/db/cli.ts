import path from 'node:path';
import { loadEnv } from '../config/env';
import { Database } from './database';
import { rebuildAllCells } from '../aggregates/comparison-cells';

/** `npm run migrate | reaggregate`: database chores from the command line (`npm run seed` is seed/cli.ts). */
const command = process.argv[2];
const env = loadEnv();
const db = new Database({ storage: path.join(env.dataDir, 'edgeledger.sqlite'), url: env.DATABASE_URL, synchronous: env.SQLITE_SYNCHRONOUS });
await db.migrate();
if (command === 'reaggregate') {
  console.log(`Rebuilt ${await rebuildAllCells(db)} comparison cells.`);
} else if (command !== 'migrate') {
  console.error('usage: cli.ts migrate | reaggregate');
  process.exitCode = 2;
}
await db.close();
