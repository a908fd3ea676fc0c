import { PlantSetting } from '@server/db/models/plant-setting';
import type { Line } from '@server/db/models/line';
import type { Browserless } from './browserless';

/** The plant as these tests expect it: schedule A, the stricter test cap, the default window-plan minutes, Chicago time. */
export const plantForWorkOrders = () =>
  PlantSetting.update({ cureScheduleId: 'A', testCap: 'rating', windowPlan: {}, timeZone: 'America/Chicago', lockLeftOnMinutes: null, updatedById: null }, { where: { id: 1 } });

/** A window of `hours` from `start` (an ISO instant with its offset). */
export function windowOf(start: string, hours: number): { windowStart: string; windowEnd: string } {
  return { windowStart: new Date(start).toISOString(), windowEnd: new Date(Date.parse(start) + hours * 3_600_000).toISOString() };
}

/** What a planner sends to create an order on `lines`; a warm, dry cure and a 12-hour window unless told otherwise. */
export function orderBody(lines: Line[], over: Record<string, unknown> = {}) {
  return {
    kind: 'repair',
    priority: 'soon',
    scope: 'Cut out the weeping coupling and make two new joints.',
    requestedBy: 'Maud Okafor',
    lineIds: lines.map((l) => l.id),
    ...windowOf('2027-03-01T06:00:00-06:00', 12),
    forecastLowF: 70,
    forecastHighRh: 50,
    ...over,
  };
}

export async function createOrder(b: Browserless, lines: Line[], over: Record<string, unknown> = {}) {
  const res = await b.post('/api/work-orders', orderBody(lines, over));
  if (res.status !== 201) throw new Error(`the order was not created: ${res.status} ${JSON.stringify(res.body)}`);
  return res.body;
}

/**
 * An order ready to plan: `joints` couplings on its first line and an isolation plan of that
 * line's register points (each must exist) plus a drain point.
 */
export async function plannableOrder(b: Browserless, lines: Line[], opts: { joints?: number; over?: Record<string, unknown> } = {}) {
  const order = await createOrder(b, lines, opts.over);
  const line = lines[0]!;
  const added = await b.post(`/api/work-orders/${order.id}/joint-tasks`, { lineId: line.id, fittingKind: 'coupling', count: opts.joints ?? 2 });
  if (added.status !== 201) throw new Error(`joints not added: ${JSON.stringify(added.body)}`);
  const prefill = (await b.get(`/api/work-orders/${order.id}/isolation-plan`)).body.suggested as { isolationPointId: string }[];
  const entries = [...prefill.map((p) => ({ isolationPointId: p.isolationPointId })), { lineId: line.id, tag: `DR-${order.number}`, kind: 'drain' }];
  const plan = await b.put(`/api/work-orders/${order.id}/isolation-plan`, { entries });
  if (plan.status !== 200) throw new Error(`isolation plan not set: ${JSON.stringify(plan.body)}`);
  return (await b.get(`/api/work-orders/${order.id}`)).body;
}
