import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';
import type { ApplicationStatus, EmailTopic, FlagReason, FlagStatus, FlagSubject, FollowablePage } from '@shared/schemas/publishing';
import { User } from './user';
import { Result } from './result';

/** A member's request to become a publisher, and an admin's decision on it. */
export class PublisherApplication extends Model<InferAttributes<PublisherApplication>, InferCreationAttributes<PublisherApplication>> {
  declare id: CreationOptional<number>;
  declare userId: number;
  declare workshop: string;
  declare instruments: string;
  declare link: string;
  declare status: ApplicationStatus;
  declare decidedById: number | null;
  declare decisionNote: string | null;
  declare decidedAt: Date | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare applicant?: NonAttribute<User>;
  declare decidedBy?: NonAttribute<User>;

  static initModel(sequelize: Sequelize) {
    PublisherApplication.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        userId: { type: DataTypes.INTEGER, allowNull: false },
        workshop: { type: DataTypes.STRING(120), allowNull: false },
        instruments: { type: DataTypes.TEXT, allowNull: false },
        link: { type: DataTypes.STRING(300), allowNull: false },
        status: { type: DataTypes.STRING(20), allowNull: false },
        decidedById: { type: DataTypes.INTEGER, allowNull: true },
        decisionNote: { type: DataTypes.TEXT, allowNull: true },
        decidedAt: { type: DataTypes.DATE, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'publisher_applications' },
    );
  }
}

/** A publisher's API token; only the SHA-256 of the token is kept, and a short prefix to tell tokens apart. */
export class ApiToken extends Model<InferAttributes<ApiToken>, InferCreationAttributes<ApiToken>> {
  declare id: CreationOptional<number>;
  declare userId: number;
  declare name: string;
  declare tokenHash: string;
  declare prefix: string;
  declare lastUsedAt: Date | null;
  declare revokedAt: Date | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare user?: NonAttribute<User>;

  static initModel(sequelize: Sequelize) {
    ApiToken.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        userId: { type: DataTypes.INTEGER, allowNull: false },
        name: { type: DataTypes.STRING(60), allowNull: false },
        tokenHash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
        prefix: { type: DataTypes.STRING(16), allowNull: false },
        lastUsedAt: { type: DataTypes.DATE, allowNull: true },
        revokedAt: { type: DataTypes.DATE, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'api_tokens' },
    );
  }
}

/** One bulk import by a publisher: how many rows, and whether its results still await review. */
export class ImportBatch extends Model<InferAttributes<ImportBatch>, InferCreationAttributes<ImportBatch>> {
  declare id: CreationOptional<number>;
  declare publisherId: number;
  declare rows: number;
  declare status: 'pending' | 'approved';
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare publisher?: NonAttribute<User>;

  static initModel(sequelize: Sequelize) {
    ImportBatch.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        publisherId: { type: DataTypes.INTEGER, allowNull: false },
        rows: { type: DataTypes.INTEGER, allowNull: false },
        status: { type: DataTypes.STRING(20), allowNull: false },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'import_batches' },
    );
  }
}

/** Which results came in with which import. */
export class ImportBatchResult extends Model<InferAttributes<ImportBatchResult>, InferCreationAttributes<ImportBatchResult>> {
  declare batchId: number;
  declare resultId: number;

  static initModel(sequelize: Sequelize) {
    ImportBatchResult.init(
      {
        batchId: { type: DataTypes.INTEGER, primaryKey: true },
        resultId: { type: DataTypes.INTEGER, primaryKey: true },
      },
      { sequelize, tableName: 'import_batch_results', timestamps: false },
    );
  }
}

/** A photo of a result, stored re-encoded under generated keys in the object store. */
export class Photo extends Model<InferAttributes<Photo>, InferCreationAttributes<Photo>> {
  declare id: CreationOptional<number>;
  declare resultId: number;
  declare uploaderId: number;
  declare objectKey: string;
  declare thumbKey: string;
  declare alt: string;
  /** Pixels of the stored (re-encoded) image. */
  declare width: number;
  declare height: number;
  declare bytes: number;
  declare removedAt: Date | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare result?: NonAttribute<Result>;

  static initModel(sequelize: Sequelize) {
    Photo.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        resultId: { type: DataTypes.INTEGER, allowNull: false },
        uploaderId: { type: DataTypes.INTEGER, allowNull: false },
        objectKey: { type: DataTypes.STRING(200), allowNull: false, unique: true },
        thumbKey: { type: DataTypes.STRING(200), allowNull: false, unique: true },
        alt: { type: DataTypes.STRING(300), allowNull: false },
        width: { type: DataTypes.INTEGER, allowNull: false },
        height: { type: DataTypes.INTEGER, allowNull: false },
        bytes: { type: DataTypes.INTEGER, allowNull: false },
        removedAt: { type: DataTypes.DATE, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'photos' },
    );
  }
}

/** A member's flag on an approved result or a page; it waits on the review desk until a moderator closes it. */
export class Flag extends Model<InferAttributes<Flag>, InferCreationAttributes<Flag>> {
  declare id: CreationOptional<number>;
  declare subjectType: FlagSubject;
  declare subjectId: number;
  declare reporterId: number;
  declare reason: FlagReason;
  declare text: string | null;
  declare status: FlagStatus;
  declare resolvedById: number | null;
  declare resolutionNote: string | null;
  declare resolvedAt: Date | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare reporter?: NonAttribute<User>;

