import { QueryTypes } from 'sequelize';
import { sequelize } from '@server/db/sequelize';
import { AppError } from '@server/errors';
import { parseNominalSize } from '@shared/trade';
import type { IsolationPointDto, LineDetailDto, LineDto, LineExportQuery, LineListQuery, LineListResponse } from '@shared/schemas/lines';

/** A row of `lines` as PostgreSQL returns it, plus the page query's isolation point count. */
export interface LineRow {
  id: string;
  line_number: string;
  area: string;
  service: string;
  material: LineDto['material'];
  schedule: string | null;
  sdr: number | null;
  nominal_size: string;
  nominal_size_in: number;
  design_pressure_psi: number;
  design_temperature_f: number;
  drawing_ref: string | null;
  notes: string | null;
  status: LineDto['status'];
  updated_at: Date;
  isolation_point_count?: string | number;
}

export type LineFilters = Omit<LineExportQuery, 'withStatus'>;

// Whitelisted: the sort name never reaches SQL itself. Size sorts by inches, not by its text.
const SORT_COLUMNS: Record<LineListQuery['sort'], string> = {
  lineNumber: 'l.line_number',
  area: 'l.area',
  service: 'l.service',
  material: 'l.material',
  nominalSize: 'l.nominal_size_in',
  designPressurePsi: 'l.design_pressure_psi',
  status: 'l.status',
  updatedAt: 'l.updated_at',
};

/** `%`, `_` and `\` in what a person types are literal characters, not LIKE wildcards. */
export function escapeLike(text: string): string {
  return text.replace(/[\\%_]/g, (c) => `\\${c}`);
}

/** The WHERE clause of a register query and its bind values ($1, $2, … in order). */
export function lineWhere(q: LineFilters): { sql: string; bind: unknown[] } {
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
  const column = SORT_COLUMNS[q.sort].replace(/^l\./, `${alias}.`);
  const dir = q.dir === 'desc' ? 'desc' : 'asc';
  return q.sort === 'lineNumber' ? `${column} ${dir}` : `${column} ${dir}, ${alias}.line_number asc`;
}

export function toLineDto(row: LineRow): LineDto {
  return {
    id: row.id,
    lineNumber: row.line_number,
    area: row.area,
    service: row.service,
    material: row.material,
    schedule: row.schedule,
    sdr: row.sdr,
    nominalSize: row.nominal_size,
    designPressurePsi: row.design_pressure_psi,
    designTemperatureF: row.design_temperature_f,
    drawingRef: row.drawing_ref,
    notes: row.notes,
    status: row.status,
    ...(row.isolation_point_count === undefined ? {} : { isolationPointCount: Number(row.isolation_point_count) }),
    updatedAt: row.updated_at.toISOString(),
  };
}

const select = <T extends object>(sql: string, bind: unknown[] = []) => sequelize.query<T>(sql, { type: QueryTypes.SELECT, bind });

/**
 * The register's facets: every area and every size in it, whatever the filters. Both walk
 * their index one distinct value at a time (a loose index scan), so 100,000 lines cost ~20 steps each.
 */
async function registerFacets(): Promise<LineListResponse['facets']> {
  const [areas, sizes] = await Promise.all([
    select<{ v: string }>(`
      with recursive a(v) as (
        select min(area) from lines
        union all
        select (select min(area) from lines where area > a.v) from a where a.v is not null
      ) select v from a where v is not null`),
    select<{ v: string }>(`
      with recursive s(inches) as (
        select min(nominal_size_in) from lines
        union all
        select (select min(nominal_size_in) from lines where nominal_size_in > s.inches) from s where s.inches is not null
      ) select (select nominal_size from lines where nominal_size_in = s.inches limit 1) as v
        from s where s.inches is not null order by s.inches`),
  ]);
  return { areas: areas.map((r) => r.v), sizes: sizes.map((r) => r.v) };
}

/** One page of the register: a count, the page itself, isolation points counted for that page only. */
export async function listLines(q: LineListQuery): Promise<LineListResponse> {
  const where = lineWhere(q);
  const offset = (q.page - 1) * q.pageSize;
  const [[count], rows, facets] = await Promise.all([
    select<{ total: string }>(`select count(*) as total from lines l ${where.sql}`, where.bind),
    select<LineRow>(
      `select p.*, (select count(*) from isolation_points ip where ip.line_id = p.id) as isolation_point_count
         from (select l.* from lines l ${where.sql} order by ${lineOrder(q)}
               limit $${where.bind.length + 1} offset $${where.bind.length + 2}) p
        order by ${lineOrder(q, 'p')}`,
      [...where.bind, q.pageSize, offset],
    ),
    registerFacets(),
  ]);
  return { rows: rows.map(toLineDto), total: Number(count.total), page: q.page, pageSize: q.pageSize, facets };
}

/** One line with its isolation points in tag order; 404 naming the line when it is not in the register. */
export async function getLine(lineNumber: string): Promise<LineDetailDto> {
  const [line] = await select<LineRow>('select l.* from lines l where l.line_number = $1', [lineNumber]);
  if (!line) throw AppError.notFound(`Line ${lineNumber} is not in the register.`);
  const points = await select<IsolationPointDto>(
    'select id, tag, kind, normal_position as "normalPosition", notes from isolation_points where line_id = $1 order by tag',
    [line.id],
  );
  return { ...toLineDto({ ...line, isolation_point_count: points.length }), isolationPoints: points };
}
