/**
 * `npm run bench:load`: the production server under varied traffic, every request different,
 * beside an Express hello-world route measured in the same run.
 *
 * 1. Builds a database (unless BENCH_KEEP names a folder that has one): the demo data's pages
 *    and members, then BENCH_RESULTS (default 100 000) approved results (copies of the demo's
 *    invented results, spread over its members and dates) and the comparison cells.
 *    BENCH_PHASES=data builds it and stops.
 * 2. Starts the server in production mode on loopback, bundled as `npm start` runs it, first
 *    with the answer cache on, then again with ANSWER_CACHE=off; and a bare Express hello-world.
 * 3. For each, one phase at a time, 10 connections (search: one at a time), hello-world for 3 s
 *    right before each phase: the comparison with varied precomputed filters (method, steels,
 *    category, material, size range, band step, sort, page); with live filters (hardness, angle,
 *    dates, bond, publishers) as well; the home list's pages; steel and abrasive pages as
 *    visitors and as signed-in members; unique searches built from the data's own words, some
 *    with typos or cut short; and the mix: 70 % reads of those kinds (30 % of readers signed
 *    in), 20 % unique searches, 10 % varied result submissions. Each phase reports its rate,
 *    p50/p95/p99 (from every response), the answer cache's hit ratio over the phase (from
 *    /api/health), and the p99 wait of a health check sent every 100 ms during it.
 * 4. Asks SQLite FTS5 over the same search documents the search phases' own queries
 *    (bench/fts.ts, in-process), as the search's yardstick.
 * 5. Counts the stored results (every submission answered 201 must be there), prints a table,
 *    and one JSON line last.
 *
 * BENCH_RESULTS (default 100000), BENCH_SECONDS (per phase, default 8), BENCH_KEEP=<dir> (build
 * or reuse the database there and keep it), BENCH_ONLY=<phases> (some of compare, live, list,
 * visitors, members, search, mix, comma-separated: only those), BENCH_CACHE=on|off (only that
 * server), BENCH_PROFILE=<dir> (the server writes a CPU profile there when it stops; summarise
 * it with `npx tsx bench/profile-summary.ts <file>`). Ports BENCH_PORT (default 3701) to
 * BENCH_PORT + 3 + 2 × BENCH_PROCS on 127.0.0.1.
 *
 * PostgreSQL: BENCH_DATABASE=postgres starts a throwaway cluster (as the tests do: never as root,
 * on BENCH_PG_PORT or a free port), builds the data there and removes it at the end; or
 * DATABASE_URL=postgres://… names a database to build into (kept; reused when it already holds
 * results). BENCH_PROCS=N (PostgreSQL only; default 1) starts N server processes on that
 * database and spreads the connections over them in turn (autocannon gives connection i the
 * address i mod N; the one-connection search phase therefore reaches the first process only);
 * rates, CPU, cache hits and stalls are the sum over the processes, health waits the first's.
 *
 * A phase whose answers are mostly not 2xx is reported as FAILED with one such answer, and the
 * bench exits 1. Figures describe this machine at this moment;
 * they are never assertions.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { spawn, type ChildProcess } from 'node:child_process';
import autocannon from 'autocannon';
import sqlite3 from 'sqlite3';
import { Database } from '../server/db/database';
import { loadDemoData } from '../seed/load';
import { Result, ResultEvent, User } from '../server/models';
import { rebuildAllCells } from '../server/aggregates/comparison-cells';
import { buildServer, serverNodeFlags } from '../scripts/build-server';
import { LocalOAuthProvider } from '../server/auth/local-provider';
import { startCluster, type Cluster } from '../tests/setup/postgres-cluster';
import { rand, traffic, vocabulary, type Req } from './traffic';
import { ftsTimes } from './fts';
import { allSearchDocs } from '../server/search/documents';

const TOTAL = Number(process.env.BENCH_RESULTS ?? 100_000);
const PHASE_SECONDS = Number(process.env.BENCH_SECONDS ?? 8);
const PHASES = (process.env.BENCH_PHASES ?? 'data,load').split(',');
const ALL_PHASES = ['compare', 'live', 'list', 'visitors', 'members', 'search', 'mix'] as const;
const ONLY = process.env.BENCH_ONLY ? process.env.BENCH_ONLY.split(',').map((p) => p.trim()) : [...ALL_PHASES];
for (const p of ONLY) if (!(ALL_PHASES as readonly string[]).includes(p)) throw new Error(`BENCH_ONLY: unknown phase "${p}" (known: ${ALL_PHASES.join(', ')})`);
const CACHES = (process.env.BENCH_CACHE ? [process.env.BENCH_CACHE] : ['on', 'off']) as ('on' | 'off')[];
for (const c of CACHES) if (c !== 'on' && c !== 'off') throw new Error(`BENCH_CACHE must be on or off (got "${c}")`);
const PROFILE = process.env.BENCH_PROFILE ? path.resolve(process.env.BENCH_PROFILE) : null;
const DIALECT = process.env.DATABASE_URL ? 'postgres' : (process.env.BENCH_DATABASE ?? 'sqlite');
if (DIALECT !== 'sqlite' && DIALECT !== 'postgres') throw new Error(`BENCH_DATABASE must be sqlite or postgres (got "${DIALECT}")`);
const PROCS = Number(process.env.BENCH_PROCS ?? 1);
if (!Number.isInteger(PROCS) || PROCS < 1) throw new Error(`BENCH_PROCS must be a whole number from 1 (got "${process.env.BENCH_PROCS}")`);
if (PROCS > 1 && DIALECT === 'sqlite') throw new Error('BENCH_PROCS > 1 needs PostgreSQL (BENCH_DATABASE=postgres or DATABASE_URL): one process owns a SQLite file');
const PORT = Number(process.env.BENCH_PORT ?? 3701);
// The servers with the answer cache off listen on ports of their own: the first ones' may still be closing.
const PORTS = { oauth: PORT, smtp: PORT + 1, s3: PORT + 2, hello: PORT + 3, server: (cache: 'on' | 'off', i: number) => PORT + 4 + (cache === 'on' ? 0 : PROCS) + i };
const HOST = '127.0.0.1';
/** The first server process's address (sign-in, vocabulary, health checks); `bases` all of them. */
let base = '';
let bases: string[] = [];
const started = performance.now();
const seconds = () => Math.round((performance.now() - started) / 100) / 10;
const say = (line: string) => console.log(`[${seconds()} s] ${line}`);

