import { useState, type ReactNode } from 'react';
import { flexRender, getCoreRowModel, getFilteredRowModel, getSortedRowModel, useReactTable, type ColumnDef, type SortingState } from '@tanstack/react-table';
import { ArrowDown, ArrowUp, ArrowUpDown } from 'lucide-react';
import { useTranslation } from 'react-i18next';
import { EmptyState } from './panels';

/** The one table: sortable headers, optional quick filter, row click. */
export function DataTable<T>({
  data,
  columns,
  filterLabel,
  emptyTitle,
  onRowClick,
  initialSorting = [],
  toolbar,
  caption,
  search,
  onSearchChange,
  searchHint,
}: {
  data: T[];
  columns: ColumnDef<T, any>[];
  filterLabel?: string;
  emptyTitle?: string;
  onRowClick?: (row: T) => void;
  initialSorting?: SortingState;
  toolbar?: ReactNode;
  caption?: string;
  /** a search kept by the caller (in the URL, say), who also filters the rows: then the table does not filter again */
  search?: string;
  onSearchChange?: (value: string) => void;
  searchHint?: string;
}) {
  const { t } = useTranslation();
  const [sorting, setSorting] = useState<SortingState>(initialSorting);
  const [filter, setFilter] = useState('');
  const table = useReactTable({
    data,
    columns,
    state: { sorting, globalFilter: onSearchChange ? '' : filter },
    onSortingChange: setSorting,
    onGlobalFilterChange: setFilter,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
    getFilteredRowModel: getFilteredRowModel(),
  });
  const rows = table.getRowModel().rows;
  return (
    <div className="flex flex-col gap-3">
      {(filterLabel || toolbar) && (
        <div className="flex flex-wrap items-end gap-3">
          {filterLabel && (
            <label className="flex flex-col gap-1 text-sm font-bold">
              {filterLabel}
              <input
                type="search"
                value={onSearchChange ? (search ?? '') : filter}
                placeholder={searchHint}
                onChange={(e) => (onSearchChange ? onSearchChange(e.target.value) : setFilter(e.target.value))}
                className="min-h-11 w-80 rounded-lg border-2 border-harbour-100 bg-white px-3 text-base font-normal"
              />
            </label>
          )}
          {toolbar}
        </div>
      )}
      <div className="overflow-x-auto rounded-xl border border-harbour-100 bg-white">
        <table className="w-full text-left text-sm">
          {caption && <caption className="sr-only">{caption}</caption>}
          <thead className="bg-harbour-50 text-harbour-900">
            {table.getHeaderGroups().map((group) => (
              <tr key={group.id}>
                {group.headers.map((header) => {
                  const sorted = header.column.getIsSorted();
                  const canSort = header.column.getCanSort();
                  return (
                    <th
                      key={header.id}
                      scope="col"
                      className="px-3 py-2 font-bold"
                      aria-sort={sorted === 'asc' ? 'ascending' : sorted === 'desc' ? 'descending' : undefined}
                    >
                      {canSort ? (
                        <button type="button" className="inline-flex min-h-11 items-center gap-1" onClick={header.column.getToggleSortingHandler()}>
                          {flexRender(header.column.columnDef.header, header.getContext())}
                          {sorted === 'asc' ? (
                            <ArrowUp className="h-4 w-4" aria-hidden />
                          ) : sorted === 'desc' ? (
                            <ArrowDown className="h-4 w-4" aria-hidden />
                          ) : (
                            <ArrowUpDown className="h-4 w-4 opacity-50" aria-hidden />
                          )}
                        </button>
                      ) : (
                        flexRender(header.column.columnDef.header, header.getContext())
                      )}
                    </th>
                  );
                })}
              </tr>
            ))}
          </thead>
          <tbody>
            {rows.map((row) => (
              <tr
                key={row.id}
                className={`border-t border-harbour-100 ${onRowClick ? 'cursor-pointer hover:bg-harbour-50' : ''}`}
                onClick={onRowClick ? () => onRowClick(row.original) : undefined}
              >
                {row.getVisibleCells().map((cell) => (
                  <td key={cell.id} className="px-3 py-2 align-middle">
                    {flexRender(cell.column.columnDef.cell, cell.getContext())}
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
        {rows.length === 0 && (
          <div className="p-4">
            <EmptyState title={emptyTitle ?? t('app.nothingHere')} />
          </div>
        )}
      </div>
    </div>
  );
}
