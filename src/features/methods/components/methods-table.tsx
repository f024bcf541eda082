import { useMemo } from 'react';
import { Link } from 'react-router-dom';
import { createColumnHelper } from '@tanstack/react-table';
import { paths } from '@/config/paths';
import { DataTable } from '@/components/ui/table';
import { formatGrams } from '@/lib/format';
import type { MethodSummary } from '@/types/api';

const column = createColumnHelper<MethodSummary>();

/** The written test methods: instrument, medium, readings per edge and retention protocol. */
export function MethodsTable({ methods }: { methods: MethodSummary[] }) {
  const columns = useMemo(
    () => [
      column.accessor('name', {
        header: 'Method',
        cell: (info) => <Link to={paths.method.getHref(info.row.original.slug)}>{info.getValue()}</Link>,
      }),
      column.accessor('version', { header: 'Version', meta: { numeric: true } }),
      column.accessor('instrument', { header: 'Instrument' }),
      column.accessor('medium', { header: 'Test medium' }),
      column.accessor('readingsPerEdge', { header: 'Readings per edge', meta: { numeric: true } }),
      column.accessor('retentionMedium', {
        header: 'Retention medium',
        cell: (info) => info.getValue() ?? '—',
      }),
      column.accessor('thresholdG', {
        header: 'Threshold',
        meta: { numeric: true },
        sortUndefined: 'last',
        cell: (info) => formatGrams(info.getValue()),
      }),
    ],
    [],
  );
  return <DataTable label="Test methods" data={methods} columns={columns} rowKey={(m) => m.slug} />;
}
