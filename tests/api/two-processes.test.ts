import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it, inject } from 'vitest';
import request from 'supertest';
import { copyBaseDatabase, demoHandle, onCluster, signIn, testRateLimits } from '../setup/test-server';
import { eventually, signingInThrough, startServerProcess, type ServerProcess } from '../setup/server-process';
import { Database } from '../../server/db/database';
import { Steel } from '../../server/models';

/**
 * With TEST_DATABASE=postgres: two server processes (A and B) on one PostgreSQL database, as two
 * app processes behind a load balancer would be. Each has its own memory (kept answers, read
 * models, search index); B hears of A's writes only through the `changes` table, which every
 * process polls. Sessions, sign-in state and rate-limit counts are in the database. B signs in
 * through A's local OAuth2 stand-in, as both would through one hosted provider.
 */
const clusterUrl = inject('postgresUrl');

/** Uploads allowed per client per minute on both processes: the limit test counts them across A and B. */
const UPLOADS_PER_MIN = 4;
/** A word only this file's result notes hold, so the search can be asked for them. */
const MARK = 'twoprocmark';

const result = (grams: number, note?: string) => ({
  steel: 'aisi-d2',
  hardness: { value: 61, scale: 'HRC' },
  abrasive: 'cbn-electroplated-wheel-250-b126',
  edgeAngle: { perSideDeg: 15 },
  sharpness: { method: 'push-cut-test-v2', readingsG: [grams, grams + 5, grams + 10] },
  ...(note ? { notes: { type: 'doc', content: [{ type: 'paragraph', content: [{ type: 'text', text: note }] }] } } : {}),
});

type Session = Awaited<ReturnType<typeof signIn>>;
/** The session's cookies as one header, to send the same browser's requests to the other process. */
const cookiesOf = (s: Session) =>
  s.agent.jar
    .getCookies({ domain: '127.0.0.1', path: '/', secure: false, script: false })
    .map((c) => c.toValueString())
    .join('; ');
const post = (url: string, s: Session, body: object) => request(url).post('/api/results').set('Cookie', cookiesOf(s)).set('X-CSRF-Token', s.csrf).send(body);
const review = (url: string, s: Session, id: number) => request(url).post(`/api/results/${id}/review`).set('Cookie', cookiesOf(s)).set('X-CSRF-Token', s.csrf).send({ decision: 'approve' });

