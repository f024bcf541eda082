import type { ReactNode } from 'react';
import { ApiError } from '@/lib/api-client';
import { Button } from './button';

/** Shown while data is on its way; announced politely to screen readers. */
export function Loading({ label = 'Loading…' }: { label?: string }) {
  return (
    <div role="status" aria-live="polite" className="flex items-center gap-3 py-8 text-muted">
      <span aria-hidden="true" className="h-4 w-4 animate-spin rounded-full border-2 border-rule border-t-accent" />
      <span>{label}</span>
    </div>
  );
}

/** Shown when there is nothing to list yet; says why and, where useful, what to do. */
export function Empty({ title, children }: { title: string; children?: ReactNode }) {
  return (
    <div className="rounded-md border border-dashed border-rule bg-panel/60 px-5 py-8 text-center">
      <p className="font-serif text-lg">{title}</p>
      {children ? <div className="mt-2 text-muted">{children}</div> : null}
    </div>
  );
}

/** Words for a failed request that a person can act on. */
export function describeError(error: unknown): string {
  if (error instanceof ApiError) {
    if (error.status === 401) return 'You are signed out. Sign in and try again.';
    if (error.status === 403) return `Not allowed: ${error.error}`;
    if (error.status === 404) return 'Not found: it may have been moved, or it is not published.';
    if (error.status >= 500) return 'The server ran into a problem. Try again in a moment.';
    return error.error;
  }
  if (error instanceof TypeError) return 'Could not reach the server. Check the connection and try again.';
  return error instanceof Error ? error.message : 'Something went wrong.';
}

/** Shown when a request failed: what happened, and a way to try again. */
export function ErrorState({ error, onRetry, title = 'This could not be loaded' }: { error: unknown; onRetry?: () => void; title?: string }) {
  return (
    <div role="alert" className="rounded-md border border-danger/40 bg-danger-soft px-5 py-4">
      <p className="font-semibold text-danger">{title}</p>
      <p className="mt-1">{describeError(error)}</p>
      {onRetry ? (
        <Button variant="secondary" size="sm" className="mt-3" onClick={onRetry}>
          Try again
        </Button>
      ) : null}
    </div>
  );
}

/** The query fields ListStates reads: TanStack Query's result for a list endpoint. */
interface ListQuery<T> {
  isPending: boolean;
  isError: boolean;
  error: unknown;
  data: { items: T[] } | undefined;
  refetch: () => unknown;
}

/** A list's loading, error and empty states, or its items through `children` once there are some. */
export function ListStates<T>({ query, emptyTitle, children }: { query: ListQuery<T>; emptyTitle: string; children: (items: T[]) => ReactNode }) {
  if (query.isPending) return <Loading />;
  if (query.isError || !query.data) return <ErrorState error={query.error} onRetry={() => query.refetch()} />;
  if (query.data.items.length === 0) return <Empty title={emptyTitle} />;
  return <>{children(query.data.items)}</>;
}
