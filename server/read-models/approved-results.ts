import { Op } from 'sequelize';
import { bandStartOf, cellColumnsOfArrays, type BandedMember, type CellArrays } from '@shared/aggregate';
import { Result, User } from '../models';
import { keptUntil } from '../queries/kept-until';
import { memberAttributes, type CellKey, type CellRecord } from '../aggregates/comparison-cells';
import { changedCells } from '../aggregates/cell-cache';
import { follow } from '../changes';
import { ABRASIVE_MATERIALS } from '@shared/vocabulary';
import { rawDate } from '../db/raw-values';

/** The cells a commit changed, or all of them after a rebuild. */
type CellChange = { keys: CellKey[] } | { all: true };

/**
 * The approved results' filterable columns as typed arrays in memory: what the comparison's
 * live filters (hardness, angle, dates, bond, publishers) need, so that a view filtered by them
 * is a scan of a few MB rather than a read of result rows (decision 019). Built once at
 * start-up (its rows in cell order, decision 026), then kept current by `apply` after each
 * commit that changed approved results: the whole-φ cells a commit named are read again
 * (through the covering index of 0008) and their rows replaced. A read waits for the updates under way, so an answer never predates a commit
 * that was acknowledged before it was asked.
 */

/** The attributes read per approved result. */
const ATTRIBUTES = ['id', ...memberAttributes, 'abrasiveId', 'createdAt', 'progressionSteps', 'progressionMaterials'] as const;
type Row = BandedMember & { id: number; abrasiveId: number; createdAt: Date | string; progressionSteps: number; progressionMaterials: string };

/** A bit per abrasive material, for the materials a progression passed through. */
const MATERIAL_BIT = new Map(Object.keys(ABRASIVE_MATERIALS).map((m, i) => [m, 1 << i]));
const viaMask = (materials: Iterable<string>): number => {
  let mask = 0;
  for (const m of materials) mask |= MATERIAL_BIT.get(m) ?? 0;
  return mask;
};

/** What one scan selects; each field left undefined selects every row. */
export interface ResultFilter {
  methodId: number;
  steelIds?: ReadonlySet<number> | null;
  materials?: ReadonlySet<string> | null;
  /** Whole φ band strictly inside (gritPhiAbove, gritPhiBelow). */
  gritPhiAbove?: number;
  gritPhiBelow?: number;
  hrcMin?: number;
  hrcMax?: number;
  angleMin?: number;
  angleMax?: number;
  /** Posted at or after / before these instants, ms since the epoch. */
  createdFrom?: number;
  createdBefore?: number;
  abrasiveIds?: ReadonlySet<number> | null;
  /** Only results by verified publishers. */
  publishers?: boolean;
  /** Only results whose progression passed through one of these materials. */
  via?: ReadonlySet<string> | null;
  /** Only results with one of these numbers of steps before the final abrasive. */
  steps?: ReadonlySet<number> | null;
}

const toMs = (d: Date | string): number => rawDate(d).getTime();

const FLOAT_COLUMNS = ['gritUm', 'medianG', 'retention', 'hrc', 'angle', 'created'] as const;
const INT_COLUMNS = ['id', 'method', 'steel', 'material', 'gritPhi', 'half', 'author', 'abrasive', 'cell', 'via', 'steps'] as const;
type FloatColumn = (typeof FLOAT_COLUMNS)[number];
type IntColumn = (typeof INT_COLUMNS)[number];

