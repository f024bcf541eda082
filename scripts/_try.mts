import { Database } from '../server/db/database';
import { loadDemoData } from '../seed/load';
const db = new Database({ storage: '', url: process.env.DATABASE_URL });
await db.migrate();
console.log(await loadDemoData(db, new Date('2026-11-01T12:00:00Z')));
await db.close();
