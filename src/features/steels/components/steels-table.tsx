import { useMemo } from 'react';
import { Link } from 'react-router-dom';
import { createColumnHelper } from '@tanstack/react-table';
import { STEEL_CATEGORIES } from '@shared/vocabulary';
import { paths } from '@/config/paths';
import { DataTable } from '@/components/ui/table';
import { label } from '@/lib/format';
import type { Designation, SteelSummary } from '@/types/api';

const column = createColumnHelper<SteelSummary>();

/** Designations in one line, e.g. "AISI D2 · EN 1.2379". */
export function formatDesignations(designations: Designation[]): string {
  return designations.map((d) => `${d.system} ${d.code}`).join(' · ');
}

/** The steel grades as a sortable table. */
export function SteelsTable({ steels }: { steels: SteelSummary[] }) {
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
  return <DataTable label="Steel grades" data={steels} columns={columns} rowKey={(s) => s.slug} initialSorting={[{ id: 'name', desc: false }]} />;
}
