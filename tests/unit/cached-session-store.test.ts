import { describe, expect, it } from 'vitest';
import type session from 'express-session';
import { CachedSessionStore } from '../../server/auth/cached-session-store';
import { WriteQueue } from '../../server/db/write-queue';

/** A store underneath that records what reached it, in order. */
function recordingStore(log: string[]) {
  const rows = new Map<string, session.SessionData>();
  return {
    rows,
    get: (sid: string, cb: (err?: unknown, v?: session.SessionData | null) => void) => {
      log.push(`get ${sid}`);
      cb(null, rows.get(sid) ?? null);
    },
    set: (sid: string, data: session.SessionData, cb?: (err?: unknown) => void) => {
      log.push(`set ${sid}`);
      rows.set(sid, data);
      cb?.();
    },
    destroy: (sid: string, cb?: (err?: unknown) => void) => {
      log.push(`destroy ${sid}`);
      rows.delete(sid);
      cb?.();
    },
    touch: (_sid: string, _data: session.SessionData, cb?: () => void) => cb?.(),
    expiration: () => new Date(Date.now() + 60_000),
  };
}

const promised = <T>(call: (cb: (err?: unknown, v?: T) => void) => void) => new Promise<T | undefined>((resolve, reject) => call((err, v) => (err ? reject(err) : resolve(v))));
const data = (user: number) => ({ cookie: { originalMaxAge: 60_000 }, passport: { user } }) as unknown as session.SessionData;

describe('CachedSessionStore', () => {
  it('writes sessions in turn with the other writes: after the write ahead of them, never during it', async () => {
    const log: string[] = [];
    const queue = new WriteQueue();
    const store = new CachedSessionStore(recordingStore(log), (write) => queue.run(write));
    const ahead = queue.run(async () => {
      log.push('write starts');
      await new Promise((r) => setTimeout(r, 30));
      log.push('write ends');
    });
    const saved = promised((cb) => store.set('a', data(1), cb));
    await Promise.all([ahead, saved]);
    await promised((cb) => store.destroy('a', cb));
    expect(log).toEqual(['write starts', 'write ends', 'set a', 'destroy a']);
  });

  it('reads a saved session from memory, and a destroyed one from the store again', async () => {
    const log: string[] = [];
    const store = new CachedSessionStore(recordingStore(log), (write) => write());
    await promised((cb) => store.set('b', data(7), cb));
    expect(await promised<session.SessionData | null>((cb) => store.get('b', cb))).toEqual(data(7));
    expect(log).toEqual(['set b']);
    await promised((cb) => store.destroy('b', cb));
    expect(await promised<session.SessionData | null>((cb) => store.get('b', cb))).toBeNull();
    expect(log).toEqual(['set b', 'destroy b', 'get b']);
  });

  it('passes a failed write on and keeps nothing of it', async () => {
    const log: string[] = [];
    const inner = { ...recordingStore(log), set: (_s: string, _d: session.SessionData, cb?: (err?: unknown) => void) => cb?.(new Error('disk full')) };
    const store = new CachedSessionStore(inner, (write) => write());
    await expect(promised((cb) => store.set('c', data(3), cb))).rejects.toThrow('disk full');
    expect(await promised<session.SessionData | null>((cb) => store.get('c', cb))).toBeNull();
  });
});
