/**
 * `npm run bench`: speed and memory of the comparison and of search, through the real HTTP
 * server, on a temporary database of invented results (100 000 approved results over about 40
 * steels, 30 abrasives and 20 testers; pages beyond the demo's are generated and named as
 * invented). Beside each figure, in the same run, a yardstick: the bare SQL GROUP BY over the
 * same rows, an Express hello-world route, SQLite FTS5 over the same search documents.
 * Prints a table as it goes; the last line is one JSON object with every figure.
 *
 * Figures are measurements of this machine at this moment, never assertions.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { fork, type ChildProcess } from 'node:child_process';
import sqlite3 from 'sqlite3';
import request from 'supertest';
import { Database } from '../server/db/database';
import { loadDemoData } from '../seed/load';
import { Abrasive, Method, Result, Steel, User } from '../server/models';
import { resultRow } from '../server/commands/submit-result';
import { rebuildAllCells } from '../server/aggregates/comparison-cells';
import { clearCellCache } from '../server/aggregates/cell-cache';
import { clearLookups } from '../server/queries/compare-lookups';
import { compare } from '../server/queries/compare';
import { allSearchDocs } from '../server/search/documents';
import type { SearchDoc } from '../server/search/search-index';
import { ftsTimes as ftsTimesOf } from './fts';
import { compareQuerySchema } from '../shared/schemas/compare';
import type { ResultInput } from '../shared/schemas/result';
import { ABRASIVE_MATERIALS, BONDS, STEEL_CATEGORIES } from '../shared/vocabulary';
import { buildServer, serverNodeFlags } from '../scripts/build-server';
import { traffic, vocabulary } from './traffic';
import { mulberry32 } from '../seed/data/results';

const TOTAL_APPROVED = Number(process.env.BENCH_RESULTS ?? 100_000);
const SEARCH_DOCS = Number(process.env.BENCH_SEARCH_DOCS ?? 50_000);
const STEELS = 40;
const ABRASIVES = 30;
const TESTERS = 20;
const PENDING_FOR_APPROVAL = 20;
const PORTS = { http: 3540, oauth: 3541, smtp: 3542, s3: 3543, hello: 3544 };

const figures: Record<string, number | string> = {};
const benchStart = performance.now();
const say = (line: string) => console.log(line);
const ms = (x: number) => Math.round(x * 100) / 100;

function percentile(values: number[], p: number): number {
  const s = [...values].sort((a, b) => a - b);
  const h = (s.length - 1) * p;
  const lo = Math.floor(h);
  return s[lo] + (h - lo) * (s[Math.min(lo + 1, s.length - 1)] - s[lo]);
}

const rand = mulberry32(0xbe4c4);
const pick = <T>(list: readonly T[]) => list[Math.floor(rand() * list.length)];

// ---------------------------------------------------------------------------------------------
// Data
// ---------------------------------------------------------------------------------------------

const root = process.env.BENCH_KEEP ?? fs.mkdtempSync(path.join(os.tmpdir(), 'edgeledger-bench-'));
fs.mkdirSync(root, { recursive: true });
const dirB = path.join(root, 'full');
const dirA = path.join(root, 'search');
fs.mkdirSync(dirB, { recursive: true });
fs.mkdirSync(dirA, { recursive: true });
const fileB = path.join(dirB, 'edgeledger.sqlite');
const fileA = path.join(dirA, 'edgeledger.sqlite');

async function buildData() {
  const t = performance.now();
  const db = new Database({ storage: fileB });
  await db.migrate();
  await loadDemoData(db);

  // Pages beyond the demo's, so there are about 40 steels, 30 abrasives and 20 testers.
  await db.write(async (transaction) => {
    const categories = Object.keys(STEEL_CATEGORIES);
    for (let i = (await Steel.count({ transaction })) + 1; i <= STEELS; i++) {
      await Steel.create(
        { slug: `bench-steel-${i}`, name: `Bench steel ${i} (invented)`, category: categories[i % categories.length], designations: [{ system: 'ISO', code: `BENCH-${i}` }], composition: [], hardnessMinHrc: 56, hardnessMaxHrc: 64, body: null },
        { transaction },
      );
    }
    const materials = Object.keys(ABRASIVE_MATERIALS);
    const bonds = Object.keys(BONDS);
    for (let i = (await Abrasive.count({ transaction })) + 1; i <= ABRASIVES; i++) {
      // Sizes spread evenly in log from 0.5 to 200 µm.
      const um = Math.round(0.5 * 400 ** ((i % 17) / 16) * 10) / 10;
      await Abrasive.create(
        {
          slug: `bench-abrasive-${i}`, name: `Bench abrasive ${i} (invented)`, material: materials[i % materials.length], bond: bonds[i % bonds.length], form: 'wheel',
          gritStandard: 'um', gritGrade: `${um} µm`, gritUm: um, gritRange: null, wheelDiameterMm: 200, widthMm: 40, wears: false, coolant: 'water', sideUsable: false, body: null,
        },
        { transaction },
      );
    }
    const existing = await User.count({ where: { role: ['member', 'publisher', 'moderator'] }, transaction });
    for (let i = existing + 1; i <= TESTERS; i++) {
      await User.create(
        { handle: `bench-tester-${i}`, displayName: `Bench tester ${i}`, email: null, role: i % 3 === 0 ? 'publisher' : 'member', oauthSubject: `bench-tester-${i}`, bio: 'Invented account for the benchmark.' },
        { transaction },
      );
    }
  });

  const steels = await Steel.findAll();
  const abrasives = await Abrasive.findAll();
  const methods = await Method.findAll();
  const v1 = methods.find((m) => m.slug === 'push-cut-test-v1')!;
  const v2 = methods.find((m) => m.slug === 'push-cut-test-v2')!;
  const retention = methods.find((m) => m.slug === 'card-cut-retention-v1')!;
  const testers = await User.findAll({ where: { role: ['member', 'publisher', 'moderator'] } });
  const benchTesters = testers.filter((u) => u.handle.startsWith('bench-tester-'));
  const already = await Result.count({ where: { status: 'approved' } });
  const toMake = TOTAL_APPROVED - already;
  const now = Date.now();

  const row = (status: 'approved' | 'pending', authorPool: User[]) => {
    const steel = pick(steels);
    const abrasive = pick(abrasives);
    const method = rand() < 0.85 ? v2 : v1;
    const lo = steel.hardnessMinHrc ?? 56;
    const hi = steel.hardnessMaxHrc ?? 64;
    const hrc = Math.round((lo + rand() * (hi - lo)) * 2) / 2;
    const base = 85 + 100 * Math.log10(abrasive.gritUm);
    const readingsG = Array.from({ length: method.readingsPerEdge }, () => Math.max(40, Math.round(base * (0.85 + 0.3 * rand()))));
    const input: ResultInput = {
      steel: steel.slug,
      hardness: { value: hrc, scale: 'HRC' },
      abrasive: abrasive.slug,
      edgeAngle: { perSideDeg: Math.round((12 + rand() * 10) * 2) / 2 },
      sharpness: { method: method.slug, readingsG },
      ...(rand() < 0.3 ? { retention: { method: retention.slug, cuts: Math.round(100 + rand() * 400) } } : {}),
    };
    const author = pick(authorPool);
    const r = resultRow(author.id, status, input, { steel, abrasive, sharpnessMethod: method, retentionMethod: input.retention ? retention : null, stepAbrasives: new Map() });
    const createdAt = new Date(now - Math.floor(rand() * 730) * 86_400_000);
    return { ...r, approvedAt: status === 'approved' ? createdAt : null, createdAt, updatedAt: createdAt };
  };

  const chunk = 2000;
  for (let made = 0; made < toMake; made += chunk) {
    const rows = Array.from({ length: Math.min(chunk, toMake - made) }, () => row('approved', testers));
    // hooks: false records no change per batch (the feed would refresh every touched cell in
    // each): the cells are rebuilt once below, and the server builds its index at start.
    await db.write((transaction) => Result.bulkCreate(rows, { transaction, validate: false, hooks: false }));
  }
  // Pending results by bench testers, for a moderator (a demo account) to approve.
  const pending = Array.from({ length: PENDING_FOR_APPROVAL }, () => row('pending', benchTesters));
  await db.write((transaction) => Result.bulkCreate(pending, { transaction, validate: false, hooks: false }));
  figures.dataBuildMs = Math.round(performance.now() - t);

  const r = performance.now();
  const cells = await rebuildAllCells(db);
  figures.reaggregateMs = Math.round(performance.now() - r);
  figures.cells = cells;
  figures.approvedResults = await Result.count({ where: { status: 'approved' } });
  figures.steels = steels.length;
  figures.abrasives = abrasives.length;
  figures.testers = testers.length;
  say(`data: ${figures.approvedResults} approved results, ${steels.length} steels, ${abrasives.length} abrasives, ${testers.length} testers, ${cells} cells (both band steps); built in ${figures.dataBuildMs} ms, reaggregate ${figures.reaggregateMs} ms`);

  // The uncached comparison, in-process (what a request costs right after a change).
  const query = compareQuerySchema.parse({});
  const cold: number[] = [];
  for (let i = 0; i < 15; i++) {
    clearCellCache();
    clearLookups();
    const s = performance.now();
    await compare(query);
    cold.push(performance.now() - s);
  }
  figures.compareColdP50Ms = ms(percentile(cold, 0.5));
  figures.compareColdP95Ms = ms(percentile(cold, 0.95));
  const live: number[] = [];
  const liveQuery = compareQuerySchema.parse({ hrcMin: '58', hrcMax: '62' });
  for (let i = 0; i < 5; i++) {
    const s = performance.now();
    await compare(liveQuery);
    live.push(performance.now() - s);
  }
  figures.compareLiveInProcessP50Ms = ms(percentile(live, 0.5));
  say(`compare in-process: uncached (cells re-read) p50 ${figures.compareColdP50Ms} ms, p95 ${figures.compareColdP95Ms} ms; live path (hardness filter over ~85k rows) p50 ${figures.compareLiveInProcessP50Ms} ms`);
  await db.sequelize.query('PRAGMA wal_checkpoint(TRUNCATE)');
  await db.close();
}

/** The bare SQL yardsticks over the same rows, with sqlite3 directly (no ORM). */
async function sqlYardsticks() {
  const raw = new sqlite3.Database(fileB, sqlite3.OPEN_READONLY);
  const all = (sql: string) => new Promise<unknown[]>((resolve, reject) => raw.all(sql, (err, rows) => (err ? reject(err) : resolve(rows))));
  const time = async (sql: string, runs: number) => {
    const out: number[] = [];
    for (let i = 0; i < runs; i++) {
      const s = performance.now();
      await all(sql);
      out.push(performance.now() - s);
    }
    return percentile(out, 0.5);
  };
  const groupBy =
    "SELECT sharpnessMethodId, steelId, material, gritPhi, COUNT(*) AS n, COUNT(DISTINCT authorId) AS testers, AVG(sharpnessMedianG) AS mean, MIN(hrc), MAX(hrc), MIN(perSideDeg), MAX(perSideDeg) FROM results WHERE status = 'approved' GROUP BY sharpnessMethodId, steelId, material, gritPhi";
  figures.sqlGroupByMs = ms(await time(groupBy, 5));
  const windowMedian = `WITH r AS (SELECT sharpnessMethodId m, steelId s, material t, gritPhi p, sharpnessMedianG g,
      ROW_NUMBER() OVER (PARTITION BY sharpnessMethodId, steelId, material, gritPhi ORDER BY sharpnessMedianG) rn,
      COUNT(*) OVER (PARTITION BY sharpnessMethodId, steelId, material, gritPhi) c
    FROM results WHERE status = 'approved')
    SELECT m, s, t, p, AVG(g) AS median FROM r WHERE rn IN ((c + 1) / 2, (c + 2) / 2) GROUP BY m, s, t, p`;
  figures.sqlWindowMedianMs = ms(await time(windowMedian, 3));
  figures.sqlCellsReadMs = ms(await time("SELECT * FROM comparison_cells WHERE bandWidth = 2 AND methodId = (SELECT id FROM methods WHERE slug = 'push-cut-test-v2')", 10));
  raw.close();
  say(`bare SQL over the same rows: GROUP BY (count, mean, ranges) ${figures.sqlGroupByMs} ms; window-function medians ${figures.sqlWindowMedianMs} ms; read one method's precomputed cells ${figures.sqlCellsReadMs} ms`);
}

