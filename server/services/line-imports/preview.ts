// The preview of an uploaded file: every row new, changed, unchanged or rejected, written to
// line_import_rows inside the caller's transaction, CHUNK_ROWS rows at a time:
//
//   1. walk the next chunk of the file, keeping only where each row starts, its number and its key;
//   2. read what the register has for those keys (one query);
//   3. read the chunk's rows in full, check them, compare them with the register and turn them
//      into COPY lines — while PostgreSQL writes the previous chunk's lines (COPY) and looks up
//      the next chunk's keys.
//
// So a large file never sits in memory as rows (only its text, the keys seen so far, to refuse a
// second row with the same key, and one chunk's COPY lines), and Node's checking runs while
// PostgreSQL works. The register is read under the register lock taken shared, so `previewed_at`
// is exactly "the register as it stood at this moment"; before each chunk the preview checks that
// nobody cancelled the import.

import { setImmediate as yieldToIo } from 'node:timers/promises';
import type { Transaction } from 'sequelize';
import { CHUNK_ROWS, copyText } from '@server/db/copy';
import { REGISTER_LOCK, lockForTransaction } from '@server/db/locks';
import {
  copyPreviewLines, databaseNow, deletePreviewRows, knownLineNumbers, linesByNumber, pointsByTag, previewRowLine, type PreviewRowData,
  type RegisterLine,
} from '@server/db/queries/line-imports';
import type { ImportCounts, RowOutcome } from '@shared/schemas/line-imports';
import { rowReader, type RawRow, type RowChunk, type RowReader } from './data-rows';
import { estimateRows, readColumns, type Columns, type LineField, type PointField } from './register-csv';
import {
  lineRowChecker, checkPointRow, diffValues, lineDiffFields, pointDiffFields, type Changes, type Checked, type LineValues, type PointValues,
} from './register-rows';
import { assertStill, type Progress } from './progress';

type PreviewRow = PreviewRowData;
type Cells = RawRow<string>;

/** One kind of file: which cells a chunk's lookup needs, the lookup, and one row's preview given it. */
interface KindPreview {
  keyField: string;
  refField: string | null;
  /** Reads the register for a chunk; returns the function that previews each of its rows. */
  lookup(chunk: RowChunk, t: Transaction): Promise<(rowNumber: number, cells: Cells) => PreviewRow>;
}

/** The cells as the planner wrote them, for a rejected row (without the reader's own notes). */
function writtenCells(cells: Cells): Record<string, string> {
  const out: Record<string, string> = {};
  for (const [k, v] of Object.entries(cells)) if (!k.startsWith('__') && typeof v === 'string') out[k] = v;
  return out;
}

/** A row checker that also refuses the second and later rows with the same key in the file. */
function keyedChecker<V>(check: (cells: Cells) => Checked<V>, keyField: string, keyHeader: string, what: string): (rowNumber: number, cells: Cells) => Checked<V> {
  const firstSeen = new Map<string, number>();
  return (rowNumber, cells) => {
    const key = cells[keyField] || null;
    const checked = check(cells);
    const first = key === null ? undefined : firstSeen.get(key);
    if (first === undefined) {
      if (key !== null) firstSeen.set(key, rowNumber);
      return checked;
    }
    const dup = { column: keyHeader, message: `${what} ${key} is already on row ${first} of this file; each may appear only once.` };
    return { ok: false, problems: [dup, ...(checked.ok ? [] : checked.problems)] };
  };
}

function row(rowNumber: number, cells: Cells, keyField: string, outcome: RowOutcome, parts: Partial<Pick<PreviewRow, 'data' | 'line' | 'changes' | 'problems'>>): PreviewRow {
  return { rowNumber, outcome, key: cells[keyField] || null, data: parts.data ?? null, line: parts.line ?? null, changes: parts.changes ?? null, problems: parts.problems ?? null };
}

/**
 * A checked row against the register: rejected (with its cells as written), new, changed (with
 * the fields that change) or unchanged. An unchanged row keeps no values: the register already has
 * them, and nothing is written for it. A line's values go to the typed columns, a point's to `data`.
 */
function outcomeOf<V extends object>(
  rowNumber: number, cells: Cells, keyField: string, checked: Checked<V>, existing: V | undefined, fields: readonly (keyof V & string)[],
  place: (v: V) => Partial<Pick<PreviewRow, 'data' | 'line'>>,
): PreviewRow {
  if (!checked.ok) return row(rowNumber, cells, keyField, 'rejected', { data: writtenCells(cells), problems: checked.problems });
  if (!existing) return row(rowNumber, cells, keyField, 'new', place(checked.values));
  const changes: Changes = diffValues(existing, checked.values, fields);
  if (!Object.keys(changes).length) return row(rowNumber, cells, keyField, 'unchanged', {});
  return row(rowNumber, cells, keyField, 'changed', { ...place(checked.values), changes });
}

