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
  await qi.createTable('rate_limit_counts', {
    key: { type: DataTypes.STRING(300), primaryKey: true },
    hits: { type: DataTypes.INTEGER, allowNull: false },
    resetAt: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('rate_limit_counts', ['resetAt']);
}

export async function down({ context: qi }: { context: QueryInterface }) {
  await qi.dropTable('rate_limit_counts');
  await qi.dropTable('sign_in_states');
}