const root = process.env.BENCH_KEEP ? path.resolve(process.env.BENCH_KEEP) : fs.mkdtempSync(path.join(os.tmpdir(), 'edgeledger-load-'));
fs.mkdirSync(root, { recursive: true });
const file = path.join(root, 'edgeledger.sqlite');
const children: ChildProcess[] = [];
let cluster: Cluster | null = null;
process.on('exit', () => {
  for (const c of children) if (c.exitCode === null) c.kill('SIGKILL');
  cluster?.stop();
  if (process.env.BENCH_KEEP) console.log(`Kept ${root}`);
  else fs.rmSync(root, { recursive: true, force: true });
});
// Interrupted: still stop the servers and the throwaway cluster (the handler above).
for (const signal of ['SIGINT', 'SIGTERM'] as const) process.once(signal, () => process.exit(130));
if (DIALECT === 'postgres' && !process.env.DATABASE_URL) {
  cluster = await startCluster(process.env.BENCH_PG_PORT ? Number(process.env.BENCH_PG_PORT) : undefined);
  const admin = new Database({ storage: '', url: `${cluster.url}postgres` });
  await admin.sequelize.query('CREATE DATABASE edgeledger_bench');
  await admin.close();
}
const databaseUrl = process.env.DATABASE_URL ?? (cluster ? `${cluster.url}edgeledger_bench` : undefined);
const openDatabase = () => new Database({ storage: file, url: databaseUrl });

// ---------------------------------------------------------------------------------------------
// The database
// ---------------------------------------------------------------------------------------------

