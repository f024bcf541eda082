import { DataTypes, type QueryInterface } from 'sequelize';

/** A member's log of their wheels and the diameters they measured over time. */
export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.createTable('wheels', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    ownerId: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'users', key: 'id' } },
    name: { type: DataTypes.STRING(120), allowNull: false },
    abrasiveId: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'abrasives', key: 'id' } },
    wears: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
    originalDiameterMm: { type: DataTypes.FLOAT, allowNull: false },
    barDiameterMm: { type: DataTypes.FLOAT, allowNull: false },
    projectionMm: { type: DataTypes.FLOAT, allowNull: false },
    usualAnglesDeg: { type: DataTypes.JSON, allowNull: false },
    createdAt: { type: DataTypes.DATE, allowNull: false },
    updatedAt: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('wheels', ['ownerId']);
  await qi.createTable('wheel_measurements', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    wheelId: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'wheels', key: 'id' } },
    measuredOn: { type: DataTypes.DATEONLY, allowNull: false },
    diameterMm: { type: DataTypes.FLOAT, allowNull: false },
    createdAt: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('wheel_measurements', ['wheelId', 'measuredOn']);
}

export async function down({ context: qi }: { context: QueryInterface }) {
  await qi.dropTable('wheel_measurements');
  await qi.dropTable('wheels');
}
