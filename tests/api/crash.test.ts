/**
 * Durability: the real server runs as a child process (`node --import tsx server/index.ts`, what
 * `npx tsx server/index.ts` runs, without npx's wrapper process so that the signal reaches the
 * server itself) over a copy of the demo database. Members post results and a moderator
 * approves them while the server is killed with SIGKILL at a random moment; after each kill
 * every write that was answered 2xx must be in the file, `PRAGMA integrity_check` must say ok,
 * and after the restart the search index must hold exactly the pages and approved results.
 * The last run ends with SIGTERM instead, which must finish cleanly (exit code 0).
 *
 * CRASH_ITERATIONS (default 4) and CRASH_SEED (default: the clock) repeat a run.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { ChildProcess } from 'node:child_process';
import { afterAll, describe, expect, it } from 'vitest';
import { inject } from 'vitest';
import sqlite3 from 'sqlite3';
import { demoHandle, signIn, testRateLimits } from '../setup/test-server';
import { startServerProcess, type ServerProcess } from '../setup/server-process';

const ITERATIONS = Number(process.env.CRASH_ITERATIONS ?? 4);
const SEED = Number(process.env.CRASH_SEED ?? Date.now() % 1_000_000);
const WRITERS = 6;

/** mulberry32: a small seeded generator, so a failing run can be repeated with CRASH_SEED. */
function random(seed: number) {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'edgeledger-crash-'));
const file = path.join(dataDir, 'edgeledger.sqlite');
let child: ChildProcess | undefined;

afterAll(() => {
  if (child && child.exitCode === null) child.kill('SIGKILL');
  fs.rmSync(dataDir, { recursive: true, force: true });
});

/** Starts the server as a child (kept in `child`, so it is killed whatever the test's outcome). */
async function startServer(): Promise<ServerProcess> {
  const server = await startServerProcess({ DATA_DIR: dataDir, ...testRateLimits });
  child = server.proc;
  return server;
}

/** Read-only look at the file while no server runs. */
async function inspect(): Promise<{ integrity: string; statusById: Map<number, string>; approvedMarked: number }> {
  const db = await new Promise<sqlite3.Database>((resolve, reject) => {
    const d = new sqlite3.Database(file, sqlite3.OPEN_READWRITE, (err) => (err ? reject(err) : resolve(d)));
  });
  const all = <T>(sql: string) => new Promise<T[]>((resolve, reject) => db.all(sql, (err, rows) => (err ? reject(err) : resolve(rows as T[]))));
  try {
    const integrity = (await all<{ integrity_check: string }>('PRAGMA integrity_check')).map((r) => r.integrity_check).join('; ');
    const rows = await all<{ id: number; status: string; marked: number }>(`SELECT id, status, input LIKE '%${MARK}%' AS marked FROM results`);
    return {
      integrity,
      statusById: new Map(rows.map((r) => [r.id, r.status])),
      approvedMarked: rows.filter((r) => r.status === 'approved' && r.marked).length,
    };
  } finally {
    await new Promise((resolve) => db.close(resolve));
  }
}

/** A word only this test's notes hold, so the index can be asked how many of its results it has. */
const MARK = 'crashmark';

const goodResult = (i: number) => ({
  steel: 'aisi-d2',
  hardness: { value: 61, scale: 'HRC' },
  heatTreatment: `crash test write ${i}`,
  abrasive: 'cbn-electroplated-wheel-250-b126',
  edgeAngle: { perSideDeg: 15 },
  sharpness: { method: 'push-cut-test-v2', readingsG: [180, 175, 190] },
  notes: { type: 'doc', content: [{ type: 'paragraph', content: [{ type: 'text', text: `${MARK} write ${i}` }] }] },
});

