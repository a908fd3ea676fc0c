import { flexRender, getCoreRowModel, useReactTable, type ColumnDef } from '@tanstack/react-table';
import { Link, useLocation, useNavigate } from 'react-router-dom';
import type { LineDto } from '@shared/schemas/lines';
import type { LineFilters } from '@/features/lines/filters';
import { formatDate, formatPressure, formatSize, formatTemperature, formatWall } from '@/lib/format';
import { LineStatusMark } from '@/features/lines/components/line-status';

type Sort = LineFilters['sort'];
type Meta = { sort?: Sort; className?: string; numeric?: boolean; wide?: boolean };

export const linePath = (lineNumber: string) => `/lines/${encodeURIComponent(lineNumber)}`;

// Lower-priority columns hide below lg (the 1024 px tablet keeps line, area, service, material, size, pressure, status).
const WIDE = 'hidden xl:table-cell';
const columns: ColumnDef<LineDto>[] = [
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

/** The register's table: the server pages and sorts; this only draws the page it was given. */
export function LinesTable({ rows, filters, onSort, dimmed }: { rows: LineDto[]; filters: LineFilters; onSort: (sort: Sort) => void; dimmed?: boolean }) {
  const navigate = useNavigate();
  // The line page's "back" link returns to this exact view of the register.
  const { search } = useLocation();
  const open = (lineNumber: string) => navigate(linePath(lineNumber), { state: { registerSearch: search } });
  const table = useReactTable({ data: rows, columns, getCoreRowModel: getCoreRowModel(), manualPagination: true, manualSorting: true, getRowId: (r) => r.id });

  return (
    <div className="overflow-x-auto rounded-xl border border-ink/10 bg-paper-raised shadow-sm">
      <table className={`w-full border-collapse text-left text-sm transition-opacity ${dimmed ? 'opacity-60' : ''}`}>
        <thead className="border-b border-ink/10 bg-paper-sunk/60 text-[13px] font-semibold text-ink-soft">
          {table.getHeaderGroups().map((hg) => (
            <tr key={hg.id}>
              {hg.headers.map((h) => {
                const meta = (h.column.columnDef.meta ?? {}) as Meta;
                const active = meta.sort === filters.sort;
                return (
                  <th
                    key={h.id}
                    scope="col"
                    aria-sort={active ? (filters.dir === 'asc' ? 'ascending' : 'descending') : undefined}
                    className={`whitespace-nowrap px-3 py-1 ${meta.numeric ? 'text-right' : ''} ${meta.wide ? WIDE : ''}`}
                  >
                    {meta.sort ? (
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
              aria-label={`Line ${row.original.lineNumber}`}
              onClick={() => open(row.original.lineNumber)}
              onKeyDown={(e) => e.key === 'Enter' && open(row.original.lineNumber)}
              className={`cursor-pointer border-b border-ink/5 last:border-0 hover:bg-tide-light/30 focus-visible:bg-tide-light/40 ${row.original.status === 'locked-out' ? 'bg-hold-light/40' : ''}`}
            >
              {row.getVisibleCells().map((cell) => {
                const meta = (cell.column.columnDef.meta ?? {}) as Meta;
                return (
                  <td key={cell.id} className={`h-12 whitespace-nowrap px-3 ${meta.numeric ? 'text-right tabular-nums' : ''} ${meta.wide ? WIDE : ''} ${meta.className ?? ''}`}>
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
