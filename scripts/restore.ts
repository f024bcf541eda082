import path from 'node:path';
import { loadEnv } from '../server/config/env';
import { restoreDatabase } from '../server/db/backup';

/**
 * `npm run restore FILE`: checks FILE (integrity, migrations table), refuses while a server has
 * the database open, keeps a copy of the current database in DATA_DIR/backups, then puts FILE
 * in its place. Start the server afterwards; it applies any newer migrations.
 */
const file = process.argv[2];
if (!file) {
  console.error('usage: npm run restore FILE   (a file written by npm run backup)');
  process.exit(2);
}
const env = loadEnv();
if (env.DATABASE_URL) {
  console.error('DATABASE_URL is set: restore that database with its own tools (e.g. pg_restore).');
  process.exit(2);
}
try {
  const { restored, previous } = await restoreDatabase(path.resolve(file), path.join(env.dataDir, 'edgeledger.sqlite'), path.join(env.dataDir, 'backups'));
  console.log(`Restored ${restored.file} (${restored.migrations.length} migrations applied in it).`);
  if (previous) console.log(`The database it replaced is kept as ${previous}.`);
} catch (err) {
  console.error(`Restore refused: ${(err as Error).message}`);
  process.exit(1);
}
