// Streaming rows into PostgreSQL with COPY, inside a Sequelize transaction.

import { Readable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import type { PoolClient } from 'pg';
import { from as copyFrom } from 'pg-copy-streams';
import type { Transaction } from 'sequelize';

/** Rows per statement or batch: big enough to be set-based, small enough to keep bind arrays modest. */
export const CHUNK_ROWS = 10_000;

export function chunks<T>(items: readonly T[], size: number): T[][] {
  const out: T[][] = [];
  for (let i = 0; i < items.length; i += size) out.push(items.slice(i, i + size));
  return out;
}

const COPY_ESCAPES: Record<string, string> = { '\\': '\\\\', '\t': '\\t', '\n': '\\n', '\r': '\\r' };

/** One value for COPY's text format: `\N` for null; backslash, tab, newline and CR escaped. */
export function copyText(v: string | null | undefined): string {
  if (v === null || v === undefined) return '\\N';
  return /[\\\t\n\r]/.test(v) ? v.replace(/[\\\t\n\r]/g, (c) => COPY_ESCAPES[c]!) : v;
}

/**
 * Streams `COPY … from stdin` (text format) on the transaction's own connection, so it is part of
 * that transaction. `lines` yields ready lines (each ending in a newline), a batch at a time; the
 * stream's back-pressure is respected, and a refusal by the server rejects (the caller rolls back).
 */
export async function copyIn(t: Transaction, sql: string, lines: AsyncIterable<string> | Iterable<string>): Promise<void> {
  const client = (t as unknown as { connection: PoolClient }).connection;
  await pipeline(Readable.from(lines, { objectMode: false }), client.query(copyFrom(sql)));
}
