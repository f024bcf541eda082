import { DataTypes, type QueryInterface } from 'sequelize';

/**
 * A result's progression, the steps before its final abrasive (shared/progression.ts): the
 * stored steps with each one's derived particle size, and the two columns its filters read
 * (how many steps; the materials met, written ",cbn,diamond,"). Existing results keep an
 * empty progression.
 */
export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.addColumn('results', 'progression', { type: DataTypes.JSON, allowNull: false, defaultValue: [] });
  await qi.addColumn('results', 'progressionSteps', { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 });
  await qi.addColumn('results', 'progressionMaterials', { type: DataTypes.STRING(200), allowNull: false, defaultValue: '' });
}

export async function down({ context: qi }: { context: QueryInterface }) {
  await qi.removeColumn('results', 'progressionMaterials');
  await qi.removeColumn('results', 'progressionSteps');
  await qi.removeColumn('results', 'progression');
}