/** The columns; `retention` is NaN where a result reports none; `cell` numbers the whole-φ cell key; `half` is 0 or 1, the half band inside it; `via` has a bit per material the progression passed through (MATERIAL_BIT), `steps` its length. */
class Columns {
  size = 0;
  f = {} as Record<FloatColumn, Float64Array>;
  i = {} as Record<IntColumn, Int32Array>;
  constructor(capacity = 1024) {
    for (const c of FLOAT_COLUMNS) this.f[c] = new Float64Array(capacity);
    for (const c of INT_COLUMNS) this.i[c] = new Int32Array(capacity);
  }
  get capacity() {
    return this.i.id.length;
  }
  grow(min: number): void {
    if (min <= this.capacity) return;
    const capacity = Math.max(min, this.capacity * 2);
    for (const c of FLOAT_COLUMNS) {
      const next = new Float64Array(capacity);
      next.set(this.f[c].subarray(0, this.size));
      this.f[c] = next;
    }
    for (const c of INT_COLUMNS) {
      const next = new Int32Array(capacity);
      next.set(this.i[c].subarray(0, this.size));
      this.i[c] = next;
    }
  }
  /**
   * A new Columns of the rows `order` names, in that order: a row of this one as its index, a
   * row of `other` as −(index + 1). Column by column, so each copy is one tight loop.
   */
  take(order: Int32Array, other?: Columns): Columns {
    const next = new Columns(Math.max(1024, order.length));
    const copy = <A extends Float64Array | Int32Array>(to: A, from: A, alt: A | undefined) => {
      for (let k = 0; k < order.length; k++) {
        const o = order[k];
        to[k] = o >= 0 ? from[o] : alt![-o - 1];
      }
    };
    for (const c of FLOAT_COLUMNS) copy(next.f[c], this.f[c], other?.f[c]);
    for (const c of INT_COLUMNS) copy(next.i[c], this.i[c], other?.i[c]);
    next.size = order.length;
    return next;
  }
  /** Its rows in cell order (cell number, half band, id): each cell's rows, and each half band's, side by side. */
  inCellOrder(): Columns {
    const { cell, half, id } = this.i;
    return this.take(Int32Array.from({ length: this.size }, (_, r) => r).sort((a, b) => cell[a] - cell[b] || half[a] - half[b] || id[a] - id[b]));
  }
  /** This one and `other`, both in cell order, merged into one in cell order (one pass). */
  mergedInCellOrder(other: Columns): Columns {
    const before = (a: Columns, r: number, b: Columns, s: number) => a.i.cell[r] - b.i.cell[s] || a.i.half[r] - b.i.half[s] || a.i.id[r] - b.i.id[s];
    const order = new Int32Array(this.size + other.size);
    let i = 0;
    let j = 0;
    for (let k = 0; k < order.length; k++) {
      order[k] = j >= other.size || (i < this.size && before(this, i, other, j) < 0) ? i++ : -(j++ + 1);
    }
    return this.take(order, other);
  }
  /** Keeps only the rows `keep` accepts, in order. */
  compact(keep: (row: number) => boolean): void {
    let to = 0;
    for (let from = 0; from < this.size; from++) {
      if (!keep(from)) continue;
      if (to !== from) {
        for (const c of FLOAT_COLUMNS) this.f[c][to] = this.f[c][from];
        for (const c of INT_COLUMNS) this.i[c][to] = this.i[c][from];
      }
      to++;
    }
    this.size = to;
  }
}

/**
 * The approved results newest first (posted time, then id, both descending: the order of the
 * results list), with the steel and abrasive of each, so that any page of the list, whole or of
 * one steel or abrasive, is found without a COUNT or an OFFSET.
 */
class Newest {
  size = 0;
  created = new Float64Array(0);
  id = new Int32Array(0);
  steel = new Int32Array(0);
  abrasive = new Int32Array(0);

  /** This list without the ids in `removed`, with `added` merged in: one pass over both. */
  merged(removed: ReadonlySet<number>, added: Columns, rows: readonly number[]): Newest {
    const order = [...rows].sort((a, b) => added.f.created[b] - added.f.created[a] || added.i.id[b] - added.i.id[a]);
    const next = new Newest();
    const capacity = this.size + order.length;
    next.created = new Float64Array(capacity);
    next.id = new Int32Array(capacity);
    next.steel = new Int32Array(capacity);
    next.abrasive = new Int32Array(capacity);
    let i = 0;
    let j = 0;
    let n = 0;
    while (i < this.size || j < order.length) {
      if (i < this.size && removed.has(this.id[i])) {
        i++;
        continue;
      }
      const r = order[j];
      const takeOld = j >= order.length || (i < this.size && (this.created[i] > added.f.created[r] || (this.created[i] === added.f.created[r] && this.id[i] > added.i.id[r])));
      if (takeOld) {
        next.created[n] = this.created[i];
        next.id[n] = this.id[i];
        next.steel[n] = this.steel[i];
        next.abrasive[n] = this.abrasive[i];
        i++;
      } else {
        next.created[n] = added.f.created[r];
        next.id[n] = added.i.id[r];
        next.steel[n] = added.i.steel[r];
        next.abrasive[n] = added.i.abrasive[r];
        j++;
      }
      n++;
    }
    next.size = n;
    return next;
  }
}

