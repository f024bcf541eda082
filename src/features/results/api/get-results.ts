import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { apiGet } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';
import type { Page, ResultSummary } from '@/types/api';
import type { ResultStatus } from '@shared/schemas/result';

/** Filters of GET /api/results; steel, abrasive and method are slugs, author a handle. */
export interface ResultsQuery {
  status?: ResultStatus;
  steel?: string;
  abrasive?: string;
  method?: string;
  author?: string;
  page?: number;
}

/** GET /api/results: one page of results, newest first (visitors see published ones only). */
export function getResults(query: ResultsQuery, signal?: AbortSignal): Promise<Page<ResultSummary>> {
  return apiGet<Page<ResultSummary>>('/api/results', { ...query }, signal);
}

/** Query options for a page of results; the previous page stays on screen while the next loads. */
export const resultsQueryOptions = (query: ResultsQuery) =>
  queryOptions({
    queryKey: queryKeys.results.list(query),
    queryFn: ({ signal }) => getResults(query, signal),
    placeholderData: keepPreviousData,
  });

/** A page of results, as a query. */
export function useResults(query: ResultsQuery, options: { enabled?: boolean } = {}) {
  return useQuery({ ...resultsQueryOptions(query), ...options });
}
