import { useState, type ReactNode } from 'react';
import {
  flexRender,
  getCoreRowModel,
  getSortedRowModel,
  useReactTable,
  type ColumnDef,
  type SortingState,
} from '@tanstack/react-table';

/**
 * The frame every table sits in: on a narrow screen it scrolls sideways inside its own box
 * (keyboard-scrollable, named for screen readers) instead of squeezing the columns.
 */
export function TableFrame({ label, children }: { label: string; children: ReactNode }) {
  return (
    <div role="region" aria-label={label} tabIndex={0} className="overflow-x-auto rounded-md border border-rule bg-panel">
      {children}
    </div>
  );
}

export const thClass = 'border-b border-rule bg-paper px-3 py-2 text-left align-bottom text-sm font-semibold text-muted';
export const tdClass = 'border-b border-rule/70 px-3 py-2 align-top';

/** Column settings read by DataTable beyond TanStack's own. */
export interface ColumnMetaInfo {
  /** Right-aligns numbers so digits line up. */
  numeric?: boolean;
}

export interface DataTableProps<T> {
  label: string;
  caption?: ReactNode;
  data: T[];
  /** Columns; their value types differ per column, hence `any` for the value. */
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
                  <th
                    key={header.id}
                    scope="col"
                    aria-sort={canSort ? (sorted === 'asc' ? 'ascending' : sorted === 'desc' ? 'descending' : 'none') : undefined}
                    className={`${thClass} ${meta?.numeric ? 'text-right' : ''}`}
                  >
                    {canSort ? (
                      <button
                        type="button"
                        onClick={header.column.getToggleSortingHandler()}
                        className={`inline-flex items-center gap-1 rounded font-semibold hover:text-ink ${meta?.numeric ? 'flex-row-reverse' : ''}`}
                      >
                        <span>{content}</span>
                        <span aria-hidden="true" className="w-3 text-xs">
                          {sorted === 'asc' ? '▲' : sorted === 'desc' ? '▼' : '↕'}
                        </span>
                      </button>
                    ) : (
                      content
                    )}
                  </th>
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
                  <td key={cell.id} className={`${tdClass} ${meta?.numeric ? 'text-right tabular-nums' : ''}`}>
                    {flexRender(cell.column.columnDef.cell, cell.getContext())}
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
