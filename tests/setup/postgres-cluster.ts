import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import net from 'node:net';
import os from 'node:os';
import path from 'node:path';

/**
 * A throwaway PostgreSQL cluster for one test run: `initdb` into a temporary folder, started
 * with `pg_ctl` on a free loopback port, stopped and removed afterwards. PostgreSQL refuses to
 * run as root, so under root (CI) the cluster belongs to and runs as `nobody`. Durability is
 * switched off (fsync, full-page writes): the cluster lives only as long as the run.
 */
export interface Cluster {
  /** postgres://postgres@127.0.0.1:PORT/ — append a database name. */
  url: string;
  stop(): void;
}

/** The folder of Debian's PostgreSQL programs (the newest installed), or of pg_config's. */
function binDir(): string {
  const debian = '/usr/lib/postgresql';
  if (fs.existsSync(debian)) {
    const versions = fs.readdirSync(debian).filter((v) => fs.existsSync(path.join(debian, v, 'bin', 'initdb')));
    versions.sort((a, b) => Number(b) - Number(a));
    if (versions.length) return path.join(debian, versions[0], 'bin');
  }
  try {
    return execFileSync('pg_config', ['--bindir'], { encoding: 'utf8' }).trim();
  } catch {
    throw new Error('TEST_DATABASE=postgres: no PostgreSQL found (install Debian\'s postgresql package; .ci/run does)');
  }
}

function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const server = net.createServer();
    server.once('error', reject);
    server.listen(0, '127.0.0.1', () => {
      const { port } = server.address() as net.AddressInfo;
      server.close(() => resolve(port));
    });
  });
}

/** `port`: where the cluster listens (a free one when not given). */
export async function startCluster(port?: number): Promise<Cluster> {
  const bin = binDir();
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'edgeledger-pg-'));
  const asRoot = process.getuid?.() === 0;
  // As root, every PostgreSQL program runs as nobody, which must own the folder.
  const run = (program: string, args: string[]) =>
    asRoot
      ? execFileSync('runuser', ['-u', 'nobody', '--', path.join(bin, program), ...args], { cwd: dir, stdio: 'pipe' })
      : execFileSync(path.join(bin, program), args, { cwd: dir, stdio: 'pipe' });
  if (asRoot) fs.chownSync(dir, Number(execFileSync('id', ['-u', 'nobody'], { encoding: 'utf8' })), Number(execFileSync('id', ['-g', 'nobody'], { encoding: 'utf8' })));
  const data = path.join(dir, 'data');
  port ??= await freePort();
  try {
    // C.UTF-8: text sorts by code point, as SQLite's default collation does.
    run('initdb', ['-D', data, '-U', 'postgres', '-A', 'trust', '-E', 'UTF8', '--locale=C.UTF-8', '--no-sync']);
    const settings = [`-p ${port}`, `-k ${dir}`, '-c listen_addresses=127.0.0.1', '-c fsync=off', '-c full_page_writes=off', '-c synchronous_commit=off', '-c max_connections=300'];
    run('pg_ctl', ['-D', data, '-o', settings.join(' '), '-l', path.join(dir, 'server.log'), '-w', '-t', '60', 'start']);
  } catch (err) {
    const log = path.join(dir, 'server.log');
    const detail = fs.existsSync(log) ? fs.readFileSync(log, 'utf8') : String((err as { stderr?: Buffer }).stderr ?? '');
    fs.rmSync(dir, { recursive: true, force: true });
    throw new Error(`could not start a PostgreSQL cluster: ${(err as Error).message}\n${detail}`, { cause: err });
  }
  return {
    url: `postgres://postgres@127.0.0.1:${port}/`,
    stop: () => {
      try {
        run('pg_ctl', ['-D', data, '-m', 'fast', '-w', 'stop']);
      } finally {
        fs.rmSync(dir, { recursive: true, force: true });
      }
    },
  };
}
