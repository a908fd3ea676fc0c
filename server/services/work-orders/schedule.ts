// The schedule: every order's window in a range, with its state, and the overlaps that book one
// line or one isolation point for two orders at once (flagged on both).

import { overlapsOf, scheduleRows } from '@server/db/queries/work-orders';
import type { ScheduleQuery, ScheduleResponse } from '@shared/schemas/work-order-plan';

export async function schedule(q: ScheduleQuery): Promise<ScheduleResponse> {
  const rows = await scheduleRows(q.from, q.to, q.area);
  const overlaps = await overlapsOf(rows.map((r) => r.id));
  return {
    from: new Date(q.from).toISOString(),
    to: new Date(q.to).toISOString(),
    orders: rows.map((r) => ({
      id: r.id, number: r.number, state: r.state, priority: r.priority, kind: r.kind,
      windowStart: r.windowStart.toISOString(), windowEnd: r.windowEnd.toISOString(),
      lines: r.lines ?? [], overlaps: overlaps.get(r.id) ?? [],
    })),
  };
}
