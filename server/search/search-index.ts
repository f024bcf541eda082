import MiniSearch, { type SearchResult } from 'minisearch';

export type SearchDocType = 'steel' | 'abrasive' | 'method' | 'result';

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
}

export interface SearchHit {
  type: SearchDocType;
  id?: number;
  slug?: string;
  title: string;
  snippet: string;
  score: number;
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
  search(query: string, type?: SearchDocType, limit = 30): { hits: SearchHit[]; facets: Record<SearchDocType, number> } {
    const terms = tokenizeQuery(query);
    const results: SearchResult[] = terms.length
      ? this.index.search(query, {
          boost: { title: 3, names: 3, body: 1 },
          combineWith: 'AND',
          prefix: (_term, i, all) => i === all.length - 1,
          fuzzy: (term) => (term.length >= 5 ? 0.2 : false),
        })
      : [];
    const facets: Record<SearchDocType, number> = { steel: 0, abrasive: 0, method: 0, result: 0 };
    for (const r of results) facets[r.type as SearchDocType] += 1;
    const hits = results
      .filter((r) => !type || r.type === type)
      .slice(0, limit)
      .map((r) => {
        const doc = this.docs.get(r.id as string)!;
        return { type: doc.type, id: doc.id, slug: doc.slug, title: doc.title, snippet: snippet(doc, r.terms), score: Math.round(r.score * 100) / 100 };
      });
    return { hits, facets };
  }
}

/** About 160 characters of the body around the first matched term. */
function snippet(doc: SearchDoc, terms: string[]): string {
  const text = doc.body || doc.names;
  const lower = text.toLowerCase();
  const at = terms.map((t) => lower.indexOf(t)).filter((i) => i >= 0).sort((a, b) => a - b)[0] ?? 0;
  const start = Math.max(0, at - 60);
  const piece = text.slice(start, start + 160).trim();
  return `${start > 0 ? '… ' : ''}${piece}${start + 160 < text.length ? ' …' : ''}`;
}
