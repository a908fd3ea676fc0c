// How an import in progress tells the planner where it is, and how a failure is worded.

import { LineImport } from '@server/db/models/line-import';

export type Progress = (percent: number) => Promise<void>;

/**
 * Writes line_imports.progress on its own pooled connection, outside any transaction, so a
 * poller sees it while the import's transaction is still open. Only rises; skips repeats; leaves
 * updated_at alone (the sweep reads that as "last moved on").
 */
export function progressWriter(importId: string): Progress {
  let last = -1;
  return async (percent) => {
    const v = Math.max(0, Math.min(100, Math.floor(percent)));
    if (v <= last) return;
    last = v;
    await LineImport.update({ progress: v }, { where: { id: importId }, silent: true });
  };
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
