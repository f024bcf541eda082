import { createHash } from 'node:crypto';
import type { CompareFilters, CompareQuery } from '@shared/schemas/compare';
import { sortRows, type CompareRow } from '@shared/compare-view';
import { SHRINKAGE_PSEUDO_RESULTS } from '@shared/compare-shrinkage';
import type { compareTableSchema, Presented } from '@shared/schemas/responses';
import { comparisonCsv, comparisonJson, type ExportContext } from '@shared/compare-export';
import { filtersInWords, filtersQueryString, resolveView, viewRows, type ResolvedView } from './compare-view';

/** The method version a view compares, with the versions it replaces and is replaced by. */
function methodOf(view: ResolvedView) {
  const m = view.method;
  const replacedBy = [...view.look.methods.values()].find((x) => x.replacesId === m.id);
  return {
    slug: m.slug,
    name: m.name,
    version: m.version,
    replaces: m.replacesId ? (view.look.methods.get(m.replacesId)?.slug ?? null) : null,
    replacedBy: replacedBy?.slug ?? null,
  };
}

/**
 * GET /api/compare: one page of the comparison's cells (method × steel × abrasive material ×
 * grit band) for one method version, sorted, with the totals of the whole view. Read from the
 * precomputed cells unless a filter needs each result (`source` says which).
 */
export async function compare(query: CompareQuery) {
  return computeCompare(query, await resolveView(query));
}

/** A response body ready to send, with its entity tag and where its page stands (for the Link header). */
export interface CompareBody {
  body: string;
  etag: string;
  page: { page: number; pageSize: number; total: number };
}

/**
 * GET /api/compare as serialised JSON with its entity tag (the route keeps both until a cell,
 * a page or an account changes: server/middleware/answer-cache.ts).
 */
export async function compareBody(query: CompareQuery): Promise<CompareBody> {
  const answer = (await compare(query)) satisfies Presented<typeof compareTableSchema>;
  const body = JSON.stringify(answer);
  return { body, etag: `W/"${createHash('sha1').update(body).digest('base64url')}"`, page: { page: answer.page, pageSize: answer.pageSize, total: answer.total } };
}

async function computeCompare(query: CompareQuery, view: ResolvedView) {
  const { rows, source, overallMedianG, methodResults } = await viewRows(view);
  const sorted = sortRows(rows, query.sort);
  const start = (query.page - 1) * query.pageSize;
  return {
    method: methodOf(view),
    step: view.step,
    source,
    /** Filters that made the view come from the results table rather than the cells. */
    liveFilters: view.liveKeys,
    sort: query.sort ?? null,
    total: rows.length,
    totalResults: rows.reduce((s, r) => s + r.n, 0),
    methodResults,
    shrinkage: { pseudoResults: SHRINKAGE_PSEUDO_RESULTS, overallMedianG },
    page: query.page,
    pageSize: query.pageSize,
    rows: sorted.slice(start, start + query.pageSize),
  };
}
/** The body of GET /api/compare. */
export type CompareResponse = Awaited<ReturnType<typeof computeCompare>>;


/** The day in UTC as YYYY-MM-DD. */
const isoDay = (d: Date) => d.toISOString().slice(0, 10);

/**
 * GET /api/compare/export: the whole view (every page) as CSV or JSON, with the licence, a
 * citation naming the date and the URL of the view, and the method version.
 */
export async function compareExport(filters: CompareFilters & { sort?: string }, format: 'csv' | 'json', baseUrl: string, now = new Date()) {
  const view = await resolveView(filters);
  const { rows } = await viewRows(view);
  const sorted: CompareRow[] = sortRows(rows, filters.sort);
  const { sort, ...rest } = filters;
  const qs = filtersQueryString({ ...rest, method: view.method.slug }, { sort });
  const ctx: ExportContext = {
    url: `${baseUrl}/compare${qs ? `?${qs}` : ''}`,
    retrievedOn: isoDay(now),
    methods: [{ slug: view.method.slug, name: view.method.name, version: view.method.version }],
    filters: filtersInWords(view),
    step: view.step,
  };
  const name = `edgeledger-comparison-${view.method.slug}-${ctx.retrievedOn}`;
  return format === 'csv'
    ? { filename: `${name}.csv`, contentType: 'text/csv; charset=utf-8', body: comparisonCsv(sorted, ctx) }
    : { filename: `${name}.json`, contentType: 'application/json; charset=utf-8', body: JSON.stringify(comparisonJson(sorted, ctx), null, 2) };
}
