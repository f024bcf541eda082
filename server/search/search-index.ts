import MiniSearch, { type Query, type SearchResult } from 'minisearch';
import { limits } from '@shared/validations';
import type { SearchOwner } from './owners';

export type SearchDocType = 'steel' | 'abrasive' | 'method' | 'result' | 'cell';

/** A compact document as indexed; `key` is unique across types ("steel:aisi-d2", "result:12"). */
export interface SearchDoc {
  key: string;
  type: SearchDocType;
  /** Shown as the hit's title. A result has none: its title is made from its owners' labels and its figures (`titleOf`). */
  title?: string;
  /** Other names: designations, grit notations, materials. */
  names: string;
  body: string;
  slug?: string;
  id?: number;
  /** A sub-facet within the type: a steel's category, an abrasive's material. */
  group?: string;
  /** For a comparison cell: where it is and its figures, shown in the hit. */
  cell?: CellFacts;
  /** Shown as the hit's snippet in place of a piece of the body; not indexed. */
  summary?: string;
  /**
   * For a result or a cell: the pages and member it refers to (steel, abrasive at its grit,
   * method, member; see server/search/owners.ts), each with the words it lends. Such a
   * document's title is shown but not indexed: its words are its owners' and its own names and body.
   */
  owners?: SearchOwner[];
  /** For a result: the figures its title shows (its id is `id`). */
  figures?: ResultFigures;
}

/** A result's figures as its title shows them. */
export interface ResultFigures {
  hrc: number;
  perSideDeg: number;
  medianG: number;
}

/** A comparison cell's figures as a search hit carries them (grams-force, HRC). */
export interface CellFacts {
  method: string;
  /** steel:material:phi (shared/schemas/compare.ts cellRefSchema). */
  ref: string;
  n: number;
  testers: number;
  medianG: number;
  q1G: number;
  q3G: number;
}

export interface SearchHit {
  type: SearchDocType;
  id?: number;
  slug?: string;
  title: string;
  snippet: string;
  /** Where the matched words are in `snippet`: [start, end) character offsets, in order. */
  highlights: [number, number][];
  /** Where the matched words are in `title`. */
  titleHighlights: [number, number][];
  /** The document's sub-facet (a steel's category, an abrasive's material), if any. */
  group?: string;
  score: number;
  cell?: CellFacts;
}

/**
 * Words too common to tell documents apart ("15° per side", "62 µm", "253 g median"): left out
 * of the index and of queries, so that no query term matches nearly every document.
 */
const STOP_WORDS = new Set(['a', 'an', 'and', 'at', 'by', 'for', 'from', 'g', 'hrc', 'in', 'is', 'median', 'of', 'on', 'or', 'per', 'side', 'the', 'to', 'um', 'with', 'µm']);

