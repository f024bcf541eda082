/**
 * `npm run bench:load`: the production server under a mixed load, beside an Express
 * hello-world route measured in the same run.
 *
 * 1. Builds a temporary database: the demo data's pages and members, then 100 000 approved
 *    results (copies of the demo's invented results, spread over its members and dates),
 *    inserted in bulk through Sequelize in a few transactions, and the comparison cells.
 * 2. Starts the server in production mode on loopback, bundled as `npm start` runs it,
 *    and, separately, a bare Express app answering "hello".
 * 3. With autocannon at 10 connections: the mix (70 % reads of pages and comparisons, 20 %
 *    search, 10 % result submissions by signed-in members) for 5 s to warm up; then three
 *    rounds of hello-world for 5 s and the mix for 10 s (30 s of mix in all), taking turns so
 *    that both are measured in the same moments of a shared machine; the mix again at half its
 *    saturated rate, for its p99; then 16 concurrent submitters
 *    (16 sessions) for 10 s; and each read of the mix alone for 3 s, to name the slow ones.
 * 4. Stops the server and counts the stored results: every submission answered 201 must be
 *    there. Prints a summary, and one JSON line last.
 *
 * BENCH_RESULTS (default 100000) and BENCH_SECONDS (default 30) change the size and the mix's
 * duration; BENCH_KEEP=1 keeps the temporary folder (database and server log). Ports 3701–3705 on 127.0.0.1. Figures describe this machine at this moment; they
 * are never assertions.
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

const TOTAL = Number(process.env.BENCH_RESULTS ?? 100_000);
const MIX_SECONDS = Number(process.env.BENCH_SECONDS ?? 30);
const PORTS = { http: 3701, oauth: 3702, smtp: 3703, s3: 3704, hello: 3705 };
const HOST = '127.0.0.1';
const base = `http://${HOST}:${PORTS.http}`;
const started = performance.now();
const seconds = () => Math.round((performance.now() - started) / 100) / 10;
const say = (line: string) => console.log(`[${seconds()} s] ${line}`);

const root = fs.mkdtempSync(path.join(os.tmpdir(), 'edgeledger-load-'));
const file = path.join(root, 'edgeledger.sqlite');
const children: ChildProcess[] = [];
process.on('exit', () => {
  for (const c of children) if (c.exitCode === null) c.kill('SIGKILL');
  if (process.env.BENCH_KEEP) console.log(`Kept ${root}`);
  else fs.rmSync(root, { recursive: true, force: true });
});

// ---------------------------------------------------------------------------------------------
// The database
// ---------------------------------------------------------------------------------------------

async function buildDatabase() {
  const db = new Database({ storage: file });
  await db.migrate();
  await loadDemoData(db);
  const templates = (await Result.findAll({ raw: true })) as unknown as Record<string, unknown>[];
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
  await db.sequelize.query('PRAGMA wal_checkpoint(TRUNCATE)');
  await db.close();
  return { cells };
}

function countResults(): Promise<number> {
  return new Promise((resolve, reject) => {
    const db = new sqlite3.Database(file, sqlite3.OPEN_READONLY, (err) => {
      if (err) return reject(err);
      db.get('SELECT count(*) AS n FROM results', (e, row: { n: number }) => db.close(() => (e ? reject(e) : resolve(row.n))));
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

function startServer(bundle: string): ChildProcess {
  const log = fs.openSync(path.join(root, 'server.log'), 'w');
  const proc = spawn(process.execPath, [...serverNodeFlags(), bundle], {
    env: {
      ...process.env,
      NODE_ENV: 'production',
      SESSION_SECRET: 'bench-only-secret-not-for-any-deployment',
      HOST,
      PORT: String(PORTS.http),
      OAUTH_PORT: String(PORTS.oauth),
      SMTP_PORT: String(PORTS.smtp),
      S3_PORT: String(PORTS.s3),
      DATA_DIR: root,
      SEED_DEMO: 'never',
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
// Load
// ---------------------------------------------------------------------------------------------

const submission = JSON.stringify({
  steel: 'aisi-d2',
  hardness: { value: 61, scale: 'HRC' },
  abrasive: 'cbn-electroplated-wheel-250-b126',
  edgeAngle: { perSideDeg: 15 },
  sharpness: { method: 'push-cut-test-v2', readingsG: [180, 175, 190, 170, 185] },
  retention: { method: 'card-cut-retention-v1', cuts: 240 },
  notes: { type: 'doc', content: [{ type: 'paragraph', content: [{ type: 'text', text: 'Load-bench submission: ' }, { type: 'text', text: 'invented', marks: [{ type: 'bold' }] }] }] },
});

function writeRequest(s: { cookie: string; csrf: string }) {
  return {
    method: 'POST' as const,
    path: '/api/results',
    headers: { 'content-type': 'application/json', cookie: s.cookie, 'x-csrf-token': s.csrf, 'x-forwarded-proto': 'https' },
    body: submission,
  };
}

/** Ten requests, cycled by every connection: 7 reads of pages and comparisons, 2 searches, 1 write. */
function mix(s: { cookie: string; csrf: string }) {
  const get = (p: string) => ({ method: 'GET' as const, path: p });
  return [
    get('/api/steels/aisi-d2'),
    get('/api/compare?method=push-cut-test-v2'),
    get('/api/abrasives/cbn-electroplated-wheel-250-b126'),
    get('/api/search?q=d2'),
    get('/api/compare?method=push-cut-test-v2&steel=aisi-d2'),
    get('/api/methods/push-cut-test-v2'),
    get('/api/compare?method=card-cut-retention-v1&material=cbn'),
    get('/api/search?q=cbn%20wheel'),
    get('/api/steels'),
    writeRequest(s),
  ];
}