async function buildDatabase() {
  const db = openDatabase();
  await db.migrate();
  await loadDemoData(db);
  // Plain values, not raw rows: a raw row holds the JSON columns (input, progression) as the
  // text SQLite stores, and writing that text back stored it encoded twice (a string holding
  // JSON), which the presenter could not read: the home list answered 500 to every request.
  const templates = (await Result.findAll()).map((r) => r.get({ plain: true })) as unknown as Record<string, unknown>[];
  const members = await User.findAll({ where: { banned: false } });
  const reviewer = members.find((m) => m.role === 'moderator')!;
  const DAY = 24 * 3600 * 1000;
  const now = Date.now();
  const chunk = 5_000;
  const perTransaction = 25_000;
  let made = templates.filter((t) => t.status === 'approved').length;
  while (made < TOTAL) {
    const target = Math.min(TOTAL, made + perTransaction);
    await db.write(async (transaction) => {
      while (made < target) {
        const n = Math.min(chunk, target - made);
        const rows = Array.from({ length: n }, (_, i) => {
          const k = made + i;
          const t = templates[k % templates.length];
          const createdAt = new Date(now - (k % 900) * DAY - k * 1000);
          const { id: _id, ...rest } = t;
          return { ...rest, authorId: members[k % members.length].id, status: 'approved', approvedAt: new Date(createdAt.getTime() + DAY / 2), createdAt, updatedAt: createdAt };
        });
        // hooks: false: no change recorded per chunk (the cells are rebuilt once below).
        const inserted = await Result.bulkCreate(rows as never[], { transaction, returning: ['id'] as never, hooks: false });
        await ResultEvent.bulkCreate(
          inserted.flatMap((r, i) => [
            { resultId: r.id, actorId: rows[i].authorId, fromStatus: null, toStatus: 'pending', note: null, createdAt: rows[i].createdAt },
            { resultId: r.id, actorId: reviewer.id, fromStatus: 'pending', toStatus: 'approved', note: null, createdAt: rows[i].approvedAt },
          ]) as never[],
          { transaction, hooks: false },
        );
        made += n;
      }
    });
    say(`  ${made} approved results`);
  }
  const cells = await rebuildAllCells(db);
  if (db.isSqlite) await db.sequelize.query('PRAGMA wal_checkpoint(TRUNCATE)');
  await db.close();
  return { cells };
}

/** The OAuth subject of the first member, whom the bench's provider signs in. */
async function firstMemberSubject(): Promise<string> {
  const db = openDatabase();
  try {
    const member = await User.findOne({ where: { role: 'member', banned: false }, order: [['id', 'ASC']] });
    return member!.oauthSubject;
  } finally {
    await db.close();
  }
}

/** How many results the database holds (0 when it has no tables yet). */
async function countResults(): Promise<number> {
  if (!databaseUrl && !fs.existsSync(file)) return 0;
  const db = openDatabase();
  try {
    await db.migrate();
    return await Result.count();
  } finally {
    await db.close();
  }
}

/**
 * Databases built before the templates were read as plain values hold the results' JSON columns
 * encoded twice ('"[]"'): decoded once here, in place, so a kept database stays usable.
 */
function repairDoubleEncodedJson(): Promise<number> {
  return new Promise((resolve, reject) => {
    const db = new sqlite3.Database(file, (err) => {
      if (err) return reject(err);
      const done = (e: Error | null, n = 0) => db.close(() => (e ? reject(e) : resolve(n)));
      db.all(`SELECT id, input, progression FROM results WHERE substr(input, 1, 1) = '"' OR substr(progression, 1, 1) = '"'`, (e, rows: { id: number; input: string; progression: string }[]) => {
        if (e || !rows.length) return done(e);
        const once = (v: string) => (v.startsWith('"') ? (JSON.parse(v) as string) : v);
        db.serialize(() => {
          db.run('BEGIN');
          const update = db.prepare('UPDATE results SET input = ?, progression = ? WHERE id = ?');
          for (const r of rows) update.run(once(r.input), once(r.progression), r.id);
          update.finalize();
          db.run('COMMIT', (c: Error | null) => done(c, rows.length));
        });
      });
    });
  });
}