const cellKeyString = (k: CellKey) => `${k.methodId}|${k.steelId}|${k.material}|${k.gritPhi}`;

/** The read model; one per process, like the database it follows (decision 001). */
export class ApprovedResults {
  private cols = new Columns();
  private newestFirst = new Newest();
  private materials: string[] = [];
  private materialNo = new Map<string, number>();
  private cellKeys: CellKey[] = [];
  private cellNo = new Map<string, number>();
  /** The build and every update after it, in order: a read waits for this. */
  private settled: Promise<void> | null = null;
  private readonly publisherIds = keptUntil<'publishers', Promise<Set<number>>>('accounts');

  /** How many approved results it holds (after the updates under way). */
  async size(): Promise<number> {
    await this.ready();
    return this.cols.size;
  }

  /** Builds the columns (at start-up) unless built; resolves once every update so far is in. */
  ready(): Promise<void> {
    if (!this.settled) this.follow(this.rebuild());
    return this.settled!;
  }

  /** Makes `next` the update that reads wait for; one that fails leaves the model to be built again. */
  private follow(next: Promise<void>): void {
    const settled = next.catch((err) => {
      if (this.settled === settled) this.settled = null;
      throw err;
    });
    this.settled = settled;
  }

  /** Forgets everything; the next read builds again (the bench's cold reads; a new database in one process). */
  reset(): void {
    this.settled = null;
  }

  /**
   * After a commit that changed approved results: the named whole-φ cells are read again and
   * their rows replaced (every row after a rebuild). The one call a write's followers make.
   */
  apply(change: CellChange): void {
    if (!this.settled) return; // not built yet: the build will read the change
    const previous = this.settled.catch(() => undefined);
    if ('all' in change) return this.follow(previous.then(() => this.rebuild()));
    const keys = change.keys;
    this.follow(
      previous
        .then(() => this.replaceCells(keys))
        .catch((err) => {
          console.error('approved results: an update failed; building again', err);
          return this.rebuild();
        }),
    );
  }

  private async rebuild(): Promise<void> {
    // Built aside and swapped in whole, so a read never sees half of it.
    const fresh = new Columns(this.cols.capacity);
    // In slices of the id order, so the heap holds one slice of row objects at a time.
    let after = 0;
    for (;;) {
      const rows = (await Result.findAll({ where: { status: 'approved', id: { [Op.gt]: after } }, attributes: [...ATTRIBUTES], order: [['id', 'ASC']], limit: 20_000, raw: true })) as unknown as Row[];
      for (const r of rows) this.append(fresh, r);
      if (rows.length < 20_000) break;
      after = rows[rows.length - 1].id;
    }
    const newest = new Newest().merged(new Set(), fresh, Array.from({ length: fresh.size }, (_, r) => r));
    this.cols = fresh.inCellOrder();
    this.newestFirst = newest;
  }

  private async replaceCells(keys: readonly CellKey[]): Promise<void> {
    if (!keys.length) return;
    const rows: Row[] = [];
    for (let i = 0; i < keys.length; i += 200) {
      const some = keys.slice(i, i + 200);
      rows.push(
        ...((await Result.findAll({
          where: { status: 'approved', [Op.or]: some.map((k) => ({ sharpnessMethodId: k.methodId, steelId: k.steelId, material: k.material, gritPhi: k.gritPhi })) },
          attributes: [...ATTRIBUTES],
          raw: true,
        })) as unknown as Row[]),
      );
    }
    const changed = new Set(keys.map((k) => this.cellOf(k)));
    const ids = new Set(rows.map((r) => r.id));
    const { cell, id } = this.cols.i;
    const removed = new Set<number>();
    this.cols.compact((row) => {
      const keep = !changed.has(cell[row]) && !ids.has(id[row]);
      if (!keep) removed.add(id[row]);
      return keep;
    });
    // The cells' rows read again, put in cell order and merged in: the columns stay in cell order.
    const added = new Columns(rows.length);
    for (const r of rows) this.append(added, r);
    this.cols = this.cols.mergedInCellOrder(added.inCellOrder());
    this.newestFirst = this.newestFirst.merged(removed, added, Array.from({ length: added.size }, (_, k) => k));
  }

