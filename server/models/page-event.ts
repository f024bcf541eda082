import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';
import type { User } from './user';

/** What a moderator did to a page as a whole (not its content): protect, unprotect, merge. */
export type PageEventAction = 'protect' | 'unprotect' | 'merged-into' | 'absorbed';

/** One page-level action, kept for the page's history: who, when, what and why. Never updated. */
export class PageEvent extends Model<InferAttributes<PageEvent>, InferCreationAttributes<PageEvent>> {
  declare id: CreationOptional<number>;
  declare pageType: 'steel' | 'abrasive' | 'method';
  declare pageId: number;
  declare actorId: number;
  declare action: PageEventAction;
  declare note: string | null;
  /** For merges: the other page's slug and how many results moved. */
  declare detail: Record<string, unknown> | null;
  declare createdAt: CreationOptional<Date>;
  declare actor?: NonAttribute<User>;

  static initModel(sequelize: Sequelize) {
    PageEvent.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        pageType: { type: DataTypes.STRING(20), allowNull: false },
        pageId: { type: DataTypes.INTEGER, allowNull: false },
        actorId: { type: DataTypes.INTEGER, allowNull: false },
        action: { type: DataTypes.STRING(20), allowNull: false },
        note: { type: DataTypes.TEXT, allowNull: true },
        detail: { type: DataTypes.JSON, allowNull: true },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'page_events', updatedAt: false },
    );
  }
}
