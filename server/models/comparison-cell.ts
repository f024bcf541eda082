import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/**
 * Precomputed aggregate of one comparison cell: method × steel × abrasive material × grit band,
 * for whole-φ bands (bandWidth 2) and half-φ bands (bandWidth 1). `bandStart` is the φ of the
 * band's coarse edge in half-φ units (whole band φ 6 → 12; its halves 12 and 13).
 * Refreshed inside the transaction of every write that changes an approved result
 * (server/aggregates/comparison-cells.ts).
 */
export class ComparisonCell extends Model<InferAttributes<ComparisonCell>, InferCreationAttributes<ComparisonCell>> {
  declare methodId: number;
  declare steelId: number;
  declare material: string;
  declare bandWidth: number;
  declare bandStart: number;
  declare n: number;
  declare testers: number;
  declare medianG: number;
  declare q1G: number;
  declare q3G: number;
  declare meanG: number;
  declare sdG: number | null;
  declare ciLoG: number | null;
  declare ciHiG: number | null;
  declare retentionN: number;
  declare retentionMedianCuts: number | null;
  declare hrcMin: number;
  declare hrcMax: number;
  declare angleMinDeg: number;
  declare angleMaxDeg: number;
  declare gritUmMin: number;
  declare gritUmMax: number;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    ComparisonCell.init(
      {
        methodId: { type: DataTypes.INTEGER, primaryKey: true },
        steelId: { type: DataTypes.INTEGER, primaryKey: true },
        material: { type: DataTypes.STRING(30), primaryKey: true },
        bandWidth: { type: DataTypes.INTEGER, primaryKey: true },
        bandStart: { type: DataTypes.INTEGER, primaryKey: true },
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
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'comparison_cells', createdAt: false },
    );
  }
}
