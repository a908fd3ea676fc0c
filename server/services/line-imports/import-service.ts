// The line-register import: upload → preview → confirm → apply. Small files are previewed and
// applied in the request; larger ones go through the worker, which calls the same functions.
// previewImport and applyImport may run twice for one job: each is a no-op once its step is done.

import { config } from '@server/config';
import { sequelize } from '@server/db/sequelize';
import { IMPORT_CONFIRM_LOCK, IMPORT_LOCK_SPACE, lockForTransaction, lockRecordForTransaction } from '@server/db/locks';
import { LineImport, LineImportRow } from '@server/db/models/line-import';
import { AppError } from '@server/errors';
import { logger } from '@server/logger';
import { enqueueImport } from '@server/queues/line-imports';
import { enqueueMail } from '@server/queues/mail';
import type { ImportRowsResponse, LineImportDto, RowOutcome } from '@shared/schemas/line-imports';
import type { Me } from '@shared/schemas/roles';
import { decodeCsv, estimateRows, hasDataRows, readColumns } from './register-csv';
import { buildPreview, countOutcomes, writePreviewRows } from './preview';
import { appliedSince, applyRows, staleMessage } from './apply';
import { describeFailure, progressWriter } from './progress';

/** `inline` forces the in-process path whatever the size (the demo loader and the bench use it). */
export interface RunOptions {
  inline?: boolean;
}

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
    createdAt: imp.createdAt.toISOString(),
    appliedAt: imp.appliedAt?.toISOString() ?? null,
  };
}

async function findImport(id: string): Promise<LineImport> {
  const imp = await LineImport.findByPk(id);
  if (!imp) throw AppError.notFound('There is no such import; it may have been uploaded on another system.');
  return imp;
}

export async function getImport(id: string): Promise<LineImportDto> {
  return toDto(await findImport(id));
}

/** Keeps the file's own name, without any folder part, as the planner will recognise it. */
const cleanFilename = (name: string) => (name.split(/[\\/]/).pop() ?? '').replace(/\p{Cc}/gu, '').slice(0, 200) || 'upload.csv';

/** Stores the file and previews it; the header is checked first, so a wrong file is refused whole (400). */
export async function uploadImport(me: Me, file: { filename: string; buffer: Buffer }, opts: RunOptions = {}): Promise<LineImportDto> {
  const text = decodeCsv(file.buffer);
  const cols = readColumns(text);
  if (!hasDataRows(text)) throw AppError.badRequest('The file has a header but no rows.', { file: ['The file has a header but no rows.'] });
  const imp = await LineImport.create({
    kind: cols.kind, filename: cleanFilename(file.filename), status: 'previewing', source: text,
    createdById: me.id, confirmedById: null, appliedAt: null, error: null,
  });
  if (opts.inline || estimateRows(text) <= config.importInlineLimit) {
    await previewImport(imp.id);
    return getImport(imp.id);
  }
  await enqueueImport({ importId: imp.id, step: 'preview' });
  return toDto(imp);
}

/** Builds the preview rows. A no-op unless the import is still 'previewing'. */
export async function previewImport(id: string): Promise<void> {
  const imp = await LineImport.unscoped().findByPk(id);
  if (!imp || imp.status !== 'previewing') return;
  const progress = progressWriter(id);
  try {
    const { rows, previewedAt } = await buildPreview(imp.source, progress);
    await progress(40);
    await sequelize.transaction(async (t) => {
      await lockRecordForTransaction(t, IMPORT_LOCK_SPACE, id);
      const now = await LineImport.findByPk(id, { transaction: t });
      if (now?.status !== 'previewing') return;
      await writePreviewRows(id, rows, t, progress);
      await now.update({ status: 'previewed', totalRows: rows.length, counts: countOutcomes(rows), progress: 100, previewedAt }, { transaction: t });
    });
  } catch (err) {
    logger.warn({ err, importId: id }, 'line import preview failed');
    await markFailed(id, describeFailure(err, 'preview'));
  }
}

