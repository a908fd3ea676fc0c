import { describe, expect, it } from 'vitest';
import { countFilledLines, csvRecords, decodeCsv } from './csv-text';
import { readRows, rowReader } from './data-rows';
import { estimateRows, hasDataRows, readColumns, type Columns, type LineField } from './register-csv';

const HEADER = 'line_number,area,service,material,schedule,nominal_size,design_pressure_psi,design_temperature_f,drawing,notes';
const row = (n: string, notes = '') => `${n},A,S,PVC,80,2,100,70,D,${notes}`;
const rowsOf = (text: string) => {
  const cols = readColumns(text) as Columns<LineField>;
  return [...readRows(text, cols)].map((r) => ({ row: r.rowNumber, line: r.cells.lineNumber, notes: r.cells.notes, quote: r.cells.__quote }));
};

describe('a Windows-1252 file (a spreadsheet\'s plain "CSV" save)', () => {
  // Each byte 0x80–0x9F that Windows-1252 defines, and the character it stands for (WHATWG encoding table).
  const DEFINED: [number, string][] = [
    [0x80, '€'], [0x82, '‚'], [0x83, 'ƒ'], [0x84, '„'], [0x85, '…'], [0x86, '†'], [0x87, '‡'], [0x88, 'ˆ'], [0x89, '‰'],
    [0x8a, 'Š'], [0x8b, '‹'], [0x8c, 'Œ'], [0x8e, 'Ž'], [0x91, '‘'], [0x92, '’'], [0x93, '“'], [0x94, '”'], [0x95, '•'],
    [0x96, '–'], [0x97, '—'], [0x98, '˜'], [0x99, '™'], [0x9a, 'š'], [0x9b, '›'], [0x9c, 'œ'], [0x9e, 'ž'], [0x9f, 'Ÿ'],
  ];
  const UNDEFINED = [0x81, 0x8d, 0x8f, 0x90, 0x9d];

  const hex = (b: number) => b.toString(16).toUpperCase();
  it.each(DEFINED.map(([b, c]) => [hex(b), c, b] as const))('byte 0x%s reads as %s, not as a C1 control', (_hex, char, byte) => {
    // ½ (0xBD) makes the file Windows-1252 whatever the byte under test is.
    expect(decodeCsv(Buffer.from([0x61, byte, 0x62, 0xbd]))).toBe(`a${char}b½`);
  });

  it('covers all 27 defined bytes and leaves no C1 control anywhere in 0x80–0xFF', () => {
    expect(DEFINED.length + UNDEFINED.length).toBe(32);
    const every = decodeCsv(Buffer.from(Array.from({ length: 128 }, (_, i) => 0x80 + i)));
    expect(every).not.toMatch(/[\u0080-\u009f]/);
  });

  it.each(UNDEFINED.map((b) => [hex(b), b] as const))('the undefined byte 0x%s reads as U+FFFD (and the row holding it is rejected: register-csv.test.ts)', (_hex, byte) => {
    expect(decodeCsv(Buffer.from([0x61, byte, 0x62]))).toBe('a\uFFFDb');
  });

  it('a UTF-8 file is read as UTF-8, with or without a byte-order mark', () => {
    expect(decodeCsv(Buffer.from('\uFEFF“½” – 10 €\n', 'utf8'))).toBe('“½” – 10 €\n');
    expect(decodeCsv(Buffer.from('“½”', 'utf8'))).toBe('“½”');
  });
});

describe('line endings, as a spreadsheet reads them', () => {
  it('a CRLF header with LF rows gives every row its own line', () => {
    expect(rowsOf(`${HEADER}\r\n${row('L-1')}\n${row('L-2')}\n${row('L-3')}`).map((r) => [r.row, r.line])).toEqual([[2, 'L-1'], [3, 'L-2'], [4, 'L-3']]);
  });

  it('a file with CR alone between rows (old spreadsheet exports) reads every row, and so does one that mixes all three', () => {
    expect(rowsOf(`${HEADER}\r${row('L-1')}\r${row('L-2')}\r`).map((r) => r.line)).toEqual(['L-1', 'L-2']);
    expect(rowsOf(`${HEADER}\r\n${row('L-1')}\r${row('L-2')}\n${row('L-3')}\r\n`).map((r) => [r.row, r.line])).toEqual([[2, 'L-1'], [3, 'L-2'], [4, 'L-3']]);
  });

  it('a line break inside a quoted cell is kept as written and does not start a row', () => {
    expect(rowsOf(`${HEADER}\r\n${row('L-1', '"two\r\nlines"')}\r\n${row('L-2', '"cr\ronly"')}\r\n${row('L-3')}`)).toMatchObject([
      { row: 2, line: 'L-1', notes: 'two\r\nlines' }, { row: 3, line: 'L-2', notes: 'cr\ronly' }, { row: 4, line: 'L-3' },
    ]);
  });

  it('the rows a file can hold are counted whatever its line endings, so a large CR-only file is never taken for a small one', () => {
    const many = Array.from({ length: 120 }, (_, i) => row(`L-${i}`));
    expect(estimateRows([HEADER, ...many].join('\r'))).toBe(120);
    expect(estimateRows([HEADER, ...many].join('\r\n') + '\r\n')).toBe(120);
    expect(estimateRows(`${HEADER}\r\n${many.slice(0, 60).join('\n')}\r${many.slice(60).join('\r')}`)).toBe(120);
  });

  it('counts lines with something in them, and never fewer than the rows', () => {
    expect(countFilledLines('a\n\n,,\n \t\nb\r\rc')).toBe(3);
    expect(countFilledLines('')).toBe(0);
    const text = `${HEADER}\n${row('L-1', '"a\nb"')}\n\n${row('L-2')}\n`;
    expect(estimateRows(text)).toBeGreaterThanOrEqual(rowsOf(text).length);
  });
});

