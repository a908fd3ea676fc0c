import { flexRender, getCoreRowModel, useReactTable, type ColumnDef } from '@tanstack/react-table';

/** What a column says of itself: the server's sort name, alignment, and whether it hides below xl. */
export type ColumnMeta<S extends string> = { sort?: S; className?: string; numeric?: boolean; wide?: boolean };

// Lower-priority columns hide below xl (the 1024 px tablet keeps the columns a person scans).
const WIDE = 'hidden xl:table-cell';

function SortHeader({ label, active, dir, onSort }: { label: string; active: boolean; dir: 'asc' | 'desc'; onSort: () => void }) {
  return (
    <button type="button" onClick={onSort} className={`-mx-2 inline-flex min-h-11 items-center gap-1 rounded-md px-2 hover:bg-paper-sunk ${active ? 'text-ink' : ''}`}>
      {label}
      <span aria-hidden className={`text-xs ${active ? 'text-tide' : 'text-ink-faint/60'}`}>
        {active ? (dir === 'asc' ? '▲' : '▼') : '↕'}
      </span>
    </button>
  );
}

/**
 * A page of rows the server paged, sorted and filtered; this only draws it. Sortable columns name
 * their sort in `meta.sort`; each row opens on click or Enter and is named for screen readers.
 */
export function ServerTable<T extends { id: string }, S extends string>(props: {
  rows: T[];
  columns: ColumnDef<T>[];
  sorted?: { sort: S; dir: 'asc' | 'desc' };
  onSort?: (sort: S) => void;
  dimmed?: boolean;
  rowLabel: (row: T) => string;
  onOpen: (row: T) => void;
  rowClassName?: (row: T) => string;
}) {
  const { rows, columns, sorted, onSort, dimmed, rowLabel, onOpen, rowClassName } = props;
  const table = useReactTable({ data: rows, columns, getCoreRowModel: getCoreRowModel(), manualPagination: true, manualSorting: true, manualFiltering: true, getRowId: (r) => r.id });
  return (
    <div className="overflow-x-auto rounded-xl border border-ink/10 bg-paper-raised shadow-sm">
      <table className={`w-full border-collapse text-left text-sm transition-opacity ${dimmed ? 'opacity-60' : ''}`}>
        <thead className="border-b border-ink/10 bg-paper-sunk/60 text-[13px] font-semibold text-ink-soft">
          {table.getHeaderGroups().map((hg) => (
            <tr key={hg.id}>
              {hg.headers.map((h) => {
                const meta = (h.column.columnDef.meta ?? {}) as ColumnMeta<S>;
                const active = !!sorted && meta.sort === sorted.sort;
                return (
                  <th
                    key={h.id}
                    scope="col"
                    aria-sort={active ? (sorted.dir === 'asc' ? 'ascending' : 'descending') : undefined}
                    className={`whitespace-nowrap px-3 py-1 ${meta.numeric ? 'text-right' : ''} ${meta.wide ? WIDE : ''}`}
                  >
                    {meta.sort && sorted && onSort ? (
                      <SortHeader label={String(h.column.columnDef.header)} active={active} dir={sorted.dir} onSort={() => onSort(meta.sort!)} />
                    ) : (
                      flexRender(h.column.columnDef.header, h.getContext())
                    )}
                  </th>
                );
              })}
            </tr>
          ))}
        </thead>
        <tbody>
          {table.getRowModel().rows.map((row) => (
            <tr
              key={row.id}
              tabIndex={0}
              aria-label={rowLabel(row.original)}
              onClick={() => onOpen(row.original)}
              onKeyDown={(e) => e.key === 'Enter' && onOpen(row.original)}
              className={`cursor-pointer border-b border-ink/5 last:border-0 hover:bg-tide-light/30 focus-visible:bg-tide-light/40 ${rowClassName?.(row.original) ?? ''}`}
            >
              {row.getVisibleCells().map((cell) => {
                const meta = (cell.column.columnDef.meta ?? {}) as ColumnMeta<S>;
                return (
                  <td key={cell.id} className={`h-12 whitespace-nowrap px-3 py-1 ${meta.numeric ? 'text-right tabular-nums' : ''} ${meta.wide ? WIDE : ''} ${meta.className ?? ''}`}>
                    {flexRender(cell.column.columnDef.cell, cell.getContext())}
                  </td>
                );
              })}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
