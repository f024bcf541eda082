import path from 'node:path';
import { loadEnv } from '../server/config/env';
import { backupDatabase } from '../server/db/backup';

/**
 * `npm run backup`: a consistent copy of DATA_DIR/edgeledger.sqlite in DATA_DIR/backups, named
 * with the UTC date and time; safe while the server runs.
 */
const env = loadEnv();
if (env.DATABASE_URL) {
  console.error('DATABASE_URL is set: back that database up with its own tools (e.g. pg_dump).');
  process.exit(2);
}
try {
  const copy = await backupDatabase(path.join(env.dataDir, 'edgeledger.sqlite'), path.join(env.dataDir, 'backups'));
  console.log(`Backup written: ${copy.file} (${(copy.bytes / 1024).toFixed(0)} KiB, integrity ok, ${copy.migrations.length} migrations applied).`);
} catch (err) {
  console.error(`Backup failed: ${(err as Error).message}`);
  process.exit(1);
}
