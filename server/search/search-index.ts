import MiniSearch, { type Query, type SearchResult } from 'minisearch';

export type SearchDocType = 'steel' | 'abrasive' | 'method' | 'result' | 'cell';

/** A compact document as indexed; `key` is unique across types ("steel:aisi-d2", "result:12"). */
export interface SearchDoc {
  key: string;
  type: SearchDocType;
  title: string;
  /** Other names: designations, grit notations, materials. */
  names: string;
  body: string;
  slug?: string;
  id?: number;
  /** A sub-facet within the type: a steel's category, an abrasive's material. */
  group?: string;
  /** For a comparison cell: where it is and its figures, shown in the hit. */
  cell?: CellFacts;
  /**
   * For a result: what it refers to (steel, abrasive at its grit, method, member), each with the
   * words it lends. Such a document's title is shown but not indexed: its words are its owners'.
   */
  owners?: { key: string; words: string }[];
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

const SPLIT = /[\s,;:()[\]{}"'!?/\\|<>=+*&^%$#@~`]+/u;

/**
 * Splits on white space and punctuation but keeps a dot or hyphen between letters and digits,
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

/** What the index keeps of a document to show it as a hit (the indexed text lives in MiniSearch). */
type ShownDoc = Pick<SearchDoc, 'type' | 'id' | 'slug' | 'title' | 'body' | 'names' | 'group' | 'cell'>;

const BOOST = { title: 3, names: 3, body: 1 };
/** A result matched through the page or member it refers to ranks below that page's own hit. */
const OWNER_WEIGHT = 0.5;

/**
 * The one in-memory search index over steels, abrasives, methods, comparison cells and approved
 * results, in two MiniSearch indexes:
 * - `index` holds every document's own words. A result's own words are few (its notes), so that
 *   no word is shared by thousands of results.
 * - `owners` holds, once each, the words that results take from what they refer to: the steel
 *   (name, designations), the abrasive at its grit (name, material, grit), the method and the
 *   member. A result matches a query term through its own words or through one of its owners;
 *   `members` maps each owner to its results.
 * MiniSearch spends a few microseconds on every document a term matches; this keeps a common
 * word ("cbn", a steel's grade, a method's name) from costing one step per result.
 * Prefix matching only on the last term and fuzzy matching only on terms of 5 or more
 * characters keep the number of candidate terms, and so the time per query, small.
 */
export class SearchIndex {
  private index = SearchIndex.create();
  private owners = SearchIndex.createOwners();
  private table = new OwnerTable();
  private readonly docs = new Map<string, ShownDoc>();

  private static create() {
    return new MiniSearch<SearchDoc>({
      idField: 'key',
      fields: ['title', 'names', 'body'],
      storeFields: ['type'],
      tokenize,
      // A result's title is made of its owners' names, which are indexed once, in `owners`.
      extractField: (doc, field) => (field === 'title' && doc.owners ? '' : (doc as unknown as Record<string, string>)[field]),
      searchOptions: { tokenize: tokenizeQuery },
    });
  }

  private static createOwners() {
    return new MiniSearch<{ key: string; words: string }>({ idField: 'key', fields: ['words'], tokenize, searchOptions: { tokenize: tokenizeQuery } });
  }

  get size(): number {
    return this.docs.size;
  }

  /** Replaces the whole index with `docs`. */
  async rebuild(docs: AsyncIterable<SearchDoc> | Iterable<SearchDoc>): Promise<void> {
    const own: SearchDoc[] = [];
    const shown = new Map<string, ShownDoc>();
    const table = new OwnerTable();
    for await (const d of docs) {
      shown.set(d.key, shownOf(d));
      if (d.owners) table.add(d.key, d.owners);
      // A result without notes has no words of its own to index.
      if (!d.owners || d.body || d.names) own.push(d);
    }
    const index = SearchIndex.create();
    await index.addAllAsync(own, { chunkSize: 500 });
    const owners = SearchIndex.createOwners();
    owners.addAll(table.ownerKeys.map((key, n) => ({ key, words: table.words[n] })));
    this.index = index;
    this.owners = owners;
    this.table = table;
    this.docs.clear();
    for (const [k, v] of shown) this.docs.set(k, v);
  }

  /** Adds or replaces one document. */
  upsert(doc: SearchDoc): void {
    this.remove(doc.key);
    if (!doc.owners || doc.body || doc.names) this.index.add(doc);
    this.docs.set(doc.key, shownOf(doc));
    if (!doc.owners) return;
    for (const o of this.table.add(doc.key, doc.owners)) {
      // An owner seen for the first time, or one whose words changed (a page renamed).
      if (this.owners.has(o.key)) this.owners.discard(o.key);
      this.owners.add(o);
    }
  }

  /** Removes one document if present. */
  remove(key: string): void {
    if (!this.docs.has(key)) return;
    if (this.index.has(key)) this.index.discard(key);
    this.docs.delete(key);
    this.table.remove(key);
  }

  /** Hits for `query`, best first, and the number of hits of each type before the type filter. */
  search(query: string, type?: SearchDocType, limit = 30): { hits: SearchHit[]; facets: Record<SearchDocType, number>; groups: Partial<Record<SearchDocType, Record<string, number>>> } {
    const terms = tokenizeQuery(query);
    const queries = terms.map((t, i) => termQuery(t, i === terms.length - 1));
    // Pages and cells: every term among their own words.
    const pages: SearchResult[] = terms.length
      ? this.index.search({ combineWith: 'AND', queries }, { boost: BOOST, filter: (r) => r.type !== 'result' })
      : [];
    const results = terms.length ? this.searchResults(queries, type === 'result' || !type ? limit : 0) : { count: 0, top: [] };
    const facets: Record<SearchDocType, number> = { steel: 0, abrasive: 0, method: 0, result: results.count, cell: 0 };
    for (const r of pages) facets[r.type as SearchDocType] += 1;
    // Sub-facets (category of steels, material of abrasives) over every hit of the type.
    const groups: Partial<Record<SearchDocType, Record<string, number>>> = {};
    for (const r of pages) {
      const group = this.docs.get(r.id as string)?.group;
      if (!group) continue;
      const counts = (groups[r.type as SearchDocType] ??= {});
      counts[group] = (counts[group] ?? 0) + 1;
    }
    const ranked = [...pages.filter((r) => !type || r.type === type).slice(0, limit).map((r) => ({ key: r.id as string, score: r.score, terms: r.terms })), ...results.top]
      .sort((a, b) => b.score - a.score)
      .slice(0, limit);
    const hits = ranked.map((r) => {
      const doc = this.docs.get(r.key)!;
      const piece = snippet(doc, r.terms);
      return {
        type: doc.type, id: doc.id, slug: doc.slug, title: doc.title,
        snippet: piece.text, highlights: piece.highlights, titleHighlights: matchedSpans(doc.title, r.terms), ...(doc.group ? { group: doc.group } : {}),
        score: Math.round(r.score * 100) / 100, ...(doc.cell ? { cell: doc.cell } : {}) };
    });
    return { hits, facets, groups };
  }

  /**
   * Results that match every query term through their own words or an owner's: how many, and the
   * best `limit` of them. The term that matches fewest results picks the candidates; each
   * candidate is then scored on every term from its owners' numbers, so a common term costs a few
   * array reads per candidate, not one MiniSearch step per result.
   */
  private searchResults(queries: Query[], limit: number): { count: number; top: { key: string; score: number; terms: string[] }[] } {
    const table = this.table;
    const perTerm = queries.map((q) => {
      const own = new Map<number, SearchResult>();
      for (const r of this.index.search(q, { boost: BOOST, filter: (x) => x.type === 'result' })) own.set(table.slotOf(r.id as string)!, r);
      const owners = new Map<number, SearchResult>();
      const ownerScore = new Float64Array(table.ownerKeys.length);
      let size = own.size;
      for (const r of this.owners.search(q)) {
        const n = table.ownerNumber.get(r.id as string)!;
        if (!table.members[n].size) continue;
        owners.set(n, r);
        ownerScore[n] = r.score * OWNER_WEIGHT;
        size += table.members[n].size;
      }
      return { own, owners, ownerScore, size };
    });
    type Term = (typeof perTerm)[number];
    const driver = perTerm.reduce((a, b) => (b.size < a.size ? b : a), perTerm[0]);
    if (!driver || driver.size === 0) return { count: 0, top: [] };
    const owned = table.owned;
    /** How well the result in `slot` matches term `t`: its own words, or its best owner; 0 for not at all. */
    const termScore = (t: Term, slot: number): number => {
      let best = t.own.size ? (t.own.get(slot)?.score ?? 0) : 0;
      if (t.owners.size) {
        for (let j = slot * OWNERS_PER_RESULT, end = j + OWNERS_PER_RESULT; j < end; j++) {
          const o = owned[j];
          if (o >= 0 && t.ownerScore[o] > best) best = t.ownerScore[o];
        }
      }
      return best;
    };
    let count = 0;
    const top: { slot: number; score: number }[] = [];
    // A result reached from two sources of the driving term is counted once.
    const seen = driver.own.size + driver.owners.size > 1 ? new Set<number>() : null;
    const consider = (slot: number) => {
      if (seen) {
        if (seen.has(slot)) return;
        seen.add(slot);
      }
      let score = 0;
      for (const t of perTerm) {
        const s = termScore(t, slot);
        if (s === 0) return;
        score += s;
      }
      count += 1;
      // Keep the best `limit`, best first.
      if (limit === 0 || (top.length === limit && score <= top[limit - 1].score)) return;
      const at = top.findIndex((x) => score > x.score);
      top.splice(at === -1 ? top.length : at, 0, { slot, score });
      if (top.length > limit) top.pop();
    };
    for (const slot of driver.own.keys()) consider(slot);
    for (const n of driver.owners.keys()) for (const slot of table.members[n]) consider(slot);
    // The matched words, for the highlights, only for the results shown.
    const termsOf = (t: Term, slot: number): string[] => {
      const s = termScore(t, slot);
      if (t.own.get(slot)?.score === s) return t.own.get(slot)!.terms;
      for (let j = slot * OWNERS_PER_RESULT; j < (slot + 1) * OWNERS_PER_RESULT; j++) if (owned[j] >= 0 && t.ownerScore[owned[j]] === s) return t.owners.get(owned[j])!.terms;
      return [];
    };
    return { count, top: top.map(({ slot, score }) => ({ key: table.keyOf(slot), score, terms: perTerm.flatMap((t) => termsOf(t, slot)) })) };
  }
}

const OWNERS_PER_RESULT = 4;

/**
 * The results in the index and the owners they take words from, numbered densely so that the
 * search can score a candidate with array reads: `owned` holds each result slot's owner numbers
 * (OWNERS_PER_RESULT per slot, -1 for none), `members` each owner's result slots.
 */
class OwnerTable {
  private readonly slots = new Map<string, number>();
  private readonly keys: string[] = [];
  private readonly free: number[] = [];
  owned = new Int32Array(1024 * OWNERS_PER_RESULT).fill(-1);
  readonly ownerNumber = new Map<string, number>();
  readonly ownerKeys: string[] = [];
  readonly words: string[] = [];
  readonly members: Set<number>[] = [];

  slotOf(key: string): number | undefined {
    return this.slots.get(key);
  }

  keyOf(slot: number): string {
    return this.keys[slot];
  }

  /** Records result `key` and its owners; returns the owners that are new or whose words changed. */
  add(key: string, owners: { key: string; words: string }[]): { key: string; words: string }[] {
    if (owners.length > OWNERS_PER_RESULT) throw new Error(`a result has at most ${OWNERS_PER_RESULT} owners`);
    this.remove(key);
    const slot = this.free.pop() ?? this.keys.length;
    if ((slot + 1) * OWNERS_PER_RESULT > this.owned.length) {
      const grown = new Int32Array(this.owned.length * 2).fill(-1);
      grown.set(this.owned);
      this.owned = grown;
    }
    this.slots.set(key, slot);
    this.keys[slot] = key;
    const changed: { key: string; words: string }[] = [];
    owners.forEach((o, j) => {
      let n = this.ownerNumber.get(o.key);
      if (n === undefined) {
        n = this.ownerKeys.length;
        this.ownerNumber.set(o.key, n);
        this.ownerKeys.push(o.key);
        this.words.push('');
        this.members.push(new Set());
      }
      if (this.words[n] !== o.words) {
        this.words[n] = o.words;
        changed.push(o);
      }
      this.members[n].add(slot);
      this.owned[slot * OWNERS_PER_RESULT + j] = n;
    });
    return changed;
  }

  remove(key: string): void {
    const slot = this.slots.get(key);
    if (slot === undefined) return;
    for (let j = slot * OWNERS_PER_RESULT; j < (slot + 1) * OWNERS_PER_RESULT; j++) {
      if (this.owned[j] >= 0) this.members[this.owned[j]].delete(slot);
      this.owned[j] = -1;
    }
    this.slots.delete(key);
    this.free.push(slot);
  }
}

function shownOf(d: SearchDoc): ShownDoc {
  const shown: ShownDoc = { type: d.type, title: d.title, body: d.body, names: d.owners ? '' : d.names };
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
