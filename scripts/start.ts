import fs from 'node:fs';
import path from 'node:path';
import { execFileSync } from 'node:child_process';

/**
 * `npm start`: builds the client when dist/ is missing or older than the sources, then starts
 * the server with its local stand-ins.
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
await import('../server/index');
