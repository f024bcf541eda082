import { useEffect, useId, useState } from 'react';
import { Link, useSearchParams } from 'react-router-dom';
import { limits } from '@shared/validations';
import { paths } from '@/config/paths';
import { useDebouncedValue } from '@/hooks/use-debounced-value';
import { Input } from '@/components/ui/field';
import { PageTitle } from '@/components/ui/page-title';
import { Empty, ErrorState, Loading } from '@/components/ui/states';
import { useSearch } from '@/features/search/api/search';
import { HIT_GROUPS, SearchHits } from '@/features/search/components/search-hits';
import type { SearchHitType } from '@/types/api';

const hitTypes = new Set<string>(HIT_GROUPS.map((g) => g.type));

/** Search: hits appear as you type (after a pause of 200 ms), grouped by type, with the query in the URL. */
export default function SearchRoute() {
  const [params, setParams] = useSearchParams();
  const urlQ = params.get('q') ?? '';
  const typeParam = params.get('type') ?? '';
  const type = hitTypes.has(typeParam) ? (typeParam as SearchHitType) : undefined;
  const [text, setText] = useState(urlQ);
  const q = useDebouncedValue(text.trim(), 200);
  const id = useId();

  // Keep the address bar in step with what is being searched, without piling up history entries.
  useEffect(() => {
    if (q === urlQ) return;
    const next = new URLSearchParams(params);
    if (q) next.set('q', q);
    else next.delete('q');
    setParams(next, { replace: true });
  }, [q]);

  // Back and forward change the address, not the box: follow them.
  useEffect(() => {
    if (urlQ !== q) setText(urlQ);
  }, [urlQ]);

  const results = useSearch(q, type);
  const typeHref = (t?: SearchHitType) => {
    const next = new URLSearchParams();
    if (q) next.set('q', q);
    if (t) next.set('type', t);
    return `${paths.search.getHref()}?${next.toString()}`;
  };

  return (
    <div className="flex flex-col gap-6">
      <PageTitle title={q ? `Search: ${q}` : 'Search'}>Search</PageTitle>
      <div role="search" className="flex max-w-2xl flex-col gap-1">
        <label htmlFor={id} className="font-medium">
          Search steels, abrasives, methods and results
        </label>
        <Input
          id={id}
          type="search"
          autoFocus
          value={text}
          maxLength={limits.searchQueryMax}
          placeholder="e.g. D2, 1.2379, CBN, F400"
          onChange={(e) => setText(e.target.value)}
        />
        <p className="text-sm text-muted">Results appear as you type.</p>
      </div>

      {results.data && q ? (
        <nav aria-label="Kinds of hits" className="flex flex-wrap gap-2 text-sm">
          <Link to={typeHref()} aria-current={!type ? 'page' : undefined} className={!type ? 'font-semibold' : ''}>
            All
          </Link>
          {HIT_GROUPS.map((g) => (
            <Link
              key={g.type}
              to={typeHref(g.type)}
              aria-current={type === g.type ? 'page' : undefined}
              className={type === g.type ? 'font-semibold' : ''}
            >
              {g.heading} ({results.data.facets?.[g.type] ?? 0})
            </Link>
          ))}
        </nav>
      ) : null}

      <div aria-live="polite" aria-busy={results.isFetching}>
        {!q ? (
          <p className="text-muted">Type a steel grade (AISI, EN or JIS), an abrasive, a grit or a word from a result’s notes.</p>
        ) : results.isPending ? (
          <Loading label="Searching…" />
        ) : results.isError ? (
          <ErrorState error={results.error} onRetry={() => results.refetch()} title="The search failed" />
        ) : results.data.hits.length === 0 ? (
          <Empty title={`Nothing found for “${q}”`}>Try fewer letters, another designation of the same steel, or a grit.</Empty>
        ) : (
          <SearchHits hits={results.data.hits} query={q} facets={results.data.facets} typeHref={type ? undefined : typeHref} />
        )}
      </div>
    </div>
  );
}