// ---------------------------------------------------------------------------------------------
// The server process
// ---------------------------------------------------------------------------------------------

interface Ready {
  url: string;
  helloUrl: string;
  bootMs: number;
  indexMs: number;
  searchDocuments: number;
}

async function startServer(dataDir: string): Promise<{ child: ChildProcess; ready: Ready; ask: <T>(type: string) => Promise<T> }> {
  // Bundled and run in plain Node, as `npm start` runs the server.
  const child = fork(await buildServer('bench/compare-server.ts', 'dist-server/bench-server.mjs'), [], {
    execArgv: [...serverNodeFlags(), '--expose-gc'],
    env: {
      ...process.env,
      BENCH_DATA_DIR: dataDir,
      BENCH_PORT: String(PORTS.http),
      BENCH_OAUTH_PORT: String(PORTS.oauth),
      BENCH_SMTP_PORT: String(PORTS.smtp),
      BENCH_S3_PORT: String(PORTS.s3),
      BENCH_HELLO_PORT: String(PORTS.hello),
    },
    stdio: ['ignore', 'inherit', 'inherit', 'ipc'],
  });
  const ask = <T>(type: string) =>
    new Promise<T>((resolve) => {
      const on = (m: { type: string }) => {
        if (m.type === type || (type === 'stop' && m.type === 'stopped')) {
          child.off('message', on);
          resolve(m as T);
        }
      };
      child.on('message', on);
      child.send({ type });
    });
  return new Promise((resolve, reject) => {
    child.once('error', reject);
    child.once('exit', (code) => reject(new Error(`bench server exited with ${code}`)));
    child.on('message', function onReady(m: { type: string } & Ready) {
      if (m.type !== 'ready') return;
      child.off('message', onReady);
      child.removeAllListeners('exit');
      resolve({ child, ready: m, ask });
    });
  });
}

