import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/**
 * A sign-in under way (migration 0013): passport-oauth2's state handle, the PKCE verifier, where
 * to return, and the value of the browser's sign-in cookie. Single-use, ten minutes.
 */
export class SignInState extends Model<InferAttributes<SignInState>, InferCreationAttributes<SignInState>> {
  declare handle: string;
  declare verifier: string;
  declare returnTo: string;
  declare browser: string;
  declare expiresAt: Date;

  static initModel(sequelize: Sequelize) {
    SignInState.init(
      {
        handle: { type: DataTypes.STRING(64), primaryKey: true },
        verifier: { type: DataTypes.STRING(200), allowNull: false },
        returnTo: { type: DataTypes.STRING(2000), allowNull: false },
        browser: { type: DataTypes.STRING(64), allowNull: false },
        expiresAt: { type: DataTypes.DATE, allowNull: false },
      },
      { sequelize, tableName: 'sign_in_states', timestamps: false },
    );
  }
}

/** One counted request of one client in one rate limit (migration 0013), keyed by limit and client. */
export class RateLimitHit extends Model<InferAttributes<RateLimitHit>, InferCreationAttributes<RateLimitHit>> {
  declare id: CreationOptional<number>;
  declare key: string;
  declare at: Date;

  static initModel(sequelize: Sequelize) {
    RateLimitHit.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        key: { type: DataTypes.STRING(300), allowNull: false },
        at: { type: DataTypes.DATE, allowNull: false },
      },
      { sequelize, tableName: 'rate_limit_hits', timestamps: false },
    );
  }
}
