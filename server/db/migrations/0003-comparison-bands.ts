import { DataTypes, QueryTypes, type QueryInterface } from 'sequelize';
import { cellColumns, groupIntoCells, type BandedMember } from '@shared/aggregate';

/**
 * Comparison cells for whole- and half-φ grit bands. The table of 0001 was keyed by whole φ
 * only; it is replaced by one keyed by (method, steel, material, band width, band start) with
 * band edges counted in half-φ units, and filled from the approved results. An index on
 * results lets the method's overall median (the target of the ranked order's shrinkage) be
 * read from the index alone.
 */
export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.dropTable('comparison_cells');
  await qi.createTable('comparison_cells', {
    methodId: { type: DataTypes.INTEGER, allowNull: false, primaryKey: true },
    steelId: { type: DataTypes.INTEGER, allowNull: false, primaryKey: true },
    material: { type: DataTypes.STRING(30), allowNull: false, primaryKey: true },
    bandWidth: { type: DataTypes.INTEGER, allowNull: false, primaryKey: true },
    bandStart: { type: DataTypes.INTEGER, allowNull: false, primaryKey: true },
    n: { type: DataTypes.INTEGER, allowNull: false },
    testers: { type: DataTypes.INTEGER, allowNull: false },
    medianG: { type: DataTypes.FLOAT, allowNull: false },
    q1G: { type: DataTypes.FLOAT, allowNull: false },
    q3G: { type: DataTypes.FLOAT, allowNull: false },
    meanG: { type: DataTypes.FLOAT, allowNull: false },
    sdG: { type: DataTypes.FLOAT, allowNull: true },
    ciLoG: { type: DataTypes.FLOAT, allowNull: true },
    ciHiG: { type: DataTypes.FLOAT, allowNull: true },
    retentionN: { type: DataTypes.INTEGER, allowNull: false },
    retentionMedianCuts: { type: DataTypes.FLOAT, allowNull: true },
    hrcMin: { type: DataTypes.FLOAT, allowNull: false },
    hrcMax: { type: DataTypes.FLOAT, allowNull: false },
    angleMinDeg: { type: DataTypes.FLOAT, allowNull: false },
    angleMaxDeg: { type: DataTypes.FLOAT, allowNull: false },
    gritUmMin: { type: DataTypes.FLOAT, allowNull: false },
    gritUmMax: { type: DataTypes.FLOAT, allowNull: false },
    updatedAt: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('comparison_cells', ['methodId', 'bandWidth']);
  await qi.addIndex('results', ['sharpnessMethodId', 'status', 'sharpnessMedianG'], { name: 'results_method_status_median' });

  // Fill the new table from the approved results (a fresh database has none yet).
  const rows = await qi.sequelize.query<BandedMember>(
    'SELECT "sharpnessMethodId", "steelId", material, "gritPhi", "gritUm", "authorId", "sharpnessMedianG", "retentionCuts", hrc, "perSideDeg" FROM results WHERE status = :status',
    { replacements: { status: 'approved' }, type: QueryTypes.SELECT },
  );
  const now = new Date();
  const cells = ([1, 0.5] as const).flatMap((step) => groupIntoCells(rows, step).map((g) => ({ ...g.key, ...cellColumns(g.members), updatedAt: now })));
  for (let i = 0; i < cells.length; i += 500) await qi.bulkInsert('comparison_cells', cells.slice(i, i + 500));
}

/** Back to 0001's whole-φ table, empty: run `npm run reaggregate` on the older code to fill it. */
export async function down({ context: qi }: { context: QueryInterface }) {
  await qi.removeIndex('results', 'results_method_status_median');
  await qi.dropTable('comparison_cells');
  await qi.createTable('comparison_cells', {
    methodId: { type: DataTypes.INTEGER, allowNull: false, primaryKey: true },
    steelId: { type: DataTypes.INTEGER, allowNull: false, primaryKey: true },
    material: { type: DataTypes.STRING(30), allowNull: false, primaryKey: true },
    gritPhi: { type: DataTypes.INTEGER, allowNull: false, primaryKey: true },
    n: { type: DataTypes.INTEGER, allowNull: false },
    testers: { type: DataTypes.INTEGER, allowNull: false },
    medianG: { type: DataTypes.FLOAT, allowNull: false },
    q1G: { type: DataTypes.FLOAT, allowNull: false },
    q3G: { type: DataTypes.FLOAT, allowNull: false },
    meanG: { type: DataTypes.FLOAT, allowNull: false },
    sdG: { type: DataTypes.FLOAT, allowNull: true },
    ciLoG: { type: DataTypes.FLOAT, allowNull: true },
    ciHiG: { type: DataTypes.FLOAT, allowNull: true },
    retentionMedianCuts: { type: DataTypes.FLOAT, allowNull: true },
    hrcMin: { type: DataTypes.FLOAT, allowNull: false },
    hrcMax: { type: DataTypes.FLOAT, allowNull: false },
    angleMinDeg: { type: DataTypes.FLOAT, allowNull: false },
    angleMaxDeg: { type: DataTypes.FLOAT, allowNull: false },
    updatedAt: { type: DataTypes.DATE, allowNull: false },
  });
}
