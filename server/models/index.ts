import type { Model, ModelStatic, Sequelize } from 'sequelize';
import { User } from './user';
import { Abrasive, Method, PageRevision, Steel } from './reference-pages';
import { ComparisonCell, Result, ResultEvent, ResultRevision } from './result';
import { PageEvent } from './page-event';
import { ChangeRow } from '../changes/change-row';
import { pageRowsOf, pagesOf, recordWritesOf, resultsOf, resultTrailOf, rowsOf, settingsOf } from '../changes/model-writes';
import { Grinder, Jig, PriceReport, Setup, Wheel, WheelMeasurement } from './wheel';
import { RateLimitHit, SignInState } from './process-state';
import { ApiToken, AuditEntry, Flag, Follow, ImportBatch, ImportBatchResult, NotificationSetting, Photo, PublisherApplication, SiteSetting, initPublishingModels } from './publishing';

/** Initialises every model on `sequelize` and declares their associations. */
export function initModels(sequelize: Sequelize) {
  for (const m of [User, Steel, Abrasive, Method, PageRevision, Result, ResultEvent, ResultRevision, ComparisonCell, Wheel, WheelMeasurement, Grinder, Jig, Setup, PriceReport]) m.initModel(sequelize);
  Result.belongsTo(User, { as: 'author', foreignKey: 'authorId' });
  Result.belongsTo(Steel, { as: 'steel', foreignKey: 'steelId' });
  Result.belongsTo(Abrasive, { as: 'abrasive', foreignKey: 'abrasiveId' });
  Result.belongsTo(Method, { as: 'sharpnessMethod', foreignKey: 'sharpnessMethodId' });
  Result.belongsTo(Method, { as: 'retentionMethod', foreignKey: 'retentionMethodId' });
  Result.hasMany(ResultEvent, { as: 'events', foreignKey: 'resultId' });
  ResultEvent.belongsTo(User, { as: 'actor', foreignKey: 'actorId' });
  Result.hasMany(ResultRevision, { as: 'revisions', foreignKey: 'resultId' });
  ResultRevision.belongsTo(Result, { as: 'result', foreignKey: 'resultId' });
  ResultRevision.belongsTo(User, { as: 'author', foreignKey: 'authorId' });
  ResultRevision.belongsTo(User, { as: 'reviewer', foreignKey: 'reviewedById' });
  PageRevision.belongsTo(User, { as: 'author', foreignKey: 'authorId' });
  PageRevision.belongsTo(User, { as: 'reviewer', foreignKey: 'reviewedById' });
  // The revisions a revision names, read for their numbers (a history says "restores revision 3").
  PageRevision.belongsTo(PageRevision, { as: 'base', foreignKey: 'baseRevisionId', constraints: false });
  PageRevision.belongsTo(PageRevision, { as: 'revertedFrom', foreignKey: 'revertedFromId', constraints: false });
  PageRevision.belongsTo(PageRevision, { as: 'appliedFrom', foreignKey: 'appliedFromId', constraints: false });
  PageEvent.initModel(sequelize);
  PageEvent.belongsTo(User, { as: 'actor', foreignKey: 'actorId' });
  Wheel.hasMany(WheelMeasurement, { as: 'measurements', foreignKey: 'wheelId' });
  initPublishingModels(sequelize);
  ChangeRow.initModel(sequelize);
  SignInState.initModel(sequelize);
  RateLimitHit.initModel(sequelize);
  // Every write through these models records its change in its transaction (server/changes/).
  // The comparison cells are not here: the feed itself refreshes them from the result changes.
  const recorded: [ModelStatic<Model>, Parameters<typeof recordWritesOf>[1]][] = [
    [Result, resultsOf], [ResultEvent, resultTrailOf], [ResultRevision, resultTrailOf],
    [Steel, pagesOf('steel')], [Abrasive, pagesOf('abrasive')], [Method, pagesOf('method')], [PageRevision, pageRowsOf], [PageEvent, pageRowsOf],
    [User, rowsOf('account')], [ApiToken, rowsOf('token')], [SiteSetting, settingsOf], [Flag, rowsOf('flag')], [Photo, rowsOf('photo')],
    [Follow, rowsOf('follow')], [PublisherApplication, rowsOf('application')], [ImportBatch, rowsOf('import')], [ImportBatchResult, rowsOf('import', 'batchId')],
    [Wheel, rowsOf('wheel')], [WheelMeasurement, rowsOf('wheel', 'wheelId')], [NotificationSetting, rowsOf('mail-settings', 'userId')], [AuditEntry, rowsOf('audit')],
    [Grinder, rowsOf('workshop', 'ownerId')], [Jig, rowsOf('workshop', 'ownerId')], [Setup, rowsOf('workshop', 'ownerId')], [PriceReport, rowsOf('price', 'abrasiveId')],
  ];
  for (const [model, describe] of recorded) recordWritesOf(model, describe);
}

export { User, Steel, Abrasive, Method, PageRevision, Result, ResultEvent, ResultRevision, ComparisonCell, Wheel, WheelMeasurement, Grinder, Jig, Setup, PriceReport };
export { PublisherApplication, ApiToken, ImportBatch, ImportBatchResult, Photo, Flag, AuditEntry, Follow, NotificationSetting, SiteSetting };
export { PageEvent };
export type { AccountFace } from './user';
export type { SummarisableResult } from './result';
export { SignInState, RateLimitHit };

/**
 * A reference page's long columns: its rich-text body and its references. Whatever lists pages
 * or names them beside a result leaves them out; reading and parsing their JSON was most of the
 * time of a submission and of a list.
 */
export const PAGE_TEXT_COLUMNS = ['body', 'citations', 'sources'];