  static initModel(sequelize: Sequelize) {
    Flag.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        subjectType: { type: DataTypes.STRING(20), allowNull: false },
        subjectId: { type: DataTypes.INTEGER, allowNull: false },
        reporterId: { type: DataTypes.INTEGER, allowNull: false },
        reason: { type: DataTypes.STRING(40), allowNull: false },
        text: { type: DataTypes.TEXT, allowNull: true },
        status: { type: DataTypes.STRING(20), allowNull: false },
        resolvedById: { type: DataTypes.INTEGER, allowNull: true },
        resolutionNote: { type: DataTypes.TEXT, allowNull: true },
        resolvedAt: { type: DataTypes.DATE, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'flags' },
    );
  }
}

const refuseChange = () => {
  throw new Error('Audit entries are never changed or deleted.');
};

/**
 * One moderator or admin action: who, what, on what, when, why, and whether it was done or
 * refused. Rows are only ever inserted; the model refuses updates and deletes.
 */
export class AuditEntry extends Model<InferAttributes<AuditEntry>, InferCreationAttributes<AuditEntry>> {
  declare id: CreationOptional<number>;
  declare actorId: number;
  /** What was attempted, e.g. "result.approve", "publisher-application.decline". */
  declare action: string;
  declare outcome: 'done' | 'refused';
  declare subjectType: string;
  declare subjectId: number | null;
  declare reason: string | null;
  declare details: Record<string, unknown> | null;
  declare createdAt: CreationOptional<Date>;
  declare actor?: NonAttribute<User>;

  static initModel(sequelize: Sequelize) {
    AuditEntry.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        actorId: { type: DataTypes.INTEGER, allowNull: false },
        action: { type: DataTypes.STRING(60), allowNull: false },
        outcome: { type: DataTypes.STRING(20), allowNull: false },
        subjectType: { type: DataTypes.STRING(30), allowNull: false },
        subjectId: { type: DataTypes.INTEGER, allowNull: true },
        reason: { type: DataTypes.TEXT, allowNull: true },
        details: { type: DataTypes.JSON, allowNull: true },
        createdAt: DataTypes.DATE,
      },
      {
        sequelize,
        tableName: 'audit_entries',
        updatedAt: false,
        hooks: { beforeUpdate: refuseChange, beforeBulkUpdate: refuseChange, beforeDestroy: refuseChange, beforeBulkDestroy: refuseChange, beforeUpsert: refuseChange },
      },
    );
  }
}

/** A member follows a steel or abrasive page for the weekly digest. */
export class Follow extends Model<InferAttributes<Follow>, InferCreationAttributes<Follow>> {
  declare id: CreationOptional<number>;
  declare userId: number;
  declare pageType: FollowablePage;
  declare pageId: number;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Follow.init(
      {
        id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
        userId: { type: DataTypes.INTEGER, allowNull: false },
        pageType: { type: DataTypes.STRING(20), allowNull: false },
        pageId: { type: DataTypes.INTEGER, allowNull: false },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'follows', updatedAt: false },
    );
  }
}

/** Which e-mail a member wants; a missing row means every kind is on. */
export class NotificationSetting extends Model<InferAttributes<NotificationSetting>, InferCreationAttributes<NotificationSetting>> {
  declare userId: number;
  declare review: CreationOptional<boolean>;
  declare application: CreationOptional<boolean>;
  declare digest: CreationOptional<boolean>;
  declare lastDigestAt: Date | null;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    NotificationSetting.init(
      {
        userId: { type: DataTypes.INTEGER, primaryKey: true },
        review: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
        application: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
        digest: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
        lastDigestAt: { type: DataTypes.DATE, allowNull: true },
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'notification_settings', createdAt: false },
    );
  }

  /** Whether mail of `topic` is on. */
  wants(topic: EmailTopic): boolean {
    return this[topic];
  }
}

/** One site setting (admin): a key and its JSON value. */
export class SiteSetting extends Model<InferAttributes<SiteSetting>, InferCreationAttributes<SiteSetting>> {
  declare key: string;
  declare value: unknown;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    SiteSetting.init(
      {
        key: { type: DataTypes.STRING(60), primaryKey: true },
        value: { type: DataTypes.JSON, allowNull: false },
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'site_settings', createdAt: false },
    );
  }
}

/** Initialises the publishing and curation models and their associations (called by initModels). */
export function initPublishingModels(sequelize: Sequelize) {
  for (const m of [PublisherApplication, ApiToken, ImportBatch, ImportBatchResult, Photo, Flag, AuditEntry, Follow, NotificationSetting, SiteSetting]) m.initModel(sequelize);
  PublisherApplication.belongsTo(User, { as: 'applicant', foreignKey: 'userId' });
  PublisherApplication.belongsTo(User, { as: 'decidedBy', foreignKey: 'decidedById' });
  ApiToken.belongsTo(User, { as: 'user', foreignKey: 'userId' });
  ImportBatch.belongsTo(User, { as: 'publisher', foreignKey: 'publisherId' });
  ImportBatchResult.belongsTo(Result, { as: 'result', foreignKey: 'resultId' });
  Photo.belongsTo(Result, { as: 'result', foreignKey: 'resultId' });
  Flag.belongsTo(User, { as: 'reporter', foreignKey: 'reporterId' });
  AuditEntry.belongsTo(User, { as: 'actor', foreignKey: 'actorId' });
}
