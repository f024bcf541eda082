import { DataTypes, Model, type Transaction, type CreationOptional, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';
import type { RichTextNode } from '@shared/rich-text';
import type { User } from './user';

export interface Citation {
  title: string;
  organisation: string;
  year: number | null;
  standard?: string;
  url?: string;
  supports: string;
}

const common = {
  id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
  slug: { type: DataTypes.STRING(80), allowNull: false, unique: true },
  name: { type: DataTypes.STRING(200), allowNull: false },
  body: { type: DataTypes.JSON, allowNull: true },
  citations: { type: DataTypes.JSON, allowNull: false, defaultValue: [] },
  currentRevisionId: { type: DataTypes.INTEGER, allowNull: true },
  isProtected: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
  mergedIntoId: { type: DataTypes.INTEGER, allowNull: true },
  sources: { type: DataTypes.JSON, allowNull: false, defaultValue: {} },
  createdAt: DataTypes.DATE,
  updatedAt: DataTypes.DATE,
};

/** Which citation (index into `citations`) an infobox value came from, by field name. */
export type PageSources = Record<string, number>;

/** A steel grade's reference page. */
export class Steel extends Model<InferAttributes<Steel>, InferCreationAttributes<Steel>> {
  declare id: CreationOptional<number>;
  declare slug: string;
  declare name: string;
  declare category: string;
  declare designations: { system: string; code: string }[];
  /** wt %; min null means the standard gives only a maximum. */
  declare composition: { element: string; min: number | null; max: number }[];
  declare hardnessMinHrc: number | null;
  declare hardnessMaxHrc: number | null;
  declare body: RichTextNode | null;
  declare citations: CreationOptional<Citation[]>;
  declare currentRevisionId: CreationOptional<number | null>;
  /** Only moderators may edit a protected page. */
  declare isProtected: CreationOptional<boolean>;
  /** Set when this page was merged into another; its slug then redirects there. */
  declare mergedIntoId: CreationOptional<number | null>;
  declare sources: CreationOptional<PageSources>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Steel.init(
      {
        ...common,
        category: { type: DataTypes.STRING(30), allowNull: false },
        designations: { type: DataTypes.JSON, allowNull: false },
        composition: { type: DataTypes.JSON, allowNull: false },
        hardnessMinHrc: { type: DataTypes.FLOAT, allowNull: true },
        hardnessMaxHrc: { type: DataTypes.FLOAT, allowNull: true },
      },
      { sequelize, tableName: 'steels' },
    );
  }
}

/** An abrasive product type's reference page (generic, never a maker's product). */
export class Abrasive extends Model<InferAttributes<Abrasive>, InferCreationAttributes<Abrasive>> {
  declare id: CreationOptional<number>;
  declare slug: string;
  declare name: string;
  declare material: string;
  declare bond: string;
  declare form: string;
  declare gritStandard: string;
  declare gritGrade: string;
  /** Representative particle size of the labelled grit, µm. */
  declare gritUm: number;
  declare gritRange: { from: string; to: string } | null;
  declare wheelDiameterMm: number | null;
  declare widthMm: number | null;
  declare wears: boolean;
  declare coolant: string;
  declare sideUsable: boolean;
  /** Free-text price, if known (e.g. "about 180 EUR in 2025"); invented in the demo data. */
  declare priceNote: CreationOptional<string | null>;
  declare body: RichTextNode | null;
  declare citations: CreationOptional<Citation[]>;
  declare currentRevisionId: CreationOptional<number | null>;
  /** Only moderators may edit a protected page. */
  declare isProtected: CreationOptional<boolean>;
  /** Set when this page was merged into another; its slug then redirects there. */
  declare mergedIntoId: CreationOptional<number | null>;
  declare sources: CreationOptional<PageSources>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Abrasive.init(
      {
        ...common,
        material: { type: DataTypes.STRING(30), allowNull: false },
        bond: { type: DataTypes.STRING(30), allowNull: false },
        form: { type: DataTypes.STRING(30), allowNull: false },
        gritStandard: { type: DataTypes.STRING(20), allowNull: false },
        gritGrade: { type: DataTypes.STRING(40), allowNull: false },
        gritUm: { type: DataTypes.FLOAT, allowNull: false },
        gritRange: { type: DataTypes.JSON, allowNull: true },
        wheelDiameterMm: { type: DataTypes.FLOAT, allowNull: true },
        widthMm: { type: DataTypes.FLOAT, allowNull: true },
        wears: { type: DataTypes.BOOLEAN, allowNull: false },
        coolant: { type: DataTypes.STRING(30), allowNull: false },
        sideUsable: { type: DataTypes.BOOLEAN, allowNull: false },
        priceNote: { type: DataTypes.STRING(120), allowNull: true },
      },
      { sequelize, tableName: 'abrasives' },
    );
  }
}

