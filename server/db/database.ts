import type { Sequelize, Transaction } from 'sequelize';
import { SequelizeStorage, Umzug } from 'umzug';
import { sqliteSequelize, sqliteWrite } from './sqlite';
import { postgresMigrateAlone, postgresSequelize, postgresWrite } from './postgres';
import { WriteQueue } from './write-queue';
import { initModels } from '../models';
import { ChangeFeed } from '../changes/feed';
import { refreshCells } from '../aggregates/comparison-cells';
import * as m0001 from './migrations/0001-initial';
import * as m0002 from './migrations/0002-reference-wiki';
import * as m0003 from './migrations/0003-comparison-bands';
import * as m0005 from './migrations/0005-publishing';
import * as m0006 from './migrations/0006-wheel-log';
import * as m0007 from './migrations/0007-result-page-indexes';
import * as m0008 from './migrations/0008-result-members-index';
import * as m0009 from './migrations/0009-changes';
import * as m0010 from './migrations/0010-result-revisions';
import * as m0011 from './migrations/0011-result-progression';
import * as m0012 from './migrations/0012-workshop';
import * as m0013 from './migrations/0013-shared-process-state';
import * as m0014 from './migrations/0014-page-revision-numbers';

/** Migrations in order; imported as modules (umzug's glob loader cannot load .ts under vitest). */
const migrations = [
  { name: '0001-initial', module: m0001 },
  { name: '0002-reference-wiki', module: m0002 },
  { name: '0003-comparison-bands', module: m0003 },
  { name: '0005-publishing', module: m0005 },
  { name: '0006-wheel-log', module: m0006 },
  { name: '0007-result-page-indexes', module: m0007 },
  { name: '0008-result-members-index', module: m0008 },
  { name: '0009-changes', module: m0009 },
  { name: '0010-result-revisions', module: m0010 },
  { name: '0011-result-progression', module: m0011 },
  { name: '0012-workshop', module: m0012 },
  { name: '0013-shared-process-state', module: m0013 },
  { name: '0014-page-revision-numbers', module: m0014 },
];

export interface DatabaseOptions {
  /** SQLite file path; ignored when `url` is given. */
  storage: string;
  /** A postgres:// URL: PostgreSQL instead of the SQLite file. */
  url?: string;
  synchronous?: 'NORMAL' | 'FULL';
  busyTimeoutMs?: number;
  logging?: boolean;
}

/**
 * The database: Sequelize with every connection set up alike, the migrations, and the one
 * way to write (`write`). On SQLite a write waits its turn behind every other write (one
 * writer); on PostgreSQL writes run side by side, SERIALIZABLE, and run again after a
 * serialization failure (`server/db/postgres.ts`).
 */
export class Database {
  readonly sequelize: Sequelize;
  readonly queue: WriteQueue;
  /** What the writes changed: recorded in each transaction, dispatched after its commit. */
  readonly changes: ChangeFeed;
  readonly isSqlite: boolean;

  constructor(readonly options: DatabaseOptions) {
    if (options.url && !/^postgres(ql)?:\/\//.test(options.url)) throw new Error('DATABASE_URL: only postgres:// URLs are supported (leave it unset for SQLite)');
    this.isSqlite = !options.url;
    this.queue = new WriteQueue(this.isSqlite);
    this.sequelize = options.url
      ? postgresSequelize(options.url, { logging: options.logging })
      : sqliteSequelize({ storage: options.storage, synchronous: options.synchronous ?? 'NORMAL', busyTimeoutMs: options.busyTimeoutMs ?? 5000, logging: options.logging });
    initModels(this.sequelize);
    this.changes = new ChangeFeed(this, this.sequelize, refreshCells, (work) => this.write(work));
  }

  /** Applies every pending migration (or those up to and including `to`, for a test of a later one). */
  async migrate({ to }: { to?: string } = {}): Promise<void> {
    const umzug = new Umzug({
      migrations: migrations.map(({ name, module }) => ({ name, up: module.up, down: module.down })),
      context: this.sequelize.getQueryInterface(),
      storage: new SequelizeStorage({ sequelize: this.sequelize, tableName: 'migrations_applied' }),
      logger: undefined,
    });
    const up = () => umzug.up(to ? { to } : {});
    if (this.isSqlite) await up();
    else await postgresMigrateAlone(this.sequelize, up);
  }

  /**
   * Runs `work` in a write transaction (on SQLite once every earlier write has finished); what
   * `work` recorded (`record(transaction, …)`, server/changes/) is written in the same
   * transaction. Resolves only after the commit and after every follower took its changes (the
   * search index, the caches), so a caller that answers 2xx afterwards never acknowledges a lost
   * write and a read that follows sees it. On PostgreSQL `work` may run more than once (see
   * `postgresWrite`).
   */
  async write<T>(work: (t: Transaction) => Promise<T>): Promise<T> {
    let feed: { dispatched?: Promise<void> } = {};
    const recorded = async (transaction: Transaction) => {
      const outcome = await work(transaction);
      feed = await this.changes.beforeCommit(transaction);
      return outcome;
    };
    const value = await this.queue.run(() => (this.isSqlite ? sqliteWrite(this.sequelize, recorded) : postgresWrite(this.sequelize, recorded)));
    await feed.dispatched;
    return value;
  }

  async close(): Promise<void> {
    await this.queue.drain();
    await this.sequelize.close();
  }
}
