import { useMemo } from 'react';
import { Link } from 'react-router-dom';
import { createColumnHelper } from '@tanstack/react-table';
import { ABRASIVE_FORMS, ABRASIVE_MATERIALS, BONDS, COOLANTS } from '@shared/vocabulary';
import { paths } from '@/config/paths';
import { DataTable } from '@/components/ui/table';
import { formatMicrometres, formatNumber, label } from '@/lib/format';
import type { AbrasiveSummary } from '@/types/api';

const column = createColumnHelper<AbrasiveSummary>();

/** The abrasive types as a sortable table: material, bond, form, grit, size and coolant. */
export function AbrasivesTable({ abrasives }: { abrasives: AbrasiveSummary[] }) {
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
  return <DataTable label="Abrasive types" data={abrasives} columns={columns} rowKey={(a) => a.slug} initialSorting={[{ id: 'name', desc: false }]} />;
}
