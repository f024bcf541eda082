import fs from 'node:fs';
import path from 'node:path';
import { Sequelize, Transaction } from 'sequelize';
import { SequelizeStorage, Umzug } from 'umzug';
import { sqliteWithPragmas } from './sqlite-driver';
import { WriteQueue } from './write-queue';
import { initModels } from '../models';
import * as m0001 from './migrations/0001-initial';
import * as m0002 from './migrations/0002-reference-wiki';
import * as m0003 from './migrations/0003-comparison-bands';
import * as m0005 from './migrations/0005-publishing';
import * as m0006 from './migrations/0006-wheel-log';
import * as m0007 from './migrations/0007-result-page-indexes';
import * as m0008 from './migrations/0008-result-members-index';
import * as m0011 from './migrations/0011-result-progression';

/** Migrations in order; imported as modules (umzug's glob loader cannot load .ts under vitest). */
const migrations = [
  { name: '0001-initial', module: m0001 },
  { name: '0002-reference-wiki', module: m0002 },
  { name: '0003-comparison-bands', module: m0003 },
  { name: '0005-publishing', module: m0005 },
  { name: '0006-wheel-log', module: m0006 },
  { name: '0007-result-page-indexes', module: m0007 },
  { name: '0008-result-members-index', module: m0008 },
  { name: '0011-result-progression', module: m0011 },
];

export interface DatabaseOptions {
  /** SQLite file path; ignored when `url` is given. */
  storage: string;
  /** Optional database URL (another dialect); SQLite is the default. */
  url?: string;
  synchronous?: 'NORMAL' | 'FULL';
  busyTimeoutMs?: number;
  logging?: boolean;
}

/**
 * The database: Sequelize with every connection set up alike, the migrations, and the one
 * way to write (`write`), which queues the transaction behind every other write.
 */
export class Database {
  readonly sequelize: Sequelize;
  readonly queue = new WriteQueue();
  readonly isSqlite: boolean;

  constructor(readonly options: DatabaseOptions) {
    this.isSqlite = !options.url;
    if (this.isSqlite) fs.mkdirSync(path.dirname(path.resolve(options.storage)), { recursive: true });
    this.sequelize = options.url
      ? new Sequelize(options.url, { logging: false })
      : new Sequelize({
          dialect: 'sqlite',
          storage: options.storage,
          dialectModule: sqliteWithPragmas({
            synchronous: options.synchronous ?? 'NORMAL',
            busyTimeoutMs: options.busyTimeoutMs ?? 5000,
          }),
          logging: options.logging ? console.log : false,
          pool: { max: 1, idle: 60_000 },
        });
    if (this.isSqlite) {
      keepOneWriterConnection(this.sequelize);
      beginAndCommitDirectly(this.sequelize);
    }
    initModels(this.sequelize);
  }

  /** Applies every pending migration. */
  async migrate(): Promise<void> {
    const umzug = new Umzug({
      migrations: migrations.map(({ name, module }) => ({ name, up: module.up, down: module.down })),
      context: this.sequelize.getQueryInterface(),
      storage: new SequelizeStorage({ sequelize: this.sequelize, tableName: 'migrations_applied' }),
      logger: undefined,
    });
    await umzug.up();
  }

  /**
   * Runs `work` in a write transaction once every earlier write has finished. Resolves only
   * after the commit, so a caller that answers 2xx afterwards never acknowledges a lost write.
   */
  write<T>(work: (t: Transaction) => Promise<T>): Promise<T> {
    return this.queue.run(() =>
      this.sequelize.transaction(
        this.isSqlite ? { type: Transaction.TYPES.IMMEDIATE } : {},
        work,
      ),
    );
  }

  async close(): Promise<void> {
    await this.queue.drain();
    await this.sequelize.close();
  }
}

/**
 * Sequelize's SQLite dialect opens a new connection for every transaction and closes it at the
 * end: a file open, the PRAGMAs and a fresh parse of the schema, several milliseconds per write.
 * Writes here run one at a time (`Database.write`'s queue, the only place that opens a
 * transaction), so every transaction can use one connection kept open for the process's life.
 * Reads outside transactions keep Sequelize's default connection.
 */
function keepOneWriterConnection(sequelize: Sequelize): void {
  type Connection = { filename?: string };
  const manager = sequelize.connectionManager as unknown as {
    getConnection(options?: { uuid?: string }): Promise<Connection>;
    releaseConnection(connection: Connection, force?: boolean): void;
  };
  const get = manager.getConnection.bind(manager);
  const release = manager.releaseConnection.bind(manager);
  let writer: Connection | undefined;
  manager.getConnection = async (options = {}) => {
    if (!options.uuid || options.uuid === 'default') return get(options);
    writer = await get({ ...options, uuid: 'writer' });
    return writer;
  };
  manager.releaseConnection = (connection, force) => {
    if (connection === writer && !force) return;
    release(connection, force);
  };
}

/**
 * A transaction's BEGIN and COMMIT go straight to its SQLite connection instead of through
 * `sequelize.query`, whose work per statement (options copied, a stack trace taken, the answer
 * parsed) cost more than the statements themselves: an empty write transaction took 0.7–0.9 ms
 * of CPU through Sequelize, 0.15–0.25 ms sent directly (measured on the 100 000-result
 * database), and most submissions under load are a transaction of their own. Sequelize still
 * runs the transaction (its connection, afterCommit hooks, rollback); savepoints are left to it.
 */
function beginAndCommitDirectly(sequelize: Sequelize): void {
  type Connection = { exec(sql: string, callback: (err: Error | null) => void): void };
  type Tx = Transaction & { parent?: Transaction; connection: Connection };
  const queryInterface = sequelize.getQueryInterface() as unknown as {
    queryGenerator: { startTransactionQuery(t: Transaction): string; commitTransactionQuery(t: Transaction): string };
    startTransaction(t: Tx, options?: object): Promise<unknown>;
    commitTransaction(t: Tx, options?: object): Promise<unknown>;
  };
  const exec = (connection: Connection, sql: string) => new Promise<void>((resolve, reject) => connection.exec(sql, (err) => (err ? reject(err) : resolve())));
  const start = queryInterface.startTransaction.bind(queryInterface);
  const commit = queryInterface.commitTransaction.bind(queryInterface);
  queryInterface.startTransaction = (t, options) => (t.parent ? start(t, options) : exec(t.connection, queryInterface.queryGenerator.startTransactionQuery(t)));
  queryInterface.commitTransaction = (t, options) => (t.parent ? commit(t, options) : exec(t.connection, queryInterface.queryGenerator.commitTransactionQuery(t)));
}
