import { useSearchParams } from 'react-router-dom';
import { paths, type ResultFilters } from '@/config/paths';
import { Field, Select } from '@/components/ui/field';
import { PageTitle } from '@/components/ui/page-title';
import { Pager } from '@/components/ui/pager';
import { Empty, ErrorState, Loading } from '@/components/ui/states';
import { useAbrasives } from '@/features/abrasives/api/get-abrasives';
import { useMethods } from '@/features/methods/api/get-methods';
import { useSteels } from '@/features/steels/api/get-steels';
import { useResults } from '@/features/results/api/get-results';
import { ResultsTable } from '@/features/results/components/results-table';

const FILTERS = ['steel', 'abrasive', 'method'] as const;

/** Every published result, newest first, filtered by steel, abrasive or method through the URL. */
export default function ResultsRoute() {
  const [params, setParams] = useSearchParams();
  const filters: ResultFilters = {};
  for (const key of FILTERS) {
    const v = params.get(key);
    if (v) filters[key] = v;
  }
  const page = Math.max(1, Number.parseInt(params.get('page') ?? '1', 10) || 1);
  const results = useResults({ status: 'approved', ...filters, page });
  const steels = useSteels();
  const abrasives = useAbrasives();
  const methods = useMethods();

  const setFilter = (key: (typeof FILTERS)[number], value: string) => {
    const next = new URLSearchParams(params);
    if (value) next.set(key, value);
    else next.delete(key);
    next.delete('page');
    setParams(next, { replace: true });
  };

  const options = {
    steel: steels.data?.items.map((s) => ({ value: s.slug, text: s.name })) ?? [],
    abrasive: abrasives.data?.items.map((a) => ({ value: a.slug, text: a.name })) ?? [],
    method: methods.data?.items.map((m) => ({ value: m.slug, text: m.name })) ?? [],
  };
  const words = { steel: ['Steel', 'All steels'], abrasive: ['Final abrasive', 'All abrasives'], method: ['Method', 'All methods'] };

  return (
    <div className="flex flex-col gap-6">
      <PageTitle title="Results" lead="Published results, newest first. Each was reviewed by a moderator before it appeared here.">
        Results
      </PageTitle>
      <form aria-label="Filter results" onSubmit={(e) => e.preventDefault()} className="grid gap-4 rounded-md border border-rule bg-panel p-4 sm:grid-cols-3">
        {FILTERS.map((key) => (
          <Field key={key} id={`results-${key}`} label={words[key][0]}>
            <Select id={`results-${key}`} value={filters[key] ?? ''} onChange={(e) => setFilter(key, e.target.value)}>
              <option value="">{words[key][1]}</option>
              {options[key].map((o) => (
                <option key={o.value} value={o.value}>
                  {o.text}
                </option>
              ))}
            </Select>
          </Field>
        ))}
      </form>
      {results.isPending ? (
        <Loading label="Loading results…" />
      ) : results.isError ? (
        <ErrorState error={results.error} onRetry={() => results.refetch()} />
      ) : results.data.items.length === 0 ? (
        <Empty title="No published results match">Clear a filter, or look again after the next review round.</Empty>
      ) : (
        <>
          <p className="text-sm text-muted" aria-live="polite">
            {results.data.total} result{results.data.total === 1 ? '' : 's'}
          </p>
          <ResultsTable results={results.data.items} label="Published results" />
          <Pager
            page={results.data.page}
            pageSize={results.data.pageSize}
            total={results.data.total}
            hrefFor={(p) => paths.results.getHref({ ...filters, page: p })}
          />
        </>
      )}
    </div>
  );
}
