import { useCallback, useMemo } from 'react';
import { useSearchParams } from 'react-router-dom';

/** The comparison's filters as the URL and the API name them (shared/schemas/compare.ts). */
export const FILTER_KEYS = [
  'method',
  'steel',
  'category',
  'material',
  'bond',
  'step',
  'umMin',
  'umMax',
  'hrcMin',
  'hrcMax',
  'angleMin',
  'angleMax',
  'publisher',
  'postedFrom',
  'postedTo',
  'via',
  'steps',
] as const;
export type FilterKey = (typeof FILTER_KEYS)[number];

/** Keys of the page itself: which view, the open cell, the pair, the chart's steel, the grit notation. */
const PAGE_KEYS = ['sort', 'page', 'view', 'cell', 'a', 'b', 'cs', 'cellPage', 'notation'] as const;
type PageKey = (typeof PAGE_KEYS)[number];

/** How the comparison is shown. */
export type CompareViewMode = 'table' | 'grid' | 'charts';

export type Params = Partial<Record<FilterKey | PageKey, string>>;

/**
 * The whole state of the comparison page, read from and written to the URL, so a link (or a
 * reload) reproduces the view. Changing a filter goes back to the first page and closes the
 * open cell, whose figures would no longer match.
 */
export function useCompareUrl() {
  const [search, setSearch] = useSearchParams();
  const params = useMemo(() => {
    const out: Params = {};
    for (const key of [...FILTER_KEYS, ...PAGE_KEYS]) {
      const v = search.get(key);
      if (v) out[key] = v;
    }
    return out;
  }, [search]);

  const filters = useMemo(() => {
    const out: Partial<Record<FilterKey, string>> = {};
    for (const key of FILTER_KEYS) if (params[key]) out[key] = params[key];
    return out;
  }, [params]);

  const update = useCallback(
    (change: Params | ((current: URLSearchParams) => Params), opts: { keepPage?: boolean } = {}) => {
      setSearch(
        () => {
          // The address bar, not the last render: React Router renders a navigation as a
          // transition, so a second change right after the first would start from stale params.
          const next = new URLSearchParams(window.location.search);
          const changes = typeof change === 'function' ? change(next) : change;
          for (const [k, v] of Object.entries(changes)) {
            if (v === undefined || v === '') next.delete(k);
            else next.set(k, v);
          }
          const filterChanged = Object.keys(changes).some((k) => (FILTER_KEYS as readonly string[]).includes(k));
          if (!opts.keepPage && !('page' in changes)) next.delete('page');
          if (filterChanged) for (const k of ['cell', 'cellPage', 'a', 'b']) if (!(k in changes)) next.delete(k);
          return next;
        },
        { replace: true },
      );
    },
    [setSearch],
  );

  const view: CompareViewMode = params.view === 'grid' || params.view === 'charts' ? params.view : 'table';
  return { params, filters, view, update };
}

/**
 * The sort after a press on a column's header: ascending, then descending, then none. It
 * takes the sort from the address bar at the press, so two quick presses never both start from
 * the same (not yet rendered) state.
 */
export function nextSort(current: string | undefined, column: string): string | undefined {
  if (current === column) return `-${column}`;
  if (current === `-${column}`) return undefined;
  return column;
}

/** A comma list from the URL as an array ("a,b" → ["a", "b"]). */
export function listOf(value: string | undefined): string[] {
  return value ? value.split(',').filter(Boolean) : [];
}
