// Set-based SQL of work orders: the per-year number counter, the list page with its filters, sort
// and count, and the windows that overlap on a line or an isolation point (the schedule's flags).
// Single orders, their lines, joint tasks and isolation plans go through the models.

import { QueryTypes, type Transaction } from 'sequelize';
import { sequelize } from '@server/db/sequelize';
import type { Snapshotted } from '@server/db/change-log';
import { escapeLike } from '@server/db/queries/lines';
import { PRIORITIES, WORK_ORDER_STATES, type WorkOrderListQuery, type WorkOrderRow } from '@shared/schemas/work-orders';
import type { OverlapDto } from '@shared/schemas/work-order-plan';

const select = <T extends object>(sql: string, bind: unknown[] = [], transaction?: Transaction) =>
  sequelize.query<T>(sql, { type: QueryTypes.SELECT, bind, transaction });

/** The next number of `year`, raised inside `t`: two orders created at once wait on the row and never share one. */
export async function nextOrderNumber(year: number, t: Transaction): Promise<number> {
  const [row] = await select<{ n: number }>(
    `insert into work_order_numbers (year, last_number) values ($1, 1)
       on conflict (year) do update set last_number = work_order_numbers.last_number + 1
     returning last_number as n`,
    [year], t,
  );
  return row!.n;
}

const list = (values: readonly string[]) => `array[${values.map((v) => `'${v}'`).join(', ')}]::text[]`;
// Whitelisted: the sort name never reaches SQL itself. Priority and state sort by their place in the scale.
const SORT_COLUMNS: Record<WorkOrderListQuery['sort'], string> = {
  number: 'o.number',
  priority: `array_position(${list(PRIORITIES)}, o.priority)`,
  state: `array_position(${list(WORK_ORDER_STATES)}, o.state)`,
  windowStart: 'o.window_start',
  createdAt: 'o.created_at',
  updatedAt: 'o.updated_at',
};

function orderWhere(q: WorkOrderListQuery): { sql: string; bind: unknown[] } {
  const bind: unknown[] = [];
  const clauses: string[] = [];
  const add = (clause: (n: string) => string, value: unknown) => {
    bind.push(value);
    clauses.push(clause(`$${bind.length}`));
  };
  // One state as a plain equality, so the (state, window_start) index gives the list its window order.
  if (q.state?.length === 1) add((n) => `o.state = ${n}::text`, q.state[0]);
  else if (q.state?.length) add((n) => `o.state = any(${n}::text[])`, q.state);
  if (q.priority?.length) add((n) => `o.priority = any(${n}::text[])`, q.priority);
  if (q.area?.length) add((n) => `exists (select 1 from work_order_lines wl join lines l on l.id = wl.line_id where wl.work_order_id = o.id and l.area = any(${n}::text[]))`, q.area);
  if (q.line?.length) add((n) => `exists (select 1 from work_order_lines wl join lines l on l.id = wl.line_id where wl.work_order_id = o.id and l.line_number = any(${n}::text[]))`, q.line);
  if (q.fitter) add((n) => `exists (select 1 from joint_tasks j where j.work_order_id = o.id and j.fitter_id = ${n}::uuid)`, q.fitter);
  if (q.windowFrom) add((n) => `o.window_end > ${n}::timestamptz`, q.windowFrom);
  if (q.windowTo) add((n) => `o.window_start < ${n}::timestamptz`, q.windowTo);
  if (q.search) add((n) => `o.number ilike ${n} escape '\\'`, `%${escapeLike(q.search)}%`);
  return { sql: clauses.length ? `where ${clauses.join(' and ')}` : '', bind };
}

/** How many orders match, with the statement's snapshot (server/db/change-log.ts keeps it until an order changes). */
export async function countOrders(q: WorkOrderListQuery): Promise<Snapshotted<number>> {
  const where = orderWhere(q);
  const [row] = await select<{ snapshot: string; total: string }>(
    `select pg_current_snapshot()::text as snapshot, (select count(*) from work_orders o ${where.sql}) as total`,
    where.bind,
  );
  return { snapshot: row!.snapshot, value: Number(row!.total) };
}

type RawRow = Omit<WorkOrderRow, 'windowStart' | 'windowEnd' | 'createdAt' | 'updatedAt' | 'jointCount'> & {
  windowStart: Date | null; windowEnd: Date | null; createdAt: Date; updatedAt: Date; jointCount: string;
};

/**
 * One page of matching orders, each with its lines and joint count (for that page only: the page is
 * cut first, so the rows skipped by the offset are never counted). Ties fall back to the number.
 */