describe('crash safety', () => {
  it(`loses no acknowledged write over ${ITERATIONS} kills at random moments (seed ${SEED})`, async () => {
    fs.copyFileSync(inject('baseDatabase'), file);
    const rand = random(SEED);
    const acknowledged = new Map<number, 'pending' | 'approved'>();
    let approvedInFile = 0;
    const survived: { acked: number; killedAfterMs: number }[] = [];

    for (let iteration = 1; iteration <= ITERATIONS; iteration += 1) {
      const last = iteration === ITERATIONS;
      const server = await startServer();

      // The index is rebuilt from the database at start: every approved result of this test
      // (including approvals committed as the server died, before any answer), no pending one.
      expect(await indexedMarked(server.url), `result documents after restart ${iteration}`).toBe(approvedInFile);

      const member = await signIn(server.url, await demoHandle(server.url, 'member'));
      const moderator = await signIn(server.url, await demoHandle(server.url, 'moderator'));
      let stop = false;
      let n = 0;
      const toApprove: number[] = [];
      const writer = async () => {
        while (!stop) {
          const res = await member.agent.post('/api/results').set('X-CSRF-Token', member.csrf).send(goodResult((n += 1))).catch(() => null);
          if (res?.status === 201) {
            acknowledged.set(res.body.id, 'pending');
            toApprove.push(res.body.id);
          } else if (res && res.status >= 400 && res.status < 500) throw new Error(`write refused: ${res.status} ${JSON.stringify(res.body)}`);
        }
      };
      const approver = async () => {
        while (!stop) {
          const id = toApprove.shift();
          if (id === undefined) {
            await new Promise((r) => setTimeout(r, 5));
            continue;
          }
          const res = await moderator.agent.post(`/api/results/${id}/review`).set('X-CSRF-Token', moderator.csrf).send({ decision: 'approve' }).catch(() => null);
          if (res?.status === 200) acknowledged.set(id, 'approved');
        }
      };
      const streams = [...Array.from({ length: WRITERS }, writer), approver()];
      // The random moment is counted from the first acknowledged write, so that writes are
      // always under way when the signal lands.
      const firstAck = acknowledged.size;
      for (const t0 = Date.now(); acknowledged.size === firstAck && Date.now() - t0 < 10_000; ) await new Promise((r) => setTimeout(r, 5));
      const killAfterMs = Math.round(200 + rand() * 1000);
      await new Promise((r) => setTimeout(r, killAfterMs));
      server.proc.kill(last ? 'SIGTERM' : 'SIGKILL');
      const code = await server.exited;
      stop = true;
      await Promise.allSettled(streams);
      if (last) expect(code, 'exit code after SIGTERM').toBe(0);
      else expect(code).toBeNull();

      const seen = await inspect();
      expect(seen.integrity).toBe('ok');
      const lost = [...acknowledged].filter(([id, status]) => {
        const stored = seen.statusById.get(id);
        return stored === undefined || (status === 'approved' && stored !== 'approved');
      });
      expect(lost, `acknowledged writes missing after kill ${iteration} (seed ${SEED})`).toEqual([]);
      approvedInFile = seen.approvedMarked;
      survived.push({ acked: acknowledged.size, killedAfterMs: killAfterMs });
    }

    // One last start: the index matches the database after the final (graceful) stop too.
    const server = await startServer();
    expect(await indexedMarked(server.url)).toBe(approvedInFile);
    expect(approvedInFile).toBeGreaterThanOrEqual([...acknowledged.values()].filter((s) => s === 'approved').length);
    server.proc.kill('SIGTERM');
    expect(await server.exited).toBe(0);
    const approvedAcked = [...acknowledged.values()].filter((s) => s === 'approved').length;
    console.info(`crash test: ${ITERATIONS} runs (seed ${SEED}), ${acknowledged.size} acknowledged results, ${approvedAcked} acknowledged approvals, none lost`, survived);
    expect(acknowledged.size).toBeGreaterThan(ITERATIONS * 5);
    expect(approvedAcked).toBeGreaterThan(0);
  }, 240_000);
});

/** How many result documents of this test the server's search index holds. */
async function indexedMarked(url: string): Promise<number> {
  const res = await fetch(`${url}/api/search?q=${MARK}&type=result`);
  const body = (await res.json()) as { facets: Record<string, number> };
  return body.facets.result;
}
