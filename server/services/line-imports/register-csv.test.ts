import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { ISOLATION_POINT_CSV_COLUMNS, LINE_CSV_COLUMNS } from '@shared/schemas/register-columns';
import { demoPlant, toCsv } from '../../../scripts/demo-plant';
import { decodeCsv } from './csv-text';
import { cellValue, readRows } from './data-rows';
import { estimateRows, normaliseHeader, readColumns, type Columns, type LineField, type PointField } from './register-csv';
import { checkPointRow, diffValues, lineDiffFields, lineRowChecker, pointDiffFields, type LineValues, type PointValues } from './register-rows';

const LINES_HEADER = 'line_number,area,service,material,schedule,nominal_size,design_pressure_psi,design_temperature_f,drawing,notes';

function checkLines(text: string) {
  const cols = readColumns(text) as Columns<LineField>;
  const check = lineRowChecker(cols);
  return { cols, rows: [...readRows(text, cols)].map((r) => ({ rowNumber: r.rowNumber, result: check(r.cells) })) };
}

function valuesOf<V>(results: { result: { ok: true; values: V } | { ok: false } }[]): V[] {
  return results.map((r) => {
    if (!r.result.ok) throw new Error(`rejected: ${JSON.stringify(r.result)}`);
    return r.result.values;
  });
}

const outcomes = <V extends object>(incoming: V[], existing: Map<string, V>, key: keyof V, fields: (keyof V & string)[]) =>
  incoming.reduce(
    (acc, v) => {
      const before = existing.get(String(v[key]));
      acc[!before ? 'new' : Object.keys(diffValues(before, v, fields)).length ? 'changed' : 'unchanged']++;
      return acc;
    },
    { new: 0, changed: 0, unchanged: 0 },
  );

describe('reading the header', () => {
  it('folds case, spaces, brackets and ° so spreadsheet headings read as the documented names', () => {
    expect(normaliseHeader('\uFEFF Design Pressure (psi) ')).toBe('design_pressure_psi');
    expect(normaliseHeader('Design temperature (°C)')).toBe('design_temperature_c');
    expect(normaliseHeader('Line-Number')).toBe('line_number');
  });

  it('a tag column makes the file an isolation-points file; the units come from the header', () => {
    expect(readColumns('tag,line_number,kind,normal_position\n').kind).toBe('isolation-points');
    const cols = readColumns('line_number,area,service,material,schedule,nominal_size,design_pressure_kpa,design_temperature_c\n');
    expect(cols).toMatchObject({ kind: 'lines', pressureUnit: 'kPa', temperatureUnit: 'C' });
  });

  it('reads back every column the template and the export write, and the other names and units the table lists', () => {
    expect(readColumns(`${LINE_CSV_COLUMNS.join(',')}\n`)).toMatchObject({ kind: 'lines', pressureUnit: 'psi', temperatureUnit: 'F' });
    expect(readColumns(`${ISOLATION_POINT_CSV_COLUMNS.join(',')}\n`).kind).toBe('isolation-points');
    const other = readColumns('line_number,area,service,material,schedule,nominal_size_in,design_pressure_barg,design_temperature_c,drawing_ref\n');
    expect(other).toMatchObject({ pressureUnit: 'bar', temperatureUnit: 'C', header: { nominalSize: 'nominal_size_in', drawingRef: 'drawing_ref' } });
    expect(readColumns('line_number,area,service,material,schedule,nominal_size,design_pressure_mpa,design_temperature_f\n').pressureUnit).toBe('MPa');
  });

  it('refuses a file whose header misses a column, repeats one or has one it does not know, in so many words', () => {
    const refusal = (header: string) => {
      try {
        readColumns(`${header}\n`);
      } catch (e) {
        return (e as Error).message;
      }
      return 'accepted';
    };
    const list = 'line_number, area, service, material, schedule, nominal_size, design_pressure_psi (or _bar, _kpa, _mpa), design_temperature_f (or _c), drawing, notes';
    expect(refusal('line_number,area,service,material,schedule,nominal_size')).toBe(
      'A lines file needs the columns design_pressure_psi (or design_pressure_bar, design_pressure_kpa), design_temperature_f (or design_temperature_c); ' +
        `the file does not have them. Columns: ${list}.`,
    );
    expect(refusal('tag,line_number,kind')).toBe(
      'An isolation-points file needs the column normal_position; the file does not have it. Columns: tag, line_number, kind, normal_position, notes.',
    );
    expect(refusal(`${LINE_CSV_COLUMNS.join(',')},Design Temperature (C)`)).toBe(
      'The columns "design_temperature_f" and "Design Temperature (C)" both give the design temperature; keep one of them.',
    );
    expect(refusal(`${LINE_CSV_COLUMNS.join(',')},colour`)).toBe(
      `The column "colour" is not one Linewright knows. A lines file has the columns ${list}. Rename or remove it and upload again.`,
    );
    expect(refusal(`${LINE_CSV_COLUMNS.join(',')},constructor`)).toMatch(/^The column "constructor" is not one Linewright knows/);
    expect(refusal(',,')).toBe(`The file is empty. The first row must name the columns: ${list}.`);
  });

  it('a column without a name is ignored, but a value under it is a problem of that row', () => {
    const { rows } = checkLines(`${LINES_HEADER},\nL-1,A,S,PVC,40,1,10,70,,,\nL-2,A,S,PVC,40,1,10,70,,,oops\n`);
    expect(rows[0]!.result.ok).toBe(true);
    expect(rows[1]!.result).toEqual({ ok: false, problems: [{ column: '(unnamed)', message: '"oops" is in a column without a name; name the column or remove the value.' }] });
  });

  it('a row with more cells than the header is rejected with a hint about quotes', () => {
    const { rows } = checkLines(`${LINES_HEADER}\nL-1,A,S,PVC,40,1,10,70,D,note, with a comma\n`);
    expect(rows[0]!.result).toMatchObject({ ok: false, problems: [{ column: '(row)', message: expect.stringMatching(/comma in a value that needs quotes/) }] });
  });
});

