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
 * Splits on white space and punctuation but keeps a dot or hyphen between letters and digits,
 * so "1.2379" and "x153crmov12" stay whole; each dotted token is indexed also without dots.
 */
function tokenize(text: string): string[] {
  const tokens: string[] = [];
  for (const raw of text.toLowerCase().split(/[\s,;:()[\]{}"'!?/\\|<>=+*&^%$#@~`]+/u)) {
    const token = raw.replace(/^[.\-_]+|[.\-_]+$/g, '');
    if (!token) continue;
    tokens.push(token);
    if (/[.\-_]/.test(token)) {
      tokens.push(token.replace(/[.\-_]/g, ''));
      for (const part of token.split(/[.\-_]+/)) if (part) tokens.push(part);
    }
  }
  return tokens;
}

/** Query tokens: as indexed, but without the extra split parts. */
function tokenizeQuery(text: string): string[] {
  return text
    .toLowerCase()
    .split(/[\s,;:()[\]{}"'!?/\\|<>=+*&^%$#@~`]+/u)
    .map((t) => t.replace(/^[.\-_]+|[.\-_]+$/g, ''))
    .filter(Boolean);
}

/**
 * The one in-memory MiniSearch index over steels, abrasives, methods and approved results.
 * Prefix matching only on the last term and fuzzy matching only on terms of 5 or more
 * characters keep the number of candidate terms, and so the time per query, small.
 */
export class SearchIndex {
  private index = SearchIndex.create();
  private readonly docs = new Map<string, SearchDoc>();

  private static create() {
    return new MiniSearch<SearchDoc>({
      idField: 'key',
      fields: ['title', 'names', 'body'],
      storeFields: ['type'],
      tokenize,
      searchOptions: { tokenize: tokenizeQuery },
    });
  }

  get size(): number {
    return this.docs.size;
  }

  /** Replaces the whole index with `docs`. */
  async rebuild(docs: AsyncIterable<SearchDoc> | Iterable<SearchDoc>): Promise<void> {
    const next = SearchIndex.create();
    const all: SearchDoc[] = [];
    for await (const d of docs) all.push(d);
    await next.addAllAsync(all, { chunkSize: 500 });
    this.index = next;
    this.docs.clear();
    for (const d of all) this.docs.set(d.key, d);
  }

  /** Adds or replaces one document. */
  upsert(doc: SearchDoc): void {
    if (this.docs.has(doc.key)) this.index.discard(doc.key);
    this.index.add(doc);
    this.docs.set(doc.key, doc);
  }

  /** Removes one document if present. */
  remove(key: string): void {
    if (!this.docs.has(key)) return;
    this.index.discard(key);
    this.docs.delete(key);
  }

  /** Hits for `query`, best first, and the number of hits of each type before the type filter. */
  search(query: string, type?: SearchDocType, limit = 30): { hits: SearchHit[]; facets: Record<SearchDocType, number>; groups: Partial<Record<SearchDocType, Record<string, number>>> } {
    const terms = tokenizeQuery(query);
    const results: SearchResult[] = terms.length
      ? this.index.search({ combineWith: 'AND', queries: terms.map((t, i) => termQuery(t, i === terms.length - 1)) }, { boost: { title: 3, names: 3, body: 1 } })
      : [];
    const facets: Record<SearchDocType, number> = { steel: 0, abrasive: 0, method: 0, result: 0, cell: 0 };
    for (const r of results) facets[r.type as SearchDocType] += 1;
    // Sub-facets (category of steels, material of abrasives) over every hit of the type.
    const groups: Partial<Record<SearchDocType, Record<string, number>>> = {};
    for (const r of results) {
      const group = this.docs.get(r.id as string)?.group;
      if (!group) continue;
      const counts = (groups[r.type as SearchDocType] ??= {});
      counts[group] = (counts[group] ?? 0) + 1;
    }
    const hits = results
      .filter((r) => !type || r.type === type)
      .slice(0, limit)
      .map((r) => {
        const doc = this.docs.get(r.id as string)!;
        const piece = snippet(doc, r.terms);
        return {
          type: doc.type, id: doc.id, slug: doc.slug, title: doc.title,
          snippet: piece.text, highlights: piece.highlights, titleHighlights: matchedSpans(doc.title, r.terms), ...(doc.group ? { group: doc.group } : {}),
          score: Math.round(r.score * 100) / 100, ...(doc.cell ? { cell: doc.cell } : {}) };
      });
    return { hits, facets, groups };
  }
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
function snippet(doc: SearchDoc, terms: string[]): { text: string; highlights: [number, number][] } {
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
