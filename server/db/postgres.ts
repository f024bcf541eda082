import pg from 'pg';
import { Sequelize, Transaction } from 'sequelize';
import type { DialectSql } from './dialect';

/**
 * Everything the project says only to PostgreSQL: how its Sequelize is built (the `pg` driver,
 * a pool), how a write transaction runs (SERIALIZABLE on a pooled connection, side by side with
 * other writes, again when PostgreSQL reports a serialization failure or a deadlock) and the
 * SQL only PostgreSQL reads.
 */
export function postgresSequelize(url: string, options: { logging?: boolean; poolMax?: number } = {}): Sequelize {
  // COUNT and SUM over integers answer int8, which pg hands over as text (it can exceed 2^53);
  // the counts here are row counts, far below that, and SQLite answers them as numbers.
  pg.types.setTypeParser(pg.types.builtins.INT8, (value) => Number(value));
  return new Sequelize(url, {
    dialect: 'postgres',
    dialectModule: pg,
    logging: options.logging ? console.log : false,
    pool: { max: options.poolMax ?? 10, idle: 30_000, acquire: 60_000 },
  });
}

/** SQLSTATEs after which the same transaction, run again, can succeed. */
const RETRYABLE = new Set(['40001', '40P01']);
/**
 * Transactions that touch one comparison cell (approvals in one steel, method and band) all
 * conflict; 40 at once from two processes exhausted 12 attempts with a short linear back-off.
 */
const MAX_ATTEMPTS = 25;

function sqlState(err: unknown): string | undefined {
  const e = err as { parent?: { code?: string }; original?: { code?: string }; code?: string } | null;
  return e?.parent?.code ?? e?.original?.code ?? e?.code;
}

/**
 * A write transaction on PostgreSQL: SERIALIZABLE, so transactions that ran side by side (in
 * this process or another) commit as if one after the other, or one of them fails with a
 * serialization failure and runs again from the start (`work` must not act outside the
 * database before the commit; what follows a commit goes in `transaction.afterCommit`).
 */
export async function postgresWrite<T>(sequelize: Sequelize, work: (t: Transaction) => Promise<T>): Promise<T> {
  for (let attempt = 1; ; attempt += 1) {
    try {
      return await sequelize.transaction({ isolationLevel: Transaction.ISOLATION_LEVELS.SERIALIZABLE }, work);
    } catch (err) {
      if (attempt >= MAX_ATTEMPTS || !RETRYABLE.has(sqlState(err) ?? '')) throw err;
      // Back off a random while, doubling after each failure up to a quarter second, so the
      // transactions that collided part.
      await new Promise((resolve) => setTimeout(resolve, Math.random() * Math.min(250, 4 * 2 ** attempt)));
    }
  }
}

/** The advisory lock key under which migrations run (any fixed number: "Edgeledger migrations"). */
const MIGRATION_LOCK = 0x6564_6765;

/**
 * Runs the migrations (`migrate`) holding a database-wide advisory lock, so that processes
 * started at the same moment on one empty database (`systemctl enable --now edgeledger@3000
 * edgeledger@3001`) migrate one after the other: the later ones wait, then find nothing left to
 * apply. Without it the second failed on the first's half-applied migration and exited. The lock
 * belongs to a transaction of its own, held open meanwhile; the migrations run on other
 * connections of the pool.
 */
export async function postgresMigrateAlone(sequelize: Sequelize, migrate: () => Promise<unknown>): Promise<void> {
  await sequelize.transaction(async (transaction) => {
    await sequelize.query('SELECT pg_advisory_xact_lock(:key)', { replacements: { key: MIGRATION_LOCK }, transaction });
    await migrate();
  });
}

export const postgresSql: DialectSql = {
  // ->> answers a JSON value as text (an object as its JSON, JSON null as NULL), as SQLite's json_extract does.
  approvedResultsPage: (columns, batch) => `SELECT ${columns}, input->>'notes' AS notes FROM results WHERE status = 'approved' AND id > :after ORDER BY id LIMIT ${batch}`,
};
