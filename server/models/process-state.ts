import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

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

/** One client's count in one rate limit's window (migration 0013), keyed by limit and client. */
export class RateLimitCount extends Model<InferAttributes<RateLimitCount>, InferCreationAttributes<RateLimitCount>> {
  declare key: string;
  declare hits: number;
  declare resetAt: Date;

  static initModel(sequelize: Sequelize) {
    RateLimitCount.init(
      {
        key: { type: DataTypes.STRING(300), primaryKey: true },
        hits: { type: DataTypes.INTEGER, allowNull: false },
        resetAt: { type: DataTypes.DATE, allowNull: false },
      },
      { sequelize, tableName: 'rate_limit_counts', timestamps: false },
    );
  }
}
