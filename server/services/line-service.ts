import { Line } from '@server/db/models/line';
import { IsolationPoint } from '@server/db/models/isolation-point';
import { currentSnapshot, keptEntry, untilChanged, type ChangeView, type KeptAnswer } from '@server/db/change-log';
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
 * One page of the register: a count, the page itself, isolation points and open orders counted for
 * that page only. The answer is kept until the register, its points or the orders change (the
 * request's freshness view, server/db/change-log.ts), so repeating a page or a search costs no
 * query; the count and facets are kept per filter, so paging costs only the page.
 */
export function listLines(q: LineListQuery, view?: ChangeView): Promise<KeptAnswer<LineListResponse>> {
  const filters: LineMatch = { area: q.area, material: q.material, status: q.status, size: q.size, search: q.search };
  return keptEntry(`lines-page:${JSON.stringify(q)}`, ['lines', 'work-orders'], async () => {
    const snapshot = await currentSnapshot(); // before both reads: the older snapshot of the two
    const [{ total, facets }, rows] = await Promise.all([
      untilChanged(`lines:${JSON.stringify(filters)}`, ['lines'], () => registerTotals(filters), { view }),
      linePage(q),
    ]);
    return { snapshot, value: { rows: rows.map((r) => toLineDto(r, r.isolationPointCount, r.openWorkOrders)), total, page: q.page, pageSize: q.pageSize, facets } };
  }, { view });
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
