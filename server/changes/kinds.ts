import type { PageType } from '@shared/schemas/pages';
import type { ResultStatus } from '@shared/schemas/result';

/** The whole-φ key of the comparison cells one result belongs to (its half-φ cells lie inside it). */
export interface CellKey {
  methodId: number;
  steelId: number;
  material: string;
  gritPhi: number;
}

/**
 * Results written: `ids` every result the write touched; `published` those that were or are
 * approved (their public views and search documents follow); `cells` the whole-φ comparison
 * cells whose approved members changed (refreshed in the same transaction by the feed).
 */
export interface ResultChange {
  kind: 'result';
  ids: number[];
  published: number[];
  cells: CellKey[];
}

/** Every comparison cell was rebuilt from the results (`npm run reaggregate`). */
export interface CellsRebuilt {
  kind: 'cells';
  all: true;
}

/**
 * Reference pages written: the page itself, a revision (a proposal too), a page event.
 * `renamed`: what results on the page are called changed (name, designations, material, grit).
 */
export interface PageChange {
  kind: 'page';
  pageType: PageType;
  ids: number[];
  renamed?: boolean;
}

/** Site settings written, by key. */
export interface SettingChange {
  kind: 'setting';
  keys: string[];
}

/** Kinds of rows that change by id, with nothing more to say. */
export const ROW_KINDS = ['account', 'token', 'flag', 'photo', 'follow', 'application', 'import', 'wheel', 'price-report', 'mail-settings', 'audit'] as const;
export type RowKind = (typeof ROW_KINDS)[number];

/** Other rows written, by id: accounts, API tokens, flags, photos, follows, … */
export interface RowChange {
  kind: RowKind;
  ids: number[];
}

/** What one write transaction changed, one kind at a time. */
export type Change = ResultChange | CellsRebuilt | PageChange | SettingChange | RowChange;
export type ChangeKind = Change['kind'];

/**
 * What a follower can follow: the kinds, where a result change that touched an approved result
 * (so its cells) counts as `cells` too, as a rebuild does. A pending submission is `result`
 * alone: nothing public changed.
 */
export type Topic = ChangeKind;

export function topicsOf(change: Change): Topic[] {
  return change.kind === 'result' && change.cells.length ? ['result', 'cells'] : [change.kind];
}

/** The state of a result that its change depends on. */
export interface ResultState {
  id: number;
  status: ResultStatus;
  sharpnessMethodId: number;
  steelId: number;
  material: string;
  gritPhi: number;
}

const cellKeyOf = (r: Omit<ResultState, 'id' | 'status'>): CellKey => ({ methodId: r.sharpnessMethodId, steelId: r.steelId, material: r.material, gritPhi: r.gritPhi });
export const cellId = (k: CellKey) => `${k.methodId}|${k.steelId}|${k.material}|${k.gritPhi}`;

/**
 * The change of results now in state `now` that were in state `before` (give `before` for
 * updates: a review, a retraction, an edit or a move; leave it out for new results). The model
 * hooks build it for every write through `Result`; a raw SQL write on results records it itself. Approved
 * states on either side make the result `published` and its cell changed.
 */
export function resultsChanged(now: readonly ResultState[], before: readonly ResultState[] = []): ResultChange {
  const ids = new Set<number>();
  const published = new Set<number>();
  const cells = new Map<string, CellKey>();
  for (const r of [...before, ...now]) {
    ids.add(r.id);
    if (r.status !== 'approved') continue;
    published.add(r.id);
    const key = cellKeyOf(r);
    cells.set(cellId(key), key);
  }
  return { kind: 'result', ids: [...ids], published: [...published], cells: [...cells.values()] };
}

/** `changes` with those of one kind (and page type) made one: ids, keys and cells each once. */
export function mergeChanges(changes: readonly Change[]): Change[] {
  const merged = new Map<string, Change>();
  const union = <T>(a: readonly T[], b: readonly T[], id: (x: T) => unknown = (x) => x) => {
    const seen = new Map(a.map((x) => [id(x), x]));
    for (const x of b) if (!seen.has(id(x))) seen.set(id(x), x);
    return [...seen.values()];
  };
  for (const c of changes) {
    const slot = c.kind === 'page' ? `page:${c.pageType}` : c.kind;
    const prior = merged.get(slot);
    if (!prior) merged.set(slot, structuredClone(c));
    else if (prior.kind === 'result' && c.kind === 'result') Object.assign(prior, { ids: union(prior.ids, c.ids), published: union(prior.published, c.published), cells: union(prior.cells, c.cells, cellId) });
    else if (prior.kind === 'page' && c.kind === 'page') Object.assign(prior, { ids: union(prior.ids, c.ids), renamed: prior.renamed || c.renamed || undefined });
    else if (prior.kind === 'setting' && c.kind === 'setting') prior.keys = union(prior.keys, c.keys);
    else if ('ids' in prior && 'ids' in c) prior.ids = union(prior.ids, c.ids);
  }
  return [...merged.values()];
}

/** A change as the `changes` table keeps it: its kind, and the rest as JSON text. */
export function rowOf(change: Change): { kind: string; keys: string } {
  const { kind, ...keys } = change;
  return { kind, keys: JSON.stringify(keys) };
}

/** A row of the `changes` table as the change it records. */
export function changeOf(row: { kind: string; keys: string }): Change {
  return { kind: row.kind, ...JSON.parse(row.keys) } as Change;
}
