import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiGet } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';
import type { CellPosition, DeskCell, OutlierHint } from '@shared/desk-context';

/** A pending result's context on the desk (all figures in g of force; fewer grams is sharper). */
export interface DeskContext {
  resultId: number;
  cell: { method: string | null; material: string; materialLabel: string; gritPhi: number; figures: DeskCell | null; position: CellPosition | null; outlier: OutlierHint };
  sharpnessMedianG: number;
  readings: { required: number; given: number; short: number; words: string };
  nearDuplicateRule: string;
  nearDuplicates: {
    id: number;
    status: string;
    author: { handle: string; displayName: string } | null;
    sameAuthor: boolean;
    perSideDeg: number;
    sharpnessMedianG: number;
    createdAt: string;
  }[];
  authorRecord: { published: number; pending: number; returnedNow: number; everReturned: number; rejected: number };
}

/** GET /api/review-desk/results/:id/context (moderators). */
export function getDeskContext(id: number, signal?: AbortSignal): Promise<DeskContext> {
  return apiGet<DeskContext>(`/api/review-desk/results/${id}/context`, {}, signal);
}

export const deskContextQueryOptions = (id: number) => queryOptions({ queryKey: queryKeys.deskContext(id), queryFn: ({ signal }) => getDeskContext(id, signal), staleTime: 0 });

/** The open result's context, as a query. */
export function useDeskContext(id: number) {
  return useQuery(deskContextQueryOptions(id));
}
