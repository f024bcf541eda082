import fs from 'node:fs';
import path from 'node:path';
import { Sequelize, Transaction } from 'sequelize';
import { sqliteWithPragmas } from './sqlite-driver';
import type { DialectSql } from './dialect';

/**
 * Everything the project says only to SQLite: how its Sequelize is built (PRAGMAs on every
 * connection, one writer connection, BEGIN and COMMIT sent directly), how a write transaction
 * starts (IMMEDIATE, one at a time through the write queue) and the SQL only SQLite reads.
 */
export function sqliteSequelize(options: { storage: string; synchronous: 'NORMAL' | 'FULL'; busyTimeoutMs: number; logging?: boolean }): Sequelize {
  fs.mkdirSync(path.dirname(path.resolve(options.storage)), { recursive: true });
  const sequelize = new Sequelize({
    dialect: 'sqlite',
    storage: options.storage,
    dialectModule: sqliteWithPragmas({ synchronous: options.synchronous, busyTimeoutMs: options.busyTimeoutMs }),
    logging: options.logging ? console.log : false,
    pool: { max: 1, idle: 60_000 },
  });
  keepOneWriterConnection(sequelize);
  beginAndCommitDirectly(sequelize);
  return sequelize;
}

/** A write transaction on SQLite: IMMEDIATE takes the write lock at BEGIN (the queue has made it free). */
export function sqliteWrite<T>(sequelize: Sequelize, work: (t: Transaction) => Promise<T>): Promise<T> {
  return sequelize.transaction({ type: Transaction.TYPES.IMMEDIATE }, work);
}

export const sqliteSql: DialectSql = {
  // NOT INDEXED keeps SQLite on the primary key: through the status index, every page re-read
  // and re-sorted all the approved rows after it (1 s of 2 at 50 000 results).
  approvedResultsPage: (columns, batch) =>
    `SELECT ${columns}, json_extract(input, '$.notes') AS notes FROM results NOT INDEXED WHERE status = 'approved' AND id > :after ORDER BY id LIMIT ${batch}`,
};

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
