import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';
import type { ResultInput, ResultRevisionStatus, ResultStatus } from '@shared/schemas/result';
import type { DerivedStep } from '@shared/progression';
import type { AccountFace, User } from './user';
import type { Abrasive, Method, Steel } from './reference-pages';

/**
 * One measured edge. `input` keeps exactly what was entered; the columns beside it are derived
 * from it on every write (particle size, grit band as whole φ, HRC, angles, median reading).
 */
export class Result extends Model<InferAttributes<Result>, InferCreationAttributes<Result>> {
  declare id: CreationOptional<number>;
  declare authorId: number;
  declare status: ResultStatus;
  declare steelId: number;
  declare abrasiveId: number;
  declare sharpnessMethodId: number;
  declare retentionMethodId: number | null;
  declare input: ResultInput;
  declare material: string;
  declare hrc: number;
  declare gritStandard: string;
  declare gritGrade: string;
  declare gritUm: number;
  /** Lower edge of the whole-φ grit band (Krumbein φ = −log2(d / 1 mm)), so larger is finer. */
  declare gritPhi: number;
  declare perSideDeg: number;
  declare inclusiveDeg: number;
  declare sharpnessMedianG: number;
  declare retentionCuts: number | null;
  /** The steps before the final abrasive with their derived µm (migration 0011). */
  declare progression: CreationOptional<DerivedStep[]>;
  declare progressionSteps: CreationOptional<number>;
  /** Materials met along the progression, ",cbn,diamond," ('' for none). */
  declare progressionMaterials: CreationOptional<string>;
  declare notesHtml: CreationOptional<string>;
  declare approvedAt: Date | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare author?: NonAttribute<User>;
  declare steel?: NonAttribute<Steel>;
  declare abrasive?: NonAttribute<Abrasive>;
  declare sharpnessMethod?: NonAttribute<Method>;
  declare retentionMethod?: NonAttribute<Method>;
  declare events?: NonAttribute<ResultEvent[]>;

  static initModel(sequelize: Sequelize) {
    Result.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        authorId: { type: DataTypes.INTEGER, allowNull: false },
        status: { type: DataTypes.STRING(20), allowNull: false },
        steelId: { type: DataTypes.INTEGER, allowNull: false },
        abrasiveId: { type: DataTypes.INTEGER, allowNull: false },
        sharpnessMethodId: { type: DataTypes.INTEGER, allowNull: false },
        retentionMethodId: { type: DataTypes.INTEGER, allowNull: true },
        input: { type: DataTypes.JSON, allowNull: false },
        material: { type: DataTypes.STRING(30), allowNull: false },
        hrc: { type: DataTypes.FLOAT, allowNull: false },
        gritStandard: { type: DataTypes.STRING(20), allowNull: false },
        gritGrade: { type: DataTypes.STRING(40), allowNull: false },
        gritUm: { type: DataTypes.FLOAT, allowNull: false },
        gritPhi: { type: DataTypes.INTEGER, allowNull: false },
        perSideDeg: { type: DataTypes.FLOAT, allowNull: false },
        inclusiveDeg: { type: DataTypes.FLOAT, allowNull: false },
        sharpnessMedianG: { type: DataTypes.FLOAT, allowNull: false },
        retentionCuts: { type: DataTypes.INTEGER, allowNull: true },
        progression: { type: DataTypes.JSON, allowNull: false, defaultValue: [] },
        progressionSteps: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        progressionMaterials: { type: DataTypes.STRING(200), allowNull: false, defaultValue: '' },
        notesHtml: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        approvedAt: { type: DataTypes.DATE, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'results' },
    );
  }
}

/** One state change of a result: who, when, from which state to which, and why. */
export class ResultEvent extends Model<InferAttributes<ResultEvent>, InferCreationAttributes<ResultEvent>> {
  declare id: CreationOptional<number>;
  declare resultId: number;
  declare actorId: number;
  declare fromStatus: ResultStatus | null;
  declare toStatus: ResultStatus;
  declare note: string | null;
  declare createdAt: CreationOptional<Date>;
  declare actor?: NonAttribute<User>;

  static initModel(sequelize: Sequelize) {
    ResultEvent.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        resultId: { type: DataTypes.INTEGER, allowNull: false },
        actorId: { type: DataTypes.INTEGER, allowNull: false },
        fromStatus: { type: DataTypes.STRING(20), allowNull: true },
        toStatus: { type: DataTypes.STRING(20), allowNull: false },
        note: { type: DataTypes.TEXT, allowNull: true },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'result_events', updatedAt: false },
    );
  }
}

/**
 * One version of a result's input, numbered per result (migration 0010). Applied at once to a
 * result not yet published; for a published one, `pending` until a moderator decides.
 */
export class ResultRevision extends Model<InferAttributes<ResultRevision>, InferCreationAttributes<ResultRevision>> {
  declare id: CreationOptional<number>;
  declare resultId: number;
  declare number: number;
  declare authorId: number;
  declare input: ResultInput;
  declare status: ResultRevisionStatus;
  declare reviewedById: number | null;
  declare note: string | null;
  declare reviewedAt: Date | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare author?: NonAttribute<User>;
  declare reviewer?: NonAttribute<User>;
  declare result?: NonAttribute<Result>;

  static initModel(sequelize: Sequelize) {
    ResultRevision.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        resultId: { type: DataTypes.INTEGER, allowNull: false },
        number: { type: DataTypes.INTEGER, allowNull: false },
        authorId: { type: DataTypes.INTEGER, allowNull: false },
        input: { type: DataTypes.JSON, allowNull: false },
        status: { type: DataTypes.STRING(20), allowNull: false },
        reviewedById: { type: DataTypes.INTEGER, allowNull: true },
        note: { type: DataTypes.TEXT, allowNull: true },
        reviewedAt: { type: DataTypes.DATE, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'result_revisions' },
    );
  }
}

/** The comparison cell model lives in ./comparison-cell.ts (whole- and half-φ bands, migration 0003). */
export { ComparisonCell } from './comparison-cell';

/**
 * What presentResultSummary reads of a result: its derived columns, the pages it refers to, its
 * author's public face and (for insiders) its trail. A Result with its includes is one; the
 * public list builds plain ones from a raw read (queries/results.ts).
 */
export type SummarisableResult = Pick<
  Result,
  'id' | 'status' | 'createdAt' | 'updatedAt' | 'authorId' | 'material' | 'gritUm' | 'gritStandard' | 'gritGrade' | 'gritPhi' | 'hrc' | 'perSideDeg' | 'inclusiveDeg' | 'sharpnessMedianG'
> & {
  author?: AccountFace | null;
  steel?: { slug: string; name: string } | null;
  abrasive?: { slug: string; name: string; bond: string } | null;
  sharpnessMethod?: { name: string } | null;
  events?: Pick<ResultEvent, 'id' | 'fromStatus' | 'toStatus' | 'note' | 'createdAt' | 'actor'>[];
};
