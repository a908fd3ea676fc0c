// The preview of an uploaded file: every row new, changed, unchanged or rejected, written to
// line_import_rows set-based. The register is read in one query, under the register lock taken
// shared, so `previewed_at` is exactly "the register as it stood at this moment".

import type { Transaction } from 'sequelize';
import { sequelize } from '@server/db/sequelize';
import { REGISTER_LOCK, lockForTransaction } from '@server/db/locks';
import { databaseNow, knownLineNumbers, linesByNumber, pointsByTag, replacePreviewRows } from '@server/db/queries/line-imports';
import type { ImportCounts, RowOutcome } from '@shared/schemas/line-imports';
import { readColumns, readRows, type Columns, type LineField, type PointField, type RawRow } from './register-csv';
import {
  lineRowChecker, checkPointRow, diffValues, lineDiffFields, pointDiffFields,
  type Changes, type Checked, type PointValues, type Problem,
} from './register-rows';
import type { Progress } from './progress';

export interface PreviewRow {
  rowNumber: number;
  outcome: RowOutcome;
  key: string | null;
  data: Record<string, unknown> | null;
  changes: Changes | null;
  problems: Problem[] | null;
}

type Parsed<V> = { rowNumber: number; key: string | null; cells: Record<string, unknown>; checked: Checked<V> };

/** Checks rows and refuses the second and later occurrences of a key within the file. */
function checkAll<F extends string, V>(rows: { rowNumber: number; cells: RawRow<F> }[], check: (cells: RawRow<F>) => Checked<V>, keyField: F, keyHeader: string, what: string): Parsed<V>[] {
  const firstSeen = new Map<string, number>();
  return rows.map(({ rowNumber, cells }) => {
    const key = cells[keyField] || null;
    let checked = check(cells);
    const first = key === null ? undefined : firstSeen.get(key);
    if (first !== undefined) {
      const dup = { column: keyHeader, message: `${what} ${key} is already on row ${first} of this file; each may appear only once.` };
      checked = { ok: false, problems: [dup, ...(checked.ok ? [] : checked.problems)] };
    } else if (key !== null) firstSeen.set(key, rowNumber);
    return { rowNumber, key, cells, checked };
  });
}

function outcomeOf<V extends object>(p: Parsed<V>, existing: V | undefined, fields: readonly (keyof V & string)[], refuse?: (v: V) => Problem | null): PreviewRow {
  if (!p.checked.ok) return { rowNumber: p.rowNumber, outcome: 'rejected', key: p.key, data: p.cells, changes: null, problems: p.checked.problems };
  const values = p.checked.values;
  const refusal = refuse?.(values);
  if (refusal) return { rowNumber: p.rowNumber, outcome: 'rejected', key: p.key, data: p.cells, changes: null, problems: [refusal] };
  const data = values as Record<string, unknown>;
  if (!existing) return { rowNumber: p.rowNumber, outcome: 'new', key: p.key, data, changes: null, problems: null };
  const changes = diffValues(existing, values, fields);
  // An unchanged row keeps no data: the register already has it, and nothing is written for it.
  if (!Object.keys(changes).length) return { rowNumber: p.rowNumber, outcome: 'unchanged', key: p.key, data: null, changes: null, problems: null };
  return { rowNumber: p.rowNumber, outcome: 'changed', key: p.key, data, changes, problems: null };
}

async function previewLines(source: string, cols: Columns<LineField>, t: Transaction, progress: Progress): Promise<PreviewRow[]> {
  const parsed = checkAll(readRows(source, cols), lineRowChecker(cols), 'lineNumber', cols.header.lineNumber!, 'Line');
  await progress(30);
  const keys = parsed.flatMap((p) => (p.checked.ok ? [p.checked.values.lineNumber] : []));
  const found = await linesByNumber(keys, t);
  const existing = new Map(found.map((l) => [l.lineNumber, l]));
  const fields = lineDiffFields(cols);
  return parsed.map((p) => outcomeOf(p, p.checked.ok ? existing.get(p.checked.values.lineNumber) : undefined, fields));
}

async function previewPoints(source: string, cols: Columns<PointField>, t: Transaction, progress: Progress): Promise<PreviewRow[]> {
  const parsed = checkAll(readRows(source, cols), (c) => checkPointRow(c, cols), 'tag', cols.header.tag!, 'Tag');
  await progress(30);
  const ok = parsed.flatMap((p) => (p.checked.ok ? [p.checked.values] : []));
  const known = await knownLineNumbers([...new Set(ok.map((v) => v.lineNumber))], t);
  const found = await pointsByTag(ok.map((v) => v.tag), t);
  const existing = new Map(found.map((p) => [p.tag, p]));
  const unknownLine = (v: PointValues): Problem | null =>
    known.has(v.lineNumber) ? null : { column: cols.header.lineNumber!, message: `Line ${v.lineNumber} is not in the register; import the lines first.` };
  const fields = pointDiffFields(cols);
  return parsed.map((p) => outcomeOf(p, p.checked.ok ? existing.get(p.checked.values.tag) : undefined, fields, unknownLine));
}

/** Reads the file and the register (short transaction, shared register lock); returns the rows and the moment. */
export async function buildPreview(source: string, progress: Progress): Promise<{ rows: PreviewRow[]; previewedAt: Date }> {
  const cols = readColumns(source);
  return sequelize.transaction(async (t) => {
    await lockForTransaction(t, REGISTER_LOCK, { shared: true });
    const now = await databaseNow(t);
    const rows = cols.kind === 'lines'
      ? await previewLines(source, cols as Columns<LineField>, t, progress)
      : await previewPoints(source, cols as Columns<PointField>, t, progress);
    return { rows, previewedAt: now };
  });
}

export function countOutcomes(rows: readonly PreviewRow[]): ImportCounts {
  const counts: ImportCounts = { new: 0, changed: 0, unchanged: 0, rejected: 0 };
  for (const r of rows) counts[r.outcome]++;
  return counts;
}

/** Replaces the import's preview rows in `t`, by COPY; progress runs from 40 to 99 %. */
export async function writePreviewRows(importId: string, rows: readonly PreviewRow[], t: Transaction, progress: Progress): Promise<void> {
  await replacePreviewRows(importId, rows, t, (done, of) => progress(40 + Math.floor((59 * done) / of)));
}
