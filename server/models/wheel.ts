import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';

/** A member's wheel in their wheel log, with the setup they use on it (mm) and their usual angles (° per side). */
export class Wheel extends Model<InferAttributes<Wheel>, InferCreationAttributes<Wheel>> {
  declare id: CreationOptional<number>;
  declare ownerId: number;
  declare name: string;
  declare abrasiveId: number | null;
  declare wears: boolean;
  declare originalDiameterMm: number;
  declare barDiameterMm: number;
  declare projectionMm: number;
  declare usualAnglesDeg: number[];
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare measurements?: NonAttribute<WheelMeasurement[]>;

  static initModel(sequelize: Sequelize) {
    Wheel.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        ownerId: { type: DataTypes.INTEGER, allowNull: false },
        name: { type: DataTypes.STRING(120), allowNull: false },
        abrasiveId: { type: DataTypes.INTEGER, allowNull: true },
        wears: { type: DataTypes.BOOLEAN, allowNull: false },
        originalDiameterMm: { type: DataTypes.FLOAT, allowNull: false },
        barDiameterMm: { type: DataTypes.FLOAT, allowNull: false },
        projectionMm: { type: DataTypes.FLOAT, allowNull: false },
        usualAnglesDeg: { type: DataTypes.JSON, allowNull: false },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'wheels' },
    );
  }
}

/** One measured diameter of a wheel on a date (mm); appended, never changed. */
export class WheelMeasurement extends Model<InferAttributes<WheelMeasurement>, InferCreationAttributes<WheelMeasurement>> {
  declare id: CreationOptional<number>;
  declare wheelId: number;
  declare measuredOn: string;
  declare diameterMm: number;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    WheelMeasurement.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        wheelId: { type: DataTypes.INTEGER, allowNull: false },
        measuredOn: { type: DataTypes.DATEONLY, allowNull: false },
        diameterMm: { type: DataTypes.FLOAT, allowNull: false },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'wheel_measurements', updatedAt: false },
    );
  }
}
