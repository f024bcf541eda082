import fs from 'node:fs';
import path from 'node:path';
import { execFileSync, spawn } from 'node:child_process';
import { buildServer, serverNodeFlags } from './build-server';

/**
 * `npm start`: builds the client when dist/ is missing or older than the sources, bundles the
 * server (about a second), then runs the bundle in plain Node with its local stand-ins, passing
 * on SIGTERM and SIGINT (the server finishes the requests under way, then closes the database).
 */
function newestMtime(dir: string): number {
  let newest = 0;
  for (const entry of fs.readdirSync(dir, { withFileTypes: true })) {
    const full = path.join(dir, entry.name);
    newest = Math.max(newest, entry.isDirectory() ? newestMtime(full) : fs.statSync(full).mtimeMs);
  }
  return newest;
}

const built = path.resolve('dist/index.html');
const sources = Math.max(newestMtime(path.resolve('src')), newestMtime(path.resolve('shared')), fs.statSync('index.html').mtimeMs);
if (!fs.existsSync(built) || fs.statSync(built).mtimeMs < sources) {
  console.log('Building the client (vite build) …');
  execFileSync(process.execPath, [path.resolve('node_modules/vite/bin/vite.js'), 'build', '--logLevel', 'warn'], { stdio: 'inherit' });
}
const server = spawn(process.execPath, [...serverNodeFlags(), await buildServer()], { stdio: 'inherit' });
for (const signal of ['SIGTERM', 'SIGINT'] as const) process.on(signal, () => server.kill(signal));
server.on('exit', (code, signal) => process.exit(code ?? (signal ? 1 : 0)));