// ---------------------------------------------------------------------------------------------
// Servers
// ---------------------------------------------------------------------------------------------

async function waitFor(url: string, timeoutMs: number) {
  const until = Date.now() + timeoutMs;
  for (;;) {
    try {
      const res = await fetch(url);
      if (res.ok) return;
    } catch {
      // not listening yet
    }
    if (Date.now() > until) throw new Error(`${url} not answering after ${timeoutMs / 1000} s`);
    await new Promise((r) => setTimeout(r, 200));
  }
}

/** Each process's log and, with PROCS > 1, its own DATA_DIR (on SQLite the file's folder). */
const dataDirOf = (i: number) => (PROCS > 1 ? path.join(root, `process-${i + 1}`) : root);

function startServer(bundle: string, answerCache: 'on' | 'off', oauthUrl: string, i: number): ChildProcess {
  const dataDir = dataDirOf(i);
  fs.mkdirSync(dataDir, { recursive: true });
  const log = fs.openSync(path.join(dataDir, 'server.log'), 'a');
  const profile = PROFILE ? ['--cpu-prof', `--cpu-prof-dir=${PROFILE}`] : [];
  const proc = spawn(process.execPath, [...serverNodeFlags(), ...profile, bundle], {
    env: {
      ...process.env,
      // Production as deployed: every hosted setting given (production refuses the local stand-ins).
      // The "hosted" OAuth2 provider is the local one, run by this bench; mail and photos are
      // never reached by this traffic.
      NODE_ENV: 'production',
      SESSION_SECRET: 'bench-only-secret-not-for-any-deployment',
      PUBLIC_URL: 'https://bench.edgeledger.example',
      OAUTH_AUTHORIZE_URL: `${oauthUrl}/authorize`,
      OAUTH_TOKEN_URL: `${oauthUrl}/token`,
      OAUTH_USERINFO_URL: `${oauthUrl}/userinfo`,
      OAUTH_CLIENT_ID: 'bench-client',
      OAUTH_CLIENT_SECRET: 'bench-client-secret',
      SMTP_HOST: HOST,
      SMTP_PORT: String(PORTS.smtp),
      S3_ENDPOINT: `http://${HOST}:${PORTS.s3}`,
      S3_ACCESS_KEY: 'bench-access-key',
      S3_SECRET_KEY: 'bench-secret-key',
      HOST,
      PORT: String(PORTS.server(answerCache, i)),
      DATA_DIR: dataDir,
      ...(databaseUrl ? { DATABASE_URL: databaseUrl } : {}),
      SEED_DEMO: 'never',
      ANSWER_CACHE: answerCache,
      LOG_LEVEL: 'info',
      // The load comes from one address through one "proxy" (X-Forwarded-Proto: https below,
      // so that the Secure session cookie is issued): limits raised, as for a trusted load test.
      TRUST_PROXY: '1',
      RATE_LIMIT_SIGNIN_PER_MIN: '1000000',
      RATE_LIMIT_POSTS_PER_MIN: '100000000',
      RATE_LIMIT_SEARCH_PER_MIN: '100000000',
      RATE_LIMIT_UPLOADS_PER_MIN: '1000000',
    },
    stdio: ['ignore', log, log],
  });
  children.push(proc);
  return proc;
}

function startHello(): ChildProcess {
  const script = `
    const express = require('express');
    const app = express();
    app.disable('x-powered-by');
    app.get('/', (_req, res) => res.send('hello'));
    app.listen(${PORTS.hello}, '${HOST}');
  `;
  const proc = spawn(process.execPath, ['-e', script], { stdio: 'ignore' });
  children.push(proc);
  return proc;
}

