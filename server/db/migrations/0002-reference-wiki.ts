import { DataTypes, type QueryInterface } from 'sequelize';

const PAGE_TABLES = ['steels', 'abrasives', 'methods'] as const;

/**
 * The reference wiki: page protection, redirects of merged pages, which citation an infobox
 * value came from, an abrasive's price note; on revisions the revision an edit started from,
 * what a revert restored, the review of a proposal; and a trail of page-level actions
 * (protect, unprotect, merge) that are not content revisions.
 */
export async function up({ context: qi }: { context: QueryInterface }) {
  for (const table of PAGE_TABLES) {
    await qi.addColumn(table, 'isProtected', { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false });
    await qi.addColumn(table, 'mergedIntoId', { type: DataTypes.INTEGER, allowNull: true });
    // { field: index into citations }, e.g. { "composition": 0 }.
    await qi.addColumn(table, 'sources', { type: DataTypes.JSON, allowNull: false, defaultValue: '{}' });
  }
  await qi.addColumn('abrasives', 'priceNote', { type: DataTypes.STRING(120), allowNull: true });

  await qi.addColumn('page_revisions', 'kind', { type: DataTypes.STRING(20), allowNull: false, defaultValue: 'edit' });
  await qi.addColumn('page_revisions', 'baseRevisionId', { type: DataTypes.INTEGER, allowNull: true });
  await qi.addColumn('page_revisions', 'revertedFromId', { type: DataTypes.INTEGER, allowNull: true });
  await qi.addColumn('page_revisions', 'appliedFromId', { type: DataTypes.INTEGER, allowNull: true });
  await qi.addColumn('page_revisions', 'reviewedById', { type: DataTypes.INTEGER, allowNull: true });
  await qi.addColumn('page_revisions', 'reviewNote', { type: DataTypes.TEXT, allowNull: true });
  await qi.addColumn('page_revisions', 'reviewedAt', { type: DataTypes.DATE, allowNull: true });
  await qi.addIndex('page_revisions', ['status', 'createdAt']);

  await qi.createTable('page_events', {
    id: { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true },
    pageType: { type: DataTypes.STRING(20), allowNull: false },
    pageId: { type: DataTypes.INTEGER, allowNull: false },
    actorId: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'users', key: 'id' } },
    action: { type: DataTypes.STRING(20), allowNull: false },
    note: { type: DataTypes.TEXT, allowNull: true },
    detail: { type: DataTypes.JSON, allowNull: true },
    createdAt: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('page_events', ['pageType', 'pageId']);
}

export async function down({ context: qi }: { context: QueryInterface }) {
  await qi.dropTable('page_events');
  await qi.removeIndex('page_revisions', ['status', 'createdAt']);
  for (const column of ['reviewedAt', 'reviewNote', 'reviewedById', 'appliedFromId', 'revertedFromId', 'baseRevisionId', 'kind']) {
    await qi.removeColumn('page_revisions', column);
  }
  await qi.removeColumn('abrasives', 'priceNote');
  for (const table of PAGE_TABLES) {
    for (const column of ['sources', 'mergedIntoId', 'isProtected']) await qi.removeColumn(table, column);
  }
}