export async function orderPage(q: WorkOrderListQuery): Promise<WorkOrderRow[]> {
  const where = orderWhere(q);
  const n = where.bind.length;
  const dir = q.dir === 'desc' ? 'desc' : 'asc';
  const nulls = q.sort === 'windowStart' ? (dir === 'asc' ? ' nulls last' : ' nulls first') : '';
  const order = `${SORT_COLUMNS[q.sort]} ${dir}${nulls}, o.number ${dir}`;
  const rows = await select<RawRow>(
    `select o.id, o.number, o.kind, o.priority, o.state, o.scope, o.requested_by as "requestedBy",
            o.window_start as "windowStart", o.window_end as "windowEnd", o.created_at as "createdAt", o.updated_at as "updatedAt",
            (select count(*) from joint_tasks j where j.work_order_id = o.id) as "jointCount",
            coalesce((select json_agg(json_build_object('id', l.id, 'lineNumber', l.line_number, 'area', l.area) order by l.line_number)
                        from work_order_lines wl join lines l on l.id = wl.line_id where wl.work_order_id = o.id), '[]') as lines
       from (select o.* from work_orders o ${where.sql}
              order by ${order} limit $${n + 1} offset $${n + 2}) o
      order by ${order}`,
    [...where.bind, q.pageSize, (q.page - 1) * q.pageSize],
  );
  return rows.map((r) => ({
    ...r,
    jointCount: Number(r.jointCount),
    windowStart: r.windowStart?.toISOString() ?? null,
    windowEnd: r.windowEnd?.toISOString() ?? null,
    createdAt: r.createdAt.toISOString(),
    updatedAt: r.updatedAt.toISOString(),
  }));
}

/**
 * For each of `orderIds`, the other orders whose windows overlap its window in time and that work
 * on one of its lines or one of its isolation points. Cancelled orders and orders without a window
 * book nothing, so they neither flag nor are flagged.
 */
export async function overlapsOf(orderIds: string[], t?: Transaction): Promise<Map<string, OverlapDto[]>> {
  const out = new Map<string, OverlapDto[]>(orderIds.map((id) => [id, []]));
  if (!orderIds.length) return out;
  const rows = await select<OverlapDto & { of: string }>(
    `with mine as (select id, window_start, window_end from work_orders
                    where id = any($1::uuid[]) and state <> 'cancelled' and window_start is not null),
          -- && on the half-open ranges is "a starts before b ends and b starts before a ends";
          -- work_orders_window_range_idx serves it, so only orders booked near the window are read.
          pairs as (select a.id as a, b.id as b, b.number, b.state from mine a join work_orders b
                      on b.id <> a.id and b.state <> 'cancelled' and b.window_start is not null
                     and tstzrange(b.window_start, b.window_end) && tstzrange(a.window_start, a.window_end))
     select p.a as "of", p.b as "orderId", p.number, p.state, 'line' as "on", l.line_number as what
       from pairs p
       join work_order_lines la on la.work_order_id = p.a
       join work_order_lines lb on lb.work_order_id = p.b and lb.line_id = la.line_id
       join lines l on l.id = la.line_id
     union all
     select distinct p.a, p.b, p.number, p.state, 'isolation-point', ea.tag
       from pairs p
       join isolation_plan_entries ea on ea.work_order_id = p.a and ea.isolation_point_id is not null
       join isolation_plan_entries eb on eb.work_order_id = p.b and eb.isolation_point_id = ea.isolation_point_id
     order by 1, 3, 5, 6`,
    [orderIds], t,
  );
  for (const { of, ...overlap } of rows) out.get(of)?.push(overlap);
  return out;
}

export interface ScheduleRow {
  id: string; number: string; state: string; priority: string; kind: string; windowStart: Date; windowEnd: Date;
  lines: { id: string; lineNumber: string; area: string }[];
}

/** Every order (not cancelled) whose window overlaps from–to, optionally only those with a line in `area`, by window start. */
export async function scheduleRows(from: string, to: string, area?: string): Promise<ScheduleRow[]> {
  return select<ScheduleRow>(
    `select o.id, o.number, o.state, o.priority, o.kind, o.window_start as "windowStart", o.window_end as "windowEnd",
            (select json_agg(json_build_object('id', l.id, 'lineNumber', l.line_number, 'area', l.area) order by l.line_number)
               from work_order_lines wl join lines l on l.id = wl.line_id where wl.work_order_id = o.id) as lines
       from work_orders o
      where o.state <> 'cancelled' and o.window_start < $2::timestamptz and o.window_end > $1::timestamptz
        and ($3::text is null or exists (select 1 from work_order_lines wl join lines l on l.id = wl.line_id where wl.work_order_id = o.id and l.area = $3))
      order by o.window_start, o.number`,
    [from, to, area ?? null],
  );
}