/** Signs the production local provider's default member in; returns the cookie and CSRF token. */
async function signIn(): Promise<{ cookie: string; csrf: string }> {
  const tls = { 'X-Forwarded-Proto': 'https' };
  const start = await fetch(`${base}/auth/signin`, { redirect: 'manual', headers: tls });
  const first = start.headers.getSetCookie().map((c) => c.split(';')[0]).join('; ');
  const authorize = await fetch(start.headers.get('location')!, { redirect: 'manual' });
  const callback = new URL(authorize.headers.get('location')!);
  const done = await fetch(`${base}${callback.pathname}${callback.search}`, { redirect: 'manual', headers: { ...tls, Cookie: first } });
  const cookie = done.headers.getSetCookie().map((c) => c.split(';')[0]).join('; ') || first;
  const session = (await (await fetch(`${base}/api/session`, { headers: { ...tls, Cookie: cookie } })).json()) as { user: unknown; csrfToken: string };
  if (!session.user) throw new Error('bench sign-in failed');
  return { cookie, csrf: session.csrfToken };
}

// ---------------------------------------------------------------------------------------------
// Traffic: every request built afresh from the data's own vocabulary
// ---------------------------------------------------------------------------------------------

// ---------------------------------------------------------------------------------------------
// Measuring
// ---------------------------------------------------------------------------------------------

function percentile(values: number[], p: number): number {
  if (!values.length) return NaN;
  const s = [...values].sort((a, b) => a - b);
  const h = (s.length - 1) * p;
  const lo = Math.floor(h);
  return Math.round((s[lo] + (h - lo) * (s[Math.min(lo + 1, s.length - 1)] - s[lo])) * 10) / 10;
}

interface Run {
  rps: number;
  p50: number;
  p95: number;
  p99: number;
  errors: number;
  statusCodes: Record<string, number>;
}

/** Drives `url` (several: connection i asks url i mod n) with autocannon; each request from `next()` when given; every response's time kept. */
async function drive(url: string | string[], seconds: number, connections: number, next?: () => Req): Promise<Run> {
  const times: number[] = [];
  const statusCodes: Record<string, number> = {};
  const options: Record<string, unknown> = { url, connections, duration: seconds };
  if (next) options.requests = [{ setupRequest: (req: Req) => Object.assign(req, next()) }];
  const instance = autocannon(options);
  instance.on('response', (_client: unknown, status: number, _bytes: number, ms: number) => {
    times.push(ms);
    statusCodes[status] = (statusCodes[status] ?? 0) + 1;
  });
  const r = (await instance) as { errors: number; timeouts: number; duration: number };
  return { rps: Math.round(times.length / seconds), p50: percentile(times, 0.5), p95: percentile(times, 0.95), p99: percentile(times, 0.99), errors: r.errors + r.timeouts, statusCodes };
}

/** Sends a health check every 100 ms until `stop`; their waits, ms. */
function probeHealth(): { stop: () => Promise<number[]> } {
  const waits: number[] = [];
  let running = true;
  const loop = (async () => {
    while (running) {
      const t = performance.now();
      await fetch(`${base}/api/health`).then((r) => r.arrayBuffer());
      waits.push(performance.now() - t);
      await new Promise((r) => setTimeout(r, 100));
    }
  })();
  return {
    stop: async () => {
      running = false;
      await loop;
      return waits;
    },
  };
}

type Health = { answerCache: { hits: number; misses: number }; eventLoop: { count: number; recent: { at: number; ms: number }[] } };
/** Every server process's health, summed (the recent stalls of all of them together). */
async function health(): Promise<Health> {
  const all = await Promise.all(bases.map(async (b) => (await (await fetch(`${b}/api/health`)).json()) as Health));
  return {
    answerCache: { hits: all.reduce((n, h) => n + h.answerCache.hits, 0), misses: all.reduce((n, h) => n + h.answerCache.misses, 0) },
    eventLoop: { count: all.reduce((n, h) => n + h.eventLoop.count, 0), recent: all.flatMap((h) => h.eventLoop.recent) },
  };
}

