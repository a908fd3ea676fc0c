// Applying a confirmed import: one transaction, set-based. The rows come straight from the
// preview's line_import_rows (insert … select … on conflict do update), ~10k row numbers a
// statement, so nothing travels back through Node and what is written is exactly what was shown.

import { QueryTypes, type Transaction } from 'sequelize';
import { sequelize } from '@server/db/sequelize';
import { AppError } from '@server/errors';
import { recordAudit } from '@server/services/audit-service';
import type { ImportCounts, ImportKind } from '@shared/schemas/line-imports';
import { readColumns } from './register-csv';
import { CHUNK_ROWS, REGISTER_LOCK, type Progress } from './line-import-shared';

export interface ApplyTarget {
  id: string;
  kind: ImportKind;
  filename: string;
  source: string;
  counts: ImportCounts;
  confirmedById: string | null;
}

const TO_WRITE = `r.import_id = $1 and r.outcome in ('new', 'changed') and r.row_number between $2 and $3`;

// drawing_ref and notes follow the file only when the file has those columns ($4, $5).
const UPSERT_LINES = `
  insert into lines as l (line_number, area, service, material, schedule, sdr, nominal_size, nominal_size_in,
                          design_pressure_psi, design_temperature_f, drawing_ref, notes)
  select r.key, r.data->>'area', r.data->>'service', r.data->>'material', r.data->>'schedule', (r.data->>'sdr')::real,
         r.data->>'nominalSize', (r.data->>'nominalSizeIn')::real, (r.data->>'designPressurePsi')::real,
         (r.data->>'designTemperatureF')::real, r.data->>'drawingRef', r.data->>'notes'
  from line_import_rows r where ${TO_WRITE}
  on conflict (line_number) do update set
    area = excluded.area, service = excluded.service, material = excluded.material, schedule = excluded.schedule,
    sdr = excluded.sdr, nominal_size = excluded.nominal_size, nominal_size_in = excluded.nominal_size_in,
    design_pressure_psi = excluded.design_pressure_psi, design_temperature_f = excluded.design_temperature_f,
    drawing_ref = case when $4 then excluded.drawing_ref else l.drawing_ref end,
    notes = case when $5 then excluded.notes else l.notes end,
    updated_at = now()
  where (l.area, l.service, l.material, l.schedule, l.sdr, l.nominal_size, l.nominal_size_in, l.design_pressure_psi,
         l.design_temperature_f, l.drawing_ref, l.notes)
    is distinct from
        (excluded.area, excluded.service, excluded.material, excluded.schedule, excluded.sdr, excluded.nominal_size,
         excluded.nominal_size_in, excluded.design_pressure_psi, excluded.design_temperature_f,
         case when $4 then excluded.drawing_ref else l.drawing_ref end, case when $5 then excluded.notes else l.notes end)`;

const UPSERT_POINTS = `
  insert into isolation_points as ip (tag, line_id, kind, normal_position, notes)
  select r.key, ln.id, r.data->>'kind', r.data->>'normalPosition', r.data->>'notes'
  from line_import_rows r join lines ln on ln.line_number = r.data->>'lineNumber'
  where ${TO_WRITE}
  on conflict (tag) do update set
    line_id = excluded.line_id, kind = excluded.kind, normal_position = excluded.normal_position,
    notes = case when $4 then excluded.notes else ip.notes end, updated_at = now()`;

const MISSING_LINE = `
  select r.row_number as "rowNumber", r.data->>'lineNumber' as "lineNumber"
  from line_import_rows r left join lines ln on ln.line_number = r.data->>'lineNumber'
  where r.import_id = $1 and r.outcome in ('new', 'changed') and ln.id is null
  order by r.row_number limit 1`;

/** Another import of the same kind applied after this one's preview read the register, if any. */
export async function appliedSince(imp: { id: string; kind: ImportKind; previewedAt: Date | null }, transaction?: Transaction): Promise<string | null> {
  const [row] = await sequelize.query<{ filename: string }>(
    `select filename from line_imports where kind = $1 and id <> $2 and status = 'applied' and applied_at > $3 order by applied_at desc limit 1`,
    { bind: [imp.kind, imp.id, imp.previewedAt ?? new Date(0)], type: QueryTypes.SELECT, transaction },
  );
  return row?.filename ?? null;
}

export const staleMessage = (other: string) =>
  `The register changed since this preview ("${other}" was applied after it); upload the file again.`;

async function rowNumberRange(importId: string, t: Transaction): Promise<{ first: number; last: number }> {
  const [r] = await sequelize.query<{ first: number | null; last: number | null }>(
    'select min(row_number) as first, max(row_number) as last from line_import_rows where import_id = $1',
    { bind: [importId], type: QueryTypes.SELECT, transaction: t },
  );
  return { first: r?.first ?? 0, last: r?.last ?? -1 };
}

async function refuseMissingLines(importId: string, t: Transaction): Promise<void> {
  const [missing] = await sequelize.query<{ rowNumber: number; lineNumber: string }>(MISSING_LINE, { bind: [importId], type: QueryTypes.SELECT, transaction: t });
  if (missing) throw new AppError(422, 'import_failed', `Nothing was written: line ${missing.lineNumber} (row ${missing.rowNumber}) is no longer in the register.`);
}

/**
 * Writes the new and changed rows, the audit entry and the 'applied' status in the caller's
 * transaction. Returns false (writing nothing) when the import is no longer waiting to be applied.
 */
export async function applyRows(imp: ApplyTarget, t: Transaction, progress: Progress): Promise<boolean> {
  await sequelize.query('select pg_advisory_xact_lock($1)', { bind: [REGISTER_LOCK], transaction: t });
  const [state] = await sequelize.query<{ status: string; previewedAt: Date | null }>(
    'select status, previewed_at as "previewedAt" from line_imports where id = $1',
    { bind: [imp.id], type: QueryTypes.SELECT, transaction: t },
  );
  if (state?.status !== 'applying') return false;
  const other = await appliedSince({ id: imp.id, kind: imp.kind, previewedAt: state.previewedAt }, t);
  if (other) throw new AppError(409, 'stale_preview', staleMessage(other));

  const cols = readColumns(imp.source);
  if (cols.kind === 'isolation-points') await refuseMissingLines(imp.id, t);
  const sql = cols.kind === 'lines' ? UPSERT_LINES : UPSERT_POINTS;
  const has = cols.header as Record<string, string | undefined>;
  const flags = cols.kind === 'lines' ? [Boolean(has.drawingRef), Boolean(has.notes)] : [Boolean(has.notes)];
  const { first, last } = await rowNumberRange(imp.id, t);
  for (let from = first; from <= last; from += CHUNK_ROWS) {
    await sequelize.query(sql, { bind: [imp.id, from, from + CHUNK_ROWS - 1, ...flags], transaction: t });
    await progress((99 * (from + CHUNK_ROWS - first)) / (last - first + 1));
  }

  const { new: added, changed, unchanged, rejected } = imp.counts;
  await recordAudit(
    { actorId: imp.confirmedById, action: 'line-import-applied', entity: 'line-import', entityId: imp.id, after: { kind: imp.kind, filename: imp.filename, new: added, changed, unchanged, skipped: rejected } },
    t,
  );
  await sequelize.query(
    `update line_imports set status = 'applied', progress = 100, error = null, applied_at = clock_timestamp(), updated_at = now() where id = $1`,
    { bind: [imp.id], transaction: t },
  );
  return true;
}
