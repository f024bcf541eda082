import { useId } from 'react';
import { useSearchParams } from 'react-router-dom';
import { ABRASIVE_MATERIALS } from '@shared/vocabulary';
import { Field, Input, Select } from '@/components/ui/field';
import { Button } from '@/components/ui/button';
import type { CompareFilters as Filters } from '@/config/paths';

export const COMPARE_FILTER_KEYS = ['method', 'steel', 'material', 'hrcMin', 'hrcMax'] as const;

/** The comparison's filters as they stand in the URL (so a filtered table can be linked to). */
export function useCompareFilters(): [Filters, (next: Filters) => void] {
  const [params, setParams] = useSearchParams();
  const filters: Filters = {};
  for (const key of COMPARE_FILTER_KEYS) {
    const v = params.get(key);
    if (v) filters[key] = v;
  }
  const update = (next: Filters) => {
    const out = new URLSearchParams();
    for (const key of COMPARE_FILTER_KEYS) if (next[key]) out.set(key, next[key]!);
    setParams(out, { replace: true });
  };
  return [filters, update];
}

export interface CompareFiltersProps {
  methods: { slug: string; name: string }[];
  steels: { slug: string; name: string }[];
}

/** Form controls bound to the URL's search parameters; the table follows as they change. */
export function CompareFilters({ methods, steels }: CompareFiltersProps) {
  const [filters, setFilters] = useCompareFilters();
  const id = useId();
  const set = (key: keyof Filters, value: string) => setFilters({ ...filters, [key]: value });
  const any = COMPARE_FILTER_KEYS.some((k) => filters[k]);

  return (
    <form
      aria-label="Filter the comparison"
      onSubmit={(e) => e.preventDefault()}
      className="grid grid-cols-2 gap-4 rounded-md border border-rule bg-panel p-4 lg:grid-cols-[repeat(3,minmax(0,1fr))_8rem_8rem_auto]"
    >
      <Field className="col-span-2 lg:col-span-1" id={`${id}-method`} label="Method">
        <Select id={`${id}-method`} value={filters.method ?? ''} onChange={(e) => set('method', e.target.value)}>
          <option value="">All methods</option>
          {methods.map((m) => (
            <option key={m.slug} value={m.slug}>
              {m.name}
            </option>
          ))}
        </Select>
      </Field>
      <Field className="col-span-2 lg:col-span-1" id={`${id}-steel`} label="Steel">
        <Select id={`${id}-steel`} value={filters.steel ?? ''} onChange={(e) => set('steel', e.target.value)}>
          <option value="">All steels</option>
          {steels.map((s) => (
            <option key={s.slug} value={s.slug}>
              {s.name}
            </option>
          ))}
        </Select>
      </Field>
      <Field className="col-span-2 lg:col-span-1" id={`${id}-material`} label="Abrasive material">
        <Select id={`${id}-material`} value={filters.material ?? ''} onChange={(e) => set('material', e.target.value)}>
          <option value="">All materials</option>
          {Object.entries(ABRASIVE_MATERIALS).map(([value, text]) => (
            <option key={value} value={value}>
              {text}
            </option>
          ))}
        </Select>
      </Field>
      <Field id={`${id}-hrc-min`} label="HRC from">
        <Input
          id={`${id}-hrc-min`}
          type="number"
          inputMode="decimal"
          min={0}
          max={100}
          step="any"
          value={filters.hrcMin ?? ''}
          onChange={(e) => set('hrcMin', e.target.value)}
        />
      </Field>
      <Field id={`${id}-hrc-max`} label="HRC to">
        <Input
          id={`${id}-hrc-max`}
          type="number"
          inputMode="decimal"
          min={0}
          max={100}
          step="any"
          value={filters.hrcMax ?? ''}
          onChange={(e) => set('hrcMax', e.target.value)}
        />
      </Field>
      <div className="col-span-2 flex items-end lg:col-span-1">
        <Button variant="quiet" onClick={() => setFilters({})} disabled={!any}>
          Clear filters
        </Button>
      </div>
    </form>
  );
}
