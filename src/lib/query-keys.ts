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
    revisions: (id: number) => ['results', 'revisions', id] as const,
  },
  adminUsers: (q: string) => ['admin-users', q] as const,
  reviewDesk: ['review-desk'] as const,
  /** Under `reviewDesk`, so a decision refreshes the open result's context too. */
  deskContext: (resultId: number) => ['review-desk', 'context', resultId] as const,
  wheels: ['wheels'] as const,
  /** Under `wheels`, so a change to the wheel log refreshes the workshop too (and the other way round). */
  workshop: ['wheels', 'workshop'] as const,
  priceReports: (abrasive: string) => ['price-reports', abrasive] as const,
  /** Publishing and curation (issue 6). */
  me: ['me'] as const,
  tokens: ['tokens'] as const,
  profile: (handle: string) => ['profiles', handle] as const,
  photos: (resultId: number) => ['photos', resultId] as const,
  audit: (filters: { actor?: string; action?: string; page?: number }) => ['audit', filters] as const,
  publisherApplications: (status?: string) => ['publisher-applications', status ?? null] as const,
  publishingSettings: ['publishing-settings'] as const,
  devMail: ['dev-mail'] as const,
  compare: {
    all: ['compare'] as const,
    table: (filters: CompareFilters) => ['compare', filters] as const,
    cell: (params: CompareFilters) => ['compare', 'cell', params] as const,
    paired: (params: CompareFilters) => ['compare', 'paired', params] as const,
    difference: (params: CompareFilters) => ['compare', 'difference', params] as const,
    points: (params: CompareFilters) => ['compare', 'points', params] as const,
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
  wiki: {
    all: ['wiki'] as const,
    history: (section: string, slug: string) => ['wiki', 'history', section, slug] as const,
    revision: (section: string, slug: string, id: number) => ['wiki', 'revision', section, slug, id] as const,
    /** The same key as the section's own detail query (e.g. queryKeys.steels.detail). */
    page: (section: string, slug: string) => [section, 'detail', slug] as const,
  },
  methods: {
    all: ['methods'] as const,
    list: () => ['methods', 'list'] as const,
    detail: (slug: string) => ['methods', 'detail', slug] as const,
  },
} as const;
