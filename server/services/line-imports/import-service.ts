// The line-register import: upload → preview → confirm → apply. Small files are previewed and
// applied in the request; larger ones go through the worker, which calls the same functions.
// previewImport and applyImport may run twice for one job: each is a no-op once its step is done.
// A cancel (cancel.ts) may come at any moment before the apply commits: both steps then write nothing.

import { config } from '@server/config';
import { sequelize } from '@server/db/sequelize';
import { IMPORT_CONFIRM_LOCK, IMPORT_LOCK_SPACE, lockForTransaction, lockRecordForTransaction } from '@server/db/locks';
import { LineImport } from '@server/db/models/line-import';
import { AppError } from '@server/errors';
import { logger } from '@server/logger';
import { enqueueImport } from '@server/queues/line-imports';
import { enqueueMail } from '@server/queues/mail';
import type { ImportCounts, LineImportDto } from '@shared/schemas/line-imports';
import type { Me } from '@shared/schemas/roles';
import { decodeCsv } from './csv-text';
import { estimateRows, hasDataRows, readColumns } from './register-csv';
import { writePreview } from './preview';
import { appliedSince, applyRows, staleMessage } from './apply';
import { describeFailure, ImportCancelled, moveOn, progressWriter } from './progress';
import { getImport, NO_SUCH_IMPORT } from './import-dto';

export { getImport, listImportRows, listImports } from './import-dto';

/** `inline` forces the in-process path whatever the size (the demo loader and the bench use it). */
export interface RunOptions {
  inline?: boolean;
}

/** Keeps the file's own name, without any folder part, as the planner will recognise it. */
const cleanFilename = (name: string) => (name.split(/[\\/]/).pop() ?? '').replace(/\p{Cc}/gu, '').slice(0, 200) || 'upload.csv';

/**
 * Stores the file and previews it; the header is checked first, so a wrong file is refused whole
 * (400). Whether it is previewed here or in the worker follows from the rows the file can hold at
 * most (its lines with something in them, whatever their line endings), never from a guess that
 * could let a large file run inside the request.
 */
export async function uploadImport(me: Me, file: { filename: string; buffer: Buffer }, opts: RunOptions = {}): Promise<LineImportDto> {
  const text = decodeCsv(file.buffer);
  const cols = readColumns(text);
  if (!hasDataRows(text, cols)) throw AppError.badRequest('The file has a header but no rows.', { file: ['The file has a header but no rows.'] });
  const imp = await LineImport.create({
    kind: cols.kind, filename: cleanFilename(file.filename), status: 'previewing', source: text,
    createdById: me.id, confirmedById: null, appliedAt: null, error: null,
  }, { returning: ['id'] }); // not the file back again
  if (opts.inline || estimateRows(text) <= config.importInlineLimit) await previewImport(imp.id, text);
  else await enqueueImport({ importId: imp.id, step: 'preview' });
  return getImport(imp.id);
}

/** Builds the preview rows in one transaction. A no-op unless the import is still 'previewing'. */
export async function previewImport(id: string, source?: string): Promise<void> {
  const imp = await LineImport.findByPk(id, { attributes: ['status'] });
  if (imp?.status !== 'previewing') return;
  const progress = progressWriter(id);
  try {
    await sequelize.transaction(async (t) => {
      await lockRecordForTransaction(t, IMPORT_LOCK_SPACE, id);
      const now = await LineImport.unscoped().findByPk(id, { transaction: t, attributes: source === undefined ? undefined : { exclude: ['source'] } });
      if (now?.status !== 'previewing') return;
      const { totalRows, counts, previewedAt } = await writePreview(id, source ?? now.source, t, progress);
      await progress.settled(); // before the row is locked by the move: a late report would wait for this commit
      await moveOn(id, 'previewing', { status: 'previewed', totalRows, counts, progress: 100, previewedAt }, t);
    });
  } catch (err) {
    if (err instanceof ImportCancelled) return;
    logger.warn({ err, importId: id }, 'line import preview failed');
    await markFailed(id, 'previewing', describeFailure(err, 'preview'));
  }
}