describe('reading the text of a file', () => {
  it('drops a UTF-8 byte-order mark and reads a Windows-1252 file (as Excel saves "CSV") too', () => {
    expect(decodeCsv(Buffer.from('\uFEFFa,b\n', 'utf8'))).toBe('a,b\n');
    expect(decodeCsv(Buffer.from([0x74, 0x20, 0xb0, 0x43]))).toBe('t °C');
  });

  it('refuses binary data as not a CSV file', () => {
    expect(() => decodeCsv(Buffer.from([0x50, 0x4b, 0x03, 0x04, 0x00]))).toThrow(/not a text CSV file/);
  });

  it('estimates the rows from the line breaks, with or without a final one', () => {
    expect(estimateRows('h\n1\n2\n')).toBe(2);
    expect(estimateRows('h\n1\n2')).toBe(2);
  });
});

describe('what reading a row found wrong rejects that row, naming it', () => {
  it('a cell with a character the file\'s encoding does not define (U+FFFD) is rejected, naming its column', () => {
    const text = decodeCsv(Buffer.from(`${LINES_HEADER}\nL-1,A,S,PVC,80,1,100,70,D,caf\xe9 \x81 note\n`, 'latin1'));
    expect(checkLines(text).rows[0]!.result).toEqual({ ok: false, problems: [{ column: 'notes', message: expect.stringMatching(/^This cell holds a character that could not be read/) }] });
  });

  it('an unclosed quote and text after a closing quote each reject their row with the column and what to do', () => {
    const { rows } = checkLines(`${LINES_HEADER}\nL-1,A,S,PVC,80,1,100,70,D,"never closed\nL-2,A,S,PVC,80,1,100,70,"2" drawing,\nL-3,A,S,PVC,80,1,100,70,,\n`);
    expect(rows.map((r) => [r.rowNumber, r.result.ok])).toEqual([[2, false], [3, false], [4, true]]);
    expect(rows[0]!.result).toEqual({ ok: false, problems: [{ column: 'notes', message: expect.stringMatching(/^A quote \(".*never closed on its row.*Close the quote/) }] });
    expect(rows[1]!.result).toEqual({ ok: false, problems: [{ column: 'drawing', message: expect.stringMatching(/^Text follows the quote/) }] });
  });

  it('a header whose quote is not closed refuses the file', () => {
    expect(() => readColumns('line_number,"area\nX,Y\n')).toThrow(/^The header \(row 1\) has a quote/);
  });
});

describe('the apostrophe the export puts before a formula-like cell', () => {
  it('comes off again, exactly one, only before =, +, -, @, a tab or a line break, and what follows is kept as it is', () => {
    for (const [cell, value] of [["'=A1", '=A1'], ["'+1", '+1'], ["'-see drawing", '-see drawing'], ["'@SUM(A1)", '@SUM(A1)'], ["'\tx ", '\tx '], ["'\r\nx", '\r\nx'], ["''=x", "''=x"], ["'hello", "'hello"], ['  =x  ', '=x']]) {
      expect(cellValue(cell!), JSON.stringify(cell)).toBe(value);
    }
  });

  it('a line number or tag may not begin with a formula character at all', () => {
    const { rows } = checkLines(`${LINES_HEADER}\n=1+1,A,S,PVC,80,1,100,70,,\n'-100,A,S,PVC,80,1,100,70,,\n@L,A,S,PVC,80,1,100,70,,\n`);
    expect(rows.map((r) => r.result)).toEqual([
      { ok: false, problems: [{ column: 'line_number', message: expect.stringMatching(/^"=1\+1" begins with "=", which a spreadsheet takes for the start of a formula/) }] },
      { ok: false, problems: [{ column: 'line_number', message: expect.stringMatching(/^"-100" begins with "-"/) }] },
      { ok: false, problems: [{ column: 'line_number', message: expect.stringMatching(/^"@L" begins with "@"/) }] },
    ]);
    const points = 'tag,line_number,kind,normal_position\n+HV-1,L-1,valve,open\n';
    const cols = readColumns(points) as Columns<PointField>;
    expect([...readRows(points, cols)].map((r) => checkPointRow(r.cells, cols))).toEqual([{ ok: false, problems: [{ column: 'tag', message: expect.stringMatching(/^"\+HV-1" begins with "\+"/) }] }]);
  });
});

describe('checking a lines row', () => {
  it('takes each material up to its maximum service temperature and no further', () => {
    const at = (material: string, f: number) => checkLines(`${LINES_HEADER}\nL-1,A,S,${material},80,1,100,${f},,\n`).rows[0]!.result;
    expect(at('PVC', 140).ok).toBe(true);
    expect(at('CPVC', 200).ok).toBe(true);
    expect(at('ABS', 180).ok).toBe(true);
    expect(at('ABS', 181)).toMatchObject({ ok: false, problems: [{ message: expect.stringMatching(/^181 °F is above ABS's maximum service temperature of 180 °F \(82.2 °C\)/) }] });
    expect(at('CPVC', 201).ok).toBe(false);
  });

  it('in a °C column says the temperature in both units', () => {
    const text = 'line_number,area,service,material,schedule,nominal_size,design_pressure_psi,design_temperature_c\nL-1,A,S,PVC,80,1,100,65\n';
    expect(checkLines(text).rows[0]!.result).toMatchObject({ ok: false, problems: [{ column: 'design_temperature_c', message: expect.stringMatching(/^65 °C \(149 °F\) is above PVC's/) }] });
  });

  it('reports every problem of a row, not only the first', () => {
    const { rows } = checkLines(`${LINES_HEADER}\n,A,S,steel,120,7,-1,hot,,\n`);
    const result = rows[0]!.result;
    expect(result.ok).toBe(false);
    if (!result.ok) expect(result.problems.map((p) => p.column)).toEqual(['line_number', 'material', 'schedule', 'nominal_size', 'design_pressure_psi', 'design_temperature_f']);
  });

  it('reads schedules as the trade writes them and sizes with a trailing inch mark', () => {
    const { rows } = checkLines(`${LINES_HEADER}\nL-1,A,S,PVC,Sch 80,"1-1/4""",100,70,,\nL-2,A,S,PVC,SDR 13.5,2 in,100,70,,\nL-3,A,S,PVC,schedule 40,1/2,100 psi,70 F,,\n`);
    expect(valuesOf(rows).map((v) => [v.schedule, v.sdr, v.nominalSize, v.nominalSizeIn])).toEqual([['80', null, '1-1/4', 1.25], [null, 13.5, '2', 2], ['40', null, '1/2', 0.5]]);
  });
});

describe('the demo plant and the sample files', () => {
  const plant = demoPlant();

  it('the demo plant has about 150 lines, 1 to 4 isolation points each, and no row the importer would reject', () => {
    expect(plant.lines.length).toBeGreaterThanOrEqual(140);
    const perLine = new Map<string, number>();
    for (const p of plant.points) perLine.set(p.line_number, (perLine.get(p.line_number) ?? 0) + 1);
    expect(Math.min(...perLine.values())).toBeGreaterThanOrEqual(1);
    expect(Math.max(...perLine.values())).toBeLessThanOrEqual(4);
    expect(valuesOf(checkLines(toCsv(plant.lines)).rows)).toHaveLength(plant.lines.length);
    const pointsText = toCsv(plant.points);
    const cols = readColumns(pointsText) as Columns<PointField>;
    expect([...readRows(pointsText, cols)].every((r) => checkPointRow(r.cells, cols).ok)).toBe(true);
    expect(new Set(plant.lines.map((l) => l.material))).toEqual(new Set(['PVC', 'CPVC', 'ABS']));
  });

  it('is the same plant every time', () => {
    expect(demoPlant()).toEqual(plant);
  });

  it('docs/sample-lines.csv shows a planner unchanged, changed and new lines against the demo plant, and no rejected ones', () => {
    const existing = new Map(valuesOf(checkLines(toCsv(plant.lines)).rows).map((v) => [v.lineNumber, v]));
    const sample = checkLines(readFileSync('docs/sample-lines.csv', 'utf8'));
    const incoming = valuesOf<LineValues>(sample.rows);
    expect(incoming.length).toBe(20);
    expect(outcomes(incoming, existing, 'lineNumber', lineDiffFields(sample.cols))).toEqual({ new: 8, changed: 4, unchanged: 8 });
  });

  it('docs/sample-isolation-points.csv names only demo lines and shows new, changed and unchanged points', () => {
    const read = (text: string) => {
      const cols = readColumns(text) as Columns<PointField>;
      return { cols, values: valuesOf<PointValues>([...readRows(text, cols)].map((r) => ({ result: checkPointRow(r.cells, cols) }))) };
    };
    const existing = new Map(read(toCsv(plant.points)).values.map((v) => [v.tag, v]));
    const sample = read(readFileSync('docs/sample-isolation-points.csv', 'utf8'));
    const lines = new Set(plant.lines.map((l) => l.line_number));
    expect(sample.values.every((v) => lines.has(v.lineNumber))).toBe(true);
    expect(outcomes(sample.values, existing, 'tag', pointDiffFields(sample.cols))).toEqual({ new: 3, changed: 2, unchanged: 4 });
  });
});