  /**
   * One page of the approved results, newest first (optionally of one steel or abrasive): their
   * ids in order, and how many there are in all.
   */
  async newest(page: number, pageSize: number, only: { steelId?: number; abrasiveId?: number } = {}): Promise<{ ids: number[]; total: number }> {
    await this.ready();
    const list = this.newestFirst;
    const start = (page - 1) * pageSize;
    if (only.steelId === undefined && only.abrasiveId === undefined) {
      return { ids: Array.from(list.id.subarray(Math.min(start, list.size), Math.min(start + pageSize, list.size))), total: list.size };
    }
    const ids: number[] = [];
    let total = 0;
    for (let k = 0; k < list.size; k++) {
      if (only.steelId !== undefined && list.steel[k] !== only.steelId) continue;
      if (only.abrasiveId !== undefined && list.abrasive[k] !== only.abrasiveId) continue;
      if (total >= start && ids.length < pageSize) ids.push(list.id[k]);
      total++;
    }
    return { ids, total };
  }

  private cellOf(k: CellKey): number {
    const s = cellKeyString(k);
    let no = this.cellNo.get(s);
    if (no === undefined) {
      no = this.cellKeys.length;
      this.cellKeys.push({ methodId: k.methodId, steelId: k.steelId, material: k.material, gritPhi: k.gritPhi });
      this.cellNo.set(s, no);
    }
    return no;
  }

  private materialOf(m: string): number {
    let no = this.materialNo.get(m);
    if (no === undefined) {
      no = this.materials.length;
      this.materials.push(m);
      this.materialNo.set(m, no);
    }
    return no;
  }

  private append(c: Columns, r: Row): void {
    c.grow(c.size + 1);
    const at = c.size++;
    c.i.id[at] = r.id;
    c.i.method[at] = r.sharpnessMethodId;
    c.i.steel[at] = r.steelId;
    c.i.material[at] = this.materialOf(r.material);
    c.i.gritPhi[at] = r.gritPhi;
    c.i.half[at] = bandStartOf(r, 0.5) - 2 * r.gritPhi;
    c.i.author[at] = r.authorId;
    c.i.abrasive[at] = r.abrasiveId;
    c.i.cell[at] = this.cellOf({ methodId: r.sharpnessMethodId, steelId: r.steelId, material: r.material, gritPhi: r.gritPhi });
    c.f.gritUm[at] = r.gritUm;
    c.f.medianG[at] = r.sharpnessMedianG;
    c.f.retention[at] = r.retentionCuts ?? NaN;
    c.f.hrc[at] = r.hrc;
    c.f.angle[at] = r.perSideDeg;
    c.f.created[at] = toMs(r.createdAt);
    c.i.via[at] = viaMask(r.progressionMaterials.split(','));
    c.i.steps[at] = r.progressionSteps;
  }

  /** The ids of the accounts that are verified publishers (kept until an account changes). */
  private publishers(): Promise<Set<number>> {
    return this.publisherIds.share('publishers', async () => new Set((await User.findAll({ where: { role: 'publisher' }, attributes: ['id'], raw: true })).map((u) => u.id)));
  }

  /**
   * The cells (figures as the comparison_cells table stores them) of the results that `filter`
   * selects, grouped by `step`, computed by the same code as the stored cells. One pass over the
   * columns and none over result rows: the matching rows' figures are gathered cell by cell into
   * reused typed arrays, whose medians and quartiles are then selected in place.
   */
  async cells(filter: ResultFilter, step: 1 | 0.5): Promise<CellRecord[]> {
    const publishers = filter.publishers ? await this.publishers() : null;
    await this.ready();
    return this.scan(filter, step, publishers);
  }

