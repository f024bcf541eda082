import type { Sequelize } from 'sequelize';
import { User } from './user';
import { Abrasive, Method, PageRevision, Steel } from './reference-pages';
import { ComparisonCell, Result, ResultEvent } from './result';
import { Wheel, WheelMeasurement } from './wheel';

/** Initialises every model on `sequelize` and declares their associations. */
export function initModels(sequelize: Sequelize) {
  for (const m of [User, Steel, Abrasive, Method, PageRevision, Result, ResultEvent, ComparisonCell, Wheel, WheelMeasurement]) m.initModel(sequelize);
  Result.belongsTo(User, { as: 'author', foreignKey: 'authorId' });
  Result.belongsTo(Steel, { as: 'steel', foreignKey: 'steelId' });
  Result.belongsTo(Abrasive, { as: 'abrasive', foreignKey: 'abrasiveId' });
  Result.belongsTo(Method, { as: 'sharpnessMethod', foreignKey: 'sharpnessMethodId' });
  Result.belongsTo(Method, { as: 'retentionMethod', foreignKey: 'retentionMethodId' });
  Result.hasMany(ResultEvent, { as: 'events', foreignKey: 'resultId' });
  ResultEvent.belongsTo(User, { as: 'actor', foreignKey: 'actorId' });
  PageRevision.belongsTo(User, { as: 'author', foreignKey: 'authorId' });
  Wheel.hasMany(WheelMeasurement, { as: 'measurements', foreignKey: 'wheelId' });
}

export { User, Steel, Abrasive, Method, PageRevision, Result, ResultEvent, ComparisonCell, Wheel, WheelMeasurement };
