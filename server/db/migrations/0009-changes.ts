import { DataTypes, type QueryInterface } from 'sequelize';

/**
 * The change feed (server/changes/): one row per kind of change a write transaction made,
 * written in that transaction. `keys` is the change's ids or keys as JSON text, so any dialect
 * stores and reads it alike; another process follows the table by id (`changesSince`).
 */
export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.createTable('changes', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    kind: { type: DataTypes.STRING(32), allowNull: false },
    keys: { type: DataTypes.TEXT, allowNull: false },
    createdAt: { type: DataTypes.DATE, allowNull: false },
  });
}

export async function down({ context: qi }: { context: QueryInterface }) {
  await qi.dropTable('changes');
}