  /** `cells`, once built: synchronous, so the scratch arrays are this call's alone. */
  private scan(filter: ResultFilter, step: 1 | 0.5, publishers: ReadonlySet<number> | null): CellRecord[] {
    const c = this.cols;
    const { method, steel, material, gritPhi, half, author, abrasive, cell, via, steps } = c.i;
    const { hrc, angle, created } = c.f;
    const steels = mask(filter.steelIds);
    const materials = filter.materials ? mask(new Set([...filter.materials].map((m) => this.materialNo.get(m) ?? -1))) : null;
    const abrasives = mask(filter.abrasiveIds);
    const authors = mask(publishers);
    const above = filter.gritPhiAbove ?? -Infinity;
    const below = filter.gritPhiBelow ?? Infinity;
    const hrcMin = filter.hrcMin ?? -Infinity;
    const hrcMax = filter.hrcMax ?? Infinity;
    const angleMin = filter.angleMin ?? -Infinity;
    const angleMax = filter.angleMax ?? Infinity;
    const from = filter.createdFrom ?? -Infinity;
    const before = filter.createdBefore ?? Infinity;
    const methodId = filter.methodId;
    // The columns are in cell order, so each group (a whole-φ cell, or a half band in it) is one
    // run of rows: its matches are gathered side by side as the scan meets them.
    const { gritUm, medianG, retention } = c.f;
    const into = this.scratchFor(c.size);
    const groups: { g: number; from: number; to: number }[] = [];
    let current = -1;
    let m = 0;
    const through = filter.via ? viaMask(filter.via) : 0;
    for (let r = 0; r < c.size; r++) {
      if (method[r] !== methodId) continue;
      if (steels && steels[steel[r]] !== 1) continue;
      if (materials && materials[material[r]] !== 1) continue;
      if (!(gritPhi[r] > above && gritPhi[r] < below)) continue;
      if (!(hrc[r] >= hrcMin && hrc[r] <= hrcMax)) continue;
      if (!(angle[r] >= angleMin && angle[r] <= angleMax)) continue;
      if (!(created[r] >= from && created[r] < before)) continue;
      if (abrasives && abrasives[abrasive[r]] !== 1) continue;
      if (authors && authors[author[r]] !== 1) continue;
      if (filter.via && !(via[r] & through)) continue;
      if (filter.steps && !filter.steps.has(steps[r])) continue;
      const g = step === 1 ? cell[r] : 2 * cell[r] + half[r];
      if (g !== current) {
        if (groups.length) groups[groups.length - 1].to = m;
        groups.push({ g, from: m, to: m });
        current = g;
      }
      into.authorIds[m] = author[r];
      into.medianG[m] = medianG[r];
      into.retentionCuts[m] = retention[r];
      into.hrc[m] = hrc[r];
      into.perSideDeg[m] = angle[r];
      into.gritUm[m] = gritUm[r];
      m++;
    }
    if (groups.length) groups[groups.length - 1].to = m;
    return groups.map(({ g, from: lo, to: hi }) => {
      const key = this.cellKeys[step === 1 ? g : g >> 1];
      const bandStart = step === 1 ? 2 * key.gritPhi : 2 * key.gritPhi + (g & 1);
      const slice: CellArrays = {
        authorIds: into.authorIds.subarray(lo, hi),
        medianG: into.medianG.subarray(lo, hi),
        retentionCuts: into.retentionCuts.subarray(lo, hi),
        hrc: into.hrc.subarray(lo, hi),
        perSideDeg: into.perSideDeg.subarray(lo, hi),
        gritUm: into.gritUm.subarray(lo, hi),
      };
      return { methodId: key.methodId, steelId: key.steelId, material: key.material, bandWidth: step === 1 ? 2 : 1, bandStart, ...cellColumnsOfArrays(slice) };
    });
  }

  /** Typed arrays for one scan, reused from call to call (grown with the data). */
  private scratch: CellArrays | null = null;
  private scratchFor(size: number): CellArrays {
    if (!this.scratch || this.scratch.medianG.length < size) {
      const n = Math.max(1024, Math.ceil(size * 1.25));
      this.scratch = { authorIds: new Int32Array(n), medianG: new Float64Array(n), retentionCuts: new Float64Array(n), hrc: new Float64Array(n), perSideDeg: new Float64Array(n), gritUm: new Float64Array(n) };
    }
    return this.scratch;
  }
}

/** A set of small non-negative ids as a byte per id (1: in the set), or null for no set. */
function mask(ids: ReadonlySet<number> | null | undefined): Uint8Array | null {
  if (!ids) return null;
  let max = 0;
  for (const id of ids) if (id > max) max = id;
  const m = new Uint8Array(max + 1);
  for (const id of ids) if (id >= 0) m[id] = 1;
  return m;
}

/** The process's read model of approved results. */
export const approvedResults = new ApprovedResults();

// The one place it follows writes: every commit that changed comparison cells, through the feed.
follow(['cells'], (batch) => {
  const changed = changedCells(batch);
  approvedResults.apply(changed === 'all' ? { all: true } : { keys: changed });
});
