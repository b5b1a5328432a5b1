import { useId, useState } from 'react';
import {
  flexRender,
  getCoreRowModel,
  getFilteredRowModel,
  getPaginationRowModel,
  getSortedRowModel,
  useReactTable,
  type ColumnDef,
  type SortingState,
} from '@tanstack/react-table';
import { ArrowDown, ArrowUp, ArrowUpDown, ChevronLeft, ChevronRight, Search } from 'lucide-react';
import { Button } from './button';
import { inputClasses } from './field';

export interface DataTableProps<TData> {
  data: TData[];
  columns: ColumnDef<TData>[];
  /** Names the table for screen readers; shown only to them. */
  caption: string;
  emptyMessage: string;
  filterLabel?: string;
  initialSorting?: SortingState;
  pageSizes?: number[];
  getRowId?: (row: TData) => string;
}

const ariaSortFor = { asc: 'ascending', desc: 'descending' } as const;

/**
 * A sortable, filterable, paged table. On a phone each row becomes a card (label beside value,
 * the row's actions last and full width) so nothing sits off-screen in a sideways scroll; the
 * explicit roles keep it a table for screen readers in both layouts.
 */
export function DataTable<TData>({
  data,
  columns,
  caption,
  emptyMessage,
  filterLabel = 'Filter',
  initialSorting = [],
  pageSizes = [10, 25, 50],
  getRowId,
}: DataTableProps<TData>) {
  const [sorting, setSorting] = useState<SortingState>(initialSorting);
  const [globalFilter, setGlobalFilter] = useState('');
  const [pagination, setPagination] = useState({ pageIndex: 0, pageSize: pageSizes[0] ?? 10 });
  const ids = useId();

  const table = useReactTable({
    data,
    columns,
    state: { sorting, globalFilter, pagination },
    onSortingChange: setSorting,
    onGlobalFilterChange: setGlobalFilter,
    onPaginationChange: setPagination,
    getRowId,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
    getFilteredRowModel: getFilteredRowModel(),
    getPaginationRowModel: getPaginationRowModel(),
  });

  const rows = table.getRowModel().rows;
  const filteredCount = table.getFilteredRowModel().rows.length;
  const pageCount = Math.max(1, table.getPageCount());
  const { pageIndex, pageSize } = table.getState().pagination;
  const filterId = `${ids}-filter`;
  const sizeId = `${ids}-size`;
  const first = filteredCount === 0 ? 0 : pageIndex * pageSize + 1;
  const last = Math.min(filteredCount, (pageIndex + 1) * pageSize);

  return (
    <div className="flex flex-col gap-3">
      <div className="flex flex-col gap-1.5 sm:max-w-xs">
        <label htmlFor={filterId} className="font-medium">
          {filterLabel}
        </label>
        <div className="relative">
          <Search className="pointer-events-none absolute top-1/2 left-3 size-5 -translate-y-1/2 text-stone" aria-hidden="true" />
          <input
            id={filterId}
            type="search"
            value={globalFilter}
            onChange={(event) => setGlobalFilter(event.target.value)}
            className={`${inputClasses} pl-10`}
            autoComplete="off"
          />
        </div>
      </div>

      <div
        className="overflow-x-auto rounded-xl border border-paper-200 bg-white"
        role="region"
        aria-label={caption}
        tabIndex={0}
      >
        <table role="table" className="w-full border-collapse text-left max-sm:block sm:min-w-[36rem]">
          <caption className="sr-only">{caption}</caption>
          <thead role="rowgroup" className="bg-paper-100 max-sm:block">
            {table.getHeaderGroups().map((group) => (
              <tr key={group.id} role="row" className="max-sm:flex max-sm:flex-wrap max-sm:gap-x-2 max-sm:px-2">
                {group.headers.map((header) => {
                  const canSort = header.column.getCanSort();
                  const sorted = header.column.getIsSorted();
                  const label = header.isPlaceholder
                    ? null
                    : flexRender(header.column.columnDef.header, header.getContext());
                  return (
                    <th
                      key={header.id}
                      scope="col"
                      role="columnheader"
                      aria-sort={canSort ? (sorted ? ariaSortFor[sorted] : 'none') : undefined}
                      // On a phone only the sortable headers stay, as a row of sort buttons.
                      className={`border-b border-paper-200 px-4 py-2 text-sm font-semibold whitespace-nowrap max-sm:border-b-0 max-sm:px-2 max-sm:py-1 ${canSort ? '' : 'max-sm:sr-only'}`}
                    >
                      {canSort ? (
                        <button
                          type="button"
                          onClick={header.column.getToggleSortingHandler()}
                          className="-mx-2 inline-flex min-h-11 items-center gap-1.5 rounded-md px-2 hover:bg-paper-200"
                        >
                          {label}
                          {sorted === 'asc' ? (
                            <ArrowUp className="size-4" aria-hidden="true" />
                          ) : sorted === 'desc' ? (
                            <ArrowDown className="size-4" aria-hidden="true" />
                          ) : (
                            <ArrowUpDown className="size-4 text-stone" aria-hidden="true" />
                          )}
                        </button>
                      ) : (
                        label
                      )}
                    </th>
                  );
                })}
              </tr>
            ))}
          </thead>
          <tbody role="rowgroup" className="max-sm:block">
            {rows.length === 0 ? (
              <tr role="row" className="max-sm:block">
                <td role="cell" colSpan={table.getVisibleLeafColumns().length} className="px-4 py-8 text-center text-stone max-sm:block">
                  {globalFilter && data.length > 0 ? `Nothing matches “${globalFilter}”.` : emptyMessage}
                </td>
              </tr>
            ) : (
              rows.map((row) => (
                <tr key={row.id} role="row" className="border-b border-paper-200 last:border-b-0 max-sm:block max-sm:border-t max-sm:px-4 max-sm:py-3">
                  {row.getVisibleCells().map((cell) => {
                    const header = cell.column.columnDef.header;
                    const isActions = cell.column.id === 'actions';
                    return (
                      <td
                        key={cell.id}
                        role="cell"
                        className={`px-4 py-3 align-top max-sm:px-0 max-sm:py-1 ${isActions ? 'max-sm:block max-sm:pt-3' : 'max-sm:grid max-sm:grid-cols-[6.5rem_minmax(0,1fr)] max-sm:gap-2'}`}
                      >
                        {!isActions && typeof header === 'string' && (
                          // The column's name beside the value on a phone; screen readers get it from the header.
                          <span aria-hidden="true" className="text-sm text-stone sm:hidden">
                            {header}
                          </span>
                        )}
                        {flexRender(cell.column.columnDef.cell, cell.getContext())}
                      </td>
                    );
                  })}
                </tr>
              ))
            )}
          </tbody>
        </table>
      </div>

      <div className="flex flex-col gap-3 sm:flex-row sm:items-center sm:justify-between">
        <p className="text-sm text-stone" aria-live="polite">
          {filteredCount === 0 ? 'No rows' : `Showing ${first}–${last} of ${filteredCount}`}
        </p>
        <div className="flex flex-wrap items-center gap-3">
          <div className="flex items-center gap-2">
            <label htmlFor={sizeId} className="text-sm font-medium whitespace-nowrap">
              Rows per page
            </label>
            <select
              id={sizeId}
              value={pageSize}
              onChange={(event) => table.setPageSize(Number(event.target.value))}
              className={`${inputClasses} w-auto cursor-pointer`}
            >
              {pageSizes.map((size) => (
                <option key={size} value={size}>
                  {size}
                </option>
              ))}
            </select>
          </div>
          <span className="text-sm whitespace-nowrap" aria-live="polite">
            Page {pageIndex + 1} of {pageCount}
          </span>
          <div className="flex gap-2">
            <Button
              variant="secondary"
              className="px-3"
              onClick={() => table.previousPage()}
              disabled={!table.getCanPreviousPage()}
              aria-label="Previous page"
            >
              <ChevronLeft className="size-5" aria-hidden="true" />
            </Button>
            <Button
              variant="secondary"
              className="px-3"
              onClick={() => table.nextPage()}
              disabled={!table.getCanNextPage()}
              aria-label="Next page"
            >
              <ChevronRight className="size-5" aria-hidden="true" />
            </Button>
          </div>
        </div>
      </div>
    </div>
  );
}
