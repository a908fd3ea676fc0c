// Applying a confirmed import: one transaction, set-based (server/db/queries/line-imports.ts).

import { Op, type Transaction } from 'sequelize';
import { REGISTER_LOCK, lockForTransaction } from '@server/db/locks';
import { LineImport } from '@server/db/models/line-import';
import { databaseNow, firstRowWithMissingLine, upsertImportRows } from '@server/db/queries/line-imports';
import { AppError } from '@server/errors';
import { recordAudit } from '@server/services/audit-service';
import type { ImportKind } from '@shared/schemas/line-imports';
import { readColumns } from './register-csv';
import type { Progress } from './progress';

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

/**
 * Writes the new and changed rows, the audit entry and the 'applied' status in the caller's
 * transaction. Returns false (writing nothing) when the import is no longer waiting to be applied.
 */
export async function applyRows(importId: string, t: Transaction, progress: Progress): Promise<boolean> {
  await lockForTransaction(t, REGISTER_LOCK);
  const imp = await LineImport.unscoped().findByPk(importId, { transaction: t });
  if (imp?.status !== 'applying') return false;
  const other = await appliedSince(imp, t);
  if (other) throw new AppError(409, 'stale_preview', staleMessage(other));

  const cols = readColumns(imp.source);
  if (cols.kind === 'isolation-points') await refuseMissingLines(imp.id, t);
  const has = cols.header as Record<string, string | undefined>;
  await upsertImportRows(imp.id, cols.kind, { drawingRef: Boolean(has.drawingRef), notes: Boolean(has.notes) }, t, (f) => progress(99 * f));

  const { new: added, changed, unchanged, rejected } = imp.counts;
  await recordAudit(
    { actorId: imp.confirmedById, action: 'line-import-applied', entity: 'line-import', entityId: imp.id, after: { kind: imp.kind, filename: imp.filename, new: added, changed, unchanged, skipped: rejected } },
    t,
  );
  // The database's clock, as previewed_at is: `applied_at > previewed_at` compares two readings of one clock.
  await imp.update({ status: 'applied', progress: 100, error: null, appliedAt: await databaseNow(t) }, { transaction: t });
  return true;
}