function linePreview(cols: Columns<LineField>): KindPreview {
  const fields = lineDiffFields(cols);
  const check = keyedChecker(lineRowChecker(cols) as (cells: Cells) => Checked<LineValues>, 'lineNumber', cols.header.lineNumber!, 'Line');
  const place = (v: LineValues) => ({ line: v as RegisterLine });
  return {
    keyField: 'lineNumber',
    refField: null,
    async lookup(chunk, t) {
      const existing = new Map<string, LineValues>();
      for (const l of await linesByNumber(chunk.keys.filter(Boolean), t)) existing.set(l.lineNumber, l as LineValues);
      return (rowNumber, cells) => {
        const checked = check(rowNumber, cells);
        return outcomeOf(rowNumber, cells, 'lineNumber', checked, checked.ok ? existing.get(checked.values.lineNumber) : undefined, fields, place);
      };
    },
  };
}

function pointPreview(cols: Columns<PointField>): KindPreview {
  const fields = pointDiffFields(cols);
  const check = keyedChecker((cells) => checkPointRow(cells as RawRow<PointField>, cols), 'tag', cols.header.tag!, 'Tag');
  const place = (v: PointValues) => ({ data: v as unknown as Record<string, unknown> });
  return {
    keyField: 'tag',
    refField: 'lineNumber',
    async lookup(chunk, t) {
      const known = await knownLineNumbers([...new Set(chunk.refs.filter(Boolean))], t);
      const existing = new Map((await pointsByTag(chunk.keys.filter(Boolean), t)).map((p) => [p.tag, p]));
      return (rowNumber, cells) => {
        let checked = check(rowNumber, cells);
        if (checked.ok && !known.has(checked.values.lineNumber)) {
          checked = { ok: false, problems: [{ column: cols.header.lineNumber!, message: `Line ${checked.values.lineNumber} is not in the register; import the lines first.` }] };
        }
        return outcomeOf(rowNumber, cells, 'tag', checked, checked.ok ? existing.get(checked.values.tag) : undefined, fields, place);
      };
    },
  };
}

/** A promise awaited later: its refusal must not count as unhandled meanwhile. */
function quiet<T>(promise: Promise<T>): Promise<T> {
  promise.catch(() => undefined);
  return promise;
}

/**
 * One chunk's rows read in full, checked, compared and turned into COPY text. A thousand rows'
 * lines are joined into one flat string at once, so what waits for the COPY is ten strings, not ten
 * thousand rows' worth of small objects for the garbage collector to move; between them, I/O (the
 * COPY and the lookup running meanwhile) gets its turn.
 */
async function previewLines(
  chunk: RowChunk, preview: (rowNumber: number, cells: Cells) => PreviewRow, reader: RowReader<string>, importId: string, counts: ImportCounts,
): Promise<string[]> {
  const parts: string[] = [];
  for (let from = 0; from < chunk.starts.length; from += 1000) {
    const lines: string[] = [];
    for (let i = from; i < Math.min(from + 1000, chunk.starts.length); i++) {
      const r = preview(chunk.rowNumbers[i]!, reader.at(chunk.starts[i]!, chunk.rowNumbers[i]!));
      counts[r.outcome]++;
      lines.push(previewRowLine(importId, r));
    }
    parts.push(`${lines.join('\n')}\n`);
    await yieldToIo();
  }
  return parts;
}

export interface PreviewResult {
  totalRows: number;
  counts: ImportCounts;
  previewedAt: Date;
}

/**
 * Writes import `importId`'s preview of `source` in `t` (replacing any earlier one); progress runs
 * from 0 to 99 %. Throws ImportCancelled when the import is cancelled part-way (`t` then rolls back).
 */
export async function writePreview(importId: string, source: string, t: Transaction, progress: Progress): Promise<PreviewResult> {
  const cols = readColumns(source);
  await lockForTransaction(t, REGISTER_LOCK, { shared: true });
  const previewedAt = await databaseNow(t);
  await deletePreviewRows(importId, t);
  const kind = cols.kind === 'lines' ? linePreview(cols as Columns<LineField>) : pointPreview(cols as Columns<PointField>);
  const reader = rowReader(source, cols as Columns<string>);
  const id = copyText(importId);
  const expected = Math.max(1, estimateRows(source));
  const counts: ImportCounts = { new: 0, changed: 0, unchanged: 0, rejected: 0 };
  const chunks = reader.chunks(kind.keyField, kind.refField, CHUNK_ROWS)[Symbol.iterator]();
  // Before each chunk: still previewing? Then what the register has for its keys.
  const lookUp = (chunk: RowChunk) => quiet(assertStill(importId, 'previewing', t).then(() => kind.lookup(chunk, t)));
  let chunk = chunks.next();
  let looking = chunk.done ? null : lookUp(chunk.value);
  let written: string[] = [];
  while (!chunk.done) {
    const preview = await looking!;
    const current = chunk.value;
    // The connection takes the previous chunk's COPY and then the next chunk's lookup (pg queues
    // them in turn) while Node checks this chunk.
    const copying = quiet(copyPreviewLines(written, t));
    chunk = chunks.next();
    looking = chunk.done ? null : lookUp(chunk.value);
    written = await previewLines(current, preview, reader, id, counts);
    await copying;
    await progress((99 * (counts.new + counts.changed + counts.unchanged + counts.rejected)) / expected);
  }
  await copyPreviewLines(written, t);
  const totalRows = counts.new + counts.changed + counts.unchanged + counts.rejected;
  return { totalRows, counts, previewedAt };
}