describe.runIf(clusterUrl)('two server processes on one PostgreSQL database', () => {
  const dirs: string[] = [];
  let database: Awaited<ReturnType<typeof copyBaseDatabase>>;
  let a: ServerProcess;
  let b: ServerProcess;

  beforeAll(async () => {
    const dataDir = () => {
      const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'edgeledger-two-'));
      dirs.push(dir);
      return dir;
    };
    const first = dataDir();
    database = await copyBaseDatabase(first);
    const env = { LOG_LEVEL: 'error', ...testRateLimits, RATE_LIMIT_UPLOADS_PER_MIN: String(UPLOADS_PER_MIN), ...database.env };
    a = await startServerProcess({ ...env, DATA_DIR: first });
    b = await startServerProcess({ ...env, DATA_DIR: dataDir(), ...signingInThrough(a) });
  }, 200_000);
  afterAll(async () => {
    await b?.stop();
    await a?.stop();
    await database?.drop();
    for (const dir of dirs) fs.rmSync(dir, { recursive: true, force: true });
  });

  it('shows an approval made on A in B’s comparison, search and steel page', async () => {
    const member = await signIn(a.url, await demoHandle(a.url, 'member'));
    const mod = await signIn(a.url, await demoHandle(a.url, 'moderator'));
    // B's kept answers and read models, read (so kept) before the approval.
    const compared = async () => (await request(b.url).get('/api/compare?method=push-cut-test-v2').expect(200)).body.totalResults as number;
    const steelCount = async () => (await request(b.url).get('/api/steels/aisi-d2').expect(200)).body.resultCount as number;
    const found = async () => (await request(b.url).get(`/api/search?q=${MARK}&type=result`).expect(200)).body.facets.result as number;
    const [total, count] = [await compared(), await steelCount()];
    expect(await found()).toBe(0);

    const id = (await post(a.url, member, result(150, `${MARK} approved on A`)).expect(201)).body.id as number;
    await review(a.url, mod, id).expect(200);

    await eventually('B’s comparison counts the approval', async () => (await compared()) === total + 1);
    await eventually('B’s steel page counts the approval', async () => (await steelCount()) === count + 1);
    await eventually('B’s search finds the approved result', async () => (await found()) === 1);
  });

  it('ends a session on B at once when it signs out on A, and a banned account’s on B at once', async () => {
    const member = await signIn(a.url, await demoHandle(a.url, 'member'));
    expect((await request(b.url).get('/api/session').set('Cookie', cookiesOf(member)).expect(200)).body.user).toMatchObject({ handle: member.user.handle });
    await post(b.url, member, result(160)).expect(201);
    await member.agent.post('/auth/signout').set('X-CSRF-Token', member.csrf).expect(204);
    expect((await request(b.url).get('/api/session').set('Cookie', cookiesOf(member)).expect(200)).body.user).toBeNull();
    await post(b.url, member, result(160)).expect(401);

    const admin = await signIn(a.url, await demoHandle(a.url, 'admin'));
    const other = await signIn(a.url, await demoHandle(a.url, 'member', 1));
    // B has read (and, on SQLite, would keep) the account before the ban.
    await post(b.url, other, result(165)).expect(201);
    await admin.agent.patch(`/api/admin/users/${other.user.handle}`).set('X-CSRF-Token', admin.csrf).send({ banned: true, reason: 'Two-process test.' }).expect(200);
    await post(b.url, other, result(165)).expect(401);
    expect((await request(b.url).get('/api/session').set('Cookie', cookiesOf(other)).expect(200)).body.user).toBeNull();
  });

  it('finishes on B a sign-in begun on A', async () => {
    const handle = await demoHandle(a.url, 'member', 2);
    const start = await request(a.url).get(`/auth/signin?as=${handle}`).expect(302);
    const signinCookie = (start.headers['set-cookie'] as unknown as string[]).map((c) => c.split(';')[0]).join('; ');
    const authorize = await fetch(start.headers.location, { redirect: 'manual' });
    const callback = new URL(authorize.headers.get('location')!);
    const onB = request.agent(b.url);
    const done = await onB.get(`${callback.pathname}${callback.search}`).set('Cookie', signinCookie).expect(302);
    expect(done.headers.location).toBe('/');
    expect((await onB.get('/api/session').expect(200)).body.user).toMatchObject({ handle });
  });

  it('counts a rate limit across both processes', async () => {
    const upload = (url: string) => request(url).post('/api/photos').attach('file', Buffer.from('not a photo'), 'note.txt');
    for (let i = 0; i < UPLOADS_PER_MIN; i += 1) expect((await upload(i % 2 ? b.url : a.url)).status).not.toBe(429);
    expect((await upload(a.url)).status).toBe(429);
    expect((await upload(b.url)).status).toBe(429);
  });

  it('of two approvals of one result at the same moment through A and B, exactly one wins (20 tries), and both comparisons agree', async () => {
    const member = await signIn(a.url, await demoHandle(a.url, 'member'));
    const [mod1, mod2] = [await signIn(a.url, await demoHandle(a.url, 'moderator')), await signIn(b.url, await demoHandle(b.url, 'moderator', 1))];
    const compared = async (url: string) => (await request(url).get('/api/compare?method=push-cut-test-v2').expect(200)).body.totalResults as number;
    const before = await compared(a.url);
    const ids: number[] = [];
    for (let i = 0; i < 20; i += 1) ids.push((await post(a.url, member, result(170 + i)).expect(201)).body.id as number);
    const outcomes = await Promise.all(ids.map((id) => Promise.all([review(a.url, mod1, id), review(b.url, mod2, id)])));
    if (outcomes.flat().some((r) => r.status >= 500)) console.error(a.output().slice(-4000), b.output().slice(-4000));
    for (const [i, pair] of outcomes.entries()) expect(pair.map((r) => r.status).sort(), `result ${ids[i]}`).toEqual([200, 409]);
    for (const id of ids) {
      const trail = (await request(b.url).get(`/api/results/${id}`).set('Cookie', cookiesOf(mod2)).expect(200)).body.trail as { to: string }[];
      expect(trail.filter((e) => e.to === 'approved'), `approvals of ${id}`).toHaveLength(1);
    }
    await eventually('A’s comparison counts the 20 approvals', async () => (await compared(a.url)) === before + 20);
    await eventually('B’s comparison counts the 20 approvals', async () => (await compared(b.url)) === before + 20);
    const cellsOf = async (url: string) => (await request(url).get('/api/compare?method=push-cut-test-v2&pageSize=5000').expect(200)).body.rows as unknown[];
    expect(await cellsOf(b.url)).toEqual(await cellsOf(a.url));
  }, 120_000);
});

/**
 * On either dialect: a server process follows writes another process made (here the test, as a
 * command-line tool would: `npm run reaggregate`, a restore, another app process on PostgreSQL),
 * which reach it only through the `changes` table.
 */
