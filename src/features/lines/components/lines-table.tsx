import { useDeferredValue } from 'react';
import type { ColumnDef } from '@tanstack/react-table';
import { ServerTable, type ColumnMeta } from '@/components/ui/server-table';
import { Link, useLocation, useNavigate } from 'react-router-dom';
import type { LineDto } from '@shared/schemas/lines';
import type { LineFilters } from '@/features/lines/filters';
import { formatDate, formatPressure, formatSize, formatTemperature, formatWall } from '@/lib/format';
import { LineStatusMark } from '@/features/lines/components/line-status';

type Sort = LineFilters['sort'];

export const linePath = (lineNumber: string) => `/lines/${encodeURIComponent(lineNumber)}`;

// `wide` columns hide below xl: the 1024 px tablet keeps line, area, service, material, size, pressure, status.
const columns: (ColumnDef<LineDto> & { meta?: ColumnMeta<Sort> })[] = [
  {
    id: 'lineNumber',
    header: 'Line',
    cell: ({ row }) => <LineLink lineNumber={row.original.lineNumber} />,
    meta: { sort: 'lineNumber' },
  },
  { id: 'area', header: 'Area', accessorKey: 'area', meta: { sort: 'area' } },
  { id: 'service', header: 'Service', accessorKey: 'service', meta: { sort: 'service', className: 'max-w-56 truncate' } },
  { id: 'material', header: 'Material', accessorKey: 'material', meta: { sort: 'material' } },
  { id: 'wall', header: 'Sch / SDR', cell: ({ row }) => formatWall(row.original), meta: { wide: true } },
  { id: 'nominalSize', header: 'Size', cell: ({ row }) => formatSize(row.original.nominalSize), meta: { sort: 'nominalSize', numeric: true } },
  { id: 'designPressurePsi', header: 'Design pressure', cell: ({ row }) => formatPressure(row.original.designPressurePsi), meta: { sort: 'designPressurePsi', numeric: true } },
  { id: 'designTemperatureF', header: 'Design temp.', cell: ({ row }) => formatTemperature(row.original.designTemperatureF), meta: { numeric: true, wide: true } },
  { id: 'status', header: 'Status', cell: ({ row }) => <LineStatusMark status={row.original.status} openOrders={row.original.openWorkOrders} />, meta: { sort: 'status' } },
  { id: 'updatedAt', header: 'Updated', cell: ({ row }) => formatDate(row.original.updatedAt), meta: { sort: 'updatedAt', wide: true } },
];

/** The line number as a real link too, so it can be opened in a new tab; the row's click does the same. */
function LineLink({ lineNumber }: { lineNumber: string }) {
  const { search } = useLocation();
  return (
    <Link to={linePath(lineNumber)} state={{ registerSearch: search }} tabIndex={-1} onClick={(e) => e.stopPropagation()} className="font-semibold text-ink hover:text-tide hover:underline">
      {lineNumber}
    </Link>
  );
}

/** Rows a screen holds (a tablet shows about ten under the heading and the filters). */
const ON_FIRST_SCREEN = 15;

/** The register's table: the server pages and sorts; this only draws the page it was given. */
export function LinesTable({ rows, filters, onSort, dimmed }: { rows: LineDto[]; filters: LineFilters; onSort: (sort: Sort) => void; dimmed?: boolean }) {
  // When the table first appears, the rows on screen are drawn first and the rest of the page (below
  // the fold) in the pass just after (React's deferred value): on a tablet's CPU the first rows are on
  // screen without waiting for the other 35 rows' render and layout. Later pages draw whole.
  const drawn = useDeferredValue(rows, rows.slice(0, ON_FIRST_SCREEN));
  const navigate = useNavigate();
  // The line page's "back" link returns to this exact view of the register.
  const { search } = useLocation();
  return (
    <ServerTable
      rows={drawn}
      columns={columns}
      sorted={filters}
      onSort={onSort}
      dimmed={dimmed}
      rowLabel={(l) => `Line ${l.lineNumber}`}
      onOpen={(l) => navigate(linePath(l.lineNumber), { state: { registerSearch: search } })}
      rowClassName={(l) => (l.status === 'locked-out' ? 'bg-hold-light/40' : '')}
    />
  );
}
