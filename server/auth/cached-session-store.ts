import session from 'express-session';

type Callback<T = unknown> = (err?: unknown, value?: T) => void;

/** The store methods this cache needs of the one underneath (connect-session-sequelize's). */
interface InnerStore {
  get(sid: string, callback: Callback<session.SessionData | null>): void;
  set(sid: string, data: session.SessionData, callback?: Callback): void;
  destroy(sid: string, callback?: Callback): void;
  touch(sid: string, data: session.SessionData, callback?: Callback): void;
  /** When the stored row expires (connect-session-sequelize: the cookie's expiry, or its default). */
  expiration(data: session.SessionData): Date;
}

/** Runs a write in turn with the database's other writes (Database.queue.run). */
export type InTurn = <T>(write: () => Promise<T>) => Promise<T>;

/** Most sessions kept in memory; the oldest are dropped past it (they are read again on use). */
const MAX_SESSIONS = 20_000;

/**
 * A session store that keeps each session's JSON in memory in front of the database store, so
 * a signed-in request does not read its session row (one process owns the database, so the
 * rows change only through here). Writes go to the database first; memory follows only once
 * they succeeded, and a destroy forgets the memory first. A kept session past its row's expiry
 * counts as gone, as the row would after the store's clean-up. Writes to the table take their
 * turn with the database's other writes (`inTurn`): a session saved while a write transaction
 * held SQLite's lock would otherwise wait for it in SQLite's busy handler, holding the
 * connection every read uses meanwhile.
 */
export class CachedSessionStore extends session.Store {
  private readonly kept = new Map<string, { json: string; expiresAt: number }>();

  constructor(
    private readonly inner: InnerStore,
    private readonly inTurn: InTurn,
  ) {
    super();
  }

  /** `inner`'s write method, run in turn; settles `callback` with its outcome. */
  private write(call: (done: Callback) => void, callback: Callback): void {
    this.inTurn(() => new Promise<void>((resolve, reject) => call((err) => (err ? reject(err) : resolve())))).then(
      () => callback(),
      (err: unknown) => callback(err),
    );
  }

  private keep(sid: string, data: session.SessionData): void {
    this.kept.delete(sid);
    if (this.kept.size >= MAX_SESSIONS) this.kept.delete(this.kept.keys().next().value!);
    this.kept.set(sid, { json: JSON.stringify(data), expiresAt: this.inner.expiration(data).getTime() });
  }

  override get(sid: string, callback: Callback<session.SessionData | null>): void {
    const hit = this.kept.get(sid);
    if (hit && hit.expiresAt > Date.now()) return callback(null, JSON.parse(hit.json) as session.SessionData);
    if (hit) this.kept.delete(sid);
    this.inner.get(sid, (err, data) => {
      if (!err && data) this.keep(sid, data);
      callback(err, data ?? null);
    });
  }

  override set(sid: string, data: session.SessionData, callback?: Callback): void {
    this.kept.delete(sid);
    this.write(
      (done) => this.inner.set(sid, data, done),
      (err) => {
        if (!err) this.keep(sid, data);
        callback?.(err);
      },
    );
  }

  override destroy(sid: string, callback?: Callback): void {
    this.kept.delete(sid);
    this.write((done) => this.inner.destroy(sid, done), (err) => callback?.(err));
  }

  override touch(sid: string, data: session.SessionData, callback?: () => void): void {
    this.inner.touch(sid, data, () => callback?.());
  }
}
