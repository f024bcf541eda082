import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { Actor, Role } from '@shared/permissions';

/** An account's public face, as presenters/user.ts presentAccount gives it. */
export type AccountFace = Pick<User, 'handle' | 'displayName' | 'role'>;

/** A person with an account; `oauthSubject` is the provider's stable id for them. */
export class User extends Model<InferAttributes<User>, InferCreationAttributes<User>> {
  declare id: CreationOptional<number>;
  declare handle: string;
  declare displayName: string;
  declare email: string | null;
  declare role: Role;
  declare banned: CreationOptional<boolean>;
  declare oauthSubject: string;
  declare bio: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  /** This account as the policy sees it (shared/permissions.ts). */
  asActor(): Actor {
    return { id: this.id, role: this.role, banned: this.banned };
  }

  static initModel(sequelize: Sequelize) {
    User.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        handle: { type: DataTypes.STRING(40), allowNull: false, unique: true },
        displayName: { type: DataTypes.STRING(80), allowNull: false },
        email: { type: DataTypes.STRING(200), allowNull: true },
        role: { type: DataTypes.STRING(20), allowNull: false, defaultValue: 'member' },
        banned: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        oauthSubject: { type: DataTypes.STRING(200), allowNull: false, unique: true },
        bio: { type: DataTypes.TEXT, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'users' },
    );
  }
}
