import type { Model, ModelStatic, Transaction } from 'sequelize';
import type { PageType } from '@shared/schemas/pages';
import { record } from './feed';
import { resultsChanged, type Change, type ResultState, type RowKind } from './kinds';

type Row = Record<string, unknown>;

/** What a write of some rows of one model changed: rows as they are `now` and as they were `before`. */
type Describe = (now: Row[], before: Row[]) => Change[];

const each = (now: Row[], before: Row[]) => [...before, ...now];
const distinct = (values: unknown[]) => [...new Set(values)] as number[];

/** Rows of a kind that changes by id; `by` names the column that holds the id (the row's own by default). */
export const rowsOf =
  (kind: RowKind, by = 'id'): Describe =>
  (now, before) => [{ kind, ids: distinct(each(now, before).map((r) => r[by])) }];

/** Columns of a page whose change alters what its results are called (their titles, their search documents). */
const NAMING: Record<PageType, string[]> = {
  steel: ['name', 'designations'],
  abrasive: ['name', 'material', 'gritStandard', 'gritGrade'],
  method: ['name', 'version'],
};

/** A reference page's own row. */
export const pagesOf =
  (pageType: PageType): Describe =>
  (now, before) => {
    const was = new Map(before.map((r) => [r.id, r]));
    const renamed = now.some((r) => was.has(r.id) && NAMING[pageType].some((c) => JSON.stringify(r[c]) !== JSON.stringify(was.get(r.id)![c])));
    return [{ kind: 'page', pageType, ids: distinct(each(now, before).map((r) => r.id)), ...(renamed ? { renamed } : {}) }];
  };

/** A row that belongs to a page (a revision, a page event): a change of that page. */
export const pageRowsOf: Describe = (now, before) => {
  const byType = new Map<PageType, number[]>();
  for (const r of each(now, before)) byType.set(r.pageType as PageType, [...(byType.get(r.pageType as PageType) ?? []), r.pageId as number]);
  return [...byType].map(([pageType, ids]) => ({ kind: 'page', pageType, ids: distinct(ids) }));
};

/** Results, with the cells of those that were or are approved. */
export const resultsOf: Describe = (now, before) => [resultsChanged(now as unknown as ResultState[], before as unknown as ResultState[])];

/** A result's trail entry: a change of the result that moves nothing public. */
export const resultTrailOf: Describe = (now, before) => [{ kind: 'result', ids: distinct(each(now, before).map((r) => r.resultId)), published: [], cells: [] }];

/** Site settings, by key. */
export const settingsOf: Describe = (now, before) => [{ kind: 'setting', keys: [...new Set(each(now, before).map((r) => String(r.key)))] }];

const HOOK = 'changeFeed';
const plain = (m: Model) => m.get({ plain: true }) as Row;
type Options = { transaction?: Transaction | null; where?: unknown; feedBefore?: Row[] };

/**
 * Makes every write through `model` record its change in the write's transaction: a create, an
 * update (with the row as it was), a destroy, an upsert, and bulk creates, updates and
 * destroys (the rows they match are read before and after, in the transaction). Recording is
 * part of the write, so a command writing through the models has nothing more to do; a write
 * in raw SQL calls `record` itself. Idempotent (named hooks), so models initialised twice in one
 * process record once. Writes outside a transaction (never the app's: every write goes through
 * `ctx.db.write`) record nothing.
 */
export function recordWritesOf(model: ModelStatic<Model>, describe: Describe): void {
  const write = (options: Options | undefined, now: Row[], before: Row[] = []) => {
    if (!options?.transaction || (!now.length && !before.length)) return;
    record(options.transaction, ...describe(now, before));
  };
  const key = model.primaryKeyAttribute;
  const matched = async (options: Options) =>
    (await model.findAll({ where: options.where as never, transaction: options.transaction ?? undefined, raw: true })) as unknown as Row[];
  const hooks: Record<string, (...args: never[]) => unknown> = {
    afterCreate: (m: Model, o: Options) => write(o, [plain(m)]),
    afterUpdate: (m: Model, o: Options) => write(o, [plain(m)], [{ ...plain(m), ...(m.previous() as Row) }]),
    afterDestroy: (m: Model, o: Options) => write(o, [], [plain(m)]),
    afterUpsert: (created: [Model, boolean | null], o: Options) => write(o, [plain(created[0])]),
    afterBulkCreate: (ms: Model[], o: Options) => write(o, ms.map(plain)),
    beforeBulkUpdate: async (o: Options) => {
      if (o.transaction) o.feedBefore = await matched(o);
    },
    afterBulkUpdate: async (o: Options) => {
      const before = o.feedBefore ?? [];
      if (!o.transaction || !before.length) return;
      const now = (await model.findAll({ where: { [key]: before.map((r) => r[key]) } as never, transaction: o.transaction, raw: true })) as unknown as Row[];
      write(o, now, before);
    },
    beforeBulkDestroy: async (o: Options) => {
      if (o.transaction) o.feedBefore = await matched(o);
    },
    afterBulkDestroy: (o: Options) => write(o, [], o.feedBefore ?? []),
  };
  for (const [hook, fn] of Object.entries(hooks)) {
    model.removeHook(hook as never, HOOK);
    model.addHook(hook as never, HOOK, fn as never);
  }
}
