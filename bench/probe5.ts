import v8 from 'node:v8';
import { loadEnv } from '../server/config/env';
import { boot } from '../server/boot';
const env = loadEnv({ NODE_ENV: 'development', LOG_LEVEL: 'error', HOST: '127.0.0.1', PORT: '3590', OAUTH_PORT: '3591', SMTP_PORT: '3592', S3_PORT: '3593', DATA_DIR: process.env.DIR!, SEED_DEMO: 'never' });
const mb = (x: number) => Math.round(x / 2 ** 20);
const show = (label: string) => { (globalThis as any).gc(); const m = process.memoryUsage(); console.log(label, 'rss', mb(m.rss), 'heapTotal', mb(m.heapTotal), 'heapUsed', mb(m.heapUsed), 'external', mb(m.external), 'ab', mb(m.arrayBuffers)); };
show('start');
const running = await boot(env, () => {});
show('booted');
for (const s of v8.getHeapSpaceStatistics()) console.log(s.space_name, mb(s.space_size), mb(s.space_used_size));
if (process.env.SNAP) { const v8m = await import('node:v8'); console.log('snap', v8m.writeHeapSnapshot(process.env.SNAP)); }
await running.stop();
process.exit(0);
