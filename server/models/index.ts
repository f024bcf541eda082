import type { Sequelize } from 'sequelize';
import { User } from './user';
import { Abrasive, Method, PageRevision, Steel } from './reference-pages';
import { ComparisonCell, Result, ResultEvent } from './result';
import { PageEvent } from './page-event';
import { watchWrites } from './write-events';
import { Grinder, Jig, PriceReport, Setup, Wheel, WheelMeasurement } from './wheel';
import { ApiToken, AuditEntry, Flag, Follow, ImportBatch, ImportBatchResult, NotificationSetting, Photo, PublisherApplication, SiteSetting, initPublishingModels } from './publishing';

/** Initialises every model on `sequelize` and declares their associations. */
export function initModels(sequelize: Sequelize) {
  for (const m of [User, Steel, Abrasive, Method, PageRevision, Result, ResultEvent, ComparisonCell, Wheel, WheelMeasurement, Grinder, Jig, Setup, PriceReport]) m.initModel(sequelize);
  Result.belongsTo(User, { as: 'author', foreignKey: 'authorId' });
  Result.belongsTo(Steel, { as: 'steel', foreignKey: 'steelId' });
  Result.belongsTo(Abrasive, { as: 'abrasive', foreignKey: 'abrasiveId' });
  Result.belongsTo(Method, { as: 'sharpnessMethod', foreignKey: 'sharpnessMethodId' });
  Result.belongsTo(Method, { as: 'retentionMethod', foreignKey: 'retentionMethodId' });
  Result.hasMany(ResultEvent, { as: 'events', foreignKey: 'resultId' });
  ResultEvent.belongsTo(User, { as: 'actor', foreignKey: 'actorId' });
  PageRevision.belongsTo(User, { as: 'author', foreignKey: 'authorId' });
  PageRevision.belongsTo(User, { as: 'reviewer', foreignKey: 'reviewedById' });
  PageEvent.initModel(sequelize);
  PageEvent.belongsTo(User, { as: 'actor', foreignKey: 'actorId' });
  Wheel.hasMany(WheelMeasurement, { as: 'measurements', foreignKey: 'wheelId' });
  initPublishingModels(sequelize);
  watchWrites({ pages: [Steel, Abrasive, Method, PageRevision, PageEvent], users: [User] } as never);
}

export { User, Steel, Abrasive, Method, PageRevision, Result, ResultEvent, ComparisonCell, Wheel, WheelMeasurement, Grinder, Jig, Setup, PriceReport };
export { PublisherApplication, ApiToken, ImportBatch, ImportBatchResult, Photo, Flag, AuditEntry, Follow, NotificationSetting, SiteSetting };
export { PageEvent };

/**
 * A reference page's long columns: its rich-text body and its references. Whatever lists pages
 * or names them beside a result leaves them out; reading and parsing their JSON was most of the
 * time of a submission and of a list.
 */
export const PAGE_TEXT_COLUMNS = ['body', 'citations', 'sources'];