describe('a server process follows writes made by another process', () => {
  let dataDir: string;
  let database: Awaited<ReturnType<typeof copyBaseDatabase>>;
  let server: ServerProcess;
  let db: Database;

  beforeAll(async () => {
    dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'edgeledger-follow-'));
    database = await copyBaseDatabase(dataDir);
    server = await startServerProcess({ ...testRateLimits, ...database.env, DATA_DIR: dataDir });
    db = new Database({ storage: path.join(dataDir, 'edgeledger.sqlite'), url: database.env.DATABASE_URL });
  }, 120_000);
  afterAll(async () => {
    await db?.close();
    await server?.stop();
    await database?.drop();
    fs.rmSync(dataDir, { recursive: true, force: true });
  });

  it('shows a steel renamed by another process on its kept page and in its search', async () => {
    const page = async () => (await request(server.url).get('/api/steels/aisi-o1').expect(200)).body.name as string;
    const found = async (q: string) => ((await request(server.url).get(`/api/search?q=${q}&type=steel`).expect(200)).body.hits as { slug: string }[]).some((h) => h.slug === 'aisi-o1');
    const name = await page();
    expect(await page()).toBe(name); // kept now
    expect(await found('Followteststeel')).toBe(false);
    await db.write(async (transaction) => {
      const steel = await Steel.findOne({ where: { slug: 'aisi-o1' }, transaction });
      await steel!.update({ name: 'Followteststeel O1' }, { transaction });
    });
    await eventually('the server’s page shows the new name', async () => (await page()) === 'Followteststeel O1');
    await eventually('the server’s search finds the new name', () => found('Followteststeel'));
  });
});

/**
 * With TEST_DATABASE=postgres: a process that was away catches up when it starts again, from the
 * tables alone (no write after its start tells it anything), and a process started after a change
 * counts it once: it starts following at the newest change there is, and what came before is
 * already in what it built from the tables.
 */