interface Run {
  rps: number;
  p50: number;
  p99: number;
  errors: number;
  non2xx: number;
  created: number;
  total: number;
  statusCodes: Record<string, number>;
}

async function drive(options: Record<string, unknown>): Promise<Run> {
  const r = (await autocannon({ connections: 10, ...options } as never)) as unknown as {
    requests: { average: number; total: number };
    latency: { p50: number; p99: number };
    errors: number;
    timeouts: number;
    non2xx: number;
    statusCodeStats: Record<string, { count: number }>;
  };
  const statusCodes = Object.fromEntries(Object.entries(r.statusCodeStats).map(([k, v]) => [k, v.count]));
  return {
    rps: Math.round(r.requests.average),
    p50: r.latency.p50,
    p99: r.latency.p99,
    errors: r.errors + r.timeouts,
    non2xx: r.non2xx,
    created: statusCodes['201'] ?? 0,
    total: r.requests.total,
    statusCodes,
  };
}

function rssMb(pid: number): number {
  const status = fs.readFileSync(`/proc/${pid}/status`, 'utf8');
  return Math.round(Number(/VmRSS:\s+(\d+)/.exec(status)![1]) / 1024);
}

// ---------------------------------------------------------------------------------------------

say(`Building a database of ${TOTAL} approved results in ${root} …`);
const built = await buildDatabase();
const resultsBefore = await countResults();
say(`Database ready: ${resultsBefore} results, ${built.cells} comparison cells.`);

const hello = startHello();
await waitFor(`http://${HOST}:${PORTS.hello}/`, 10_000);
const server = startServer(await buildServer());
const bootStart = performance.now();
await Promise.race([
  waitFor(`${base}/api/health`, 420_000),
  new Promise((_, reject) => server.once('exit', (code) => reject(new Error(`the server exited (${code}):\n${fs.readFileSync(path.join(root, 'server.log'), 'utf8').slice(-3000)}`)))),
]).catch((err) => {
  console.error(String(err));
  console.error(fs.readFileSync(path.join(root, 'server.log'), 'utf8').slice(-3000));
  process.exit(1);
});
const bootS = Math.round((performance.now() - bootStart) / 100) / 10;
say(`Production server ready in ${bootS} s (pid ${server.pid}).`);

const sessions = await Promise.all(Array.from({ length: 16 }, () => signIn()));

// The mix first warms up (the JIT, the kept answers and the pages' caches fill), uncounted.
// Then hello-world and the mix take turns, so that both meet the machine in the same state
// (on this shared 2-core machine hello-world alone moved between 4 500 and 8 000 req/s within
// an hour): ROUNDS rounds of hello-world for 5 s and the mix for MIX_SECONDS / ROUNDS.
say('Mix warm-up, 10 connections, 5 s (not counted) …');
const warmUp = await drive({ url: base, duration: 5, requests: mix(sessions[0]) });
const ROUNDS = 3;
const helloRounds: Run[] = [];
const mixRounds: Run[] = [];
for (let round = 1; round <= ROUNDS; round += 1) {
  const h = await drive({ url: `http://${HOST}:${PORTS.hello}/`, duration: 5 });
  const m = await drive({ url: base, duration: Math.round(MIX_SECONDS / ROUNDS), requests: mix(sessions[0]) });
  helloRounds.push(h);
  mixRounds.push(m);
  say(`  round ${round}: hello-world ${h.rps} req/s; mix ${m.rps} req/s (${Math.round((m.rps / h.rps) * 1000) / 10} %), p50 ${m.p50} ms, p99 ${m.p99} ms, errors ${m.errors}, non-2xx ${m.non2xx}`);
}
/** The rounds as one run: requests per second over all of them, the worst p50/p99, every error. */
function together(runs: Run[]): Run {
  const statusCodes: Record<string, number> = {};
  for (const r of runs) for (const [code, n] of Object.entries(r.statusCodes)) statusCodes[code] = (statusCodes[code] ?? 0) + n;
  return {
    rps: Math.round(runs.reduce((n, r) => n + r.rps, 0) / runs.length),
    p50: Math.max(...runs.map((r) => r.p50)),
    p99: Math.max(...runs.map((r) => r.p99)),
    errors: runs.reduce((n, r) => n + r.errors, 0),
    non2xx: runs.reduce((n, r) => n + r.non2xx, 0),
    created: runs.reduce((n, r) => n + r.created, 0),
    total: runs.reduce((n, r) => n + r.total, 0),
    statusCodes,
  };
}
const helloRun = together(helloRounds);
const mixRun = together([...mixRounds]);
mixRun.created += warmUp.created;
mixRun.errors += warmUp.errors;
mixRun.non2xx += warmUp.non2xx;
for (const [code, n] of Object.entries(warmUp.statusCodes)) mixRun.statusCodes[code] = (mixRun.statusCodes[code] ?? 0) + n;
say(`  hello-world ${helloRun.rps} req/s; mix ${mixRun.rps} req/s (${Math.round((mixRun.rps / helloRun.rps) * 1000) / 10} % of hello-world), worst p99 ${mixRun.p99} ms, errors ${mixRun.errors}, non-2xx ${mixRun.non2xx}`);