/** A written test protocol; a changed protocol is a new row that `replacesId` the old one. */
export class Method extends Model<InferAttributes<Method>, InferCreationAttributes<Method>> {
  declare id: CreationOptional<number>;
  declare slug: string;
  declare name: string;
  declare version: number;
  declare replacesId: number | null;
  declare instrument: string;
  declare medium: string;
  declare readingsPerEdge: number;
  declare retentionMedium: string | null;
  declare thresholdG: number | null;
  declare body: RichTextNode | null;
  declare citations: CreationOptional<Citation[]>;
  declare currentRevisionId: CreationOptional<number | null>;
  /** Only moderators may edit a protected page. */
  declare isProtected: CreationOptional<boolean>;
  /** Set when this page was merged into another; its slug then redirects there. */
  declare mergedIntoId: CreationOptional<number | null>;
  declare sources: CreationOptional<PageSources>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Method.init(
      {
        ...common,
        version: { type: DataTypes.INTEGER, allowNull: false },
        replacesId: { type: DataTypes.INTEGER, allowNull: true },
        instrument: { type: DataTypes.STRING(200), allowNull: false },
        medium: { type: DataTypes.STRING(200), allowNull: false },
        readingsPerEdge: { type: DataTypes.INTEGER, allowNull: false },
        retentionMedium: { type: DataTypes.STRING(200), allowNull: true },
        thresholdG: { type: DataTypes.FLOAT, allowNull: true },
      },
      { sequelize, tableName: 'methods' },
    );
  }
}

/** One saved edit of a steel, abrasive or method page; never updated in place except its status. */
export class PageRevision extends Model<InferAttributes<PageRevision>, InferCreationAttributes<PageRevision>> {
  declare id: CreationOptional<number>;
  declare pageType: 'steel' | 'abrasive' | 'method';
  declare pageId: number;
  /**
   * Revision 1, 2, 3… of its page, in the order saved (migration 0014): how the history, the
   * messages and the desk name it. Set on create, inside the write's transaction (see initModel).
   */
  declare number: CreationOptional<number>;
  declare authorId: number;
  declare summary: string;
  declare fields: Record<string, unknown>;
  declare body: RichTextNode | null;
  declare status: 'live' | 'proposed' | 'declined';
  /** 'edit' (a saved form), 'revert' (restores `revertedFromId`) or 'merge' (a stale proposal applied together with later edits). */
  declare kind: CreationOptional<'edit' | 'revert' | 'merge'>;
  /** The revision the editor started from (optimistic concurrency). */
  declare baseRevisionId: CreationOptional<number | null>;
  declare revertedFromId: CreationOptional<number | null>;
  /** For kind 'merge': the approved proposal this revision applies. */
  declare appliedFromId: CreationOptional<number | null>;
  declare reviewedById: CreationOptional<number | null>;
  declare reviewNote: CreationOptional<string | null>;
  declare reviewedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare author?: NonAttribute<User>;
  declare reviewer?: NonAttribute<User>;
  /** The revisions named by baseRevisionId, revertedFromId and appliedFromId, when included (their id and number). */
  declare base?: NonAttribute<PageRevision | null>;
  declare revertedFrom?: NonAttribute<PageRevision | null>;
  declare appliedFrom?: NonAttribute<PageRevision | null>;

  static initModel(sequelize: Sequelize) {
    PageRevision.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        pageType: { type: DataTypes.STRING(20), allowNull: false },
        pageId: { type: DataTypes.INTEGER, allowNull: false },
        number: { type: DataTypes.INTEGER, allowNull: false },
        authorId: { type: DataTypes.INTEGER, allowNull: false },
        summary: { type: DataTypes.STRING(300), allowNull: false },
        fields: { type: DataTypes.JSON, allowNull: false },
        body: { type: DataTypes.JSON, allowNull: true },
        status: { type: DataTypes.STRING(20), allowNull: false },
        kind: { type: DataTypes.STRING(20), allowNull: false, defaultValue: 'edit' },
        baseRevisionId: { type: DataTypes.INTEGER, allowNull: true },
        revertedFromId: { type: DataTypes.INTEGER, allowNull: true },
        appliedFromId: { type: DataTypes.INTEGER, allowNull: true },
        reviewedById: { type: DataTypes.INTEGER, allowNull: true },
        reviewNote: { type: DataTypes.TEXT, allowNull: true },
        reviewedAt: { type: DataTypes.DATE, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'page_revisions' },
    );
    // Every new revision takes the next number of its page, read in the creating transaction:
    // on SQLite the write queue runs one write at a time; on PostgreSQL two SERIALIZABLE writes
    // that read the same last number conflict and one runs again (the unique index on page and
    // number refuses a duplicate in any case). `validate: false` would skip it: never used here.
    // (Sequelize hands `beforeValidate` the options of the save, transaction included; its types name only the validation's.)
    PageRevision.beforeValidate('numberPerPage', async (revision, options) => {
      if (!revision.isNewRecord || revision.number) return;
      const { transaction } = options as { transaction?: Transaction | null };
      const last = (await PageRevision.max('number', { where: { pageType: revision.pageType, pageId: revision.pageId }, transaction: transaction ?? undefined })) as number | null;
      revision.number = (last ?? 0) + 1;
    });
  }
}

/** A reference page of any type. */
export type PageModel = Steel | Abrasive | Method;
