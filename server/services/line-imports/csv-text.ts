// The text of an uploaded CSV file, read as a spreadsheet reads it. Pure: no database, no clock.
//
// - Encoding: UTF-8 (a byte-order mark is dropped), else Windows-1252 (a spreadsheet's plain "CSV"
//   save), decoded by iconv-lite: Node's TextDecoder('windows-1252') gives C1 controls for
//   0x80–0x9F. The five bytes Windows-1252 leaves undefined (0x81 0x8D 0x8F 0x90 0x9D) become
//   U+FFFD, and the row checks reject a cell holding one (register-rows.ts).
// - Line endings: CRLF, LF and a lone CR (old spreadsheet exports) each end a row, mixed in one
//   file as they come; inside a quoted cell they are kept as they are.
// - Rows are counted as a spreadsheet numbers them: one per record (a quoted cell's line breaks
//   do not start a row), blank lines included, the first line being row 1.
// - Quotes: a cell that starts with a quote runs to the matching quote. When that quote is never
//   closed, or closes on a later line with more text after it (a stray quote that would swallow
//   the rows below), the quote is taken as a plain character, the record ends with its own line,
//   and the record carries a `quote` problem; reading goes on with the next line. Text after a
//   closing quote on the same line joins the cell (as spreadsheets read it) and is flagged too.

import { isUtf8 } from 'node:buffer';
import iconv from 'iconv-lite';
import { AppError } from '@server/errors';

/** Decodes an upload: UTF-8 (BOM dropped), or Windows-1252 when the bytes are not UTF-8. */
export function decodeCsv(buffer: Buffer): string {
  if (buffer.includes(0)) throw AppError.badRequest('This file is not a text CSV file (it holds binary data). Save it from the spreadsheet as "CSV".');
  const text = isUtf8(buffer) ? buffer.toString('utf8') : iconv.decode(buffer, 'windows-1252');
  return text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
}

export interface QuoteProblem {
  /** The cell (0-based) whose quote is wrong. */
  cell: number;
  /** `unclosed`: never closed on its row; `text-after`: more text follows the closing quote. */
  kind: 'unclosed' | 'text-after';
}

export interface CsvRecord {
  /** The spreadsheet's row number. */
  row: number;
  /** The cells exactly as written (quotes removed, nothing trimmed). */
  cells: string[];
  quote: QuoteProblem | null;
  /** Where the record starts in the text, and where the next one does. */
  start: number;
  next: number;
}

const COMMA = 44;
const LF = 10;
const CR = 13;
const QUOTE = 34;

/** The index of the first CR or LF at or after `from`, or the text's length. */
function lineEnd(text: string, from: number): number {
  for (let i = from; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (c === LF || c === CR) return i;
  }
  return text.length;
}

/** The index of the first comma, CR or LF at or after `from`, or the text's length. */
function cellEnd(text: string, from: number): number {
  for (let i = from; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (c === COMMA || c === LF || c === CR) return i;
  }
  return text.length;
}

/** Where the next record starts, given the index of the line break (or end) that ends this one. */
function afterBreak(text: string, at: number): number {
  if (at >= text.length) return text.length;
  return text.charCodeAt(at) === CR && text.charCodeAt(at + 1) === LF ? at + 2 : at + 1;
}

/** A quoted cell from its opening quote: its value and the index after the closing quote; null when never closed. */
function quoted(text: string, open: number): { value: string; end: number } | null {
  let value = '';
  let from = open + 1;
  for (;;) {
    const q = text.indexOf('"', from);
    if (q === -1) return null;
    if (text.charCodeAt(q + 1) === QUOTE) {
      value += text.slice(from, q + 1);
      from = q + 2;
      continue;
    }
    return { value: value + text.slice(from, q), end: q + 1 };
  }
}

const endsCell = (text: string, at: number) => {
  const c = text.charCodeAt(at);
  return at >= text.length || c === COMMA || c === LF || c === CR;
};

