// An import as the API shows it, alone or in the list of past imports, and its preview rows.

import { LineImport, LineImportRow } from '@server/db/models/line-import';
import { Person } from '@server/db/models/person';
import { AppError } from '@server/errors';
import type { ImportListQuery, ImportListResponse, ImportRowDto, ImportRowsResponse, LineImportDto, RowOutcome } from '@shared/schemas/line-imports';

const WITH_UPLOADER = { include: [{ model: Person, as: 'uploader', attributes: ['name'] }] };

function toDto(imp: LineImport): LineImportDto {
  return {
    id: imp.id,
    kind: imp.kind,
    filename: imp.filename,
    status: imp.status,
    totalRows: imp.totalRows,
    counts: imp.counts,
    progress: imp.progress,
    error: imp.error,
    uploadedBy: imp.uploader?.name ?? '',
    createdAt: imp.createdAt.toISOString(),
    appliedAt: imp.appliedAt?.toISOString() ?? null,
    cancelledAt: imp.cancelledAt?.toISOString() ?? null,
  };
}

export const NO_SUCH_IMPORT = 'There is no such import; it may have been uploaded on another system.';

export async function getImport(id: string): Promise<LineImportDto> {
  const imp = await LineImport.findByPk(id, WITH_UPLOADER);
  if (!imp) throw AppError.notFound(NO_SUCH_IMPORT);
  return toDto(imp);
}

/** Past imports, newest first. */
export async function listImports(query: ImportListQuery): Promise<ImportListResponse> {
  const { rows, count } = await LineImport.findAndCountAll({
    ...WITH_UPLOADER,
    order: [['createdAt', 'DESC'], ['id', 'DESC']],
    offset: (query.page - 1) * query.pageSize,
    limit: query.pageSize,
  });
  return { rows: rows.map(toDto), total: count };
}

/** What a preview row shows of its values: a lines row's typed columns as one object, or its `data`. */
function rowData(r: LineImportRow): ImportRowDto['data'] {
  if (r.data || r.area === null) return r.data;
  return {
    lineNumber: r.key, area: r.area, service: r.service, material: r.material, schedule: r.schedule, sdr: r.sdr,
    nominalSize: r.nominalSize, nominalSizeIn: r.nominalSizeIn, designPressurePsi: r.designPressurePsi,
    designTemperatureF: r.designTemperatureF, drawingRef: r.drawingRef, notes: r.notes,
  };
}

export async function listImportRows(id: string, query: { page: number; pageSize: number; outcome?: RowOutcome }): Promise<ImportRowsResponse> {
  if (!(await LineImport.count({ where: { id } }))) throw AppError.notFound(NO_SUCH_IMPORT);
  const { rows, count } = await LineImportRow.findAndCountAll({
    where: { importId: id, ...(query.outcome ? { outcome: query.outcome } : {}) },
    order: [['rowNumber', 'ASC']],
    offset: (query.page - 1) * query.pageSize,
    limit: query.pageSize,
  });
  return {
    rows: rows.map((r) => ({ rowNumber: r.rowNumber, outcome: r.outcome, key: r.key, data: rowData(r), changes: r.changes, problems: r.problems })),
    total: count,
  };
}
