import type { ReactNode } from 'react';
import type { CellContext, ColumnDef } from '@tanstack/react-table';

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
 * What a column draws for a row: its `cell` (called with `{ row: { original } }`, all our cells read),
 * or else the row's `accessorKey` field. Columns keep react-table's ColumnDef shape, but nothing of
 * react-table runs: the server pages, sorts and filters, so a plain map draws the page without the
 * library's 46 KB and its per-cell objects on the first screen.
 */
function cellOf<T>(column: ColumnDef<T>, original: T): ReactNode {
  const { cell } = column;
  if (typeof cell === 'function') return cell({ row: { original } } as CellContext<T, unknown>) as ReactNode;
  if (typeof cell === 'string') return cell;
  const key = 'accessorKey' in column ? (column.accessorKey as keyof T) : undefined;
  return key === undefined ? null : (original[key] as ReactNode);
}

const metaOf = <S extends string,>(column: ColumnDef<unknown>) => (column.meta ?? {}) as ColumnMeta<S>;

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
  return (
    <div className="overflow-x-auto rounded-xl border border-ink/10 bg-paper-raised shadow-sm">
      <table className={`w-full border-collapse text-left text-sm transition-opacity ${dimmed ? 'opacity-60' : ''}`}>
        <thead className="border-b border-ink/10 bg-paper-sunk/60 text-[13px] font-semibold text-ink-soft">
          <tr>
            {columns.map((column, i) => {
              const meta = metaOf<S>(column as ColumnDef<unknown>);
              const active = !!sorted && meta.sort === sorted.sort;
              const header = typeof column.header === 'string' ? column.header : '';
              return (
                <th
                  key={column.id ?? i}
                  scope="col"
                  aria-sort={active ? (sorted.dir === 'asc' ? 'ascending' : 'descending') : undefined}
                  className={`whitespace-nowrap px-3 py-1 ${meta.numeric ? 'text-right' : ''} ${meta.wide ? WIDE : ''}`}
                >
                  {meta.sort && sorted && onSort ? <SortHeader label={header} active={active} dir={sorted.dir} onSort={() => onSort(meta.sort!)} /> : header}
                </th>
              );
            })}
          </tr>
        </thead>
        <tbody>
          {rows.map((row) => (
            <tr
              key={row.id}
              tabIndex={0}
              aria-label={rowLabel(row)}
              onClick={() => onOpen(row)}
              onKeyDown={(e) => e.key === 'Enter' && onOpen(row)}
              className={`cursor-pointer border-b border-ink/5 last:border-0 hover:bg-tide-light/30 focus-visible:bg-tide-light/40 ${rowClassName?.(row) ?? ''}`}
            >
              {columns.map((column, i) => {
                const meta = metaOf<S>(column as ColumnDef<unknown>);
                return (
                  <td key={column.id ?? i} className={`h-12 whitespace-nowrap px-3 py-1 ${meta.numeric ? 'text-right tabular-nums' : ''} ${meta.wide ? WIDE : ''} ${meta.className ?? ''}`}>
                    {cellOf(column, row)}
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