/** Reads the record that starts at `start`. */
export function readRecord(text: string, start: number, row: number): CsvRecord {
  const cells: string[] = [];
  let quote: QuoteProblem | null = null;
  let pos = start;
  for (;;) {
    if (text.charCodeAt(pos) === QUOTE) {
      const q = quoted(text, pos);
      const eol = lineEnd(text, pos);
      if (q === null || (q.end > eol && !endsCell(text, q.end))) {
        // A stray quote: read the rest of its own line with the quote as a plain character.
        quote ??= { cell: cells.length, kind: 'unclosed' };
        cells.push(...text.slice(pos, eol).split(','));
        return { row, cells, quote, start, next: afterBreak(text, eol) };
      }
      if (endsCell(text, q.end)) {
        cells.push(q.value);
        pos = q.end;
      } else {
        quote ??= { cell: cells.length, kind: 'text-after' };
        const end = cellEnd(text, q.end);
        cells.push(q.value + text.slice(q.end, end));
        pos = end;
      }
    } else {
      const end = cellEnd(text, pos);
      cells.push(text.slice(pos, end));
      pos = end;
    }
    if (pos < text.length && text.charCodeAt(pos) === COMMA) {
      pos++;
      continue;
    }
    return { row, cells, quote, start, next: afterBreak(text, pos) };
  }
}

/** What a quick walk over a record found: where the next one starts, whether it is blank, and two of its cells as written. */
export interface RecordScan {
  next: number;
  blank: boolean;
  a: string;
  b: string;
}

/**
 * readRecord's fast path for walking a large file: for a record with no cell that starts with a
 * quote (the usual register row), where it ends, whether it is blank, and cells `a` and `b` (0-based;
 * -1 for none), without building the other cells. Null for a record with a quoted cell: read that
 * one with readRecord.
 */
export function scanRecord(text: string, start: number, a: number, b: number): RecordScan | null {
  const scan: RecordScan = { next: text.length, blank: true, a: '', b: '' };
  for (let pos = start, i = 0; ; i++) {
    if (text.charCodeAt(pos) === QUOTE) return null;
    const end = cellEnd(text, pos);
    if (i === a) scan.a = text.slice(pos, end);
    if (i === b) scan.b = text.slice(pos, end);
    if (scan.blank && end > pos) {
      const c = text.charCodeAt(pos); // a printable ASCII character settles it; anything else, trim decides as isBlank does
      scan.blank = !(c > 32 && c < 127) && text.slice(pos, end).trim() === '';
    }
    if (end < text.length && text.charCodeAt(end) === COMMA) {
      pos = end + 1;
      continue;
    }
    scan.next = afterBreak(text, end);
    return scan;
  }
}

/** Every record from `start` (row `row`) to the end of the text, blank ones included. */
export function* csvRecords(text: string, start = 0, row = 1): Generator<CsvRecord> {
  for (let pos = start; pos < text.length; row++) {
    const record = readRecord(text, pos, row);
    yield record;
    pos = record.next;
  }
}

/** A record with nothing in it: a blank line, or only commas and spaces (a spreadsheet's empty row). */
export function isBlank(cells: readonly string[]): boolean {
  for (const c of cells) if (c.length && c.trim() !== '') return false;
  return true;
}

const FILLED = /[^,\s]/g;

/**
 * The lines that have something other than commas and spaces in them: at least as many as the
 * file's non-blank rows (a quoted cell's line breaks only add lines), and cheap to count (a regular
 * expression finds the next filled line, indexOf the end of it).
 */
export function countFilledLines(text: string): number {
  let count = 0;
  let nextLf = -2;
  let nextCr = -2;
  for (let pos = 0; ; ) {
    FILLED.lastIndex = pos;
    const m = FILLED.exec(text);
    if (!m) return count;
    count++;
    if (nextLf !== -1 && nextLf < m.index) nextLf = text.indexOf('\n', m.index);
    if (nextCr !== -1 && nextCr < m.index) nextCr = text.indexOf('\r', m.index);
    const end = nextLf === -1 ? nextCr : nextCr === -1 ? nextLf : Math.min(nextLf, nextCr);
    if (end === -1) return count;
    pos = end + 1;
  }
}