const SPLIT = /[\s,;:()[\]{}"'!?/\\|<>=+*&^%$#@~`·]+/u;

/**
 * Splits on white space and punctuation (the middle dot that joins a body's blocks too) but keeps
 * a dot or hyphen between letters and digits,
 * so "1.2379" and "x153crmov12" stay whole; each dotted token is indexed also without dots.
 */
function tokenize(text: string): string[] {
  const tokens: string[] = [];
  for (const raw of text.toLowerCase().split(SPLIT)) {
    const token = raw.replace(/^[.\-_]+|[.\-_]+$/g, '');
    if (!token || STOP_WORDS.has(token)) continue;
    tokens.push(token);
    if (/[.\-_]/.test(token)) {
      tokens.push(token.replace(/[.\-_]/g, ''));
      for (const part of token.split(/[.\-_]+/)) if (part && !STOP_WORDS.has(part)) tokens.push(part);
    }
  }
  return tokens;
}

/** Query terms: as indexed, without the extra split parts; stop words dropped unless that leaves none. */
export function tokenizeQuery(text: string): string[] {
  const terms = text
    .toLowerCase()
    .split(SPLIT)
    .map((t) => t.replace(/^[.\-_]+|[.\-_]+$/g, ''))
    .filter(Boolean);
  const kept = terms.filter((t) => !STOP_WORDS.has(t));
  return kept.length ? kept : terms;
}

/** What the index keeps of a page or cell to show it as a hit (the indexed text lives in MiniSearch). */
type ShownDoc = Pick<SearchDoc, 'type' | 'id' | 'slug' | 'body' | 'names' | 'summary' | 'group' | 'cell'> & { title: string };

const BOOST = { title: 3, names: 3, body: 1 };
/** Where each kind of owner sits among a document's owners, by its key's prefix ("steel:12"). */
const OWNER_PLACES = ['steel', 'abrasive', 'method', 'member'] as const;
/** Owners one document can have (a result: steel, abrasive at its grit, method, member). */
const OWNERS_PER_DOC = OWNER_PLACES.length;

type Counts = { facets: Record<SearchDocType, number>; groups: Partial<Record<SearchDocType, Record<string, number>>> };
/** A hit before it is written out: its document's key in the index ("steel:aisi-d2", "result:12"), how it is shown, its score and matched words. */
type Ranked = { key: string; shown: ShownDoc; score: number; terms: string[] };
type SearchAnswer = { hits: SearchHit[] } & Counts;
/** Hits shown for a query, unless the caller asks for another number. */
const HITS_SHOWN = 30;
/**
 * With no type asked for, each type's own best few come too, beside the best overall: the "All"
 * view shows every type that matched with its best hits, not only those among the best 30.
 */
const SECTION_BEST = limits.searchSectionBest;

/**
 * A result's title: "AISI D2 on <abrasive> · 61 HRC · 15° per side · median 142 g · @handle",
 * from its owners' labels and its figures in tenths of HRC and degrees and whole grams.
 */
function resultTitle(steel: string, abrasive: string, hrcTenths: number, degTenths: number, grams: number, handle: string | undefined): string {
  return `${steel} on ${abrasive} · ${hrcTenths / 10} HRC · ${degTenths / 10}° per side · median ${grams} g${handle ? ` · @${handle}` : ''}`;
}

const labelOf = (doc: SearchDoc, place: (typeof OWNER_PLACES)[number]) => doc.owners?.find((o) => o.key.startsWith(`${place}:`))?.label;

/** The title a document's hit shows (a result's made from its owners' labels and its figures). */
export function titleOf(doc: SearchDoc): string {
  const f = doc.figures;
  if (doc.type !== 'result' || !f) return doc.title ?? '';
  return resultTitle(labelOf(doc, 'steel') ?? '', labelOf(doc, 'abrasive') ?? '', Math.round(f.hrc * 10), Math.round(f.perSideDeg * 10), Math.round(f.medianG), labelOf(doc, 'member'));
}

/**
 * The one in-memory search index over steels, abrasives, methods, comparison cells and approved
 * results, in three MiniSearch indexes:
 * - `pages` holds the reference pages, a hundred or so, whole.
 * - `own` holds the own words of the documents that refer to pages (results: their notes; cells:
 *   their material and grit band), each distinct text once, however many documents share it.
 * - `owners` holds, once each, the words such documents take from what they refer to: the steel
 *   (name, designations), the abrasive at its grit, the method, the member.
 * A result or cell matches a query term through its own words or through one of its owners. The
 * documents themselves are rows of typed arrays in groups that score alike (`OwnedTable`), not
 * objects: a query scores each group once in one pass of array reads, and a result takes about
 * 32 bytes beside its notes (decision 033). Prefix matching only on the last term and
 * fuzzy matching only on terms of 5 or more characters keep the number of candidate terms, and
 * so the time per query, small.
 */
export class SearchIndex {
  private pages = SearchIndex.create();
  private own = SearchIndex.create();
  private owners = SearchIndex.createOwners();
  private table = new OwnedTable();
  /** Pages and cells as shown; results are shown from the table. */
  private readonly docs = new Map<string, ShownDoc>();
  /** Per query term, each own text's score (zero again after each query). */
  private textScores: Float64Array[] = [];

  private static create() {
    return new MiniSearch<SearchDoc | OwnText>({
      idField: 'key',
      fields: ['title', 'names', 'body'],
      tokenize,
      searchOptions: { tokenize: tokenizeQuery },
    });
  }

  private static createOwners() {
    return new MiniSearch<SearchOwner>({ idField: 'key', fields: ['words'], tokenize, searchOptions: { tokenize: tokenizeQuery } });
  }

  get size(): number {
    return this.docs.size + this.table.results;
  }

  /** Replaces the whole index with `docs`. */
  async rebuild(docs: AsyncIterable<SearchDoc> | Iterable<SearchDoc>): Promise<void> {
    const pageDocs: SearchDoc[] = [];
    const shown = new Map<string, ShownDoc>();
    const table = new OwnedTable();
    for await (const d of docs) {
      if (d.type !== 'result') shown.set(d.key, shownOf(d));
      if (d.owners) table.add(d);
      else pageDocs.push(d);
    }
    const pages = SearchIndex.create();
    await pages.addAllAsync(pageDocs, { chunkSize: 500 });
    const own = SearchIndex.create();
    await own.addAllAsync(table.texts(), { chunkSize: 500 });
    const owners = SearchIndex.createOwners();
    owners.addAll(table.ownerKeys.map((key, n) => ({ key, words: table.words[n], label: table.labels[n] })));
    [this.pages, this.own, this.owners, this.table] = [pages, own, owners, table];
    this.docs.clear();
    for (const [k, v] of shown) this.docs.set(k, v);
    this.warmUp();
  }

  /**
   * A few searches over the index's own commonest words, one of each kind (one word, several,
   * a typo, a number as a prefix), so that the first people to search after a start do not wait
   * while the JavaScript engine compiles the search code.
   */
  private warmUp(): void {
    const biggest = [...this.table.ownerKeys.keys()].sort((a, b) => this.table.memberCount(b) - this.table.memberCount(a)).slice(0, 3);
    for (const n of biggest) {
      const words = tokenizeQuery(this.table.words[n]).slice(0, 3);
      const long = words.find((w) => w.length >= 5);
      const queries = [words[0], words.join(' '), ...(long ? [`${long.slice(0, -2)}${long.at(-1)}${long.at(-2)}`] : []), `${words[0]} 1`];
      for (const q of queries) if (q) this.answer(tokenizeQuery(q), undefined, HITS_SHOWN);
    }
  }

  /** Adds or replaces one document. */
  upsert(doc: SearchDoc): void {
    this.remove(doc.key);
    if (doc.type !== 'result') this.docs.set(doc.key, shownOf(doc));
    if (!doc.owners) {
      this.pages.add(doc);
      return;
    }
    const added = this.table.add(doc);
    if (added.text) this.own.add(added.text);
    for (const o of added.owners) {
      // An owner seen for the first time, or one whose words changed (a page renamed).
      if (this.owners.has(o.key)) this.owners.discard(o.key);
      this.owners.add(o);
    }
  }

  /** Whether the index holds the document `key` (`result:12`, `steel:aisi-d2`, …). */
  has(key: string): boolean {
    return this.docs.has(key) || this.table.has(key);
  }

  /** Removes one document if present. */
  remove(key: string): void {
    if (this.pages.has(key)) this.pages.discard(key);
    this.docs.delete(key);
    const unused = this.table.remove(key);
    if (unused !== null) this.own.discard(unused);
  }

  /** Hits for `query`, best first, and the number of hits of each type before the type filter. */
  search(query: string, type?: SearchDocType, limit = HITS_SHOWN): SearchAnswer {
    return this.answer(tokenizeQuery(query), type, limit);
  }

  private answer(terms: string[], type: SearchDocType | undefined, limit: number): SearchAnswer {
    const counts: Counts = { facets: { steel: 0, abrasive: 0, method: 0, result: 0, cell: 0 }, groups: {} };
    if (!terms.length) return { hits: [], ...counts };
    const queries = terms.map((t, i) => termQuery(t, i === terms.length - 1));
    const pages = this.pages.search({ combineWith: 'AND', queries }, { boost: BOOST });
    for (const r of pages) countHit(counts, this.docs.get(r.id as string)!);
    const owned = this.searchOwned(queries, type, limit, counts);
    const fromPages = pages.map((r): Ranked => ({ key: r.id as string, shown: this.docs.get(r.id as string)!, score: r.score, terms: r.terms }));
    const overall = [...fromPages.filter((r) => !type || r.shown.type === type).slice(0, limit), ...owned.top].sort((a, b) => b.score - a.score).slice(0, limit);
    // Each type's best few (pages come best first), beside the best overall, each hit once.
    const shown = new Set(overall.map((r) => r.key));
    const perPageType = new Map<SearchDocType, number>();
    const sections = type
      ? []
      : [
          ...fromPages.filter((r) => {
            const n = (perPageType.get(r.shown.type) ?? 0) + 1;
            perPageType.set(r.shown.type, n);
            return n <= SECTION_BEST;
          }),
          ...owned.best,
        ].filter((r) => !shown.has(r.key) && shown.add(r.key));
    const ranked = [...overall, ...sections].sort((a, b) => b.score - a.score);
    const hits = ranked.map(({ shown: doc, score, terms: matched }) => {
      const piece = doc.summary !== undefined ? { text: doc.summary, highlights: matchedSpans(doc.summary, matched) } : snippet(doc, matched);
      return {
        type: doc.type, id: doc.id, slug: doc.slug, title: doc.title,
        snippet: piece.text, highlights: piece.highlights, titleHighlights: matchedSpans(doc.title, matched), ...(doc.group ? { group: doc.group } : {}),
        score: Math.round(score * 100) / 100, ...(doc.cell ? { cell: doc.cell } : {}) };
    });
    return { hits, ...counts };
  }

  /** Per query term, a score per own text: zeros, as long as the table's texts. */
  private textScoresFor(terms: number): Float64Array[] {
    const size = this.table.textCapacity;
    for (let i = 0; i < terms; i++) if (!this.textScores[i] || this.textScores[i].length < size) this.textScores[i] = new Float64Array(Math.max(size, 64));
    return this.textScores.slice(0, terms);
  }

  /**
   * Results and cells that match every query term through their own words or an owner's, counted
   * into `counts`; returns the best `limit` of them (of `type`, if given) and, with no type, each
   * type's best `SECTION_BEST` (`best`, which may repeat some of `top`). Each term is first
   * scored on the owners and the distinct own texts (a few hundred MiniSearch look-ups at most);
   * then one pass over the table's groups (documents of one type with the same owners, own text
   * and facet group, which score alike) scores each group from those numbers, the term that
   * reaches fewest documents first, so most groups are left after a handful of array reads.
   */
  private searchOwned(queries: Query[], type: SearchDocType | undefined, limit: number, counts: Counts): { top: Ranked[]; best: Ranked[] } {
    const table = this.table;
    const textScores = this.textScoresFor(queries.length);
    const perTerm = queries.map((q, i) => {
      const texts = new Map<number, SearchResult>();
      const textScore = textScores[i];
      let size = 0;
      for (const r of this.own.search(q, { boost: BOOST })) {
        const n = r.id as number;
        texts.set(n, r);
        textScore[n] = r.score;
        size += table.textUses(n);
      }
      const owners = new Map<number, SearchResult>();
      const ownerScore = new Float64Array(table.ownerKeys.length);
      for (const r of this.owners.search(q)) {
        const n = table.ownerNumber.get(r.id as string)!;
        if (!table.memberCount(n)) continue;
        owners.set(n, r);
        ownerScore[n] = r.score;
        size += table.memberCount(n);
      }
      return { texts, textScore, owners, ownerScore, size };
    });
    try {
      // The most selective term first: a group it does not match costs one term's reads.
      const order = [...perTerm].sort((a, b) => a.size - b.size);
      if (order[0].size === 0) return { top: [], best: [] };
      const ownerScores = order.map((t) => t.ownerScore);
      const ownScores = order.map((t) => t.textScore);
      const terms = order.length;
      const { owned, typeCode: typeOf, groupCode: groupOf, textOf, members } = table;
      const wanted = type ? TYPE_CODES.indexOf(type) : -1;
      const typeCounts = new Int32Array(TYPE_CODES.length);
      const groupCounts = new Int32Array(table.groupNames.length);
      const top = new BestGroups(limit, members);
      const bestOfType = type ? null : TYPE_CODES.map(() => new BestGroups(SECTION_BEST, members));
      for (let g = 0, end = table.groups; g < end; g++) {
        const kind = typeOf[g];
        if (kind === FREE) continue;
        const base = g * OWNERS_PER_DOC;
        const text = textOf[g];
        let score = 0;
        let t = 0;
        // A term scores its best owner's match plus the document's own words' match: a result on a
        // CBN wheel ranks above one that only names CBN in its notes, one that does both above
        // either (on the demo data: owner matches about 6, notes 3, the pages themselves 10–30).
        for (; t < terms; t++) {
          const os = ownerScores[t];
          let owner = 0;
          for (let j = base; j < base + OWNERS_PER_DOC; j++) {
            const o = owned[j];
            if (o >= 0 && os[o] > owner) owner = os[o];
          }
          const both = text >= 0 ? owner + ownScores[t][text] : owner;
          if (both === 0) break;
          score += both;
        }
        if (t < terms) continue;
        const n = members[g];
        typeCounts[kind] += n;
        if (groupOf[g] >= 0) groupCounts[groupOf[g]] += n;
        bestOfType?.[kind].offer(g, score);
        if (wanted < 0 || kind === wanted) top.offer(g, score);
      }
      TYPE_CODES.forEach((t, i) => (counts.facets[t] += typeCounts[i]));
      groupCounts.forEach((n, g) => {
        if (!n) return;
        const [t, name] = table.groupNames[g];
        const groups = (counts.groups[t] ??= {});
        groups[name] = (groups[name] ?? 0) + n;
      });
      // The matched words, for the highlights, only for the groups shown.
      const termsOf = (t: (typeof perTerm)[number], g: number): string[] => {
        let owner: SearchResult | undefined;
        for (let j = g * OWNERS_PER_DOC; j < (g + 1) * OWNERS_PER_DOC; j++) {
          const o = owned[j];
          if (o >= 0 && t.ownerScore[o] > 0 && (!owner || t.owners.get(o)!.score > owner.score)) owner = t.owners.get(o);
        }
        return [...(t.texts.get(textOf[g])?.terms ?? []), ...(owner?.terms ?? [])];
      };
      const rank = (best: BestGroups): Ranked[] => {
        const ranked: Ranked[] = [];
        for (const { g, score } of best.list) {
          const matched = perTerm.flatMap((t) => termsOf(t, g));
          for (const row of table.rowsOf(g, best.cap - ranked.length)) ranked.push({ key: table.keyOf(row), shown: table.shown(row, this.docs), score, terms: matched });
        }
        return ranked;
      };
      return { top: rank(top), best: (bestOfType ?? []).flatMap(rank) };
    } finally {
      for (const t of perTerm) for (const n of t.texts.keys()) t.textScore[n] = 0;
    }
  }
}

const TYPE_CODES: SearchDocType[] = ['steel', 'abrasive', 'method', 'result', 'cell'];

/** The best groups offered, best first (equal scores in the order offered), as few as hold `cap` documents. */
class BestGroups {
  readonly list: { g: number; score: number }[] = [];
  private held = 0;
  private floor = -Infinity;
  constructor(
    readonly cap: number,
    private readonly members: ArrayLike<number>,
  ) {}

  offer(g: number, score: number): void {
    if (score <= this.floor) return;
    const list = this.list;
    const at = list.findIndex((x) => score > x.score);
    list.splice(at === -1 ? list.length : at, 0, { g, score });
    this.held += this.members[g];
    while (list.length > 1 && this.held - this.members[list[list.length - 1].g] >= this.cap) this.held -= this.members[list.pop()!.g];
    if (this.held >= this.cap) this.floor = list[list.length - 1].score;
  }
}
/** The type code of a group no document is in. */
const FREE = 255;

/** Counts a hit into the type facets and its type's groups. */
function countHit(counts: Counts, doc: Pick<ShownDoc, 'type' | 'group'>): void {
  counts.facets[doc.type] += 1;
  if (!doc.group) return;
  const groups = (counts.groups[doc.type] ??= {});
  groups[doc.group] = (groups[doc.group] ?? 0) + 1;
}

/** A distinct own text (a result's notes, a cell's names) as the `own` index holds it. */
type OwnText = { key: number; names: string; body: string };

/** A typed array twice as long (or `size` long), the old values kept, the rest `fill`. */
function grown<T extends Int32Array | Uint8Array | Float64Array>(array: T, size = array.length * 2, fill = 0): T {
  const bigger = new (array.constructor as new (n: number) => T)(size);
  if (fill) bigger.fill(fill);
  bigger.set(array);
  return bigger;
}

/**
 * The documents with owners (results, cells) as rows of typed arrays, in groups that score alike:
 * one group per type, owners, own text and facet group. A group holds its owner numbers
 * (`owned`, OWNERS_PER_DOC per group in OWNER_PLACES order, -1 for none), its own text's number
 * (`textOf`, -1 for none), its type and facet group, its number of documents (`members`) and
 * its rows as a list in the order added (`first`, `last`, `next`, `previous`). A row is one
 * document: a result, found by its id (`rowOfResult`), keeps its figures in tenths and is shown
 * from them and its group's owners' labels; a cell is found by its key and shown from the index's
 * map. Owners and own texts are numbered densely; an own text shared by several documents is
 * held and indexed once. On the bench's 100 000 results (copies of the demo's, spread over its
 * members) about 500 groups; at worst one per document.
 */
class OwnedTable {
  results = 0;
  /** Groups in use or freed: the search passes over groups [0, groups). */
  groups = 0;
  private readonly freeGroups: number[] = [];
  private readonly groupNumber = new Map<string, number>();
  owned = new Int32Array(256 * OWNERS_PER_DOC).fill(-1);
  typeCode = new Uint8Array(256).fill(FREE);
  /** Each group's facet group (index in groupNames, -1 for none). */
  groupCode = new Int32Array(256).fill(-1);
  textOf = new Int32Array(256).fill(-1);
  members = new Int32Array(256);
  private first = new Int32Array(256).fill(-1);
  private last = new Int32Array(256).fill(-1);
  /** Rows: each one's group, neighbours in it, and a result's id and figures. */
  private rows = 0;
  private readonly freeRows: number[] = [];
  private groupOfRow = new Int32Array(1024);
  private next = new Int32Array(1024);
  private previous = new Int32Array(1024);
  private resultId = new Int32Array(1024);
  private hrcTenths = new Int32Array(1024);
  private degTenths = new Int32Array(1024);
  private grams = new Int32Array(1024);
  private rowOfResult = new Int32Array(1024).fill(-1);
  /** Rows of the documents that are not results (cells), by key, and their keys by row. */
  private readonly rowOfKey = new Map<string, number>();
  private readonly keyOfRow = new Map<number, string>();
  readonly groupNames: [SearchDocType, string][] = [];
  private readonly facetNumber = new Map<string, number>();
  readonly ownerNumber = new Map<string, number>();
  readonly ownerKeys: string[] = [];
  readonly words: string[] = [];
  readonly labels: string[] = [];
  /** Per owner number, how many documents have it. */
  private ownerUses = new Int32Array(256);
  /** Own texts: number by text, the text by number, how many documents use it, numbers free again. */
  private readonly textNumber = new Map<string, number>();
  private readonly textNames: string[] = [];
  private readonly textBodies: string[] = [];
  private uses = new Int32Array(256);
  private readonly freeTexts: number[] = [];

  get textCapacity(): number {
    return this.textBodies.length;
  }

  private rowOf(key: string): number | undefined {
    if (!key.startsWith('result:')) return this.rowOfKey.get(key);
    const id = Number(key.slice('result:'.length));
    const row = Number.isInteger(id) && id >= 0 && id < this.rowOfResult.length ? this.rowOfResult[id] : -1;
    return row >= 0 ? row : undefined;
  }

  has(key: string): boolean {
    return this.rowOf(key) !== undefined;
  }

  memberCount(owner: number): number {
    return this.ownerUses[owner];
  }

  textUses(text: number): number {
    return this.uses[text];
  }

  /** Every own text in use, as the `own` index holds it. */
  texts(): OwnText[] {
    const out: OwnText[] = [];
    for (let n = 0; n < this.textBodies.length; n++) if (this.uses[n] > 0) out.push({ key: n, names: this.textNames[n], body: this.textBodies[n] });
    return out;
  }

  /** The first `count` rows of group `g`, in the order added. */
  rowsOf(g: number, count: number): number[] {
    const out: number[] = [];
    for (let row = this.first[g]; row >= 0 && out.length < count; row = this.next[row]) out.push(row);
    return out;
  }

  /** Row `row`'s document key in the index: a cell's as added, a result's "result:<id>". */
  keyOf(row: number): string {
    return this.keyOfRow.get(row) ?? `result:${this.resultId[row]}`;
  }

  /** How row `row` is shown as a hit (a cell's from `docs`, where the index keeps it). */
  shown(row: number, docs: Map<string, ShownDoc>): ShownDoc {
    const key = this.keyOfRow.get(row);
    if (key !== undefined) return docs.get(key)!;
    const g = this.groupOfRow[row];
    const label = (place: number) => {
      const o = this.owned[g * OWNERS_PER_DOC + place];
      return o >= 0 ? this.labels[o] : undefined;
    };
    const text = this.textOf[g];
    return {
      type: 'result',
      id: this.resultId[row],
      title: resultTitle(label(0) ?? '', label(1) ?? '', this.hrcTenths[row], this.degTenths[row], this.grams[row], label(3)),
      body: text >= 0 ? this.textBodies[text] : '',
      names: '',
    };
  }

  /**
   * Records `doc` and its owners; returns the owners that are new or whose words changed, and its
   * own text when no other document had it (to be indexed).
   */
  add(doc: SearchDoc): { owners: SearchOwner[]; text: OwnText | null } {
    const owners = doc.owners ?? [];
    if (owners.length > OWNERS_PER_DOC) throw new Error(`a search document has at most ${OWNERS_PER_DOC} owners`);
    const isResult = doc.type === 'result';
    if (isResult && (doc.id === undefined || !doc.figures)) throw new Error(`the result document ${doc.key} needs its id and figures`);
    this.remove(doc.key);
    const changed: SearchOwner[] = [];
    const numbers = [-1, -1, -1, -1];
    for (const o of owners) {
      const place = OWNER_PLACES.indexOf(o.key.slice(0, o.key.indexOf(':')) as (typeof OWNER_PLACES)[number]);
      if (place < 0) throw new Error(`a search owner's key starts with one of ${OWNER_PLACES.join(', ')} (got "${o.key}")`);
      let n = this.ownerNumber.get(o.key);
      if (n === undefined) {
        n = this.ownerKeys.length;
        this.ownerNumber.set(o.key, n);
        this.ownerKeys.push(o.key);
        this.words.push('');
        this.labels.push('');
        if (n >= this.ownerUses.length) this.ownerUses = grown(this.ownerUses);
      }
      if (this.words[n] !== o.words || this.labels[n] !== o.label) {
        this.words[n] = o.words;
        this.labels[n] = o.label;
        changed.push(o);
      }
      this.ownerUses[n] += 1;
      numbers[place] = n;
    }
    const text = this.useText(doc.names, doc.body);
    const g = this.groupFor(TYPE_CODES.indexOf(doc.type), doc.group ? this.facetOf(doc.type, doc.group) : -1, text?.number ?? -1, numbers);
    const row = this.freeRows.pop() ?? this.rows++;
    if (row >= this.groupOfRow.length) this.growRows();
    this.groupOfRow[row] = g;
    this.previous[row] = this.last[g];
    this.next[row] = -1;
    if (this.last[g] >= 0) this.next[this.last[g]] = row;
    else this.first[g] = row;
    this.last[g] = row;
    this.members[g] += 1;
    if (isResult) {
      const id = doc.id!;
      if (id >= this.rowOfResult.length) this.rowOfResult = grown(this.rowOfResult, Math.max(id + 1, this.rowOfResult.length * 2), -1);
      this.rowOfResult[id] = row;
      this.resultId[row] = id;
      this.hrcTenths[row] = Math.round(doc.figures!.hrc * 10);
      this.degTenths[row] = Math.round(doc.figures!.perSideDeg * 10);
      this.grams[row] = Math.round(doc.figures!.medianG);
      this.results += 1;
    } else {
      this.rowOfKey.set(doc.key, row);
      this.keyOfRow.set(row, doc.key);
    }
    return { owners: changed, text: text?.added ? { key: text.number, names: doc.names, body: doc.body } : null };
  }

  /** Forgets the document `key`; returns its own text's number when no document uses it any more (to be dropped from the index). */
  remove(key: string): number | null {
    const row = this.rowOf(key);
    if (row === undefined) return null;
    const g = this.groupOfRow[row];
    if (this.keyOfRow.has(row)) {
      this.rowOfKey.delete(key);
      this.keyOfRow.delete(row);
    } else {
      this.rowOfResult[this.resultId[row]] = -1;
      this.results -= 1;
    }
    const [before, after] = [this.previous[row], this.next[row]];
    if (before >= 0) this.next[before] = after;
    else this.first[g] = after;
    if (after >= 0) this.previous[after] = before;
    else this.last[g] = before;
    this.freeRows.push(row);
    for (let j = g * OWNERS_PER_DOC; j < (g + 1) * OWNERS_PER_DOC; j++) if (this.owned[j] >= 0) this.ownerUses[this.owned[j]] -= 1;
    const text = this.textOf[g];
    if (--this.members[g] === 0) this.freeGroup(g);
    if (text < 0 || --this.uses[text] > 0) return null;
    this.textNumber.delete(`${this.textNames[text]}\u0000${this.textBodies[text]}`);
    this.textNames[text] = this.textBodies[text] = '';
    this.freeTexts.push(text);
    return text;
  }

  /** The group of documents of this type, facet group, own text and owners (made when new). */
  private groupFor(kind: number, facet: number, text: number, owners: number[]): number {
    const key = `${kind} ${facet} ${text} ${owners.join(' ')}`;
    let g = this.groupNumber.get(key);
    if (g !== undefined) return g;
    g = this.freeGroups.pop() ?? this.groups++;
    if (g >= this.typeCode.length) this.growGroups();
    this.groupNumber.set(key, g);
    this.typeCode[g] = kind;
    this.groupCode[g] = facet;
    this.textOf[g] = text;
    this.owned.set(owners, g * OWNERS_PER_DOC);
    this.first[g] = this.last[g] = -1;
    return g;
  }

  private freeGroup(g: number): void {
    const owners = Array.from(this.owned.subarray(g * OWNERS_PER_DOC, (g + 1) * OWNERS_PER_DOC));
    this.groupNumber.delete(`${this.typeCode[g]} ${this.groupCode[g]} ${this.textOf[g]} ${owners.join(' ')}`);
    this.typeCode[g] = FREE;
    this.groupCode[g] = -1;
    this.textOf[g] = -1;
    this.owned.fill(-1, g * OWNERS_PER_DOC, (g + 1) * OWNERS_PER_DOC);
    this.freeGroups.push(g);
  }

  /** The number of the own text (names, body), counted as used once more; null for no words. */
  private useText(names: string, body: string): { number: number; added: boolean } | null {
    if (!names && !body) return null;
    const key = `${names}\u0000${body}`;
    let n = this.textNumber.get(key);
    const added = n === undefined;
    if (n === undefined) {
      n = this.freeTexts.pop() ?? this.textBodies.length;
      this.textNumber.set(key, n);
      this.textNames[n] = names;
      this.textBodies[n] = body;
      if (n >= this.uses.length) this.uses = grown(this.uses);
    }
    this.uses[n] += 1;
    return { number: n, added };
  }

  private facetOf(type: SearchDocType, group: string): number {
    const key = `${type}:${group}`;
    let g = this.facetNumber.get(key);
    if (g === undefined) {
      g = this.groupNames.push([type, group]) - 1;
      this.facetNumber.set(key, g);
    }
    return g;
  }

  /** Doubles every per-group array. */
  private growGroups(): void {
    const size = this.typeCode.length * 2;
    this.owned = grown(this.owned, size * OWNERS_PER_DOC, -1);
    this.typeCode = grown(this.typeCode, size, FREE);
    this.groupCode = grown(this.groupCode, size, -1);
    this.textOf = grown(this.textOf, size, -1);
    this.members = grown(this.members, size);
    this.first = grown(this.first, size, -1);
    this.last = grown(this.last, size, -1);
  }

  /** Doubles every per-row array. */
  private growRows(): void {
    const size = this.groupOfRow.length * 2;
    for (const name of ['groupOfRow', 'next', 'previous', 'resultId', 'hrcTenths', 'degTenths', 'grams'] as const) this[name] = grown(this[name], size);
  }
}

function shownOf(d: SearchDoc): ShownDoc {
  const shown: ShownDoc = { type: d.type, title: titleOf(d), body: d.body, names: d.owners ? '' : d.names };
  if (d.summary !== undefined) shown.summary = d.summary;
  if (d.id !== undefined) shown.id = d.id;
  if (d.slug !== undefined) shown.slug = d.slug;
  if (d.group !== undefined) shown.group = d.group;
  if (d.cell !== undefined) shown.cell = d.cell;
  return shown;
}

/**
 * The term's variants with two neighbouring characters swapped ("52010" → "25010", "50210",
 * "52100", "52001"). A swap is one typing slip but two edits to MiniSearch's Levenshtein
 * fuzziness, which allows only one edit for a five-character term.
 */
export function transpositions(term: string): string[] {
  const out = new Set<string>();
  for (let i = 0; i + 1 < term.length; i++) {
    if (term[i] === term[i + 1]) continue;
    out.add(term.slice(0, i) + term[i + 1] + term[i] + term.slice(i + 2));
  }
  out.delete(term);
  return [...out];
}

/**
 * One query term as MiniSearch runs it: prefix matching only when it is the last term (what the
 * person is still typing), fuzzy matching (one edit in five characters) only for terms of five or
 * more characters, and for those also the swapped-neighbour variants, matched exactly and
 * weighted down, so "52010" finds 52100.
 */
function termQuery(term: string, last: boolean): Query {
  const long = term.length >= 5;
  const queries: Query[] = [{ queries: [term], prefix: last, fuzzy: long ? 0.2 : false }];
  if (long) queries.push({ queries: transpositions(term), prefix: false, fuzzy: false, boostTerm: () => 0.4 });
  return { combineWith: 'OR', queries };
}

/** Words of a text with their offsets, as the index tokenizes them (dots and hyphens inside kept). */
function wordsOf(text: string): { start: number; end: number; forms: string[] }[] {
  const out: { start: number; end: number; forms: string[] }[] = [];
  for (const m of text.matchAll(/[\p{L}\p{N}]+(?:[.\-_][\p{L}\p{N}]+)*/gu)) {
    const word = m[0].toLowerCase();
    const forms = [word];
    if (/[.\-_]/.test(word)) forms.push(word.replace(/[.\-_]/g, ''), ...word.split(/[.\-_]+/));
    out.push({ start: m.index!, end: m.index! + m[0].length, forms });
  }
  return out;
}

/** [start, end) offsets of the words of `text` that are among the matched index `terms`. */
export function matchedSpans(text: string, terms: string[]): [number, number][] {
  const wanted = new Set(terms.map((t) => t.toLowerCase()));
  return wordsOf(text)
    .filter((w) => w.forms.some((f) => wanted.has(f)))
    .map((w) => [w.start, w.end] as [number, number]);
}

/**
 * About 160 characters of the body (or, without a body, the other names) around the first
 * matched word, cut at word boundaries, with the offsets of every matched word in it.
 */
function snippet(doc: ShownDoc, terms: string[]): { text: string; highlights: [number, number][] } {
  const text = doc.body || doc.names;
  const first = matchedSpans(text, terms)[0]?.[0] ?? 0;
  let start = Math.max(0, first - 60);
  let end = Math.min(text.length, start + 160);
  // Do not cut a word in two.
  if (start > 0) start = text.indexOf(' ', start) + 1 || start;
  if (end < text.length) end = text.lastIndexOf(' ', end) > start ? text.lastIndexOf(' ', end) : end;
  const before = start > 0 ? '… ' : '';
  const piece = `${before}${text.slice(start, end).trim()}${end < text.length ? ' …' : ''}`;
  return { text: piece, highlights: matchedSpans(piece, terms) };
}
