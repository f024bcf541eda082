import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it, inject } from 'vitest';
import request from 'supertest';
import { boot, type Running } from '../../server/boot';
import { loadEnv } from '../../server/config/env';
import { copyBaseDatabase, demoHandle, signIn, testRateLimits } from '../setup/test-server';

/**
 * With TEST_DATABASE=postgres: two servers (A and B) on one PostgreSQL database, as two app
 * processes behind a load balancer would be. Sessions are read from the database on every
 * request there, so a session begun on A serves on B, and a sign-out on A counts on B at once.
 */
const clusterUrl = inject('postgresUrl');

const goodResult = () => ({
  steel: 'aisi-d2',
  hardness: { value: 61, scale: 'HRC' },
  abrasive: 'cbn-electroplated-wheel-250-b126',
  edgeAngle: { perSideDeg: 15 },
  sharpness: { method: 'push-cut-test-v2', readingsG: [180, 175, 190] },
});

describe.runIf(clusterUrl)('two servers on one PostgreSQL database', () => {
  const dirs: string[] = [];
  let database: Awaited<ReturnType<typeof copyBaseDatabase>>;
  let a: Running;
  let b: Running;

  beforeAll(async () => {
    const start = async () => {
      const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'edgeledger-two-'));
      dirs.push(dataDir);
      database ??= await copyBaseDatabase(dataDir);
      return boot(loadEnv({ NODE_ENV: 'test', PORT: '0', OAUTH_PORT: '0', SMTP_PORT: '0', DATA_DIR: dataDir, SEED_DEMO: 'never', ...testRateLimits, ...database.env }), () => undefined);
    };
    a = await start();
    b = await start();
  }, 120_000);
  afterAll(async () => {
    await a?.stop();
    await b?.stop();
    await database?.drop();
    for (const dir of dirs) fs.rmSync(dir, { recursive: true, force: true });
  });

  it('serves a session begun on A from B, and a sign-out on A ends it on B at once', async () => {
    const member = await signIn(a.url, await demoHandle(a.url, 'member'));
    const cookie = member.agent.jar
      .getCookies({ domain: '127.0.0.1', path: '/', secure: false, script: false })
      .map((c) => c.toValueString())
      .join('; ');
    const onB = await request(b.url).get('/api/session').set('Cookie', cookie).expect(200);
    expect(onB.body.user).toMatchObject({ handle: member.user.handle });
    await request(b.url).post('/api/results').set('Cookie', cookie).set('X-CSRF-Token', member.csrf).send(goodResult()).expect(201);

    await member.agent.post('/auth/signout').set('X-CSRF-Token', member.csrf).expect(204);
    const afterOnB = await request(b.url).get('/api/session').set('Cookie', cookie).expect(200);
    expect(afterOnB.body.user).toBeNull();
    await request(b.url).post('/api/results').set('Cookie', cookie).set('X-CSRF-Token', member.csrf).send(goodResult()).expect(401);
  });
});
