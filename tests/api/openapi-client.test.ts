/**
 * The "Done when" of API v1: a publisher generates a client from /api/v1/openapi.json with a
 * well-known generator (openapi-typescript), a script typed by it compiles (tsc, strict), and it
 * pages through /api/v1/results by the Link header with an API token, reading every result once.
 */
import { execFile } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { promisify } from 'node:util';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import openapiTS, { astToString } from 'openapi-typescript';
import { demoHandle, signIn, startTestServer } from '../setup/test-server';

const run = promisify(execFile);
const root = path.resolve(import.meta.dirname, '../..');
const script = path.join(root, 'examples/publisher-client/page-results.ts');

let server: Awaited<ReturnType<typeof startTestServer>>;
let dir: string;
beforeAll(async () => {
  server = await startTestServer();
  dir = fs.mkdtempSync(path.join(os.tmpdir(), 'edgeledger-client-'));
});
afterAll(async () => {
  await server?.stop();
  if (dir) fs.rmSync(dir, { recursive: true, force: true });
});

describe('a client generated from the document', () => {
  it('generates, compiles a paging script against it, and the script reads every result of a steel by the Link header', async () => {
    const document = (await request(server.url).get('/api/v1/openapi.json').expect(200)).text;
    const types = astToString(await openapiTS(document));
    // Every answer the script reads is typed field by field, not as a loose object.
    expect(types).toContain('ResultPage: {');
    fs.writeFileSync(path.join(dir, 'api-types.d.ts'), types);
    fs.copyFileSync(script, path.join(dir, 'page-results.ts'));
    fs.writeFileSync(
      path.join(dir, 'tsconfig.json'),
      JSON.stringify({ compilerOptions: { target: 'ES2022', module: 'ESNext', moduleResolution: 'bundler', strict: true, noEmit: true, skipLibCheck: true, types: ['node'], typeRoots: [path.join(root, 'node_modules/@types')] }, include: ['*.ts'] }),
    );
    // tsc exits non-zero (and execFile rejects, with the compiler's messages) on any type error.
    await run(process.execPath, [path.join(root, 'node_modules/typescript/bin/tsc'), '-p', dir], { cwd: dir });

    const publisher = await signIn(server.url, await demoHandle(server.url, 'publisher'));
    const token = (await publisher.agent.post('/api/v1/tokens').set('X-CSRF-Token', publisher.csrf).send({ name: 'client test' }).expect(201)).body.token as string;
    const { stdout } = await run(process.execPath, [path.join(root, 'node_modules/tsx/dist/cli.mjs'), path.join(dir, 'page-results.ts'), 'aisi-d2'], {
      cwd: dir,
      env: { ...process.env, EDGELEDGER_URL: server.url, EDGELEDGER_TOKEN: token },
    });
    const read = JSON.parse(stdout) as { pages: number; total: number; results: { id: number; steel: string }[] };

    // What the script read is the list itself: the first page's own figures, every id once, all of the steel.
    const first = await request(server.url).get('/api/v1/results?steel=aisi-d2&status=approved').expect(200);
    expect(read.pages, 'more than one page, so the links were followed').toBeGreaterThan(1);
    expect(read.pages).toBe(Math.ceil(first.body.total / first.body.pageSize));
    expect(read.total).toBe(first.body.total);
    expect(new Set(read.results.map((r) => r.id)).size).toBe(first.body.total);
    expect(read.results.slice(0, first.body.items.length).map((r) => r.id)).toEqual(first.body.items.map((r: { id: number }) => r.id));
    expect(new Set(read.results.map((r) => r.steel))).toEqual(new Set(['aisi-d2']));
  });
});
