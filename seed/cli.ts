import path from 'node:path';
import { loadEnv } from '../server/config/env';
import { Database } from '../server/db/database';
import { loadDemoData } from './load';

/** `npm run seed`: migrates, then loads the invented demo data into an empty database. */
const env = loadEnv();
if (env.isProduction) {
  console.error('The demo data is invented: it is never loaded in production.');
  process.exit(2);
}
const db = new Database({ storage: path.join(env.dataDir, 'edgeledger.sqlite'), url: env.DATABASE_URL, synchronous: env.SQLITE_SYNCHRONOUS });
await db.migrate();
const r = await loadDemoData(db);
console.log(r.loaded ? `Loaded ${r.results} demo results.` : 'The database already has accounts; demo data not loaded.');
await db.close();
