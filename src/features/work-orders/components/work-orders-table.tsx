import { flexRender, getCoreRowModel, useReactTable, type ColumnDef } from '@tanstack/react-table';
import { Link, useLocation, useNavigate } from 'react-router-dom';
import { PRIORITY_LABELS, WORK_ORDER_KIND_LABELS, type WorkOrderRow } from '@shared/schemas/work-orders';
import type { WorkOrderFilters } from '@/features/work-orders/filters';
import { StateMark } from '@/features/work-orders/components/state-mark';
import { formatDateTime } from '@/lib/format';

type Sort = WorkOrderFilters['sort'];
type Meta = { sort?: Sort; className?: string; wide?: boolean };

export const orderPath = (id: string) => `/work-orders/${id}`;
const WIDE = 'hidden xl:table-cell';
/** "Urgent: within a day or two" → "Urgent" in a table cell; the whole phrase in the filter. */
export const priorityWord = (p: WorkOrderRow['priority']) => PRIORITY_LABELS[p].split(':')[0]!;

const columns: ColumnDef<WorkOrderRow>[] = [
  { id: 'number', header: 'Order', cell: ({ row }) => <OrderLink row={row.original} />, meta: { sort: 'number' } },
  { id: 'state', header: 'State', cell: ({ row }) => <StateMark state={row.original.state} />, meta: { sort: 'state' } },
  { id: 'priority', header: 'Priority', cell: ({ row }) => priorityWord(row.original.priority), meta: { sort: 'priority' } },
  { id: 'kind', header: 'Kind', cell: ({ row }) => WORK_ORDER_KIND_LABELS[row.original.kind], meta: { wide: true } },
  {
    id: 'lines',
    header: 'Lines',
    cell: ({ row }) => row.original.lines.map((l) => l.lineNumber).join(', '),
    meta: { className: 'max-w-48 truncate' },
  },
  { id: 'area', header: 'Area', cell: ({ row }) => [...new Set(row.original.lines.map((l) => l.area))].join(', '), meta: { className: 'max-w-40 truncate', wide: true } },
  {
    id: 'windowStart',
    header: 'Window',
    cell: ({ row }) => (row.original.windowStart && row.original.windowEnd ? <WindowCell start={row.original.windowStart} end={row.original.windowEnd} /> : <span className="text-ink-faint">not booked</span>),
    meta: { sort: 'windowStart' },
  },
  { id: 'joints', header: 'Joints', cell: ({ row }) => row.original.jointCount, meta: { className: 'text-right tabular-nums' } },
  { id: 'scope', header: 'Scope', cell: ({ row }) => row.original.scope, meta: { className: 'max-w-64 truncate', wide: true } },
  { id: 'updatedAt', header: 'Updated', cell: ({ row }) => formatDateTime(row.original.updatedAt), meta: { sort: 'updatedAt', wide: true } },
];

function WindowCell({ start, end }: { start: string; end: string }) {
  return (
    <span className="leading-tight">
      <span className="block">{formatDateTime(start)}</span>
      <span className="block text-xs text-ink-soft">to {formatDateTime(end)}</span>
    </span>
  );
}

function OrderLink({ row }: { row: WorkOrderRow }) {
  const { search } = useLocation();
  return (
    <Link to={orderPath(row.id)} state={{ listSearch: search }} tabIndex={-1} onClick={(e) => e.stopPropagation()} className="font-semibold text-ink hover:text-tide hover:underline">
      {row.number}
    </Link>
  );
}

function SortHeader({ label, active, dir, onSort }: { label: string; active: boolean; dir: 'asc' | 'desc'; onSort: () => void }) {
  return (
    <button type="button" onClick={onSort} className={`-mx-2 inline-flex min-h-11 items-center gap-1 rounded-md px-2 hover:bg-paper-sunk ${active ? 'text-ink' : ''}`}>
      {label}
      <span aria-hidden className={`text-xs ${active ? 'text-tide' : 'text-ink-faint/60'}`}>{active ? (dir === 'asc' ? '▲' : '▼') : '↕'}</span>
    </button>
  );
}

/** The work-order table: the server pages, sorts and filters; this draws the page it was given. */
export function WorkOrdersTable({ rows, filters, onSort, dimmed }: { rows: WorkOrderRow[]; filters?: WorkOrderFilters; onSort?: (sort: Sort) => void; dimmed?: boolean }) {
  const navigate = useNavigate();
  const { search } = useLocation();
  const open = (id: string) => navigate(orderPath(id), { state: { listSearch: search } });
  const table = useReactTable({ data: rows, columns, getCoreRowModel: getCoreRowModel(), manualPagination: true, manualSorting: true, manualFiltering: true, getRowId: (r) => r.id });

  return (
    <div className="overflow-x-auto rounded-xl border border-ink/10 bg-paper-raised shadow-sm">
      <table className={`w-full border-collapse text-left text-sm transition-opacity ${dimmed ? 'opacity-60' : ''}`}>
        <thead className="border-b border-ink/10 bg-paper-sunk/60 text-[13px] font-semibold text-ink-soft">
          {table.getHeaderGroups().map((hg) => (
            <tr key={hg.id}>
              {hg.headers.map((h) => {
                const meta = (h.column.columnDef.meta ?? {}) as Meta;
                const active = !!filters && meta.sort === filters.sort;
                return (
                  <th key={h.id} scope="col" aria-sort={active ? (filters.dir === 'asc' ? 'ascending' : 'descending') : undefined} className={`whitespace-nowrap px-3 py-1 ${meta.wide ? WIDE : ''}`}>
                    {meta.sort && filters && onSort ? (
                      <SortHeader label={String(h.column.columnDef.header)} active={active} dir={filters.dir} onSort={() => onSort(meta.sort!)} />
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
              aria-label={`Work order ${row.original.number}`}
              onClick={() => open(row.original.id)}
              onKeyDown={(e) => e.key === 'Enter' && open(row.original.id)}
              className="cursor-pointer border-b border-ink/5 last:border-0 hover:bg-tide-light/30 focus-visible:bg-tide-light/40"
            >
              {row.getVisibleCells().map((cell) => {
                const meta = (cell.column.columnDef.meta ?? {}) as Meta;
                return (
                  <td key={cell.id} className={`h-12 whitespace-nowrap px-3 py-1 ${meta.wide ? WIDE : ''} ${meta.className ?? ''}`}>
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
