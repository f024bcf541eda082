import { DataTypes, type QueryInterface } from 'sequelize';

const id = { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true };
const user = (allowNull = false) => ({ type: DataTypes.INTEGER, allowNull, references: { model: 'users', key: 'id' } });
const createdAt = { type: DataTypes.DATE, allowNull: false };
const updatedAt = { type: DataTypes.DATE, allowNull: false };

/**
 * Publishing and curation: publisher applications, API tokens (hashed), import batches,
 * photos, flags, the audit log, follows, e-mail settings and site settings.
 */
export async function up({ context: qi }: { context: QueryInterface }) {
  await qi.createTable('publisher_applications', {
    id,
    userId: user(),
    workshop: { type: DataTypes.STRING(120), allowNull: false },
    instruments: { type: DataTypes.TEXT, allowNull: false },
    link: { type: DataTypes.STRING(300), allowNull: false },
    status: { type: DataTypes.STRING(20), allowNull: false },
    decidedById: user(true),
    decisionNote: { type: DataTypes.TEXT, allowNull: true },
    decidedAt: { type: DataTypes.DATE, allowNull: true },
    createdAt,
    updatedAt,
  });
  await qi.addIndex('publisher_applications', ['userId']);
  await qi.addIndex('publisher_applications', ['status', 'createdAt']);

  await qi.createTable('api_tokens', {
    id,
    userId: user(),
    name: { type: DataTypes.STRING(60), allowNull: false },
    tokenHash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
    prefix: { type: DataTypes.STRING(16), allowNull: false },
    lastUsedAt: { type: DataTypes.DATE, allowNull: true },
    revokedAt: { type: DataTypes.DATE, allowNull: true },
    createdAt,
    updatedAt,
  });
  await qi.addIndex('api_tokens', ['userId']);

  await qi.createTable('import_batches', {
    id,
    publisherId: user(),
    rows: { type: DataTypes.INTEGER, allowNull: false },
    status: { type: DataTypes.STRING(20), allowNull: false },
    createdAt,
    updatedAt,
  });
  await qi.createTable('import_batch_results', {
    batchId: { type: DataTypes.INTEGER, allowNull: false, primaryKey: true, references: { model: 'import_batches', key: 'id' } },
    resultId: { type: DataTypes.INTEGER, allowNull: false, primaryKey: true, references: { model: 'results', key: 'id' } },
  });
  await qi.addIndex('import_batch_results', ['resultId']);

  await qi.createTable('photos', {
    id,
    resultId: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'results', key: 'id' } },
    uploaderId: user(),
    objectKey: { type: DataTypes.STRING(200), allowNull: false, unique: true },
    thumbKey: { type: DataTypes.STRING(200), allowNull: false, unique: true },
    alt: { type: DataTypes.STRING(300), allowNull: false },
    width: { type: DataTypes.INTEGER, allowNull: false },
    height: { type: DataTypes.INTEGER, allowNull: false },
    bytes: { type: DataTypes.INTEGER, allowNull: false },
    removedAt: { type: DataTypes.DATE, allowNull: true },
    createdAt,
    updatedAt,
  });
  await qi.addIndex('photos', ['resultId']);

  await qi.createTable('flags', {
    id,
    subjectType: { type: DataTypes.STRING(20), allowNull: false },
    subjectId: { type: DataTypes.INTEGER, allowNull: false },
    reporterId: user(),
    reason: { type: DataTypes.STRING(40), allowNull: false },
    text: { type: DataTypes.TEXT, allowNull: true },
    status: { type: DataTypes.STRING(20), allowNull: false },
    resolvedById: user(true),
    resolutionNote: { type: DataTypes.TEXT, allowNull: true },
    resolvedAt: { type: DataTypes.DATE, allowNull: true },
    createdAt,
    updatedAt,
  });
  await qi.addIndex('flags', ['status', 'createdAt']);
  await qi.addIndex('flags', ['subjectType', 'subjectId']);

  await qi.createTable('audit_entries', {
    id,
    actorId: user(),
    action: { type: DataTypes.STRING(60), allowNull: false },
    outcome: { type: DataTypes.STRING(20), allowNull: false },
    subjectType: { type: DataTypes.STRING(30), allowNull: false },
    subjectId: { type: DataTypes.INTEGER, allowNull: true },
    reason: { type: DataTypes.TEXT, allowNull: true },
    details: { type: DataTypes.JSON, allowNull: true },
    createdAt,
  });
  await qi.addIndex('audit_entries', ['createdAt']);
  await qi.addIndex('audit_entries', ['actorId', 'createdAt']);
  await qi.addIndex('audit_entries', ['subjectType', 'subjectId']);

  await qi.createTable('follows', {
    id,
    userId: user(),
    pageType: { type: DataTypes.STRING(20), allowNull: false },
    pageId: { type: DataTypes.INTEGER, allowNull: false },
    createdAt,
  });
  await qi.addIndex('follows', ['userId', 'pageType', 'pageId'], { unique: true });
  await qi.addIndex('follows', ['pageType', 'pageId']);

  await qi.createTable('notification_settings', {
    userId: { ...user(), primaryKey: true },
    review: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
    application: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
    digest: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
    lastDigestAt: { type: DataTypes.DATE, allowNull: true },
    updatedAt,
  });

  await qi.createTable('site_settings', {
    key: { type: DataTypes.STRING(60), primaryKey: true },
    value: { type: DataTypes.JSON, allowNull: false },
    updatedAt,
  });
}

export async function down({ context: qi }: { context: QueryInterface }) {
  for (const t of ['site_settings', 'notification_settings', 'follows', 'audit_entries', 'flags', 'photos', 'import_batch_results', 'import_batches', 'api_tokens', 'publisher_applications']) {
    await qi.dropTable(t);
  }
}
