/**
 * Every TanStack Query key, from one module, so queries and the mutations that invalidate
 * them always agree. Keys are hierarchical: invalidating `results.all` refreshes every list
 * and detail of results.
 */
import type { CompareFilters, ResultFilters } from '@/config/paths';

export const queryKeys = {
  session: ['session'] as const,
  demoAccounts: ['auth', 'demo-accounts'] as const,
  results: {
    all: ['results'] as const,
    list: (filters: ResultFilters & { status?: string; author?: string }) => ['results', 'list', filters] as const,
    detail: (id: number) => ['results', 'detail', id] as const,
  },
  reviewDesk: ['review-desk'] as const,
  compare: {
    all: ['compare'] as const,
    table: (filters: CompareFilters) => ['compare', filters] as const,
  },
  search: {
    all: ['search'] as const,
    query: (q: string, type?: string) => ['search', q, type ?? null] as const,
  },
  steels: {
    all: ['steels'] as const,
    list: () => ['steels', 'list'] as const,
    detail: (slug: string) => ['steels', 'detail', slug] as const,
  },
  abrasives: {
    all: ['abrasives'] as const,
    list: () => ['abrasives', 'list'] as const,
    detail: (slug: string) => ['abrasives', 'detail', slug] as const,
  },
  methods: {
    all: ['methods'] as const,
    list: () => ['methods', 'list'] as const,
    detail: (slug: string) => ['methods', 'detail', slug] as const,
  },
} as const;
