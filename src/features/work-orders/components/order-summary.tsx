import { Link } from 'react-router-dom';
import { PRIORITY_LABELS, WORK_ORDER_KIND_LABELS, type WorkOrderDto } from '@shared/schemas/work-orders';
import { degC, degF, formatDateTime, formatPressure, formatSize } from '@/lib/format';

function Fact({ label, children }: { label: string; children: React.ReactNode }) {
  return (
    <div className="min-w-0">
      <dt className="text-xs font-semibold uppercase tracking-wide text-ink-faint">{label}</dt>
      <dd className="mt-0.5">{children}</dd>
    </div>
  );
}

/** Scope, lines, window and cure conditions as the planner wrote them. */
export function OrderSummary({ order }: { order: WorkOrderDto }) {
  return (
    <div className="space-y-4 text-sm">
      <p className="whitespace-pre-line text-base">{order.scope}</p>
      <dl className="grid grid-cols-2 gap-x-6 gap-y-3 sm:grid-cols-3">
        <Fact label="Kind">{WORK_ORDER_KIND_LABELS[order.kind]}</Fact>
        <Fact label="Priority">{PRIORITY_LABELS[order.priority]}</Fact>
        <Fact label="Requested by">{order.requestedBy}</Fact>
        <Fact label="Window">
          {order.windowStart && order.windowEnd ? <>{formatDateTime(order.windowStart)}<br />to {formatDateTime(order.windowEnd)}</> : <span className="text-ink-faint">not booked</span>}
        </Fact>
        <Fact label="Forecast low">{order.forecastLowF === null ? <span className="text-ink-faint">not given</span> : `${degF(order.forecastLowF)} (${degC(order.forecastLowF)})`}</Fact>
        <Fact label="Forecast high humidity">{order.forecastHighRh === null ? <span className="text-ink-faint">not given</span> : `${order.forecastHighRh} %`}</Fact>
        <Fact label="Written by">{order.createdBy.name}, {formatDateTime(order.createdAt)}</Fact>
        {order.plannedAt && <Fact label="Planned">{formatDateTime(order.plannedAt)}</Fact>}
        {order.componentRatingPsi !== null && <Fact label="Weakest component">{formatPressure(order.componentRatingPsi)}</Fact>}
      </dl>
      {order.lateReason && <p><span className="font-semibold">Planned late because:</span> {order.lateReason}</p>}
      {order.cancelReason && <p><span className="font-semibold">Cancelled because:</span> {order.cancelReason}</p>}
      <div>
        <h3 className="mb-1 font-semibold">Lines ({order.lines.length})</h3>
        <ul className="divide-y divide-ink/10">
          {order.lines.map((l) => (
            <li key={l.id} className="flex min-h-11 flex-wrap items-center gap-x-3">
              <Link to={`/lines/${encodeURIComponent(l.lineNumber)}`} className="font-semibold text-tide hover:underline">{l.lineNumber}</Link>
              <span className="text-ink-soft">{l.area} · {l.service} · {l.material} {formatSize(l.nominalSize)} · design {formatPressure(l.designPressurePsi)}</span>
            </li>
          ))}
        </ul>
      </div>
    </div>
  );
}
