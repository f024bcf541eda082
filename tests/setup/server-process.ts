import { spawn, type ChildProcess } from 'node:child_process';

export interface ServerProcess {
  proc: ChildProcess;
  url: string;
  /** The local OAuth2 stand-in's address, when this process started one. */
  oauthUrl?: string;
  /** Resolves with the exit code once the process has ended. */
  exited: Promise<number | null>;
  /** What the process wrote to stdout and stderr so far. */
  output(): string;
  /** SIGTERM, then waits for the process to finish its requests and close its database. */
  stop(): Promise<void>;
}

/**
 * Starts the real server (`server/index.ts` through tsx) as a process of its own, as an operator
 * would run one of several behind a load balancer; resolves once it says it is ready. Each
 * process has its own memory (caches, read models, search index), so only the database and the
 * change feed can keep two of them in agreement.
 */
export function startServerProcess(env: Record<string, string>): Promise<ServerProcess> {
  const proc = spawn(process.execPath, ['--import', 'tsx', 'server/index.ts'], {
    env: { ...process.env, NODE_ENV: 'test', PORT: '0', OAUTH_PORT: '0', SMTP_PORT: '0', SEED_DEMO: 'never', LOG_LEVEL: 'silent', ...env },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  const exited = new Promise<number | null>((resolve) => proc.once('exit', (code) => resolve(code)));
  const stop = async () => {
    if (proc.exitCode === null && proc.signalCode === null) proc.kill('SIGTERM');
    await exited;
  };
  return new Promise((resolve, reject) => {
    let out = '';
    const timer = setTimeout(() => {
      proc.kill('SIGKILL');
      reject(new Error(`server not ready after 90 s:\n${out}`));
    }, 90_000);
    const onData = (chunk: Buffer) => {
      out += chunk.toString();
      const ready = /Edgeledger ready at (http:\/\/[\d.:]+)/.exec(out);
      if (ready) {
        clearTimeout(timer);
        proc.stdout!.off('data', onData);
        proc.stdout!.on('data', (more: Buffer) => (out += more.toString()));
        resolve({ proc, url: ready[1], oauthUrl: /Local OAuth2 provider at (http:\/\/[\d.:]+)/.exec(out)?.[1], exited, stop, output: () => out });
      }
    };
    proc.stdout!.on('data', onData);
    proc.stderr!.on('data', (chunk: Buffer) => (out += chunk.toString()));
    proc.once('exit', (code) => {
      clearTimeout(timer);
      reject(new Error(`server exited (${code}) before it was ready:\n${out}`));
    });
  });
}

/** The environment that has another process sign people in through `p`'s local OAuth2 stand-in, as processes behind one load balancer share one hosted provider. */
export function signingInThrough(p: ServerProcess): Record<string, string> {
  return { OAUTH_AUTHORIZE_URL: `${p.oauthUrl}/authorize`, OAUTH_TOKEN_URL: `${p.oauthUrl}/token`, OAUTH_USERINFO_URL: `${p.oauthUrl}/userinfo` };
}

/** Asks `probe` again (every 50 ms) until it gives true; fails naming `what` after `deadlineMs`. */
export async function eventually(what: string, probe: () => Promise<boolean>, deadlineMs = 10_000): Promise<void> {
  const until = Date.now() + deadlineMs;
  for (;;) {
    if (await probe()) return;
    if (Date.now() > until) throw new Error(`not within ${deadlineMs} ms: ${what}`);
    await new Promise((resolve) => setTimeout(resolve, 50));
  }
}
