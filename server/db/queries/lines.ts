// Set-based reads of the line register: a filtered, sorted page with its count, the facets, and
// the export's cursor. Single lines are read through the Line model (services/line-service.ts).

import { QueryTypes, type InferAttributes, type Transaction } from 'sequelize';
import { sequelize } from '@server/db/sequelize';
import type { Snapshotted } from '@server/db/change-log';
import type { Line } from '@server/db/models/line';
import { parseNominalSize } from '@shared/trade';
import type { LineExportQuery, LineListQuery } from '@shared/schemas/lines';
import { OPEN_WORK_ORDER_STATES } from '@shared/schemas/work-orders';

/** A line as these queries return it: the model's own attributes, named as the model names them. */
export type LineAttributes = InferAttributes<Line>;
export type LineFilters = Omit<LineExportQuery, 'withStatus'>;
/** What narrows the register, without the order. */
export type LineMatch = Pick<LineFilters, 'area' | 'material' | 'status' | 'size' | 'search'>;

/** Every column of `lines l` under the model's attribute names. */
const LINE_COLUMNS = `l.id, l.line_number as "lineNumber", l.area, l.service, l.material, l.schedule, l.sdr,
  l.nominal_size as "nominalSize", l.nominal_size_in as "nominalSizeIn", l.design_pressure_psi as "designPressurePsi",
  l.design_temperature_f as "designTemperatureF", l.drawing_ref as "drawingRef", l.notes, l.status,
  l.created_at as "createdAt", l.updated_at as "updatedAt"`;

// Whitelisted: the sort name never reaches SQL itself. Size sorts by inches, not by its text.
const SORT_COLUMNS: Record<LineListQuery['sort'], string> = {
  lineNumber: 'line_number',
  area: 'area',
  service: 'service',
  material: 'material',
  nominalSize: 'nominal_size_in',
  designPressurePsi: 'design_pressure_psi',
  status: 'status',
  updatedAt: 'updated_at',
};

/** `%`, `_` and `\` in what a person types are literal characters, not LIKE wildcards. */
export function escapeLike(text: string): string {
  return text.replace(/[\\%_]/g, (c) => `\\${c}`);
}

/** The WHERE clause of a register query and its bind values ($1, $2, … in order). */
export function lineWhere(q: LineMatch): { sql: string; bind: unknown[] } {
  const bind: unknown[] = [];
  const clauses: string[] = [];
  const add = (clause: (n: string) => string, value: unknown) => {
    bind.push(value);
    clauses.push(clause(`$${bind.length}`));
  };
  if (q.area?.length) add((n) => `l.area = any(${n}::text[])`, q.area);
  if (q.material?.length) add((n) => `l.material = any(${n}::text[])`, q.material);
  if (q.status?.length) add((n) => `l.status = any(${n}::text[])`, q.status);
  if (q.size?.length) {
    // Compared as inches so lines_size_idx serves it and "1 1/4" finds "1-1/4"; an unlisted size finds nothing.
    const inches = q.size.map(parseNominalSize).filter((v): v is number => v !== null);
    add((n) => `l.nominal_size_in = any(${n}::real[])`, inches);
  }
  if (q.search) add((n) => `l.line_number ilike ${n} escape '\\'`, `%${escapeLike(q.search)}%`);
  return { sql: clauses.length ? `where ${clauses.join(' and ')}` : '', bind };
}

/** One sort column; ties fall back to the line number so pages never overlap or skip. */
export function lineOrder(q: Pick<LineFilters, 'sort' | 'dir'>, alias = 'l'): string {
  const column = `${alias}.${SORT_COLUMNS[q.sort]}`;
  const dir = q.dir === 'desc' ? 'desc' : 'asc';
  return q.sort === 'lineNumber' ? `${column} ${dir}` : `${column} ${dir}, ${alias}.line_number asc`;
}

const select = <T extends object>(sql: string, bind: unknown[] = [], transaction?: Transaction) =>
  sequelize.query<T>(sql, { type: QueryTypes.SELECT, bind, transaction });

/** The register's facets (every area and size in it, whatever the filters) and how many lines match. */
export interface RegisterTotals {
  total: number;
  facets: { areas: string[]; sizes: string[] };
}

/**
 * The count and the facets in one statement, with its snapshot (server/db/change-log.ts keeps them
 * until the register changes). The facets walk their index one distinct value at a time (a loose
 * index scan), so 100,000 lines cost ~20 steps each.
 */
export async function registerTotals(q: LineMatch): Promise<Snapshotted<RegisterTotals>> {
  const where = lineWhere(q);
  const [row] = await select<{ snapshot: string; total: string; areas: string[]; sizes: string[] }>(
    `select pg_current_snapshot()::text as snapshot,
            (select count(*) from lines l ${where.sql}) as total,
            array(with recursive a(v) as (
                    select min(area) from lines
                    union all
                    select (select min(area) from lines where area > a.v) from a where a.v is not null
                  ) select v from a where v is not null) as areas,
            array(with recursive s(inches) as (
                    select min(nominal_size_in) from lines
                    union all
                    select (select min(nominal_size_in) from lines where nominal_size_in > s.inches) from s where s.inches is not null
                  ) select (select nominal_size from lines where nominal_size_in = s.inches limit 1)
                      from s where s.inches is not null order by s.inches) as sizes`,
    where.bind,
  );
  return { snapshot: row!.snapshot, value: { total: Number(row!.total), facets: { areas: row!.areas, sizes: row!.sizes } } };
}

const OPEN_STATES = `array[${OPEN_WORK_ORDER_STATES.map((s) => `'${s}'`).join(', ')}]`;

/** One page of matching lines, with each line's isolation points and open work orders counted for that page only. */
export async function linePage(q: LineListQuery): Promise<(LineAttributes & { isolationPointCount: number; openWorkOrders: number })[]> {
  const where = lineWhere(q);
  const n = where.bind.length;
  const rows = await select<LineAttributes & { isolationPointCount: string; openWorkOrders: string }>(
    `select p.*, (select count(*) from isolation_points ip where ip.line_id = p.id) as "isolationPointCount",
            (select count(*) from work_order_lines wl join work_orders o on o.id = wl.work_order_id
              where wl.line_id = p.id and o.state = any(${OPEN_STATES})) as "openWorkOrders"
       from (select ${LINE_COLUMNS} from lines l ${where.sql} order by ${lineOrder(q)} limit $${n + 1} offset $${n + 2}) p
      order by ${lineOrder(q, 'p').replace(/p\.(\w+)/g, (_m, c: string) => `p."${camel(c)}"`)}`,
    [...where.bind, q.pageSize, (q.page - 1) * q.pageSize],
  );
  return rows.map((r) => ({ ...r, isolationPointCount: Number(r.isolationPointCount), openWorkOrders: Number(r.openWorkOrders) }));
}

const camel = (snake: string) => snake.replace(/_([a-z])/g, (_m, c: string) => c.toUpperCase());

/**
 * Opens a server-side cursor over the matching lines, in the list's order, inside `t` (read it
 * with fetchLineExport; the transaction's end closes it). All batches come from one snapshot.
 */
export async function openLineExportCursor(q: LineFilters, t: Transaction): Promise<void> {
  const where = lineWhere(q);
  await sequelize.query(`declare line_export no scroll cursor for select ${LINE_COLUMNS} from lines l ${where.sql} order by ${lineOrder(q)}`, {
    bind: where.bind,
    transaction: t,
  });
}

export function fetchLineExport(batch: number, t: Transaction): Promise<LineAttributes[]> {
  return select<LineAttributes>(`fetch ${batch} from line_export`, [], t);
}
