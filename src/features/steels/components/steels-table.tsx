import { useId, useMemo } from 'react';
import { Link, useSearchParams } from 'react-router-dom';
import { createColumnHelper } from '@tanstack/react-table';
import { STEEL_CATEGORIES } from '@shared/vocabulary';
import { matchesComposition, parseCompositionFilter, type CompositionLimit, type ElementFilter } from '@shared/composition-filter';
import { paths } from '@/config/paths';
import { DataTable } from '@/components/ui/table';
import { Field, Input, Select } from '@/components/ui/field';
import { Empty } from '@/components/ui/states';
import { formatNumber, label } from '@/lib/format';
import type { Designation, SteelSummary } from '@/types/api';

/** A steel in the list; the server sends its composition limits too (wt %). */
type SteelRow = SteelSummary & { composition?: CompositionLimit[] };

const column = createColumnHelper<SteelRow>();

/** Designations in one line, e.g. "AISI D2 · EN 1.2379". */
export function formatDesignations(designations: Designation[]): string {
  return designations.map((d) => `${d.system} ${d.code}`).join(' · ');
}

/** The middle of an element's range (0 to max for a maximum-only limit), wt %, or undefined when not listed. */
function nominal(s: SteelRow, element: string): number | undefined {
  const l = s.composition?.find((c) => c.element === element);
  return l ? ((l.min ?? 0) + l.max) / 2 : undefined;
}

/** The list's filters, kept in the address so a filtered list can be shared. */
function useSteelFilters() {
  const [params, setParams] = useSearchParams();
  const set = (key: string, value: string) => {
    const next = new URLSearchParams(params);
    if (value) next.set(key, value);
    else next.delete(key);
    setParams(next, { replace: true });
  };
  return { category: params.get('category') ?? '', composition: params.get('composition') ?? '', hrcMin: params.get('hrcMin') ?? '', hrcMax: params.get('hrcMax') ?? '', set };
}

/**
 * The steel grades as a sortable table (TanStack Table), with filters: category, element ranges
 * typed as "C ≥ 1 %, V ≥ 2 %" (compared with the middle of each standard range), and a typical
 * hardness range that must overlap the steel's.
 */
export function SteelsTable({ steels }: { steels: SteelRow[] }) {
  const id = useId();
  const f = useSteelFilters();
  let filters: ElementFilter[] = [];
  let compositionError: string | undefined;
  try {
    filters = parseCompositionFilter(f.composition);
  } catch (err) {
    compositionError = err instanceof Error ? err.message : 'cannot read this filter';
  }
  const hrcMin = f.hrcMin === '' ? undefined : Number(f.hrcMin);
  const hrcMax = f.hrcMax === '' ? undefined : Number(f.hrcMax);
  const shown = steels.filter(
    (s) =>
      (!f.category || s.category === f.category) &&
      (compositionError || !s.composition || matchesComposition(s.composition, filters)) &&
      (hrcMin === undefined || Number.isNaN(hrcMin) || (s.hardnessHrc?.max ?? -Infinity) >= hrcMin) &&
      (hrcMax === undefined || Number.isNaN(hrcMax) || (s.hardnessHrc?.min ?? Infinity) <= hrcMax),
  );

  const columns = useMemo(
    () => [
      column.accessor('name', {
        header: 'Steel',
        cell: (info) => <Link to={paths.steel.getHref(info.row.original.slug)}>{info.getValue()}</Link>,
      }),
      column.accessor((s) => label(STEEL_CATEGORIES, s.category), { id: 'category', header: 'Category' }),
      column.accessor((s) => formatDesignations(s.designations), {
        id: 'designations',
        header: 'Designations',
        enableSorting: false,
        cell: (info) => <span className="text-sm">{info.getValue() || '—'}</span>,
      }),
      ...['C', 'Cr', 'V'].map((element) =>
        column.accessor((s) => nominal(s, element), {
          id: `el-${element}`,
          header: `${element} %`,
          meta: { numeric: true },
          sortUndefined: 'last',
          cell: (info) => formatNumber(info.getValue(), 2),
        }),
      ),
      column.accessor((s) => s.hardnessHrc?.min, {
        id: 'hrc',
        header: 'Typical HRC',
        meta: { numeric: true },
        sortUndefined: 'last',
        cell: (info) => {
          const h = info.row.original.hardnessHrc;
          return h ? `${h.min}–${h.max}` : '—';
        },
      }),
      column.accessor('resultCount', { header: 'Results', meta: { numeric: true } }),
    ],
    [],
  );
  return (
    <div className="flex flex-col gap-4">
      <form role="search" aria-label="Filter steels" className="grid gap-3 rounded-md border border-rule bg-panel p-4 md:grid-cols-[12rem_1fr_7rem_7rem]" onSubmit={(e) => e.preventDefault()}>
        <Field id={`${id}-cat`} label="Category">
          <Select id={`${id}-cat`} value={f.category} onChange={(e) => f.set('category', e.target.value)}>
            <option value="">any</option>
            {Object.entries(STEEL_CATEGORIES).map(([value, text]) => (
              <option key={value} value={value}>
                {text}
              </option>
            ))}
          </Select>
        </Field>
        <Field id={`${id}-comp`} label="Elements" hint="e.g. C ≥ 1 %, V ≥ 2 % (the middle of each standard range)" error={compositionError}>
          <Input
            id={`${id}-comp`}
            value={f.composition}
            placeholder="C ≥ 1 %, Cr ≥ 12 %"
            aria-invalid={compositionError ? true : undefined}
            aria-describedby={`${id}-comp-hint${compositionError ? ` ${id}-comp-error` : ''}`}
            onChange={(e) => f.set('composition', e.target.value)}
          />
        </Field>
        <Field id={`${id}-hmin`} label="HRC from">
          <Input id={`${id}-hmin`} type="number" inputMode="decimal" value={f.hrcMin} onChange={(e) => f.set('hrcMin', e.target.value)} />
        </Field>
        <Field id={`${id}-hmax`} label="HRC to">
          <Input id={`${id}-hmax`} type="number" inputMode="decimal" value={f.hrcMax} onChange={(e) => f.set('hrcMax', e.target.value)} />
        </Field>
      </form>
      <p role="status" className="text-sm text-muted">
        {shown.length} of {steels.length} steel grades
      </p>
      {shown.length ? (
        <DataTable label="Steel grades" data={shown} columns={columns} rowKey={(s) => s.slug} initialSorting={[{ id: 'name', desc: false }]} />
      ) : (
        <Empty title="No steel matches these filters">Loosen a filter, or clear the element filter.</Empty>
      )}
    </div>
  );
}