type Autocannon = (opts: Record<string, unknown>) => Promise<{ requests: { average: number }; latency: { p50: number; p99: number }; non2xx: number; errors: number }>;

/** 10 connections for 5 s on `url`, or on paths from `next()` there, each request its own. */
async function load(url: string, next?: () => string): Promise<{ reqPerSec: number; p50: number; p99: number }> {
  const autocannon = (await import('autocannon')).default as unknown as Autocannon;
  const r = await autocannon({ url, connections: 10, duration: 5, ...(next ? { requests: [{ setupRequest: (req: { path: string }) => Object.assign(req, { path: next() }) }] } : {}) });
  if (r.non2xx || r.errors) throw new Error(`${url}: ${r.non2xx} non-2xx, ${r.errors} errors under load`);
  return { reqPerSec: Math.round(r.requests.average), p50: r.latency.p50, p99: r.latency.p99 };
}

/** Signs a demo account in through the real OAuth2 round trip; returns an agent and the CSRF token. */
async function signIn(url: string, handle: string) {
  const agent = request.agent(url);
  const start = await agent.get(`/auth/signin?as=${encodeURIComponent(handle)}`).expect(302);
  const authorize = await fetch(start.headers.location, { redirect: 'manual' });
  const callback = new URL(authorize.headers.get('location')!);
  await agent.get(`${callback.pathname}${callback.search}`).expect(302);
  const session = await agent.get('/api/session').expect(200);
  return { agent, csrf: session.body.csrfToken as string };
}

