import path from 'node:path';
import { loadEnv } from '../config/env';
import { Database } from './database';
import { rebuildAllCells } from '../aggregates/comparison-cells';
import { runAdmin } from './admin';

/**
 * `npm run migrate | reaggregate | admin`: database chores from the command line, on SQLite or
 * PostgreSQL as the environment names it (`npm run seed` is seed/cli.ts). `npm run admin -- grant
 * <handle> <role>` gives an account a role (see server/db/admin.ts).
 */
const command = process.argv[2];
const env = loadEnv();
const db = new Database({ storage: path.join(env.dataDir, 'edgeledger.sqlite'), url: env.DATABASE_URL, synchronous: env.SQLITE_SYNCHRONOUS });
await db.migrate();
if (command === 'reaggregate') {
  console.log(`Rebuilt ${await rebuildAllCells(db)} comparison cells.`);
} else if (command === 'admin') {
  const { code, message } = await runAdmin({ db }, process.argv.slice(3));
  (code === 0 ? console.log : console.error)(message);
  process.exitCode = code;
} else if (command !== 'migrate') {
  console.error('usage: cli.ts migrate | reaggregate | admin grant <handle> <role>');
  process.exitCode = 2;
}
await db.close();
