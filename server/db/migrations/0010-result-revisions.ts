import { DataTypes, type QueryInterface } from 'sequelize';

/**
 * Result revisions: every version of a result's input its author wrote, numbered per result.
 * An edit of a draft, pending or returned result is applied at once (status `applied`); a
 * correction of an approved result waits (`pending`) until a moderator approves, returns or
 * rejects it, and a newer correction supersedes one still waiting.
 */
export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.createTable('result_revisions', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    resultId: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'results', key: 'id' } },
    number: { type: DataTypes.INTEGER, allowNull: false },
    authorId: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'users', key: 'id' } },
    input: { type: DataTypes.JSON, allowNull: false },
    status: { type: DataTypes.STRING(20), allowNull: false },
    reviewedById: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'users', key: 'id' } },
    note: { type: DataTypes.TEXT, allowNull: true },
    reviewedAt: { type: DataTypes.DATE, allowNull: true },
    createdAt: { type: DataTypes.DATE, allowNull: false },
    updatedAt: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('result_revisions', ['resultId', 'number'], { unique: true, name: 'result_revisions_result_number' });
  await qi.addIndex('result_revisions', ['status', 'createdAt'], { name: 'result_revisions_status' });
}

export async function down({ context: qi }: { context: QueryInterface }) {
  await qi.dropTable('result_revisions');
}