describe.runIf(clusterUrl)('a process that starts after changes made through another', () => {
  const dirs: string[] = [];
  let database: Awaited<ReturnType<typeof copyBaseDatabase>>;
  let env: Record<string, string>;
  let a: ServerProcess;
  const late: ServerProcess[] = [];
  const RESTART_MARK = 'restartmark';

  /** Starts a process on the same database that signs in through A's stand-in, as B does above. */
  const startAnother = async () => {
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'edgeledger-late-'));
    dirs.push(dir);
    const started = await startServerProcess({ ...env, DATA_DIR: dir, ...signingInThrough(a) });
    late.push(started);
    return started;
  };
  const totalOf = async (url: string, query = '') => (await request(url).get(`/api/compare?method=push-cut-test-v2${query}`).expect(200)).body.totalResults as number;
  const foundOn = async (url: string, q: string, type: string) => (await request(url).get(`/api/search?q=${q}&type=${type}`).expect(200)).body.facets[type] as number;
  const steelOn = async (url: string, slug: string) => (await request(url).get(`/api/steels/${slug}`).expect(200)).body as { name: string; resultCount: number };
  /** A live filter (hardness) answers from the process's in-memory read model of approved results, not the precomputed cells. */
  const LIVE = '&hrcMin=55&hrcMax=65';

  beforeAll(async () => {
    const first = fs.mkdtempSync(path.join(os.tmpdir(), 'edgeledger-restart-'));
    dirs.push(first);
    database = await copyBaseDatabase(first);
    env = { LOG_LEVEL: 'error', ...testRateLimits, ...database.env };
    a = await startServerProcess({ ...env, DATA_DIR: first });
  }, 200_000);
  afterAll(async () => {
    for (const p of late) await p.stop();
    await a?.stop();
    await database?.drop();
    for (const dir of dirs) fs.rmSync(dir, { recursive: true, force: true });
  });

  /** A moderator's edit of a steel page's name through `url` (a moderator's edit is published at once). */
  async function rename(url: string, mod: Session, slug: string, name: string) {
    const page = (await request(url).get(`/api/steels/${slug}`).expect(200)).body as Record<string, unknown>;
    const keys = ['category', 'designations', 'composition', 'hardnessHrc', 'citations', 'sources'];
    const body = { ...Object.fromEntries(keys.map((k) => [k, page[k]])), body: page.body, baseRevision: page.revision, summary: 'Renamed while B was away.', name };
    await request(url).put(`/api/steels/${slug}`).set('Cookie', cookiesOf(mod)).set('X-CSRF-Token', mod.csrf).send(body).expect(200);
  }

  it('serves, right after it starts again, what A approved and renamed while it was stopped', async () => {
    let b = await startAnother();
    const member = await signIn(a.url, await demoHandle(a.url, 'member'));
    const mod = await signIn(a.url, await demoHandle(a.url, 'moderator'));
    // B reads (and keeps) all of it before it stops.
    const before = { total: await totalOf(b.url), live: await totalOf(b.url, LIVE), steel: await steelOn(b.url, 'aisi-d2'), renamed: await steelOn(b.url, 'aisi-1095') };
    expect(await foundOn(b.url, RESTART_MARK, 'result')).toBe(0);
    await b.stop();

    const ids: number[] = [];
    for (let i = 0; i < 3; i += 1) ids.push((await post(a.url, member, result(180 + i, `${RESTART_MARK} approved while B was away`)).expect(201)).body.id as number);
    for (const id of ids) await review(a.url, mod, id).expect(200);
    await rename(a.url, mod, 'aisi-1095', 'Restartcheck 1095');

    b = await startAnother();
    // Asked once each, at once: no write after B's start, so only what B built at its start can answer.
    expect(await totalOf(b.url)).toBe(before.total + 3);
    expect(await totalOf(b.url, LIVE)).toBe(before.live + 3);
    expect(await foundOn(b.url, RESTART_MARK, 'result')).toBe(3);
    expect((await steelOn(b.url, 'aisi-d2')).resultCount).toBe(before.steel.resultCount + 3);
    expect((await steelOn(b.url, 'aisi-1095')).name).toBe('Restartcheck 1095');
    expect(before.renamed.name).not.toBe('Restartcheck 1095');
    expect(await foundOn(b.url, 'Restartcheck', 'steel')).toBe(1);
    // And B agrees with A.
    expect(await totalOf(b.url)).toBe(await totalOf(a.url));
    expect(await totalOf(b.url, LIVE)).toBe(await totalOf(a.url, LIVE));
  }, 200_000);

  it('counts a change made before it started once, after following the changes made since', async () => {
    const member = await signIn(a.url, await demoHandle(a.url, 'member', 1));
    const mod = await signIn(a.url, await demoHandle(a.url, 'moderator'));
    const mark = 'nightjarquill';
    const id = (await post(a.url, member, result(190, `${mark} approved before C started`)).expect(201)).body.id as number;
    await review(a.url, mod, id).expect(200);
    const c = await startAnother();
    const counts = async (url: string) => ({ total: await totalOf(url), live: await totalOf(url, LIVE), found: await foundOn(url, mark, 'result'), d2: (await steelOn(url, 'aisi-d2')).resultCount });
    const atStart = await counts(c.url);
    expect(atStart).toEqual(await counts(a.url));
    expect(atStart.found).toBe(1);

    // A change after C's start, through A: once C shows it, C's poller has read every change
    // up to it, so a replay of the earlier approval would have happened by then.
    await rename(a.url, mod, 'aisi-o1', 'Latestartcheck O1');
    await eventually('C shows the rename made after its start', async () => (await steelOn(c.url, 'aisi-o1')).name === 'Latestartcheck O1');
    expect(await counts(c.url)).toEqual(atStart);
    expect(await counts(c.url)).toEqual(await counts(a.url));
  }, 200_000);
});

describe.runIf(clusterUrl)('two processes started at the same moment on an empty PostgreSQL database', () => {
  it('both start: one migrates while the other waits, then finds nothing left to apply', async () => {
    const name = `edgeledger_empty_${process.pid}`;
    await onCluster(clusterUrl!, `CREATE DATABASE "${name}"`);
    const dirs = [0, 1].map(() => fs.mkdtempSync(path.join(os.tmpdir(), 'edgeledger-empty-')));
    const env = { LOG_LEVEL: 'error', ...testRateLimits, DATABASE_URL: `${clusterUrl}${name}` };
    const started = await Promise.allSettled(dirs.map((dir) => startServerProcess({ ...env, DATA_DIR: dir })));
    try {
      for (const s of started) expect(s.status, s.status === 'rejected' ? String(s.reason) : '').toBe('fulfilled');
      for (const s of started) if (s.status === 'fulfilled') await request(s.value.url).get('/api/health').expect(200);
    } finally {
      for (const s of started) if (s.status === 'fulfilled') await s.value.stop();
      await onCluster(clusterUrl!, `DROP DATABASE IF EXISTS "${name}" WITH (FORCE)`);
      for (const dir of dirs) fs.rmSync(dir, { recursive: true, force: true });
    }
  }, 200_000);
});
