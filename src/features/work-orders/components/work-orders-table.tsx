import type { ColumnDef } from '@tanstack/react-table';
import { ServerTable, type ColumnMeta } from '@/components/ui/server-table';
import { Link, useLocation, useNavigate } from 'react-router-dom';
import { PRIORITY_LABELS, WORK_ORDER_KIND_LABELS, type WorkOrderRow } from '@shared/schemas/work-orders';
import type { WorkOrderFilters } from '@/features/work-orders/filters';
import { StateMark } from '@/features/work-orders/components/state-mark';
import { formatDateTime } from '@/lib/format';

type Sort = WorkOrderFilters['sort'];

export const orderPath = (id: string) => `/work-orders/${id}`;
/** "Urgent: within a day or two" → "Urgent" in a table cell; the whole phrase in the filter. */
export const priorityWord = (p: WorkOrderRow['priority']) => PRIORITY_LABELS[p].split(':')[0]!;

const columns: (ColumnDef<WorkOrderRow> & { meta?: ColumnMeta<Sort> })[] = [
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

/** The work-order table: the server pages, sorts and filters; this draws the page it was given. */
export function WorkOrdersTable({ rows, filters, onSort, dimmed }: { rows: WorkOrderRow[]; filters?: WorkOrderFilters; onSort?: (sort: Sort) => void; dimmed?: boolean }) {
  const navigate = useNavigate();
  const { search } = useLocation();
  return (
    <ServerTable
      rows={rows}
      columns={columns}
      sorted={filters}
      onSort={onSort}
      dimmed={dimmed}
      rowLabel={(o) => `Work order ${o.number}`}
      onOpen={(o) => navigate(orderPath(o.id), { state: { listSearch: search } })}
    />
  );
}
