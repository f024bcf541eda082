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
  /** The workshop (migration 0012): the grinder it runs on, its limits, coolant, price and retirement. */
  declare grinderId: CreationOptional<number | null>;
  declare minDiameterMm: CreationOptional<number | null>;
  declare ratedSpeedMps: CreationOptional<number | null>;
  declare coolant: CreationOptional<string | null>;
  declare acquiredOn: CreationOptional<string | null>;
  declare pricePaid: CreationOptional<number | null>;
  declare currency: CreationOptional<string | null>;
  declare retiredOn: CreationOptional<string | null>;
  declare retiredAfterSharpenings: CreationOptional<number | null>;
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
        grinderId: { type: DataTypes.INTEGER, allowNull: true },
        minDiameterMm: { type: DataTypes.FLOAT, allowNull: true },
        ratedSpeedMps: { type: DataTypes.FLOAT, allowNull: true },
        coolant: { type: DataTypes.STRING(30), allowNull: true },
        acquiredOn: { type: DataTypes.DATEONLY, allowNull: true },
        pricePaid: { type: DataTypes.FLOAT, allowNull: true },
        currency: { type: DataTypes.STRING(3), allowNull: true },
        retiredOn: { type: DataTypes.DATEONLY, allowNull: true },
        retiredAfterSharpenings: { type: DataTypes.INTEGER, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'wheels' },
    );
  }
}

/** One measured diameter of a wheel on a date (mm), whether it was just dressed, and the sharpenings since the entry before. */
export class WheelMeasurement extends Model<InferAttributes<WheelMeasurement>, InferCreationAttributes<WheelMeasurement>> {
  declare id: CreationOptional<number>;
  declare wheelId: number;
  declare measuredOn: string;
  declare diameterMm: number;
  declare dressed: CreationOptional<boolean>;
  declare sharpenings: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    WheelMeasurement.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        wheelId: { type: DataTypes.INTEGER, allowNull: false },
        measuredOn: { type: DataTypes.DATEONLY, allowNull: false },
        diameterMm: { type: DataTypes.FLOAT, allowNull: false },
        dressed: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        sharpenings: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'wheel_measurements', updatedAt: false },
    );
  }
}

/** A member's grinder: spindle speed (rpm), support-bar diameter (mm) and where the bar mounts. */
export class Grinder extends Model<InferAttributes<Grinder>, InferCreationAttributes<Grinder>> {
  declare id: CreationOptional<number>;
  declare ownerId: number;
  declare name: string;
  declare spindleRpm: number;
  declare barDiameterMm: number;
  declare barMount: string;
  declare pricePaid: number | null;
  declare currency: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Grinder.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        ownerId: { type: DataTypes.INTEGER, allowNull: false },
        name: { type: DataTypes.STRING(120), allowNull: false },
        spindleRpm: { type: DataTypes.FLOAT, allowNull: false },
        barDiameterMm: { type: DataTypes.FLOAT, allowNull: false },
        barMount: { type: DataTypes.STRING(30), allowNull: false },
        pricePaid: { type: DataTypes.FLOAT, allowNull: true },
        currency: { type: DataTypes.STRING(3), allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'grinders' },
    );
  }
}

/** A member's jig, with the distance at which it holds the blade's plane from the bar's axis (mm). */
export class Jig extends Model<InferAttributes<Jig>, InferCreationAttributes<Jig>> {
  declare id: CreationOptional<number>;
  declare ownerId: number;
  declare name: string;
  declare offsetMm: number;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Jig.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        ownerId: { type: DataTypes.INTEGER, allowNull: false },
        name: { type: DataTypes.STRING(120), allowNull: false },
        offsetMm: { type: DataTypes.FLOAT, allowNull: false },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'jigs' },
    );
  }
}

/** A saved way to hold one tool: a jig, a projection (mm) and the wanted angle per side (°). */
export class Setup extends Model<InferAttributes<Setup>, InferCreationAttributes<Setup>> {
  declare id: CreationOptional<number>;
  declare ownerId: number;
  declare name: string;
  declare jigId: number | null;
  declare projectionMm: number;
  declare perSideDeg: number;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Setup.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        ownerId: { type: DataTypes.INTEGER, allowNull: false },
        name: { type: DataTypes.STRING(120), allowNull: false },
        jigId: { type: DataTypes.INTEGER, allowNull: true },
        projectionMm: { type: DataTypes.FLOAT, allowNull: false },
        perSideDeg: { type: DataTypes.FLOAT, allowNull: false },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'setups' },
    );
  }
}

/** A price a member paid for an abrasive (no shop named): amount, ISO 4217 currency, date, new or used. */
export class PriceReport extends Model<InferAttributes<PriceReport>, InferCreationAttributes<PriceReport>> {
  declare id: CreationOptional<number>;
  declare abrasiveId: number;
  declare reporterId: number;
  declare price: number;
  declare currency: string;
  declare paidOn: string;
  declare condition: string;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    PriceReport.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        abrasiveId: { type: DataTypes.INTEGER, allowNull: false },
        reporterId: { type: DataTypes.INTEGER, allowNull: false },
        price: { type: DataTypes.FLOAT, allowNull: false },
        currency: { type: DataTypes.STRING(3), allowNull: false },
        paidOn: { type: DataTypes.DATEONLY, allowNull: false },
        condition: { type: DataTypes.STRING(10), allowNull: false },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'price_reports' },
    );
  }
}