/** Asks a few of the phase's requests one by one; the first answer that is not 2xx/3xx, with its body. */
async function sampleFailure(next: () => Req): Promise<string | null> {
  for (let i = 0; i < 5; i++) {
    const r = next();
    const res = await fetch(`${base}${r.path}`, { method: r.method, headers: r.headers, body: r.body, redirect: 'manual' });
    const body = await res.text();
    if (res.status >= 400) return `${r.method} ${r.path} → ${res.status} ${body.slice(0, 300)}`;
  }
  return null;
}

const failures: string[] = [];

interface Figure extends Run {
  phase: string;
  cache: 'on' | 'off';
  hello: number;
  ofHello: number;
  hitRatio: number | null;
  healthP99: number;
  created: number;
  cpuMsPerReq: number;
  helloCpuMsPerReq: number;
  stalls: number;
  longestStallMs: number;
}

/** A process's CPU time so far (user + system), ms, from /proc (Linux). */
function cpuMs(pid: number): number {
  const fields = fs.readFileSync(`/proc/${pid}/stat`, 'utf8').split(') ')[1].split(' ');
  return ((Number(fields[11]) + Number(fields[12])) * 1000) / 100; // utime, stime in ticks of 1/100 s (USER_HZ)
}

let serverPids: number[] = [];
let helloPid = 0;
const serversCpuMs = () => serverPids.reduce((n, pid) => n + cpuMs(pid), 0);

async function phase(name: string, cache: 'on' | 'off', next: () => Req, connections = 10): Promise<Figure> {
  const helloCpu = cpuMs(helloPid);
  const hello = await drive(`http://${HOST}:${PORTS.hello}/`, 3, connections);
  const helloCpuPerReq = (cpuMs(helloPid) - helloCpu) / (hello.rps * 3);
  const before = await health();
  const startedAt = Date.now();
  const probe = probeHealth();
  const cpuBefore = serversCpuMs();
  const run = await drive(bases, PHASE_SECONDS, connections, next);
  const cpu = serversCpuMs() - cpuBefore;
  const waits = await probe.stop();
  const after = await health();
  const hits = after.answerCache.hits - before.answerCache.hits;
  const asked = hits + after.answerCache.misses - before.answerCache.misses;
  // The server's own count of event-loop stalls over 20 ms during the phase, and the longest.
  const stalls = after.eventLoop.count - before.eventLoop.count;
  const longestStall = Math.max(0, ...after.eventLoop.recent.filter((s) => s.at >= startedAt).map((s) => s.ms));
  const f: Figure = {
    phase: name,
    cache,
    ...run,
    hello: hello.rps,
    ofHello: Math.round((run.rps / hello.rps) * 1000) / 10,
    // The server's CPU time per answer, beside hello-world's: steadier than req/s on a busy machine.
    cpuMsPerReq: Math.round((cpu / Math.max(1, times(run))) * 100) / 100,
    helloCpuMsPerReq: Math.round(helloCpuPerReq * 1000) / 1000,
    hitRatio: asked ? Math.round((hits / asked) * 1000) / 10 : null,
    healthP99: percentile(waits, 0.99),
    stalls,
    longestStallMs: longestStall,
    created: run.statusCodes['201'] ?? 0,
  };
  const bad = Object.entries(run.statusCodes).filter(([c]) => !['200', '201', '301'].includes(c));
  const badCount = bad.reduce((n, [, x]) => n + x, 0);
  if (badCount * 2 > times(run)) {
    const sample = await sampleFailure(next);
    failures.push(`${name} (cache ${cache})`);
    say(`  FAILED: ${name} (cache ${cache}): ${badCount} of ${times(run)} answers not 2xx/3xx; its figures measure errors. ${sample ? `For example: ${sample}` : ''}`);
  }
  say(
    `  ${name.padEnd(22)} cache ${cache.padEnd(3)}: ${String(f.rps).padStart(5)} req/s (${f.ofHello} % of hello-world ${f.hello}), p50 ${f.p50} ms, p95 ${f.p95} ms, p99 ${f.p99} ms; CPU ${f.cpuMsPerReq} ms/answer (hello-world ${f.helloCpuMsPerReq}); ` +
      `answer cache hits ${f.hitRatio ?? '–'} %; health p99 ${f.healthP99} ms; loop stalls > 20 ms ${f.stalls} (longest ${f.longestStallMs} ms)${bad.length ? `; other answers ${JSON.stringify(Object.fromEntries(bad))}` : ''}${run.errors ? `; errors ${run.errors}` : ''}`,
  );
  return f;
}

