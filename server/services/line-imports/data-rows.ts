// The data rows of a register file, after its header (register-csv.ts reads the header). Pure: no
// database, no clock. A row's cells are keyed by field, trimmed, and carry what reading found wrong
// with the row's shape; row numbers are the spreadsheet's (csv-text.ts), blank rows are skipped.
// A large file is walked a chunk at a time as positions (where each row starts, its number and
// its key), so that a chunk's rows are read in full only when they are checked and written.

import { isBlank, readRecord, scanRecord, type CsvRecord, type QuoteProblem } from './csv-text';
import type { Columns } from './register-csv';

/** A row's cells by field, plus what the reading found wrong with its shape. */
export type RawRow<F extends string> = Partial<Record<F, string>> & {
  /** Cells beyond the header's columns that hold something. */
  __extra?: number;
  /** Values in columns without a name. */
  __unnamed?: string[];
  /** A quote that was not closed where it should be, and the column it is in (as the file heads it). */
  __quote?: { column: string; kind: QuoteProblem['kind'] };
  /** Fields whose cell holds U+FFFD, a character the decoding could not read. */
  __unreadable?: F[];
};

/**
 * The one apostrophe the register's export puts before a cell that a spreadsheet would run as a
 * formula (line-register-export.ts, FORMULA_LEAD) comes off again, and what follows is kept
 * exactly; any other cell is trimmed. (A spreadsheet saves a typed '=x as =x, so an apostrophe
 * before one of these characters in a CSV file is the export's.)
 */
export function cellValue(raw: string): string {
  return raw.charCodeAt(0) === 39 && /^'[=+\-@\t\r\n]/.test(raw) ? raw.slice(1) : raw.trim();
}

const UNREADABLE = '\uFFFD';

function toRawRow<F extends string>(record: CsvRecord, cols: Columns<F>, mayBeUnreadable: boolean): RawRow<F> {
  const row: RawRow<F> = {};
  const { cells, quote } = record;
  const width = cols.byIndex.length;
  for (let i = 0; i < cells.length; i++) {
    const v = cellValue(cells[i]!);
    const field = i < width ? cols.byIndex[i] : undefined;
    if (field) {
      row[field] = v as RawRow<F>[F];
      if (mayBeUnreadable && v.includes(UNREADABLE)) (row.__unreadable ??= []).push(field);
    } else if (v === '') continue;
    else if (i < width) (row.__unnamed ??= []).push(v);
    else row.__extra = (row.__extra ?? 0) + 1;
  }
  if (quote) {
    const field = cols.byIndex[quote.cell];
    row.__quote = { column: (field && cols.header[field]) || '(row)', kind: quote.kind };
  }
  return row;
}

/** Rows of a chunk as positions in the text, with the cells a lookup needs read already. */
export interface RowChunk {
  rowNumbers: number[];
  starts: number[];
  /** The key cell (line number, tag) of each row, '' when empty. */
  keys: string[];
  /** Another cell each row refers by (an isolation point's line number), when asked for. */
  refs: string[];
}

export interface RowReader<F extends string> {
  /** The data rows, blank ones skipped, `size` at a time, as positions. */
  chunks(keyField: F, refField: F | null, size: number): Generator<RowChunk>;
  /** The row that starts at `start` (from a chunk), in full. */
  at(start: number, rowNumber: number): RawRow<F>;
}

export function rowReader<F extends string>(text: string, cols: Columns<F>): RowReader<F> {
  const mayBeUnreadable = text.includes(UNREADABLE);
  const cell = (record: CsvRecord, index: number) => (index < 0 ? '' : (record.cells[index] ?? ''));
  return {
    *chunks(keyField, refField, size) {
      const keyIndex = cols.byIndex.indexOf(keyField);
      const refIndex = refField === null ? -1 : cols.byIndex.indexOf(refField);
      let chunk: RowChunk = { rowNumbers: [], starts: [], keys: [], refs: [] };
      for (let pos = cols.dataStart, row = cols.headerRow + 1; pos < text.length; row++) {
        // Most rows have no quoted cell: walk those without building their cells.
        const quick = scanRecord(text, pos, keyIndex, refIndex);
        const record = quick ? null : readRecord(text, pos, row);
        const next = quick ? quick.next : record!.next;
        if (quick ? !quick.blank : !isBlank(record!.cells)) {
          chunk.rowNumbers.push(row);
          chunk.starts.push(pos);
          chunk.keys.push(cellValue(quick ? quick.a : cell(record!, keyIndex)));
          if (refField !== null) chunk.refs.push(cellValue(quick ? quick.b : cell(record!, refIndex)));
          if (chunk.starts.length === size) {
            yield chunk;
            chunk = { rowNumbers: [], starts: [], keys: [], refs: [] };
          }
        }
        pos = next;
      }
      if (chunk.starts.length) yield chunk;
    },
    at: (start, rowNumber) => toRawRow(readRecord(text, start, rowNumber), cols, mayBeUnreadable),
  };
}

/** Every data row after the header, keyed by field; blank rows are skipped. (For tests and small files.) */
export function* readRows<F extends string>(text: string, cols: Columns<F>): Generator<{ rowNumber: number; cells: RawRow<F> }> {
  const mayBeUnreadable = text.includes(UNREADABLE);
  for (let pos = cols.dataStart, row = cols.headerRow + 1; pos < text.length; row++) {
    const record = readRecord(text, pos, row);
    pos = record.next;
    if (!isBlank(record.cells)) yield { rowNumber: row, cells: toRawRow(record, cols, mayBeUnreadable) };
  }
}
