import path from 'node:path';
import { spawn, type ChildProcess } from 'node:child_process';

/**
 * `npm run dev`: the server from its sources through tsx (restarted when a server or shared file
 * changes) on PORT (3000), and Vite's dev server on :5173 with `/api` and `/auth` proxied to it
 * (vite.config.ts). Ctrl-C stops both.
 */
const children: ChildProcess[] = [
  spawn(process.execPath, [path.resolve('node_modules/tsx/dist/cli.mjs'), 'watch', '--clear-screen=false', 'server/index.ts'], { stdio: 'inherit' }),
  spawn(process.execPath, [path.resolve('node_modules/vite/bin/vite.js')], { stdio: 'inherit' }),
];
let exiting = false;
const stopAll = (signal: NodeJS.Signals) => {
  if (exiting) return;
  exiting = true;
  for (const child of children) child.kill(signal);
};
for (const signal of ['SIGTERM', 'SIGINT'] as const) process.on(signal, () => stopAll(signal));
for (const child of children) {
  child.on('exit', (code) => {
    stopAll('SIGTERM');
    process.exitCode = code ?? 0;
  });
}
