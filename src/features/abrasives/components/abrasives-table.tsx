import { useId, useMemo } from 'react';
import { Link, useSearchParams } from 'react-router-dom';
import { gritBandPhi } from '@shared/grit';
import { Field, Select } from '@/components/ui/field';
import { Empty } from '@/components/ui/states';
import { formatGritBand } from '@/lib/format';
import { createColumnHelper } from '@tanstack/react-table';
import { ABRASIVE_FORMS, ABRASIVE_MATERIALS, BONDS, COOLANTS } from '@shared/vocabulary';
import { paths } from '@/config/paths';
import { DataTable } from '@/components/ui/table';
import { formatMicrometres, formatNumber, label } from '@/lib/format';
import type { AbrasiveSummary } from '@/types/api';

const column = createColumnHelper<AbrasiveSummary>();

/** The whole-φ grit band of an abrasive (see shared/grit.ts), or null without a size. */
const bandOf = (a: AbrasiveSummary) => (a.gritUm ? gritBandPhi(a.gritUm) : null);

/**
 * The abrasive types as a sortable table: material, bond, form, grit, size and coolant, with
 * filters by material, bond and grit band kept in the address.
 */
export function AbrasivesTable({ abrasives }: { abrasives: AbrasiveSummary[] }) {
  const id = useId();
  const [params, setParams] = useSearchParams();
  const material = params.get('material') ?? '';
  const bond = params.get('bond') ?? '';
  const band = params.get('band') ?? '';
  const setFilter = (key: string, value: string) => {
    const next = new URLSearchParams(params);
    if (value) next.set(key, value);
    else next.delete(key);
    setParams(next, { replace: true });
  };
  const bands = [...new Set(abrasives.map(bandOf).filter((b): b is number => b !== null))].sort((a, b) => a - b);
  const shown = abrasives.filter((a) => (!material || a.material === material) && (!bond || a.bond === bond) && (!band || String(bandOf(a)) === band));
  const columns = useMemo(
    () => [
      column.accessor('name', {
        header: 'Abrasive',
        cell: (info) => <Link to={paths.abrasive.getHref(info.row.original.slug)}>{info.getValue()}</Link>,
      }),
      column.accessor((a) => label(ABRASIVE_MATERIALS, a.material), { id: 'material', header: 'Material' }),
      column.accessor((a) => label(BONDS, a.bond), { id: 'bond', header: 'Bond' }),
      column.accessor((a) => label(ABRASIVE_FORMS, a.form), { id: 'form', header: 'Form' }),
      column.accessor('gritUm', {
        header: 'Grit',
        meta: { numeric: true },
        sortUndefined: 'last',
        cell: (info) => {
          const a = info.row.original;
          return (
            <span className="whitespace-nowrap">
              {a.grit?.grade ?? '—'}
              {a.gritUm ? <span className="text-muted"> ≈ {formatMicrometres(a.gritUm)} µm</span> : null}
            </span>
          );
        },
      }),
      column.accessor('wheelDiameterMm', {
        header: 'Ø (mm)',
        meta: { numeric: true },
        sortUndefined: 'last',
        cell: (info) => formatNumber(info.getValue(), 0),
      }),
      column.accessor('wears', {
        header: 'Wears',
        cell: (info) => (info.getValue() ? 'yes, shrinks' : 'keeps size'),
      }),
      column.accessor((a) => label(COOLANTS, a.coolant), { id: 'coolant', header: 'Coolant' }),
      column.accessor('resultCount', { header: 'Results', meta: { numeric: true } }),
    ],
    [],
  );
  return (
    <div className="flex flex-col gap-4">
      <form role="search" aria-label="Filter abrasives" className="grid gap-3 rounded-md border border-rule bg-panel p-4 sm:grid-cols-3" onSubmit={(e) => e.preventDefault()}>
        <Field id={`${id}-material`} label="Material">
          <Select id={`${id}-material`} value={material} onChange={(e) => setFilter('material', e.target.value)}>
            <option value="">any</option>
            {Object.entries(ABRASIVE_MATERIALS).map(([value, text]) => (
              <option key={value} value={value}>
                {text}
              </option>
            ))}
          </Select>
        </Field>
        <Field id={`${id}-bond`} label="Bond">
          <Select id={`${id}-bond`} value={bond} onChange={(e) => setFilter('bond', e.target.value)}>
            <option value="">any</option>
            {Object.entries(BONDS).map(([value, text]) => (
              <option key={value} value={value}>
                {text}
              </option>
            ))}
          </Select>
        </Field>
        <Field id={`${id}-band`} label="Grit band (particle size)">
          <Select id={`${id}-band`} value={band} onChange={(e) => setFilter('band', e.target.value)}>
            <option value="">any</option>
            {bands.map((phi) => (
              <option key={phi} value={String(phi)}>
                {formatGritBand({ loUm: 1000 * 2 ** -(phi + 1), hiUm: 1000 * 2 ** -phi })}
              </option>
            ))}
          </Select>
        </Field>
      </form>
      <p role="status" className="text-sm text-muted">
        {shown.length} of {abrasives.length} abrasive types
      </p>
      {shown.length ? (
        <DataTable label="Abrasive types" data={shown} columns={columns} rowKey={(a) => a.slug} initialSorting={[{ id: 'name', desc: false }]} />
      ) : (
        <Empty title="No abrasive matches these filters" />
      )}
    </div>
  );
}
