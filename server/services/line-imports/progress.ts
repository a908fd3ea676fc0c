// How an import in progress tells the planner where it is, notices that it was cancelled, and how
// a failure is worded.

import { Op, type Transaction } from 'sequelize';
import { sequelize } from '@server/db/sequelize';
import { LineImport } from '@server/db/models/line-import';
import { logger } from '@server/logger';
import { importStatus } from '@server/db/queries/line-imports';
import type { ImportStatus } from '@shared/schemas/line-imports';

/** Reports how far an import is (0–100); `settled()` waits until every report is written. */
export type Progress = ((percent: number) => Promise<void>) & { settled(): Promise<void> };

/**
 * Writes line_imports.progress on its own pooled connection, outside any transaction, so a
 * poller sees it while the import's transaction is still open. Only rises; skips repeats; leaves
 * updated_at alone (the sweep reads that as "last moved on"). The writes go on in the background,
 * one after another, without waiting for the disk (synchronous_commit off: a progress figure lost
 * in a crash is harmless), so the import never waits for them; `settled()` waits for the last one.
 */
export function progressWriter(importId: string): Progress {
  let last = -1;
  let writing = Promise.resolve();
  const write = (v: number) =>
    sequelize.transaction(async (t) => {
      await sequelize.query('set local synchronous_commit = off', { transaction: t });
      await LineImport.update({ progress: v }, { where: { id: importId, progress: { [Op.lt]: v } }, silent: true, transaction: t });
    });
  const progress = async (percent: number) => {
    const v = Math.max(0, Math.min(100, Math.floor(percent)));
    if (v <= last) return;
    last = v;
    writing = writing.then(() => write(v)).catch((err) => logger.warn({ err, importId }, 'could not write an import\'s progress'));
  };
  return Object.assign(progress, { settled: () => writing });
}

/** A planner-readable sentence for a failure; never a stack trace. */
export function describeFailure(err: unknown, step: 'preview' | 'apply'): string {
  const e = err as { status?: number; message?: string; parent?: { message?: string; code?: string }; original?: { message?: string } };
  if (typeof e?.status === 'number' && e.message) return e.message;
  const said = e?.parent?.message ?? e?.original?.message ?? e?.message ?? 'an unknown error';
  return step === 'apply'
    ? `Nothing was written: the database refused the import (${said}). The register is as it was before; if this happens again, ask an administrator.`
    : `The preview could not be made (${said}). Upload the file again; if this happens again, ask an administrator.`;
}

/** Thrown inside a preview's or an apply's transaction when the import was cancelled meanwhile: it rolls back, writing nothing. */
export class ImportCancelled extends Error {
  constructor(readonly importId: string) {
    super(`line import ${importId} was cancelled while it ran`);
  }
}

/** Between chunks: goes on only while the import is still `status` (a cancel commits at once, outside `t`). */
export async function assertStill(importId: string, status: ImportStatus, t: Transaction): Promise<void> {
  if ((await importStatus(importId, t)) !== status) throw new ImportCancelled(importId);
}

/** Moves an import on from `from` in `t`, only if it is still `from`; otherwise it was cancelled, and `t` must roll back. */
export async function moveOn(importId: string, from: ImportStatus, values: Partial<LineImport>, t: Transaction): Promise<void> {
  const [changed] = await LineImport.update(values, { where: { id: importId, status: from }, transaction: t });
  if (changed === 0) throw new ImportCancelled(importId);
}
