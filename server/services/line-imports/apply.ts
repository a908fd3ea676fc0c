// Applying a confirmed import: one transaction, set-based (server/db/queries/line-imports.ts).

import { Op, type Transaction } from 'sequelize';
import { REGISTER_LOCK, lockForTransaction } from '@server/db/locks';
import { LineImport } from '@server/db/models/line-import';
import { databaseNow, firstRowWithMissingLine, importFileStart, writeImportRows } from '@server/db/queries/line-imports';
import { AppError } from '@server/errors';
import { recordAudit } from '@server/services/audit-service';
import type { ImportKind } from '@shared/schemas/line-imports';
import { readColumns, type AnyColumns } from './register-csv';
import { assertStill, moveOn, type Progress } from './progress';

/** Another import of the same kind applied after this one's preview read the register, if any. */
export async function appliedSince(imp: { id: string; kind: ImportKind; previewedAt: Date | null }, transaction?: Transaction): Promise<string | null> {
  const other = await LineImport.findOne({
    where: { kind: imp.kind, id: { [Op.ne]: imp.id }, status: 'applied', appliedAt: { [Op.gt]: imp.previewedAt ?? new Date(0) } },
    order: [['appliedAt', 'DESC']],
    attributes: ['filename'],
    transaction,
  });
  return other?.filename ?? null;
}

export const staleMessage = (other: string) =>
  `The register changed since this preview ("${other}" was applied after it); upload the file again.`;

async function refuseMissingLines(importId: string, t: Transaction): Promise<void> {
  const missing = await firstRowWithMissingLine(importId, t);
  if (missing) throw new AppError(422, 'import_failed', `Nothing was written: line ${missing.lineNumber} (row ${missing.rowNumber}) is no longer in the register.`);
}

/** A new line that is in the register after all (added since the preview by something other than an import) refuses the whole apply. */
function explainDuplicate(err: unknown): never {
  const e = err as { parent?: { code?: string; constraint?: string; detail?: string } };
  if (e.parent?.code === '23505' && e.parent.constraint === 'lines_line_number_key') {
    const line = /=\((.*)\) already exists/.exec(e.parent.detail ?? '')?.[1] ?? 'a line of this file';
    throw new AppError(409, 'stale_preview', `Nothing was written: line ${line} is in the register now but was not when this file was previewed; upload the file again.`);
  }
  throw err;
}

/** The file's columns, read from the start of the stored file (the whole file only if its header is longer). */
async function storedColumns(importId: string, t: Transaction): Promise<AnyColumns> {
  const start = await importFileStart(importId, 64 * 1024, t);
  try {
    return readColumns(start.text);
  } catch (err) {
    if (start.whole) throw err;
    const whole = await LineImport.unscoped().findByPk(importId, { attributes: ['source'], transaction: t });
    return readColumns(whole?.source ?? '');
  }
}

/**
 * Writes the new and changed rows, the audit entry and the 'applied' status in the caller's
 * transaction. Returns false (writing nothing) when the import is no longer waiting to be applied;
 * throws ImportCancelled (the caller rolls back) when it is cancelled while this runs.
 */
export async function applyRows(importId: string, t: Transaction, progress: Progress): Promise<boolean> {
  await lockForTransaction(t, REGISTER_LOCK);
  const imp = await LineImport.findByPk(importId, { transaction: t });
  if (imp?.status !== 'applying') return false;
  const other = await appliedSince(imp, t);
  if (other) throw new AppError(409, 'stale_preview', staleMessage(other));

  const cols = await storedColumns(importId, t);
  if (cols.kind === 'isolation-points') await refuseMissingLines(imp.id, t);
  const has = cols.header as Record<string, string | undefined>;
  const stillApplying = () => assertStill(importId, 'applying', t);
  await writeImportRows(imp.id, cols.kind, { drawingRef: Boolean(has.drawingRef), notes: Boolean(has.notes) }, t, stillApplying, (f) => progress(99 * f))
    .catch(explainDuplicate);

  const { new: added, changed, unchanged, rejected } = imp.counts;
  await recordAudit(
    { actorId: imp.confirmedById, action: 'line-import-applied', entity: 'line-import', entityId: imp.id, after: { kind: imp.kind, filename: imp.filename, new: added, changed, unchanged, skipped: rejected } },
    t,
  );
  await progress.settled(); // before the row is locked by the move: a late report would wait for this commit
  // The database's clock, as previewed_at is: `applied_at > previewed_at` compares two readings of one clock.
  // Only if still 'applying': a cancel that got in first makes this throw, and nothing is written.
  await moveOn(importId, 'applying', { status: 'applied', progress: 100, error: null, appliedAt: await databaseNow(t) }, t);
  return true;
}
