import { DataTypes, type QueryInterface } from 'sequelize';

/**
 * The workshop (issue 18): a member's grinders, jigs and saved setups; wheels of the wheel log gain
 * a grinder, a minimum diameter, a rated speed, a coolant, a date and price paid and a retirement;
 * a measurement may be a dressing and counts the sharpenings since the entry before; members report
 * prices paid on abrasive pages.
 */
export async function up({ context: qi }: { context: QueryInterface }) {
  const id = { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true };
  const owner = { type: DataTypes.INTEGER, allowNull: false, references: { model: 'users', key: 'id' } };
  const stamps = { createdAt: { type: DataTypes.DATE, allowNull: false }, updatedAt: { type: DataTypes.DATE, allowNull: false } };
  await qi.createTable('grinders', {
    id,
    ownerId: owner,
    name: { type: DataTypes.STRING(120), allowNull: false },
    spindleRpm: { type: DataTypes.FLOAT, allowNull: false },
    barDiameterMm: { type: DataTypes.FLOAT, allowNull: false },
    barMount: { type: DataTypes.STRING(30), allowNull: false },
    pricePaid: { type: DataTypes.FLOAT, allowNull: true },
    currency: { type: DataTypes.STRING(3), allowNull: true },
    ...stamps,
  });
  await qi.addIndex('grinders', ['ownerId']);
  await qi.createTable('jigs', {
    id,
    ownerId: owner,
    name: { type: DataTypes.STRING(120), allowNull: false },
    offsetMm: { type: DataTypes.FLOAT, allowNull: false },
    ...stamps,
  });
  await qi.addIndex('jigs', ['ownerId']);
  await qi.createTable('setups', {
    id,
    ownerId: owner,
    name: { type: DataTypes.STRING(120), allowNull: false },
    jigId: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'jigs', key: 'id' } },
    projectionMm: { type: DataTypes.FLOAT, allowNull: false },
    perSideDeg: { type: DataTypes.FLOAT, allowNull: false },
    ...stamps,
  });
  await qi.addIndex('setups', ['ownerId']);
  await qi.addColumn('wheels', 'grinderId', { type: DataTypes.INTEGER, allowNull: true, references: { model: 'grinders', key: 'id' } });
  await qi.addColumn('wheels', 'minDiameterMm', { type: DataTypes.FLOAT, allowNull: true });
  await qi.addColumn('wheels', 'ratedSpeedMps', { type: DataTypes.FLOAT, allowNull: true });
  await qi.addColumn('wheels', 'coolant', { type: DataTypes.STRING(30), allowNull: true });
  await qi.addColumn('wheels', 'acquiredOn', { type: DataTypes.DATEONLY, allowNull: true });
  await qi.addColumn('wheels', 'pricePaid', { type: DataTypes.FLOAT, allowNull: true });
  await qi.addColumn('wheels', 'currency', { type: DataTypes.STRING(3), allowNull: true });
  await qi.addColumn('wheels', 'retiredOn', { type: DataTypes.DATEONLY, allowNull: true });
  await qi.addColumn('wheels', 'retiredAfterSharpenings', { type: DataTypes.INTEGER, allowNull: true });
  await qi.addColumn('wheel_measurements', 'dressed', { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false });
  await qi.addColumn('wheel_measurements', 'sharpenings', { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 });
  await qi.createTable('price_reports', {
    id,
    abrasiveId: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'abrasives', key: 'id' } },
    reporterId: owner,
    price: { type: DataTypes.FLOAT, allowNull: false },
    currency: { type: DataTypes.STRING(3), allowNull: false },
    paidOn: { type: DataTypes.DATEONLY, allowNull: false },
    condition: { type: DataTypes.STRING(10), allowNull: false },
    ...stamps,
  });
  await qi.addIndex('price_reports', ['abrasiveId', 'currency']);
}

export async function down({ context: qi }: { context: QueryInterface }) {
  await qi.dropTable('price_reports');
  for (const column of ['sharpenings', 'dressed']) await qi.removeColumn('wheel_measurements', column);
  for (const column of ['retiredAfterSharpenings', 'retiredOn', 'currency', 'pricePaid', 'acquiredOn', 'coolant', 'ratedSpeedMps', 'minDiameterMm', 'grinderId']) {
    await qi.removeColumn('wheels', column);
  }
  await qi.dropTable('setups');
  await qi.dropTable('jigs');
  await qi.dropTable('grinders');
}
