import { useState, type ReactNode } from 'react';
import { TableFrame, tdClass, thClass } from './table-frame';
import {
  flexRender,
  getCoreRowModel,
  getSortedRowModel,
  useReactTable,
  type ColumnDef,
  type SortingState,
} from '@tanstack/react-table';

// Re-exported so pages that build plain tables can keep importing them from here.
export { TableFrame, tdClass, thClass };

/**
 * A column header that sorts on a press (a real button, so Enter and Space work) and says its
 * order through aria-sort; without `canSort`, a plain header.
 */
export function SortableTh({ sorted, canSort, numeric, onToggle, children }: { sorted: false | 'asc' | 'desc'; canSort: boolean; numeric?: boolean; onToggle?: (event: unknown) => void; children: ReactNode }) {
  return (
    <th scope="col" aria-sort={canSort ? (sorted === 'asc' ? 'ascending' : sorted === 'desc' ? 'descending' : 'none') : undefined} className={`${thClass} ${numeric ? 'text-right' : ''}`}>
      {canSort ? (
        <button type="button" onClick={onToggle} className={`inline-flex items-center gap-1 rounded font-semibold hover:text-ink ${numeric ? 'flex-row-reverse' : ''}`}>
          <span>{children}</span>
          <span aria-hidden="true" className="w-3 text-xs">
            {sorted === 'asc' ? '▲' : sorted === 'desc' ? '▼' : '↕'}
          </span>
        </button>
      ) : (
        children
      )}
    </th>
  );
}

/** Column settings read by DataTable beyond TanStack's own. */
export interface ColumnMetaInfo {
  /** Right-aligns numbers so digits line up. */
  numeric?: boolean;
  /** Long names (abrasives, methods): keeps the column wide enough to read when the table scrolls. */
  wide?: boolean;
}

export interface DataTableProps<T> {
  label: string;
  caption?: ReactNode;
  data: T[];
  /** Columns; their value types differ per column, hence `any` for the value. */
  // eslint-disable-next-line @typescript-eslint/no-explicit-any -- each column's value type differs
  columns: ColumnDef<T, any>[];
  initialSorting?: SortingState;
  /** A stable key per row (an id or slug), so React keeps rows across re-sorts. */
  rowKey?: (row: T) => string;
}

/**
 * A table built with TanStack Table: headers sort on click or Enter and say so through
 * aria-sort; the sort order is announced in the caption for screen readers.
 */
export function DataTable<T>({ label, caption, data, columns, initialSorting = [], rowKey }: DataTableProps<T>) {
  const [sorting, setSorting] = useState<SortingState>(initialSorting);
  const table = useReactTable({
    data,
    columns,
    state: { sorting },
    onSortingChange: setSorting,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
    getRowId: rowKey ? (row) => rowKey(row) : undefined,
  });

  return (
    <TableFrame label={label}>
      <table className="w-full min-w-[44rem] border-collapse text-[0.95rem]">
        {caption ? <caption className="px-3 py-2 text-left text-sm text-muted">{caption}</caption> : null}
        <thead>
          {table.getHeaderGroups().map((group) => (
            <tr key={group.id}>
              {group.headers.map((header) => {
                const meta = header.column.columnDef.meta as ColumnMetaInfo | undefined;
                const sorted = header.column.getIsSorted();
                const canSort = header.column.getCanSort();
                const content = header.isPlaceholder ? null : flexRender(header.column.columnDef.header, header.getContext());
                return (
                  <SortableTh key={header.id} sorted={sorted} canSort={canSort} numeric={meta?.numeric} onToggle={header.column.getToggleSortingHandler()}>
                    {content}
                  </SortableTh>
                );
              })}
            </tr>
          ))}
        </thead>
        <tbody>
          {table.getRowModel().rows.map((row) => (
            <tr key={row.id} className="hover:bg-accent-soft/40">
              {row.getVisibleCells().map((cell) => {
                const meta = cell.column.columnDef.meta as ColumnMetaInfo | undefined;
                return (
                  <td key={cell.id} className={`${tdClass} ${meta?.numeric ? 'whitespace-nowrap text-right tabular-nums' : ''}`}>
                    {meta?.wide ? (
                      <div className="min-w-48">{flexRender(cell.column.columnDef.cell, cell.getContext())}</div>
                    ) : (
                      flexRender(cell.column.columnDef.cell, cell.getContext())
                    )}
                  </td>
                );
              })}
            </tr>
          ))}
        </tbody>
      </table>
    </TableFrame>
  );
}
