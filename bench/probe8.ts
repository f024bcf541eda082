import { loadEnv } from '../server/config/env';
import { boot } from '../server/boot';
import { Sequelize } from 'sequelize';
const env = loadEnv({ NODE_ENV: 'development', LOG_LEVEL: 'error', HOST: '127.0.0.1', PORT: '3590', OAUTH_PORT: '3591', SMTP_PORT: '3592', S3_PORT: '3593', DATA_DIR: process.env.DIR!, SEED_DEMO: 'never' });
const running = await boot(env, () => {});
const orig = Sequelize.prototype.query;
const seen: string[] = [];
Sequelize.prototype.query = function (this: Sequelize, sql: any, opts: any) { seen.push(String(typeof sql === 'string' ? sql : sql.query).slice(0, 150)); return orig.call(this, sql, opts); } as any;
for (const p of (process.env.PATHS ?? '/api/steels/aisi-d2').split(',')) {
  await (await fetch(running.url + p)).text(); seen.length = 0;
  await (await fetch(running.url + p)).text();
  console.log(p, seen.length, '\n  ' + seen.join('\n  '));
}
await running.stop(); process.exit(0);
