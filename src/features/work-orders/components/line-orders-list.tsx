import { Link } from 'react-router-dom';
import type { WorkOrderRow } from '@shared/schemas/work-orders';
import { StateMark } from '@/features/work-orders/components/state-mark';
import { formatDateTime } from '@/lib/format';

/** A line's orders, newest window first: number, state, window, scope. */
export function LineOrdersList({ rows }: { rows: WorkOrderRow[] }) {
  return (
    <ul className="divide-y divide-ink/10">
      {rows.map((o) => (
        <li key={o.id} className="py-2">
          <div className="flex flex-wrap items-center gap-x-3 gap-y-1">
            <Link to={`/work-orders/${o.id}`} className="inline-flex min-h-11 items-center font-semibold text-tide hover:underline">{o.number}</Link>
            <StateMark state={o.state} />
          </div>
          <p className="text-sm text-ink-soft">
            {o.windowStart && o.windowEnd ? `${formatDateTime(o.windowStart)} to ${formatDateTime(o.windowEnd)}` : 'No window booked'} · {o.jointCount} {o.jointCount === 1 ? 'joint' : 'joints'}
          </p>
          <p className="truncate text-sm">{o.scope}</p>
        </li>
      ))}
    </ul>
  );
}