// ---------------------------------------------------------------------------------------------
// Search at about 50 000 documents
// ---------------------------------------------------------------------------------------------

/** Unique search queries asked, each once: built from the data's own words, some misspelt or cut short (bench/traffic.ts). */
const SEARCH_QUERY_COUNT = Number(process.env.BENCH_SEARCH_QUERIES ?? 200);
/** Other queries, asked before the measured ones to warm the process up (see searchPhase). */
const SEARCH_WARM_UP = 20;

async function searchPhase() {
  // A copy of the full database with only as many results left approved as make ~50 000 documents.
  fs.copyFileSync(fileB, fileA);
  const db = new Database({ storage: fileA });
  await db.migrate();
  const pages = (await Steel.count()) + (await Abrasive.count()) + (await Method.count());
  const wholeCells = Number(((await db.sequelize.query('SELECT COUNT(*) AS c FROM comparison_cells WHERE bandWidth = 2', { plain: true })) as { c: number }).c);
  const keep = SEARCH_DOCS - pages - wholeCells;
  await db.write(async (transaction) => {
    const cutoff = (await db.sequelize.query(`SELECT id FROM results WHERE status = 'approved' ORDER BY id LIMIT 1 OFFSET ${keep}`, { plain: true, transaction })) as { id: number } | null;
    if (cutoff) await db.sequelize.query(`UPDATE results SET status = 'pending' WHERE status = 'approved' AND id >= ${cutoff.id}`, { transaction });
  });
  await rebuildAllCells(db);

  // FTS5 over the very same documents and queries, as a yardstick.
  const docs: SearchDoc[] = [];
  const ft = performance.now();
  for await (const d of allSearchDocs()) docs.push(d);
  figures.searchDocsReadMs = Math.round(performance.now() - ft);
  await db.sequelize.query('PRAGMA wal_checkpoint(TRUNCATE)');
  await db.close();

  const { ready, ask } = await startServer(dirA);
  // The queries, from the words of the pages the server holds; each asked once below.
  const words = traffic(await vocabulary(ready.url), []);
  const queryOf = () => new URL(words.search().path, ready.url).searchParams.get('q')!;
  const warmUp = Array.from({ length: SEARCH_WARM_UP }, queryOf);
  const queries = Array.from({ length: SEARCH_QUERY_COUNT }, queryOf);
  const ftsTimes = await ftsTimesOf(docs, queries);
  figures.ftsP50Ms = ms(percentile(ftsTimes, 0.5));
  figures.ftsP95Ms = ms(percentile(ftsTimes, 0.95));

  figures.searchDocuments = ready.searchDocuments;
  figures.indexReadyMs = Math.round(ready.indexMs);
  figures.searchBootMs = Math.round(ready.bootMs);
  // The very first requests of a fresh process also compile Express's, zod's and the search's
  // code (measured: 15–40 ms each, one blocking the loop for 40–56 ms); the figures below are of
  // a warmed process, after other queries, as a server that has been up a minute would be.
  const coldStart: number[] = [];
  for (const q of warmUp) {
    const s = performance.now();
    await (await fetch(`${ready.url}/api/search?q=${encodeURIComponent(q)}`)).text();
    coldStart.push(performance.now() - s);
  }
  figures.searchFirstRequestMs = ms(coldStart[0]);
  await ask('reset-loop');
  // Each query asked once, one at a time: no answer is ever kept for a later asking.
  const times: number[] = [];
  const hitsOf: Record<string, number> = {};
  const slowest: Record<string, number> = {};
  for (const q of queries) {
    const s = performance.now();
    const res = await fetch(`${ready.url}/api/search?q=${encodeURIComponent(q)}`);
    const body = (await res.json()) as { facets: Record<string, number> };
    times.push(performance.now() - s);
    slowest[q] = performance.now() - s;
    if (!res.ok) throw new Error(`search ${q}: ${res.status}`);
    hitsOf[q] = Object.values(body.facets).reduce((a, b) => a + b, 0);
  }
  const loop = await ask<{ loopMaxMs: number; rssMb: number }>('stats');
  figures.searchP50Ms = ms(percentile(times, 0.5));
  figures.searchP95Ms = ms(percentile(times, 0.95));
  figures.searchMaxMs = ms(Math.max(...times));
  figures.searchLoopMaxMs = ms(loop.loopMaxMs);
  figures.searchRssMb = Math.round(loop.rssMb);
  const heaviest = Object.entries(hitsOf).sort((a, b) => b[1] - a[1])[0];
  say(
    `search at ${ready.searchDocuments} documents (HTTP, ${times.length} unique queries, one at a time): p50 ${figures.searchP50Ms} ms, p95 ${figures.searchP95Ms} ms, max ${figures.searchMaxMs} ms; ` +
      `first request after start ${figures.searchFirstRequestMs} ms; ` +
      `event loop max delay ${figures.searchLoopMaxMs} ms; index ready ${figures.indexReadyMs} ms (boot ${figures.searchBootMs} ms); ` +
      `FTS5 same docs and queries p50 ${figures.ftsP50Ms} ms, p95 ${figures.ftsP95Ms} ms; most hits: "${heaviest[0]}" ${heaviest[1]}; slowest: ` +
      Object.entries(slowest).sort((x, y) => y[1] - x[1]).slice(0, 4).map(([q, t]) => `"${q}" ${ms(t)} ms`).join(', '),
  );
  await ask('stop');
}

