// Small pieces the preview and the apply share.

import { Readable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import type { PoolClient } from 'pg';
import { from as copyFrom } from 'pg-copy-streams';
import type { Transaction } from 'sequelize';
import { sequelize } from '@server/db/sequelize';

/**
 * Advisory lock over the whole register: an apply takes it exclusively, a preview's read of the
 * register takes it shared. So a preview sees either all of an import or none of it, and
 * `applied_at > previewed_at` means exactly "applied after this preview read the register".
 */
export const REGISTER_LOCK = 73_201_001;
/** Two-key advisory lock space for one import (with hashtext(id)): two runs of one job never interleave. */
export const IMPORT_LOCK_SPACE = 7_321;
/** Rows per statement: big enough to be set-based, small enough to keep bind arrays modest. */
export const CHUNK_ROWS = 10_000;

export type Progress = (percent: number) => Promise<void>;

export function chunks<T>(items: readonly T[], size: number): T[][] {
  const out: T[][] = [];
  for (let i = 0; i < items.length; i += size) out.push(items.slice(i, i + size));
  return out;
}

/** One value for COPY's text format: `\\N` for null; backslash, tab, newline and CR escaped. */
export function copyText(v: string | null | undefined): string {
  if (v === null || v === undefined) return '\\N';
  return /[\\\t\n\r]/.test(v) ? v.replace(/[\\\t\n\r]/g, (c) => COPY_ESCAPES[c]!) : v;
}
const COPY_ESCAPES: Record<string, string> = { '\\': '\\\\', '\t': '\\t', '\n': '\\n', '\r': '\\r' };

/**
 * Streams `COPY … from stdin` (text format) on the transaction's own connection, so it is part of
 * that transaction. `chunks` yields ready lines (each ending in a newline), a batch at a time; the
 * stream's back-pressure is respected, and a refusal by the server rejects (the caller rolls back).
 */
export async function copyIn(t: Transaction, sql: string, chunks: AsyncIterable<string> | Iterable<string>): Promise<void> {
  const client = (t as unknown as { connection: PoolClient }).connection;
  await pipeline(Readable.from(chunks, { objectMode: false }), client.query(copyFrom(sql)));
}

/**
 * Writes line_imports.progress on its own pooled connection, outside any transaction, so a
 * poller sees it while the import's transaction is still open. Only rises; skips repeats.
 */
export function progressWriter(importId: string): Progress {
  let last = -1;
  return async (percent) => {
    const v = Math.max(0, Math.min(100, Math.floor(percent)));
    if (v <= last) return;
    last = v;
    await sequelize.query('update line_imports set progress = $2 where id = $1', { bind: [importId, v] });
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
