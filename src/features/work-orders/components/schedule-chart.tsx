import { Link } from 'react-router-dom';
import type { ScheduleResponse } from '@shared/schemas/work-order-plan';
import { WORK_ORDER_STATE_LABELS, type WorkOrderState } from '@shared/schemas/work-orders';
import { STATE_LOOK } from '@/features/work-orders/state-words';
import { addDays } from '@/features/work-orders/local-time';
import { formatDateTime } from '@/lib/format';

type Order = ScheduleResponse['orders'][number];
type Row = { area: string; lineNumber: string; lanes: Order[][] };
const DAY_FMT = new Intl.DateTimeFormat('en-US', { weekday: 'short', month: 'short', day: 'numeric' });
const DAYS = 7;
/** A label needs about 130 px; at the narrowest chart (about 700 px for 7 days) that is 1.3 days, so a lane keeps that much free after a start. */
const LABEL_MS = 1.3 * 86_400_000;
const freeAfter = (o: Order) => Math.max(Date.parse(o.windowEnd), Date.parse(o.windowStart) + LABEL_MS);

/** Rows by area then line; an order on two lines is on both rows. Orders meeting in time on one row take separate lanes. */
function rowsOf(orders: Order[]): Row[] {
  const byLine = new Map<string, { area: string; lineNumber: string; orders: Order[] }>();
  for (const o of orders) {
    for (const l of o.lines) {
      const row = byLine.get(l.lineNumber) ?? { area: l.area, lineNumber: l.lineNumber, orders: [] };
      row.orders.push(o);
      byLine.set(l.lineNumber, row);
    }
  }
  return [...byLine.values()]
    .sort((a, b) => a.area.localeCompare(b.area) || a.lineNumber.localeCompare(b.lineNumber))
    .map((r) => {
      const lanes: Order[][] = [];
      for (const o of [...r.orders].sort((a, b) => a.windowStart.localeCompare(b.windowStart))) {
        const lane = lanes.find((l) => freeAfter(l[l.length - 1]!) <= Date.parse(o.windowStart));
        if (lane) lane.push(o);
        else lanes.push([o]);
      }
      return { area: r.area, lineNumber: r.lineNumber, lanes };
    });
}

/** A week of windows: a bar per order from its window's start to its end, in its state's colour and words. */
export function ScheduleChart({ schedule, weekStart }: { schedule: ScheduleResponse; weekStart: Date }) {
  const from = weekStart.getTime();
  const to = addDays(weekStart, DAYS).getTime();
  const pct = (t: number) => ((Math.min(Math.max(t, from), to) - from) / (to - from)) * 100;
  const rows = rowsOf(schedule.orders);
  const days = Array.from({ length: DAYS }, (_, i) => addDays(weekStart, i));
  let lastArea = '';

  return (
    <div className="overflow-x-auto rounded-xl border border-ink/10 bg-paper-raised shadow-sm">
      <div className="min-w-[880px]">
        <div className="grid grid-cols-[170px_1fr] border-b border-ink/10 bg-paper-sunk/60 text-[13px] font-semibold text-ink-soft">
          <div className="px-3 py-2">Area / line</div>
          <div className="grid grid-cols-7">
            {days.map((d) => <div key={d.getTime()} className="border-l border-ink/10 px-2 py-2">{DAY_FMT.format(d)}</div>)}
          </div>
        </div>
        {rows.length === 0 && <p className="px-3 py-8 text-center text-ink-soft">No order has its window in this week.</p>}
        {rows.map((r) => {
          const header = r.area !== lastArea;
          lastArea = r.area;
          return (
            <div key={r.lineNumber}>
              {header && <h3 className="border-b border-ink/10 bg-paper px-3 py-1.5 text-sm font-semibold">{r.area}</h3>}
              <div className="grid grid-cols-[170px_1fr] border-b border-ink/5">
                <Link to={`/lines/${encodeURIComponent(r.lineNumber)}`} className="flex min-h-11 items-center px-3 text-sm font-medium text-tide hover:underline">{r.lineNumber}</Link>
                <div className="relative" style={{ height: r.lanes.length * 52 + 4, containerType: 'inline-size' }}>
                  <div aria-hidden className="absolute inset-0 grid grid-cols-7">{days.map((d) => <div key={d.getTime()} className="border-l border-ink/10" />)}</div>
                  {r.lanes.flatMap((lane, i) =>
                    lane.map((o) => <Bar key={o.id} order={o} left={pct(Date.parse(o.windowStart))} right={pct(Date.parse(o.windowEnd))} top={i * 52 + 4} />),
                  )}
                </div>
              </div>
            </div>
          );
        })}
      </div>
    </div>
  );
}

function Bar({ order, left, right, top }: { order: Order; left: number; right: number; top: number }) {
  const state = order.state as WorkOrderState;
  const look = STATE_LOOK[state];
  const overlap = order.overlaps.length > 0;
  const label = `${order.number}, ${WORK_ORDER_STATE_LABELS[state]}, ${formatDateTime(order.windowStart)} to ${formatDateTime(order.windowEnd)}${overlap ? `; overlaps ${[...new Set(order.overlaps.map((o) => o.number))].join(', ')}` : ''}`;
  // The link is wide enough for its label; the coloured bar inside it is the window's true length (cqw: the row's width).
  return (
    <Link
      to={`/work-orders/${order.id}`}
      title={label}
      aria-label={label}
      className="group absolute flex h-11 items-center whitespace-nowrap rounded-md text-xs font-semibold text-ink"
      style={{ left: `${left}%`, width: `max(${right - left}%, 130px)`, top }}
    >
      <span
        aria-hidden
        className={`absolute inset-y-0 left-0 rounded-md group-hover:brightness-95 ${overlap ? 'outline-2 outline-offset-1 outline-refuse' : ''}`}
        style={{ width: `max(${right - left}cqw, 10px)`, background: look.fill, border: `2px solid ${look.stroke}` }}
      />
      <span aria-hidden className="relative flex items-center gap-1 pl-2">
        {overlap && <span className="rounded bg-refuse px-1 text-white">!</span>}
        <span>{look.mark}</span>
        <span className="rounded bg-paper-raised/70 px-0.5">{order.number}</span>
      </span>
    </Link>
  );
}