const halfRate = Math.max(1, Math.floor(mixRun.rps / 2));
say(`Mix at half its saturated rate (${halfRate} req/s), 20 s …`);
const halfRun = await drive({ url: base, duration: 20, requests: mix(sessions[1]), overallRate: halfRate });
say(`  ${halfRun.rps} req/s, p50 ${halfRun.p50} ms, p99 ${halfRun.p99} ms, errors ${halfRun.errors}, non-2xx ${halfRun.non2xx}`);

// Each request of the mix alone, so a slow one can be named.
say('Each request of the mix alone, 10 connections, 3 s each …');
const perRequest: Record<string, { rps: number; p50: number; p99: number }> = {};
for (const r of mix(sessions[2]).slice(0, -1)) {
  const run = await drive({ url: base, duration: 3, requests: [r] });
  perRequest[r.path] = { rps: run.rps, p50: run.p50, p99: run.p99 };
  say(`  ${r.path}: ${run.rps} req/s, p50 ${run.p50} ms, p99 ${run.p99} ms`);
}

say('Submissions: 16 concurrent submitters (16 sessions), 10 s …');
let next = 0;
const submitRun = await drive({
  url: base,
  connections: 16,
  duration: 10,
  requests: [writeRequest(sessions[0])],
  setupClient: (client: { setRequests: (r: unknown[]) => void }) => client.setRequests([writeRequest(sessions[next++ % sessions.length])]),
});
say(`  ${submitRun.rps} results/s, p50 ${submitRun.p50} ms, p99 ${submitRun.p99} ms, errors ${submitRun.errors}, non-2xx ${submitRun.non2xx}`);

const rss = rssMb(server.pid!);
const health = (await (await fetch(`${base}/api/health`)).json()) as { searchDocuments: number };
server.kill('SIGTERM');
await new Promise((resolve) => server.once('exit', resolve));
hello.kill('SIGTERM');
const resultsAfter = await countResults();
const acknowledged = mixRun.created + halfRun.created + submitRun.created;
const stored = resultsAfter - resultsBefore;
// A write still in flight when autocannon stops is stored but never answered: stored may exceed
// acknowledged; only the reverse would be a lost write.
const lost = Math.max(0, acknowledged - stored);
const serverErrors = [mixRun, halfRun, submitRun].reduce((n, r) => n + Object.entries(r.statusCodes).filter(([c]) => Number(c) >= 500).reduce((a, [, v]) => a + v, 0), 0);
say(`Writes acknowledged ${acknowledged}, stored ${stored} (in flight at the end: ${stored - acknowledged + lost}): lost ${lost}; 5xx answers ${serverErrors}.`);
say(`Server RSS at the end: ${rss} MB; search documents ${health.searchDocuments}. Bench took ${seconds()} s.`);

console.log(
  JSON.stringify({
    results: resultsBefore,
    bootS,
    hello: { rps: helloRun.rps, p50: helloRun.p50, p99: helloRun.p99 },
    mix: { rps: mixRun.rps, p50: mixRun.p50, p99: mixRun.p99, errors: mixRun.errors, non2xx: mixRun.non2xx, ofHello: Math.round((mixRun.rps / helloRun.rps) * 1000) / 1000 },
    rounds: mixRounds.map((m, i) => ({ hello: helloRounds[i].rps, mix: m.rps, ofHello: Math.round((m.rps / helloRounds[i].rps) * 1000) / 1000 })),
    halfRate: { target: halfRate, rps: halfRun.rps, p50: halfRun.p50, p99: halfRun.p99, errors: halfRun.errors, non2xx: halfRun.non2xx },
    perRequest,
    submit16: { perS: submitRun.rps, p50: submitRun.p50, p99: submitRun.p99, errors: submitRun.errors, non2xx: submitRun.non2xx },
    writes: { acknowledged, stored, lost, serverErrors },
    rssMb: rss,
    searchDocuments: health.searchDocuments,
    seconds: seconds(),
  }),
);
process.exit(0);
