import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { apiGet } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';
import type { Page } from '@/types/api';
import type { AuditLine } from '../types';

export interface AuditFilters {
  actor?: string;
  action?: string;
  page?: number;
}

/** GET /api/audit (moderators): the audit log, newest first, filtered by actor and action prefix. */
export function getAudit(filters: AuditFilters, signal?: AbortSignal): Promise<Page<AuditLine>> {
  return apiGet<Page<AuditLine>>('/api/audit', { ...filters }, signal);
}

export const auditQueryOptions = (filters: AuditFilters) =>
  queryOptions({ queryKey: queryKeys.audit(filters), queryFn: ({ signal }) => getAudit(filters, signal), placeholderData: keepPreviousData, staleTime: 0 });

/** A page of the audit log, as a query. */
export function useAudit(filters: AuditFilters) {
  return useQuery(auditQueryOptions(filters));
}
