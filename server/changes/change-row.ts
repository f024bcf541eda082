import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** One row of the `changes` table (migration 0009): a kind of change and its keys as JSON text. */
export class ChangeRow extends Model<InferAttributes<ChangeRow>, InferCreationAttributes<ChangeRow>> {
  declare id: CreationOptional<number>;
  declare kind: string;
  declare keys: string;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    ChangeRow.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        kind: { type: DataTypes.STRING(32), allowNull: false },
        keys: { type: DataTypes.TEXT, allowNull: false },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'changes', updatedAt: false },
    );
  }
}
