/**
 * `npm run backup` and `npm run restore FILE`, run as the scripts they are, against a server's
 * data folder: a backup taken while the server runs, a restore refused while it runs, then the
 * round trip: what was written before the backup is back, what came after it is gone.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { execFile } from 'node:child_process';
import { promisify } from 'node:util';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { inject } from 'vitest';
import sqlite3 from 'sqlite3';
import { boot, type Running } from '../../server/boot';
import { loadEnv } from '../../server/config/env';
import { checkBackup, databaseInUse, restoreDatabase } from '../../server/db/backup';
import { demoHandle, signIn, testRateLimits } from '../setup/test-server';

const exec = promisify(execFile);
const tsx = path.resolve('node_modules/.bin/tsx');

let dataDir: string;
let running: Running | undefined;
const envFor = (dir: string) => ({ ...process.env, NODE_ENV: 'test', DATA_DIR: dir, LOG_LEVEL: 'silent' });
const start = async () =>
  boot(loadEnv({ NODE_ENV: 'test', PORT: '0', OAUTH_PORT: '0', SMTP_PORT: '0', DATA_DIR: dataDir, SEED_DEMO: 'never', ...testRateLimits }), () => undefined);

/** Runs one of the npm scripts; resolves with its exit code and output. */
async function script(name: 'backup' | 'restore', ...args: string[]) {
  try {
    const { stdout, stderr } = await exec(tsx, [`scripts/${name}.ts`, ...args], { env: envFor(dataDir), timeout: 30_000 });
    return { code: 0, out: stdout + stderr };
  } catch (err) {
    const e = err as { code?: number; stdout?: string; stderr?: string };
    return { code: e.code ?? 1, out: `${e.stdout ?? ''}${e.stderr ?? ''}` };
  }
}

const goodResult = (heatTreatment: string) => ({
  steel: 'aisi-d2',
  hardness: { value: 61, scale: 'HRC' },
  heatTreatment,
  abrasive: 'cbn-electroplated-wheel-250-b126',
  edgeAngle: { perSideDeg: 15 },
  sharpness: { method: 'push-cut-test-v2', readingsG: [180, 175, 190] },
});

beforeAll(() => {
  dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'edgeledger-backup-'));
  fs.copyFileSync(inject('baseDatabase'), path.join(dataDir, 'edgeledger.sqlite'));
});
afterAll(async () => {
  await running?.stop();
  fs.rmSync(dataDir, { recursive: true, force: true });
});

describe('backup and restore', () => {
  it('round-trips: a backup taken while the server runs, restored after it stops', async () => {
    running = await start();
    const member = await signIn(running.url, await demoHandle(running.url, 'member'));
    const before = await member.agent.post('/api/results').set('X-CSRF-Token', member.csrf).send(goodResult('written before the backup')).expect(201);

    const backup = await script('backup');
    expect(backup.code, backup.out).toBe(0);
    const file = /Backup written: (\S+)/.exec(backup.out)![1];
    expect(path.dirname(file)).toBe(path.join(dataDir, 'backups'));
    expect(path.basename(file)).toMatch(/^edgeledger-\d{4}-\d{2}-\d{2}T\d{2}-\d{2}-\d{2}Z\.sqlite$/);
    const checked = await checkBackup(file);
    expect(checked.migrations).toContain('0001-initial');

    const after = await member.agent.post('/api/results').set('X-CSRF-Token', member.csrf).send(goodResult('written after the backup')).expect(201);

    // While the server has the database open, a restore is refused and changes nothing.
    expect(await databaseInUse(path.join(dataDir, 'edgeledger.sqlite'))).toBe(true);
    const refused = await script('restore', file);
    expect(refused.code).not.toBe(0);
    expect(refused.out).toMatch(/open in another process/);

    await running.stop();
    running = undefined;
    expect(await databaseInUse(path.join(dataDir, 'edgeledger.sqlite'))).toBe(false);
    const restored = await script('restore', file);
    expect(restored.code, restored.out).toBe(0);
    const previous = /kept as (\S+?)\.?$/m.exec(restored.out)![1];
    expect(fs.existsSync(previous)).toBe(true);

    running = await start();
    const author = await signIn(running.url, await demoHandle(running.url, 'member'));
    await author.agent.get(`/api/results/${before.body.id}`).expect(200);
    await author.agent.get(`/api/results/${after.body.id}`).expect(404);
    await running.stop();
    running = undefined;

    // The copy kept by the restore still has the later result: the restore can be undone.
    const kept = await new Promise<sqlite3.Database>((resolve, reject) => {
      const db = new sqlite3.Database(previous, sqlite3.OPEN_READONLY, (err) => (err ? reject(err) : resolve(db)));
    });
    const rows = await new Promise<unknown[]>((resolve, reject) => kept.all('SELECT id FROM results WHERE id = ?', [after.body.id], (err, r) => (err ? reject(err) : resolve(r))));
    await new Promise((resolve) => kept.close(resolve));
    expect(rows).toHaveLength(1);
  });

  it('refuses to restore a file that is not a sound Edgeledger database', async () => {
    const junk = path.join(dataDir, 'junk.sqlite');
    fs.writeFileSync(junk, Buffer.alloc(8192, 0x5a));
    const notOurs = path.join(dataDir, 'other.sqlite');
    await new Promise<void>((resolve, reject) => {
      const db = new sqlite3.Database(notOurs, (err) => {
        if (err) return reject(err);
        db.exec('CREATE TABLE t (x); INSERT INTO t VALUES (1);', (e) => db.close(() => (e ? reject(e) : resolve())));
      });
    });
    // A copy cut short, as an interrupted transfer would leave it.
    const truncated = path.join(dataDir, 'truncated.sqlite');
    const whole = fs.readFileSync(path.join(dataDir, 'edgeledger.sqlite'));
    fs.writeFileSync(truncated, whole.subarray(0, Math.floor(whole.length / 2)));
    const before = fs.readFileSync(path.join(dataDir, 'edgeledger.sqlite'));

    const target = path.join(dataDir, 'edgeledger.sqlite');
    for (const [file, reason] of [
      [notOurs, /no migrations_applied table/],
      [truncated, /integrity check failed|not a sound SQLite database|malformed/],
      [path.join(dataDir, 'missing.sqlite'), /no such file/],
    ] as const) {
      await expect(restoreDatabase(file, target, path.join(dataDir, 'backups'))).rejects.toThrow(reason);
    }
    // And through the script, with a failing exit code.
    const res = await script('restore', junk);
    expect(res.code).not.toBe(0);
    expect(res.out).toMatch(/Restore refused: .*not a (database SQLite can open|sound SQLite database)/);
    expect(fs.readFileSync(path.join(dataDir, 'edgeledger.sqlite')).equals(before)).toBe(true);
  });
});