const times = (run: Run) => Object.values(run.statusCodes).reduce((a, b) => a + b, 0);

function rssMb(pid: number): number {
  const status = fs.readFileSync(`/proc/${pid}/status`, 'utf8');
  return Math.round(Number(/VmRSS:\s+(\d+)/.exec(status)![1]) / 1024);
}

// ---------------------------------------------------------------------------------------------

const where = databaseUrl ? `PostgreSQL (${databaseUrl.replace(/\/\/[^@/]*@/, '//')})` : root;
if ((await countResults()) === 0) {
  say(`Building a database of ${TOTAL} approved results in ${where} …`);
  const loadStarted = performance.now();
  const built = await buildDatabase();
  say(`Database ready: ${await countResults()} results, ${built.cells} comparison cells, loaded in ${Math.round((performance.now() - loadStarted) / 100) / 10} s.`);
} else {
  say(`Reusing the database in ${where}.`);
  if (!databaseUrl) {
    const repaired = await repairDoubleEncodedJson();
    if (repaired) say(`  Repaired ${repaired} results whose JSON columns an earlier build had encoded twice.`);
  }
}
if (!PHASES.includes('load')) process.exit(0);
const resultsBefore = await countResults();

const provider = new LocalOAuthProvider(((subject) => () => subject)(await firstMemberSubject()));
const oauthUrl = await provider.start(PORTS.oauth);
const hello = startHello();
helloPid = hello.pid!;
await waitFor(`http://${HOST}:${PORTS.hello}/`, 10_000);
const bundle = await buildServer();
const figures: Figure[] = [];
const servers: { cache: 'on' | 'off'; process: number; bootS: number; rssMb: number }[] = [];
say(`${DIALECT === 'postgres' ? 'PostgreSQL' : 'SQLite'}, ${PROCS} server process${PROCS > 1 ? 'es' : ''}.`);
/** The search phases' queries, for FTS5 after the servers stop. */
const searchQueries: string[] = [];
const asked = (r: Req): Req => {
  searchQueries.push(new URL(r.path, base).searchParams.get('q')!);
  return r;
};
for (const cache of CACHES) {
  bases = Array.from({ length: PROCS }, (_, i) => `http://${HOST}:${PORTS.server(cache, i)}`);
  base = bases[0];
  const procs: ChildProcess[] = [];
  const boots: number[] = [];
  // One after the other: each process builds its read models and search index from the tables at start.
  for (const [i, url] of bases.entries()) {
    const server = startServer(bundle, cache, oauthUrl, i);
    const bootStart = performance.now();
    await Promise.race([
      waitFor(`${url}/api/health`, 420_000),
      new Promise((_, reject) => server.once('exit', (code) => reject(new Error(`the server exited (${code})`)))),
    ]).catch((err) => {
      console.error(String(err));
      console.error(fs.readFileSync(path.join(dataDirOf(i), 'server.log'), 'utf8').slice(-3000));
      process.exit(1);
    });
    boots.push(Math.round((performance.now() - bootStart) / 100) / 10);
    procs.push(server);
    say(`Production server ${i + 1} of ${PROCS} (answer cache ${cache}) ready at ${url} in ${boots[i]} s (pid ${server.pid}, RSS ${rssMb(server.pid!)} MB).`);
  }
  serverPids = procs.map((p) => p.pid!);
  const sessions = await Promise.all(Array.from({ length: 16 }, () => signIn()));
  const t = traffic(await vocabulary(base), sessions);
  // Warm-up (the JIT, the pages' caches), uncounted.
  await drive(bases, 3, 10, t.mixed);
  const phases: Record<(typeof ALL_PHASES)[number], () => Promise<Figure>> = {
    compare: () => phase('compare (precomputed)', cache, () => t.compare()),
    live: () => phase('compare (live filters)', cache, () => t.compareLive()),
    list: () => phase('home list pages', cache, () => t.list()),
    visitors: () => phase('pages, visitors', cache, () => (rand() < 0.5 ? t.steel() : t.abrasive())),
    members: () => phase('pages, members', cache, () => (rand() < 0.5 ? t.steel(true) : t.abrasive(true))),
    search: () => phase('unique search, 1 conn', cache, () => asked(t.search()), 1),
    mix: () => phase('mix 70/20/10', cache, t.mixed),
  };
  for (const p of ALL_PHASES) if (ONLY.includes(p)) figures.push(await phases[p]());
  procs.forEach((p, i) => servers.push({ cache, process: i + 1, bootS: boots[i], rssMb: rssMb(p.pid!) }));
  for (const p of procs) p.kill('SIGTERM');
  await Promise.all(procs.map((p) => new Promise((resolve) => (p.exitCode === null ? p.once('exit', resolve) : resolve(null)))));
}
hello.kill('SIGTERM');
await provider.stop();

