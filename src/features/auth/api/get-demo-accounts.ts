import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiGet } from '@/lib/api-client';
import { paths } from '@/config/paths';
import { queryKeys } from '@/lib/query-keys';
import type { DemoAccount } from '@/types/api';

/** GET /auth/demo-accounts: the invented accounts one may sign in as; absent in production (404). */
export function getDemoAccounts(signal?: AbortSignal): Promise<DemoAccount[]> {
  return apiGet<DemoAccount[]>(paths.auth.demoAccounts, {}, signal);
}

/** Query options for the demo accounts; a 404 means this is production and is not retried. */
export const demoAccountsQueryOptions = () =>
  queryOptions({
    queryKey: queryKeys.demoAccounts,
    queryFn: ({ signal }) => getDemoAccounts(signal),
    retry: false,
    staleTime: Infinity,
  });

/** The demo accounts, as a query. */
export function useDemoAccounts() {
  return useQuery(demoAccountsQueryOptions());
}
