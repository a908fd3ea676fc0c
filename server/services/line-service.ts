import { Line } from '@server/db/models/line';
import { IsolationPoint } from '@server/db/models/isolation-point';
import { untilChanged } from '@server/db/change-log';
import { linePage, registerTotals, type LineAttributes, type LineMatch } from '@server/db/queries/lines';
import { AppError } from '@server/errors';
import type { LineDetailDto, LineDto, LineListQuery, LineListResponse } from '@shared/schemas/lines';

export function toLineDto(line: LineAttributes, isolationPointCount?: number, openWorkOrders?: number): LineDto {
  return {
    id: line.id,
    lineNumber: line.lineNumber,
    area: line.area,
    service: line.service,
    material: line.material,
    schedule: line.schedule,
    sdr: line.sdr,
    nominalSize: line.nominalSize,
    designPressurePsi: line.designPressurePsi,
    designTemperatureF: line.designTemperatureF,
    drawingRef: line.drawingRef,
    notes: line.notes,
    status: line.status,
    ...(isolationPointCount === undefined ? {} : { isolationPointCount }),
    ...(openWorkOrders === undefined ? {} : { openWorkOrders }),
    updatedAt: line.updatedAt.toISOString(),
  };
}

/**
 * One page of the register: a count, the page itself, isolation points counted for that page only.
 * The count and facets are computed once per filter and register version (an import or a status
 * change makes a new one), so paging and repeating a search cost only the page.
 */
export async function listLines(q: LineListQuery): Promise<LineListResponse> {
  const filters: LineMatch = { area: q.area, material: q.material, status: q.status, size: q.size, search: q.search };
  const [{ total, facets }, rows] = await Promise.all([
    untilChanged(`lines:${JSON.stringify(filters)}`, ['lines'], () => registerTotals(filters)),
    linePage(q),
  ]);
  return { rows: rows.map((r) => toLineDto(r, r.isolationPointCount, r.openWorkOrders)), total, page: q.page, pageSize: q.pageSize, facets };
}

/** One line with its isolation points in tag order; 404 naming the line when it is not in the register. */
export async function getLine(lineNumber: string): Promise<LineDetailDto> {
  const line = await Line.findOne({ where: { lineNumber } });
  if (!line) throw AppError.notFound(`Line ${lineNumber} is not in the register.`);
  const points = await IsolationPoint.findAll({ where: { lineId: line.id }, order: [['tag', 'ASC']] });
  return {
    ...toLineDto(line.get({ plain: true }), points.length),
    isolationPoints: points.map((p) => ({ id: p.id, tag: p.tag, kind: p.kind, normalPosition: p.normalPosition, notes: p.notes })),
  };
}