// ---------------------------------------------------------------------------------------------
// The comparison at 100 000 results
// ---------------------------------------------------------------------------------------------

async function comparePhase() {
  const { ready, ask } = await startServer(dirB);
  const atBoot = await ask<{ rssMb: number; rssAfterGcMb: number; heapAfterGcMb: number }>('stats');
  figures.rssAtBootAfterGcMb = Math.round(atBoot.rssAfterGcMb);
  figures.heapAtBootAfterGcMb = Math.round(atBoot.heapAfterGcMb);
  figures.compareBootMs = Math.round(ready.bootMs);
  figures.fullIndexReadyMs = Math.round(ready.indexMs);
  figures.fullSearchDocuments = ready.searchDocuments;
  const base = `${ready.url}/api/compare`;
  const first = (await (await fetch(base)).json()) as { total: number; method: { slug: string }; rows: { steel: string; material: string; cell: string }[] };
  figures.compareCellsInDefaultView = first.total;

  await ask('reset-loop');
  // Views as people ask them, every one different (bench/traffic.ts), one at a time.
  const t = traffic(await vocabulary(ready.url), []);
  const kinds: [string, () => { path: string }, number][] = [
    ['compareVaried', () => t.compare(), 150],
    ['compareLive', () => t.compareLive(), 80],
    ['homeList', () => t.list(), 80],
  ];
  for (const [name, next, runs] of kinds) {
    const out: number[] = [];
    for (let i = 0; i < runs; i++) {
      const url = `${ready.url}${next().path}`;
      const s = performance.now();
      const res = await fetch(url);
      await res.arrayBuffer();
      out.push(performance.now() - s);
      if (!res.ok) throw new Error(`${url}: ${res.status}`);
    }
    figures[`${name}P50Ms`] = ms(percentile(out, 0.5));
    figures[`${name}P95Ms`] = ms(percentile(out, 0.95));
    say(`${name.padEnd(16)} ${runs} different requests: p50 ${figures[`${name}P50Ms`]} ms, p95 ${figures[`${name}P95Ms`]} ms, max ${ms(Math.max(...out))} ms`);
  }
  const sequentialLoop = await ask<{ loopMaxMs: number }>('stats');
  figures.compareLoopMaxMs = ms(sequentialLoop.loopMaxMs);

  const loaded = await load(ready.url, () => t.compare().path);
  figures.compareReqPerSec = loaded.reqPerSec;
  figures.compareLoadP99Ms = loaded.p99;
  const loadedFiltered = await load(ready.url, () => t.compareLive().path);
  figures.compareLiveReqPerSec = loadedFiltered.reqPerSec;
  const hello = await load(`${ready.helloUrl}/hello`);
  figures.helloReqPerSec = hello.reqPerSec;
  // The app's own middleware (session, passport, helmet, limits, CSRF) around a trivial handler.
  const health = await load(`${ready.url}/api/health`);
  figures.healthReqPerSec = health.reqPerSec;
  say(`10 connections, 5 s each, every request different: compare ${loaded.reqPerSec} req/s (p99 ${loaded.p99} ms), with live filters ${loadedFiltered.reqPerSec} req/s (p99 ${loadedFiltered.p99} ms), Express hello-world ${hello.reqPerSec} req/s, the app's /api/health ${health.reqPerSec} req/s`);

  // Approval to visible: a moderator approves a pending result; time until the table shows it.
  const v2Pending = await (async () => {
    const raw = new sqlite3.Database(fileB, sqlite3.OPEN_READONLY);
    const rows = await new Promise<{ id: number; slug: string; designations: string; material: string; gritPhi: number; method: string }[]>((resolve, reject) =>
      raw.all(
        "SELECT r.id, s.slug, s.designations, r.material, r.gritPhi, m.slug AS method FROM results r JOIN steels s ON s.id = r.steelId JOIN methods m ON m.id = r.sharpnessMethodId WHERE r.status = 'pending' AND r.authorId IN (SELECT id FROM users WHERE handle LIKE 'bench-tester-%')",
        (err, r) => (err ? reject(err) : resolve(r as never)),
      ),
    );
    raw.close();
    return rows;
  })();
  const mod = await signIn(ready.url, 'grey-hone');
  const visible: number[] = [];
  const posts: number[] = [];
  const searchVisible: number[] = [];
  for (const p of v2Pending) {
    const cellUrl = `${base}?method=${p.method}&steel=${p.slug}&material=${p.material}&pageSize=5000`;
    const cellRef = `${p.slug}:${p.material}:${p.gritPhi}`;
    const nOf = async () => ((await (await fetch(cellUrl)).json()) as { rows: { cell: string; n: number }[] }).rows.find((r) => r.cell === cellRef)?.n ?? 0;
    const before = await nOf();
    const s = performance.now();
    await mod.agent.post(`/api/results/${p.id}/review`).set('X-CSRF-Token', mod.csrf).send({ decision: 'approve' }).expect(200);
    posts.push(performance.now() - s);
    while ((await nOf()) !== before + 1) {
      if (performance.now() - s > 5000) throw new Error(`result ${p.id} not visible after 5 s`);
    }
    visible.push(performance.now() - s);
    // The steel's last designation code and the material: what a person would type, and selective.
    const codes = (JSON.parse(p.designations) as { code: string }[]).map((d) => d.code);
    const q = `${ready.url}/api/search?type=cell&q=${encodeURIComponent(`${codes[codes.length - 1] ?? p.slug} ${p.material}`)}`;
    while (true) {
      const hits = ((await (await fetch(q)).json()) as { hits: { cell?: { ref: string; method: string; n: number } }[] }).hits;
      const h = hits.find((x) => x.cell?.ref === cellRef && x.cell.method === p.method);
      if (h && h.cell!.n === before + 1) break;
      if (performance.now() - s > 5000) break;
    }
    searchVisible.push(performance.now() - s);
  }
  figures.approvalVisibleMs = ms(percentile(visible, 0.5));
  figures.approvalVisibleMaxMs = ms(Math.max(...visible));
  figures.approvalSearchVisibleMs = ms(percentile(searchVisible, 0.5));
  figures.approvalPostMs = ms(percentile(posts, 0.5));
  say(`approval to visible in the comparison (HTTP approve + read, ${visible.length} approvals): p50 ${figures.approvalVisibleMs} ms, max ${figures.approvalVisibleMaxMs} ms (the approving POST alone p50 ${figures.approvalPostMs} ms); in the cell's search hit p50 ${figures.approvalSearchVisibleMs} ms`);

  const stats = await ask<{ rssMb: number; heapMb: number; rssAfterGcMb: number; heapAfterGcMb: number; loopMaxMs: number; loopP99Ms: number }>('stats');
  figures.rssMb = Math.round(stats.rssMb);
  figures.heapMb = Math.round(stats.heapMb);
  figures.rssAfterGcMb = Math.round(stats.rssAfterGcMb);
  figures.heapAfterGcMb = Math.round(stats.heapAfterGcMb);
  figures.loopMaxMs = ms(stats.loopMaxMs);
  say(`server RSS ${figures.rssMb} MB (heap ${figures.heapMb} MB; after a full GC RSS ${figures.rssAfterGcMb} MB, heap ${figures.heapAfterGcMb} MB) with ${figures.approvedResults} results and ${ready.searchDocuments} search documents; event loop max delay over the comparison runs ${figures.loopMaxMs} ms; index ready at boot ${figures.fullIndexReadyMs} ms`);
  await ask('stop');
}

// BENCH_KEEP=<dir>: keep (or reuse) the generated databases there, for looking into a figure.
const phases = (process.env.BENCH_PHASES ?? 'data,sql,search,compare').split(',');
try {
  if (phases.includes('data')) await buildData();
  if (phases.includes('sql')) await sqlYardsticks();
  if (phases.includes('search')) await searchPhase();
  if (phases.includes('compare')) await comparePhase();
  figures.compareP95OverSqlGroupBy = ms((figures.compareVariedP95Ms as number) / (figures.sqlGroupByMs as number));
  figures.compareReqPerSecOverHello = ms((figures.compareReqPerSec as number) / (figures.helloReqPerSec as number));
  figures.searchP95OverFts = ms((figures.searchP95Ms as number) / (figures.ftsP95Ms as number));
  figures.benchSeconds = Math.round((performance.now() - benchStart) / 1000);
  figures.cpus = os.cpus().length;
} finally {
  if (!process.env.BENCH_KEEP) fs.rmSync(root, { recursive: true, force: true });
}
console.log(JSON.stringify(figures));