/** Marks an import failed, unless it has meanwhile moved on (a cancel, say); true when it did. */
async function markFailed(id: string, from: 'previewing' | 'applying', message: string): Promise<boolean> {
  const [changed] = await LineImport.update({ status: 'failed', error: message }, { where: { id, status: from } });
  return changed > 0;
}

function refuseUnlessPreviewed(imp: LineImport): void {
  if (imp.status === 'previewing') throw AppError.conflict(`The preview is still being made (${imp.progress}%); confirm it when it is ready.`);
  if (imp.status === 'applying' || imp.status === 'applied') throw AppError.conflict('This import has already been confirmed.');
  if (imp.status === 'failed') throw AppError.conflict(`This import failed and cannot be confirmed: ${imp.error ?? 'no reason was kept'} Upload the file again.`);
  if (imp.status === 'cancelled') throw AppError.conflict('This import was cancelled, so it cannot be confirmed; upload the file again to import it.');
}

/** Why an import with no new and no changed row cannot be confirmed, in one sentence. */
export function nothingToWriteMessage(counts: ImportCounts): string {
  const { rejected, unchanged } = counts;
  const n = rejected + unchanged;
  const why = !unchanged
    ? n === 1 ? "the file's only row is rejected" : `all ${n} rows of the file are rejected`
    : !rejected
      ? n === 1 ? "the file's only row already matches the register" : `all ${n} rows of the file already match the register`
      : `of the file's ${n} rows, ${rejected} ${rejected === 1 ? 'is' : 'are'} rejected and ${unchanged} already ${unchanged === 1 ? 'matches' : 'match'} the register`;
  return `There is nothing to write: ${why}. The register is left as it is; correct the file and upload it again if something should change.`;
}

/**
 * Confirms a preview: refused (409) twice over, with nothing to write, while another import of the
 * kind is being applied, or once the register changed after the preview. Small imports are applied
 * at once (applied), large ones queued (applying); a failure writes nothing and answers 422.
 */
export async function confirmImport(me: Me, id: string, opts: RunOptions = {}): Promise<LineImportDto> {
  const imp = await sequelize.transaction(async (t) => {
    await lockForTransaction(t, IMPORT_CONFIRM_LOCK);
    const found = await LineImport.findByPk(id, { transaction: t, lock: t.LOCK.UPDATE });
    if (!found) throw AppError.notFound(NO_SUCH_IMPORT);
    refuseUnlessPreviewed(found);
    if (found.counts.new + found.counts.changed === 0) throw new AppError(409, 'nothing_to_write', nothingToWriteMessage(found.counts));
    const busy = await LineImport.findOne({ where: { kind: found.kind, status: 'applying' }, transaction: t });
    if (busy) throw AppError.conflict(`Another import ("${busy.filename}") is being written to the register; when it has finished, upload this file again.`);
    const other = await appliedSince(found, t);
    if (other) throw new AppError(409, 'stale_preview', staleMessage(other));
    return found.update({ status: 'applying', confirmedById: me.id, progress: 0 }, { transaction: t });
  });
  if (!opts.inline && imp.totalRows > config.importInlineLimit) {
    await enqueueImport({ importId: id, step: 'apply' });
    return getImport(id);
  }
  await applyImport(id);
  const done = await getImport(id);
  if (done.status === 'failed') throw new AppError(422, 'import_failed', done.error ?? 'The import failed; nothing was written.');
  if (done.status === 'cancelled') throw AppError.conflict('This import was cancelled while it was being written; nothing was written.');
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
    if (err instanceof ImportCancelled) return; // the planner cancelled it: nothing written, nothing to tell
    logger.warn({ err, importId: id }, 'line import apply failed');
    const failed = await markFailed(id, 'applying', describeFailure(err, 'apply'));
    if (failed && opts.notify) await mailConfirmer(id, 'failed');
    return;
  }
  if (applied && opts.notify) await mailConfirmer(id, 'applied');
}

/** Tells whoever confirmed the import how it ended; one mail per outcome however often it is asked for. */
export async function mailConfirmer(importId: string, outcome: 'applied' | 'failed'): Promise<void> {
  await enqueueMail({ purpose: outcome === 'applied' ? 'line-import-applied' : 'line-import-failed', recordId: importId });
}
