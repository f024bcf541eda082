import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it, inject, vi } from 'vitest';
import request from 'supertest';
import { boot, type Running } from '../../server/boot';
import { loadEnv } from '../../server/config/env';
import { onCluster, testRateLimits } from '../setup/test-server';
import { loadDemoData } from '../../seed/load';

/**
 * With TEST_DATABASE=postgres: the same demo data loaded at the same instant into a new SQLite
 * file and a new PostgreSQL database, served by two servers; every read below must answer the
 * same bytes from both (the reference is the SQLite server, the project's embedded default;
 * both name one PUBLIC_URL, which exports cite).
 */
const clusterUrl = inject('postgresUrl');
const clock = new Date('2026-11-20T09:00:00Z');

describe.runIf(clusterUrl)('PostgreSQL answers byte for byte as SQLite does', () => {
  const name = `edgeledger_parity_${process.pid}`;
  const dirs: string[] = [];
  let sqlite: Running;
  let postgres: Running;

  const start = async (databaseUrl?: string) => {
    const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'edgeledger-parity-'));
    dirs.push(dataDir);
    const env = { NODE_ENV: 'test', PORT: '0', OAUTH_PORT: '0', SMTP_PORT: '0', DATA_DIR: dataDir, SEED_DEMO: 'auto', PUBLIC_URL: 'http://edgeledger.test', ...testRateLimits, ...(databaseUrl && { DATABASE_URL: databaseUrl }) };
    // The entry (server/index.ts) hands boot the demo-data loader; a test hands it in the same way.
    return boot(loadEnv(env), () => undefined, { demoData: loadDemoData });
  };

  beforeAll(async () => {
    // The demo data's dates (and every stamp written while loading it) from one frozen instant.
    vi.useFakeTimers({ toFake: ['Date'] });
    vi.setSystemTime(clock);
    await onCluster(clusterUrl!, `CREATE DATABASE "${name}"`);
    sqlite = await start();
    postgres = await start(`${clusterUrl}${name}`);
  }, 120_000);
  afterAll(async () => {
    vi.useRealTimers();
    await sqlite?.stop();
    await postgres?.stop();
    await onCluster(clusterUrl!, `DROP DATABASE IF EXISTS "${name}" WITH (FORCE)`);
    for (const dir of dirs) fs.rmSync(dir, { recursive: true, force: true });
  });

  const same = async (url: string) => {
    const [a, b] = await Promise.all([request(sqlite.url).get(url), request(postgres.url).get(url)]);
    expect(a.status, url).toBe(200);
    expect(b.status, url).toBe(200);
    expect(b.text, url).toBe(a.text);
    return JSON.parse(a.text) as unknown;
  };

  it('answers the pages, lists and searches alike', async () => {
    const urls = [
      '/api/steels',
      '/api/steels?category=tool',
      '/api/steels/aisi-d2',
      '/api/steels/aisi-d2/revisions',
      '/api/abrasives',
      '/api/abrasives/cbn-electroplated-wheel-250-b126',
      '/api/methods',
      '/api/methods/push-cut-test-v2',
      '/api/search?q=d2',
      '/api/search?q=cbn',
      '/api/search?q=52100&type=result',
      '/api/publishers',
    ];
    for (const url of urls) await same(url);
    const accounts = (await same('/auth/demo-accounts')) as { handle: string }[];
    for (const { handle } of accounts.slice(0, 4)) await same(`/api/profiles/${handle}`);
  });

  it('answers the comparison, its cells, pairs, points and exports alike', async () => {
    const view = (await same('/api/compare?method=push-cut-test-v2&pageSize=5000')) as { rows: { cell: string }[] };
    expect(view.rows.length).toBeGreaterThan(1);
    await same('/api/compare?method=push-cut-test-v2&sort=-n&pageSize=10&page=2');
    await same('/api/compare?method=push-cut-test-v2&hrcMin=60');
    for (const row of view.rows.slice(0, 5)) await same(`/api/compare/cell?method=push-cut-test-v2&cell=${row.cell}`);
    await same(`/api/compare/paired?method=push-cut-test-v2&a=${view.rows[0].cell}&b=${view.rows[1].cell}`);
    await same('/api/compare/points?method=push-cut-test-v2&limit=10');
    const csv = '/api/compare/export?format=csv&method=push-cut-test-v2&category=tool&sort=-median';
    const [a, b] = await Promise.all([request(sqlite.url).get(csv).expect(200), request(postgres.url).get(csv).expect(200)]);
    expect(b.text).toBe(a.text);
    await same('/api/compare/export?format=json&method=push-cut-test-v2&category=tool');
  });
});