// The yardstick: SQLite FTS5 over the same documents, asked the search phases' own queries.
let fts: { queries: number; p50: number; p95: number } | null = null;
if (searchQueries.length) {
  const db = openDatabase();
  await db.migrate();
  const ftsMs = await ftsTimes(allSearchDocs(), searchQueries);
  await db.close();
  fts = { queries: ftsMs.length, p50: percentile(ftsMs, 0.5), p95: percentile(ftsMs, 0.95) };
  say(`  SQLite FTS5 on the same documents and the search phases' ${fts.queries} queries (in-process, no HTTP): p50 ${fts.p50} ms, p95 ${fts.p95} ms.`);
}

const resultsAfter = await countResults();
const acknowledged = figures.reduce((n, f) => n + f.created, 0);
const stored = resultsAfter - resultsBefore;
// A write in flight when a phase stops is stored but never answered: stored may exceed
// acknowledged (warm-ups write too); only the reverse would be a lost write.
const lost = Math.max(0, acknowledged - stored);
const serverErrors = figures.reduce((n, f) => n + Object.entries(f.statusCodes).filter(([c]) => Number(c) >= 500).reduce((a, [, x]) => a + x, 0), 0);
const by = (name: string, cache: 'on' | 'off') => figures.find((f) => f.phase === name && f.cache === cache);
const members = (cache: 'on' | 'off') => {
  const m = by('pages, members', cache);
  const v = by('pages, visitors', cache);
  return m && v ? Math.round((m.rps / v.rps) * 1000) / 10 : null;
};
if (CACHES.some((c) => members(c) !== null)) say(`Members' pages at ${CACHES.map((c) => `${members(c)} % of visitors' throughput (cache ${c})`).join(', ')}.`);
say(`Writes acknowledged ${acknowledged}, stored ${stored}: lost ${lost}; 5xx answers ${serverErrors}. Server RSS at the end: ${servers.map((s) => `${s.rssMb} MB (cache ${s.cache}${PROCS > 1 ? `, process ${s.process}` : ''})`).join(', ')}. Bench took ${seconds()} s.`);

console.log(
  JSON.stringify({
    database: DIALECT,
    processes: PROCS,
    results: resultsBefore,
    phaseSeconds: PHASE_SECONDS,
    servers,
    figures: figures.map(({ statusCodes: _s, ...f }) => f),
    membersOfVisitors: { on: members('on'), off: members('off') },
    fts,
    writes: { acknowledged, stored, lost, serverErrors },
    failed: failures,
    seconds: seconds(),
  }),
);
if (failures.length) console.error(`FAILED: ${failures.join('; ')}: most answers were not 2xx/3xx.`);
process.exit(failures.length || lost ? 1 : 0);
