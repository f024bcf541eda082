import type { Sequelize } from 'sequelize';
import { sqliteSql } from './sqlite';
import { postgresSql } from './postgres';

/**
 * The few statements that cannot be written once for both dialects; each dialect's module
 * (sqlite.ts, postgres.ts) gives its own. Everything else is dialect-neutral: models, or raw SQL
 * with camelCase names in double quotes.
 */
export interface DialectSql {
  /** One page of approved results after `:after` by id: `columns` and the submission's notes as JSON text (`notes`). */
  approvedResultsPage(columns: string, batch: number): string;
}

export function dialectSql(sequelize: Sequelize): DialectSql {
  return sequelize.getDialect() === 'postgres' ? postgresSql : sqliteSql;
}
