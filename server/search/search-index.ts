import MiniSearch, { type Query, type SearchResult } from 'minisearch';
import { limits } from '@shared/validations';

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
  /** Shown as the hit's snippet in place of a piece of the body; not indexed. */
  summary?: string;
  /**
   * For a result or a cell: the pages and member it refers to (steel, abrasive at its grit,
   * method, member; see server/search/owners.ts), each with the words it lends. Such a
   * document's title is shown but not indexed: its words are its owners' and its own names and body.
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

/** What the index keeps of a document to show it as a hit (the indexed text lives in MiniSearch). */
type ShownDoc = Pick<SearchDoc, 'type' | 'id' | 'slug' | 'title' | 'body' | 'names' | 'summary' | 'group' | 'cell'>;

const BOOST = { title: 3, names: 3, body: 1 };
/** Owners one document can have (a result: steel, abrasive at its grit, method, member). */
const OWNERS_PER_DOC = 4;

type Counts = { facets: Record<SearchDocType, number>; groups: Partial<Record<SearchDocType, Record<string, number>>> };
type Ranked = { key: string; score: number; terms: string[] };
type SearchAnswer = { hits: SearchHit[] } & Counts;
/** Hits shown for a query, unless the caller asks for another number. */
const HITS_SHOWN = 30;
/**
 * With no type asked for, each type's own best few come too, beside the best overall: the "All"
 * view shows every type that matched with its best hits, not only those among the best 30.
 */
const SECTION_BEST = limits.searchSectionBest;

/**
 * The one in-memory search index over steels, abrasives, methods, comparison cells and approved
 * results, in three MiniSearch indexes:
 * - `pages` holds the reference pages, a hundred or so, whole.
 * - `own` holds the own words of the documents that refer to pages (results: their notes; cells:
 *   their material and grit band), which are few, so that no word is shared by thousands of them.
 * - `owners` holds, once each, the words such documents take from what they refer to: the steel
 *   (name, designations), the abrasive at its grit, the method, the member.
 * A result or cell matches a query term through its own words or through one of its owners. The
 * owners' numbers sit in typed arrays (`OwnerTable`), so a common word ("cbn", a steel's grade, a
 * method's name) costs a few array reads per document, where MiniSearch would spend a few
 * microseconds on each. Prefix matching only on the last term and fuzzy matching only on terms
 * of 5 or more characters keep the number of candidate terms, and so the time per query, small.
 */
export class SearchIndex {
  private pages = SearchIndex.create();
  private own = SearchIndex.create();
  private owners = SearchIndex.createOwners();
  private table = new OwnerTable();
  private readonly docs = new Map<string, ShownDoc>();