async function markFailed(id: string, message: string): Promise<void> {
  await LineImport.update({ status: 'failed', error: message }, { where: { id } });
}

export async function listImportRows(id: string, query: { page: number; pageSize: number; outcome?: RowOutcome }): Promise<ImportRowsResponse> {
  await findImport(id);
  const { rows, count } = await LineImportRow.findAndCountAll({
    where: { importId: id, ...(query.outcome ? { outcome: query.outcome } : {}) },
    order: [['rowNumber', 'ASC']],
    offset: (query.page - 1) * query.pageSize,
    limit: query.pageSize,
  });
  return {
    rows: rows.map((r) => ({ rowNumber: r.rowNumber, outcome: r.outcome, key: r.key, data: r.data, changes: r.changes, problems: r.problems })),
    total: count,
  };
}

function refuseUnlessPreviewed(imp: LineImport): void {
  if (imp.status === 'previewing') throw AppError.conflict(`The preview is still being made (${imp.progress}%); confirm it when it is ready.`);
  if (imp.status === 'applying' || imp.status === 'applied') throw AppError.conflict('This import has already been confirmed.');
  if (imp.status === 'failed') throw AppError.conflict(`This import failed and cannot be confirmed: ${imp.error ?? 'no reason was kept'} Upload the file again.`);
}

/**
 * Confirms a preview: refused (409) twice over, while another import of the kind is being applied,
 * or once the register changed after the preview. Small imports are applied at once (applied),
 * large ones queued (applying); a failure writes nothing and answers 422 with the reason.
 */
export async function confirmImport(me: Me, id: string, opts: RunOptions = {}): Promise<LineImportDto> {
  const imp = await sequelize.transaction(async (t) => {
    await lockForTransaction(t, IMPORT_CONFIRM_LOCK);
    const found = await LineImport.findByPk(id, { transaction: t, lock: t.LOCK.UPDATE });
    if (!found) throw AppError.notFound('There is no such import; it may have been uploaded on another system.');
    refuseUnlessPreviewed(found);
    const busy = await LineImport.findOne({ where: { kind: found.kind, status: 'applying' }, transaction: t });
    if (busy) throw AppError.conflict(`Another import ("${busy.filename}") is being written to the register; when it has finished, upload this file again.`);
    const other = await appliedSince(found, t);
    if (other) throw new AppError(409, 'stale_preview', staleMessage(other));
    return found.update({ status: 'applying', confirmedById: me.id, progress: 0 }, { transaction: t });
  });
  if (!opts.inline && imp.totalRows > config.importInlineLimit) {
    await enqueueImport({ importId: id, step: 'apply' });
    return toDto(imp);
  }
  await applyImport(id);
  const done = await getImport(id);
  if (done.status === 'failed') throw new AppError(422, 'import_failed', done.error ?? 'The import failed; nothing was written.');
  return done;
}

/** Writes a confirmed import in one transaction. A no-op unless 'applying'. `notify` mails the confirmer. */
export async function applyImport(id: string, opts: { notify?: boolean } = {}): Promise<void> {
  const imp = await LineImport.findByPk(id, { attributes: ['status'] });
  if (imp?.status !== 'applying') return;
  let applied = false;
  try {
    applied = await sequelize.transaction((t) => applyRows(id, t, progressWriter(id)));
  } catch (err) {
    logger.warn({ err, importId: id }, 'line import apply failed');
    await markFailed(id, describeFailure(err, 'apply'));
    if (opts.notify) await mailConfirmer(id, 'failed');
    return;
  }
  if (applied && opts.notify) await mailConfirmer(id, 'applied');
}

/** Tells whoever confirmed the import how it ended; one mail per outcome however often it is asked for. */
export async function mailConfirmer(importId: string, outcome: 'applied' | 'failed'): Promise<void> {
  await enqueueMail({ purpose: outcome === 'applied' ? 'line-import-applied' : 'line-import-failed', recordId: importId });
}