describe('blank rows', () => {
  it('blank lines before the header and between the header and the rows are skipped; rows keep the numbers a spreadsheet shows', () => {
    const text = `\n\r\n,,,\n${HEADER}\n\n,,,,,,,,,\n${row('L-1')}\n\n${row('L-2')}\n\n`;
    const cols = readColumns(text);
    expect(cols.headerRow).toBe(4);
    expect(hasDataRows(text, cols)).toBe(true);
    expect(rowsOf(text).map((r) => [r.row, r.line])).toEqual([[7, 'L-1'], [9, 'L-2']]);
  });

  it('a header followed by blank lines only has no rows', () => {
    const text = `\n${HEADER}\n\n , \n`;
    expect(hasDataRows(text, readColumns(text))).toBe(false);
  });
});

describe('quotes that are not closed where they should be', () => {
  it('an unclosed quote rejects its own row only; the rows below are read on their own', () => {
    const text = `${HEADER}\n${row('L-1')}\n${row('L-2', '"5 in. reducer, see drawing')}\n${row('L-3')}\n${row('L-4')}\n`;
    expect(rowsOf(text)).toEqual([
      { row: 2, line: 'L-1', notes: '', quote: undefined },
      { row: 3, line: 'L-2', notes: '"5 in. reducer', quote: { column: 'notes', kind: 'unclosed' } },
      { row: 4, line: 'L-3', notes: '', quote: undefined },
      { row: 5, line: 'L-4', notes: '', quote: undefined },
    ]);
  });

  it('a stray quote that a later quote would close, rows below, is taken as unclosed too', () => {
    const text = `${HEADER}\n${row('L-1', '"stray')}\n${row('L-2')}\n${row('L-3', '"quoted" text')}\n`;
    expect(rowsOf(text).map((r) => [r.row, r.line, r.quote?.kind])).toEqual([[2, 'L-1', 'unclosed'], [3, 'L-2', undefined], [4, 'L-3', 'text-after']]);
  });

  it('text after a closing quote on the same row joins the cell, as spreadsheets read it, and is flagged', () => {
    expect(rowsOf(`${HEADER}\n${row('L-1', '"2" pipe')}\n`)).toEqual([{ row: 2, line: 'L-1', notes: '2 pipe', quote: { column: 'notes', kind: 'text-after' } }]);
  });

  it('a quote inside an unquoted cell and doubled quotes inside a quoted one are plain characters', () => {
    expect(rowsOf(`${HEADER}\n${row('L-1', '2" pipe')}\n${row('L-2', '"say ""stop"""')}\n`)).toMatchObject([
      { line: 'L-1', notes: '2" pipe', quote: undefined }, { line: 'L-2', notes: 'say "stop"', quote: undefined },
    ]);
  });

  it('the reader walks every record, each starting where the last ended', () => {
    const text = `a,"b\nc"\r\nd\re`;
    expect([...csvRecords(text)].map((r) => [r.row, r.cells])).toEqual([[1, ['a', 'b\nc']], [2, ['d']], [3, ['e']]]);
  });
});

describe('walking a large file a chunk at a time', () => {
  it('finds the same rows, numbers and keys as reading every row in full, quoted cells, blank rows and odd spaces included', () => {
    const text = [
      '', HEADER, ' , ,\u00a0', row('L-1'), '"L-2",A,S,PVC,80,2,100,70,D,"two\nlines"', '\u2028,', row(' L-3 ', '"open'), row('L-4'), '""""', ',\t', row('L-5'),
    ].join('\r\n');
    const cols = readColumns(text) as Columns<LineField>;
    const reader = rowReader(text, cols);
    const walked = [...reader.chunks('lineNumber', 'area', 2)].flatMap((c) => c.rowNumbers.map((n, i) => [n, c.keys[i], c.refs[i], reader.at(c.starts[i]!, n).lineNumber]));
    const read = [...readRows(text, cols)].map((r) => [r.rowNumber, r.cells.lineNumber ?? '', r.cells.area ?? '', r.cells.lineNumber]);
    expect(walked).toEqual(read);
    expect(read.map((r) => r[0])).toEqual([4, 5, 7, 8, 9, 11]);
  });
});