  private static create() {
    return new MiniSearch<SearchDoc>({
      idField: 'key',
      fields: ['title', 'names', 'body'],
      tokenize,
      // The title of a document with owners is made of its owners' names, indexed in `owners`.
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
    const pageDocs: SearchDoc[] = [];
    const ownDocs: SearchDoc[] = [];
    const shown = new Map<string, ShownDoc>();
    const table = new OwnerTable();
    for await (const d of docs) {
      shown.set(d.key, shownOf(d));
      if (!d.owners) pageDocs.push(d);
      else {
        table.add(d);
        // A result without notes has no words of its own to index.
        if (d.body || d.names) ownDocs.push(d);
      }
    }
    const pages = SearchIndex.create();
    await pages.addAllAsync(pageDocs, { chunkSize: 500 });
    const own = SearchIndex.create();
    await own.addAllAsync(ownDocs, { chunkSize: 500 });
    const owners = SearchIndex.createOwners();
    owners.addAll(table.ownerKeys.map((key, n) => ({ key, words: table.words[n] })));
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
    this.docs.set(doc.key, shownOf(doc));
    if (!doc.owners) {
      this.pages.add(doc);
      return;
    }
    if (doc.body || doc.names) this.own.add(doc);
    for (const o of this.table.add(doc)) {
      // An owner seen for the first time, or one whose words changed (a page renamed).
      if (this.owners.has(o.key)) this.owners.discard(o.key);
      this.owners.add(o);
    }
  }

  /** Whether the index holds the document `key` (`result:12`, `steel:aisi-d2`, …). */
  has(key: string): boolean {
    return this.docs.has(key);
  }

  /** Removes one document if present. */
  remove(key: string): void {
    if (!this.docs.has(key)) return;
    for (const index of [this.pages, this.own]) if (index.has(key)) index.discard(key);
    this.docs.delete(key);
    this.table.remove(key);
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
    const fromPages = (r: SearchResult): Ranked => ({ key: r.id as string, score: r.score, terms: r.terms });
    const overall = [...pages.filter((r) => !type || this.docs.get(r.id as string)!.type === type).slice(0, limit).map(fromPages), ...owned.top].sort((a, b) => b.score - a.score).slice(0, limit);
    // Each type's best few (pages come best first), beside the best overall, each hit once.
    const shown = new Set(overall.map((r) => r.key));
    const perPageType = new Map<SearchDocType, number>();
    const sections = type
      ? []
      : [
          ...pages.filter((r) => {
            const t = this.docs.get(r.id as string)!.type;
            perPageType.set(t, (perPageType.get(t) ?? 0) + 1);
            return perPageType.get(t)! <= SECTION_BEST;
          }).map(fromPages),
          ...owned.best,
        ].filter((r) => !shown.has(r.key) && shown.add(r.key));
    const ranked = [...overall, ...sections].sort((a, b) => b.score - a.score);
    const hits = ranked.map((r) => {
      const doc = this.docs.get(r.key)!;
      const piece = doc.summary !== undefined ? { text: doc.summary, highlights: matchedSpans(doc.summary, r.terms) } : snippet(doc, r.terms);
      return {
        type: doc.type, id: doc.id, slug: doc.slug, title: doc.title,
        snippet: piece.text, highlights: piece.highlights, titleHighlights: matchedSpans(doc.title, r.terms), ...(doc.group ? { group: doc.group } : {}),
        score: Math.round(r.score * 100) / 100, ...(doc.cell ? { cell: doc.cell } : {}) };
    });
    return { hits, ...counts };
  }

  /**
   * Results and cells that match every query term through their own words or an owner's, counted
   * into `counts`; returns the best `limit` of them (of `type`, if given) and, with no type, each
   * type's best `SECTION_BEST` (`best`, which may repeat some of `top`). The term that reaches
   * fewest documents picks the candidates; each candidate is then scored on every term from its
   * owners' numbers, in plain loops over typed arrays, so a common term costs a few array reads
   * per candidate.
   */
  private searchOwned(queries: Query[], type: SearchDocType | undefined, limit: number, counts: Counts): { top: Ranked[]; best: Ranked[] } {
    const table = this.table;
    const perTerm = queries.map((q) => {
      const own = new Map<number, SearchResult>();
      for (const r of this.own.search(q, { boost: BOOST })) own.set(table.slotOf(r.id as string)!, r);
      const owners = new Map<number, SearchResult>();
      const ownerScore = new Float64Array(table.ownerKeys.length);
      let size = own.size;
      for (const r of this.owners.search(q)) {
        const n = table.ownerNumber.get(r.id as string)!;
        if (!table.memberCount(n)) continue;
        owners.set(n, r);
        ownerScore[n] = r.score;
        size += table.memberCount(n);
      }
      return { own, owners, ownerScore, size };
    });
    type Term = (typeof perTerm)[number];
    const driver = perTerm.reduce((a, b) => (b.size < a.size ? b : a), perTerm[0]);
    if (driver.size === 0) return { top: [], best: [] };
    const candidates = table.candidates(driver.own.keys(), driver.owners.size ? driver.ownerScore : null);
    const owned = table.owned;
    const typeOf = table.typeCode;
    const groupOf = table.groupCode;
    const wanted = type ? TYPE_CODES.indexOf(type) : -1;
    const typeCounts = new Int32Array(TYPE_CODES.length);
    const groupCounts = new Int32Array(table.groupNames.length);
    const top: Kept[] = [];
    const bestOfType = type ? null : TYPE_CODES.map((): Kept[] => []);
    let floor = -Infinity;
    for (let c = 0; c < candidates.length; c++) {
      const slot = candidates[c];
      const base = slot * OWNERS_PER_DOC;
      let score = 0;
      let matched = true;
      // A term scores its best owner's match plus the document's own words' match: a result on a
      // CBN wheel ranks above one that only names CBN in its notes, one that does both above
      // either (on the demo data: owner matches about 6, notes 3, the pages themselves 10–30).
      for (const t of perTerm) {
        let owner = 0;
        const os = t.ownerScore;
        for (let j = base; j < base + OWNERS_PER_DOC; j++) {
          const o = owned[j];
          if (o >= 0 && os[o] > owner) owner = os[o];
        }
        const both = owner + (t.own.size ? (t.own.get(slot)?.score ?? 0) : 0);
        if (both === 0) {
          matched = false;
          break;
        }
        score += both;
      }
      if (!matched) continue;
      typeCounts[typeOf[slot]] += 1;
      if (groupOf[slot] >= 0) groupCounts[groupOf[slot]] += 1;
      if (bestOfType) keepBest(bestOfType[typeOf[slot]], SECTION_BEST, slot, score);
      // Keep the best `limit` of the type asked for, best first.
      if (score <= floor || (wanted >= 0 && typeOf[slot] !== wanted)) continue;
      if (keepBest(top, limit, slot, score) && top.length === limit) floor = top[limit - 1].score;
    }
    TYPE_CODES.forEach((t, i) => (counts.facets[t] += typeCounts[i]));
    groupCounts.forEach((n, g) => {
      if (!n) return;
      const [t, name] = table.groupNames[g];
      const groups = (counts.groups[t] ??= {});
      groups[name] = (groups[name] ?? 0) + n;
    });
    // The matched words, for the highlights, only for the documents shown.
    const termsOf = (t: Term, slot: number): string[] => {
      let owner: SearchResult | undefined;
      for (let j = slot * OWNERS_PER_DOC; j < (slot + 1) * OWNERS_PER_DOC; j++) {
        const o = owned[j];
        if (o >= 0 && t.ownerScore[o] > 0 && (!owner || t.owners.get(o)!.score > owner.score)) owner = t.owners.get(o);
      }
      return [...(t.own.get(slot)?.terms ?? []), ...(owner?.terms ?? [])];
    };
    const rank = ({ slot, score }: Kept): Ranked => ({ key: table.keyOf(slot), score, terms: perTerm.flatMap((t) => termsOf(t, slot)) });
    return { top: top.map(rank), best: (bestOfType ?? []).flat().map(rank) };
  }
}

type Kept = { slot: number; score: number };

/** Puts a scored document into `list` (best first, at most `cap` long) if it ranks there; says whether it did. */
function keepBest(list: Kept[], cap: number, slot: number, score: number): boolean {
  if (list.length === cap && score <= list[cap - 1].score) return false;
  const at = list.findIndex((x) => score > x.score);
  list.splice(at === -1 ? list.length : at, 0, { slot, score });
  if (list.length > cap) list.pop();
  return true;
}

const TYPE_CODES: SearchDocType[] = ['steel', 'abrasive', 'method', 'result', 'cell'];

/** Counts a hit into the type facets and its type's groups. */
function countHit(counts: Counts, doc: Pick<ShownDoc, 'type' | 'group'>): void {
  counts.facets[doc.type] += 1;
  if (!doc.group) return;
  const groups = (counts.groups[doc.type] ??= {});
  groups[doc.group] = (groups[doc.group] ?? 0) + 1;
}

/**
 * The documents with owners and the owners they take words from, numbered densely so that the
 * search can score a candidate with array reads: `owned` holds each slot's owner numbers
 * (OWNERS_PER_DOC per slot, -1 for none). An owner's documents are found by a pass over
 * `owned` (a few hundred thousand integer reads, well under a millisecond at 100 000 documents),
 * which costs far less memory than a set of slots per owner.
 */
class OwnerTable {
  private readonly slots = new Map<string, number>();
  private readonly keys: string[] = [];
  private readonly free: number[] = [];
  owned = new Int32Array(1024 * OWNERS_PER_DOC).fill(-1);
  /** Each slot's type (index in TYPE_CODES) and group (index in groupNames, -1 for none), for the facets. */
  typeCode = new Uint8Array(1024);
  groupCode = new Int32Array(1024).fill(-1);
  readonly groupNames: [SearchDocType, string][] = [];
  private readonly groupNumber = new Map<string, number>();
  readonly ownerNumber = new Map<string, number>();
  readonly ownerKeys: string[] = [];
  readonly words: string[] = [];
  /** Per owner number, how many documents have it. */
  private members = new Int32Array(256);
  /** Per slot, the number of the last search that listed it as a candidate. */
  private marks = new Uint32Array(1024);
  private marking = 0;
  private buffer = new Int32Array(1024);

  slotOf(key: string): number | undefined {
    return this.slots.get(key);
  }

  keyOf(slot: number): string {
    return this.keys[slot];
  }

  memberCount(owner: number): number {
    return this.members[owner];
  }

  /** The slots in `slots` and those with an owner that `ownerScore` scores above 0, each once. */
  candidates(slots: Iterable<number>, ownerScore: Float64Array | null): Int32Array {
    this.marking = (this.marking + 1) >>> 0 || 1;
    if (this.marking === 1) this.marks.fill(0);
    const seen = this.marking;
    let count = 0;
    const take = (slot: number) => {
      if (this.marks[slot] === seen) return;
      this.marks[slot] = seen;
      this.buffer[count++] = slot;
    };
    for (const slot of slots) take(slot);
    if (ownerScore) {
      const owned = this.owned;
      for (let slot = 0, end = this.keys.length; slot < end; slot++) {
        for (let j = slot * OWNERS_PER_DOC; j < (slot + 1) * OWNERS_PER_DOC; j++) {
          const o = owned[j];
          if (o >= 0 && ownerScore[o] > 0) {
            take(slot);
            break;
          }
        }
      }
    }
    return this.buffer.subarray(0, count);
  }

  /** Records `doc` and its owners; returns the owners that are new or whose words changed. */
  add(doc: SearchDoc): { key: string; words: string }[] {
    const owners = doc.owners ?? [];
    if (owners.length > OWNERS_PER_DOC) throw new Error(`a search document has at most ${OWNERS_PER_DOC} owners`);
    this.remove(doc.key);
    const slot = this.free.pop() ?? this.keys.length;
    if (slot >= this.typeCode.length) this.grow();
    this.slots.set(doc.key, slot);
    this.keys[slot] = doc.key;
    this.typeCode[slot] = TYPE_CODES.indexOf(doc.type);
    this.groupCode[slot] = doc.group ? this.groupOf(doc.type, doc.group) : -1;
    const changed: { key: string; words: string }[] = [];
    owners.forEach((o, j) => {
      let n = this.ownerNumber.get(o.key);
      if (n === undefined) {
        n = this.ownerKeys.length;
        this.ownerNumber.set(o.key, n);
        this.ownerKeys.push(o.key);
        this.words.push('');
        if (n >= this.members.length) {
          const grown = new Int32Array(this.members.length * 2);
          grown.set(this.members);
          this.members = grown;
        }
      }
      if (this.words[n] !== o.words) {
        this.words[n] = o.words;
        changed.push(o);
      }
      this.members[n] += 1;
      this.owned[slot * OWNERS_PER_DOC + j] = n;
    });
    return changed;
  }

  remove(key: string): void {
    const slot = this.slots.get(key);
    if (slot === undefined) return;
    for (let j = slot * OWNERS_PER_DOC; j < (slot + 1) * OWNERS_PER_DOC; j++) {
      if (this.owned[j] >= 0) this.members[this.owned[j]] -= 1;
      this.owned[j] = -1;
    }
    this.slots.delete(key);
    this.free.push(slot);
  }

  private groupOf(type: SearchDocType, group: string): number {
    const key = `${type}:${group}`;
    let g = this.groupNumber.get(key);
    if (g === undefined) {
      g = this.groupNames.push([type, group]) - 1;
      this.groupNumber.set(key, g);
    }
    return g;
  }

  /** Doubles every per-slot array. */
  private grow(): void {
    const size = this.typeCode.length * 2;
    const owned = new Int32Array(size * OWNERS_PER_DOC).fill(-1);
    owned.set(this.owned);
    const typeCode = new Uint8Array(size);
    typeCode.set(this.typeCode);
    const groupCode = new Int32Array(size).fill(-1);
    groupCode.set(this.groupCode);
    const marks = new Uint32Array(size);
    marks.set(this.marks);
    [this.owned, this.typeCode, this.groupCode, this.marks, this.buffer] = [owned, typeCode, groupCode, marks, new Int32Array(size)];
  }
}

function shownOf(d: SearchDoc): ShownDoc {
  const shown: ShownDoc = { type: d.type, title: d.title, body: d.body, names: d.owners ? '' : d.names };
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
