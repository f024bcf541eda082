/**
 * The bench's server process: the real Edgeledger server on the bench's database, plus a bare
 * Express hello-world app in the same process (the yardstick for req/s), with the event loop's
 * delay recorded. Started by bench/compare.ts with fork(); answers its messages over IPC.
 */
import { monitorEventLoopDelay } from 'node:perf_hooks';
import type { AddressInfo } from 'node:net';
import express from 'express';
import { loadEnv } from '../server/config/env';
import { boot } from '../server/boot';

const lines: string[] = [];
const env = loadEnv({
  NODE_ENV: 'development',
  LOG_LEVEL: 'error',
  HOST: '127.0.0.1',
  PORT: process.env.BENCH_PORT ?? '3540',
  OAUTH_PORT: process.env.BENCH_OAUTH_PORT ?? '3541',
  SMTP_PORT: process.env.BENCH_SMTP_PORT ?? '3542',
  S3_PORT: process.env.BENCH_S3_PORT ?? '3543',
  DATA_DIR: process.env.BENCH_DATA_DIR!,
  SEED_DEMO: 'never',
  // The bench is one client asking thousands of times; the per-client limits would answer 429.
  RATE_LIMIT_SEARCH_PER_MIN: '100000000',
  RATE_LIMIT_POSTS_PER_MIN: '100000000',
  RATE_LIMIT_SIGNIN_PER_MIN: '100000000',
});

const started = performance.now();
const running = await boot(env, (line) => lines.push(line));
const bootMs = performance.now() - started;
const indexLine = lines.find((l) => l.startsWith('Search index:')) ?? '';
const indexMs = Number(/in (\d+) ms/.exec(indexLine)?.[1] ?? NaN);

const hello = express();
hello.get('/hello', (_req, res) => {
  res.json({ hello: 'world' });
});
const helloServer = await new Promise<import('node:http').Server>((resolve) => {
  const s = hello.listen(Number(process.env.BENCH_HELLO_PORT ?? 3544), '127.0.0.1', () => resolve(s));
});

let delay = monitorEventLoopDelay({ resolution: 1 });
delay.enable();

process.on('message', async (msg: { type: string }) => {
  if (msg.type === 'stats') {
    const before = process.memoryUsage();
    // With --expose-gc: what stays alive once the garbage is collected (RSS seldom shrinks much).
    (globalThis as { gc?: () => void }).gc?.();
    const after = process.memoryUsage();
    process.send!({
      type: 'stats',
      rssMb: before.rss / 2 ** 20,
      heapMb: before.heapUsed / 2 ** 20,
      rssAfterGcMb: after.rss / 2 ** 20,
      heapAfterGcMb: after.heapUsed / 2 ** 20,
      loopMaxMs: delay.max / 1e6,
      loopP99Ms: delay.percentile(99) / 1e6,
    });
  } else if (msg.type === 'reset-loop') {
    delay.disable();
    delay = monitorEventLoopDelay({ resolution: 1 });
    delay.enable();
    process.send!({ type: 'reset-loop' });
  } else if (msg.type === 'stop') {
    delay.disable();
    helloServer.close();
    await running.stop();
    process.send!({ type: 'stopped' });
    process.exit(0);
  }
});

process.send!({
  type: 'ready',
  url: running.url,
  helloUrl: `http://127.0.0.1:${(helloServer.address() as AddressInfo).port}`,
  bootMs,
  indexMs,
  searchDocuments: running.ctx.search.size,
});
