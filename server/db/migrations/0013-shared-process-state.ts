import { DataTypes, type QueryInterface } from 'sequelize';

/**
 * State every app process must share (issue 15): a sign-in begun on one process finishes on
 * another (the OAuth state's handle, its PKCE verifier, where to return, the browser's cookie
 * value), and a rate limit counts a client's requests across all of them.
 */
export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.createTable('sign_in_states', {
    handle: { type: DataTypes.STRING(64), primaryKey: true },
    verifier: { type: DataTypes.STRING(200), allowNull: false },
    returnTo: { type: DataTypes.STRING(2000), allowNull: false },
    browser: { type: DataTypes.STRING(64), allowNull: false },
    expiresAt: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('sign_in_states', ['expiresAt']);
  // One row per counted request: inserts never conflict, where a shared counter row made
  // concurrent requests of one client fail each other's SERIALIZABLE transactions.
  await qi.createTable('rate_limit_hits', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    key: { type: DataTypes.STRING(300), allowNull: false },
    at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('rate_limit_hits', ['key', 'at']);
  await qi.addIndex('rate_limit_hits', ['at']);
}

export async function down({ context: qi }: { context: QueryInterface }) {
  await qi.dropTable('rate_limit_hits');
  await qi.dropTable('sign_in_states');
}
