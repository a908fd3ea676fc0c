import Papa from 'papaparse';
import { describe, expect, it } from 'vitest';
import { Line } from '@server/db/models/line';
import { EXPORT_BATCH } from '@server/services/line-register-export';
import { useTestApp } from '../helpers/app';
import { makeLines, uniquePrefix } from '../helpers/line-rows';

// The columns the line importer reads, written out here so a rename on either side shows.
const IMPORT_COLUMNS = ['line_number', 'area', 'service', 'material', 'schedule', 'nominal_size', 'design_pressure_psi', 'design_temperature_f', 'drawing', 'notes'];

const users = useTestApp({ signIn: ['fitter', 'planner'] });

/** A list filter of several values goes as one repeated parameter per value (`?area=A&area=B`), as the client sends it. */
const toQuery = (query: Record<string, string | string[]>) =>
  new URLSearchParams(Object.entries(query).flatMap(([k, v]) => (Array.isArray(v) ? v : [v]).map((x): [string, string] => [k, x])));
async function exportCsv(query: Record<string, string | string[]>) {
  const res = await users.fitter.raw(`/api/lines/export.csv?${toQuery(query)}`);
  const text = await res.text();
  const rows = Papa.parse<string[]>(text, { delimiter: ',', skipEmptyLines: true }).data;
  return { res, text, header: rows[0], rows: rows.slice(1) };
}
const column = (header: string[], rows: string[][], name: string) => rows.map((r) => r[header.indexOf(name)]);

describe('exporting the line register as CSV', () => {
  it('downloads as a dated CSV file whose header is the importer’s columns, one line per register line', async () => {
    const p = uniquePrefix('EXP');
    await makeLines(p, [{ schedule: '40', drawingRef: 'P-101', notes: 'by the pump' }, { sdr: 21, schedule: null }]);
    const { res, text, header, rows } = await exportCsv({ area: `${p} area` });
    expect(res.status).toBe(200);
    expect(res.headers.get('content-type')).toBe('text/csv; charset=utf-8');
    const today = new Date().toISOString().slice(0, 10);
    expect(res.headers.get('content-disposition')).toBe(`attachment; filename=line-register-${today}.csv`);
    expect(header).toEqual(IMPORT_COLUMNS);
    expect(text.split('\r\n')[0]).toBe(IMPORT_COLUMNS.join(','));
    expect(rows).toEqual([
      [`${p}-001`, `${p} area`, 'Caustic 20%', 'PVC', '40', '2', '100', '73', 'P-101', 'by the pump'],
      [`${p}-002`, `${p} area`, 'Caustic 20%', 'PVC', 'SDR 21', '2', '100', '73', '', ''],
    ]);
  });

  it('adds a status column at the end only when asked with withStatus=1', async () => {
    const p = uniquePrefix('STAT');
    await makeLines(p, [{ status: 'locked-out' }]);
    const { header, rows } = await exportCsv({ area: `${p} area`, withStatus: '1' });
    expect(header).toEqual([...IMPORT_COLUMNS, 'status']);
    expect(rows[0].at(-1)).toBe('locked-out');
  });

  it('a cell starting with =, +, -, @, tab, CR or LF leaves with an apostrophe so spreadsheets keep it as text', async () => {
    const p = uniquePrefix('FORMULA');
    const dangerous = ['=HYPERLINK("http://evil.invalid","open")', '+1+1', '-2+3', '@SUM(A1:A9)', '\tcmd', '\rcmd', '\ncmd', '=1+1\nsecond line'];
    await makeLines(p, dangerous.map((notes) => ({ notes })));
    const { text, header, rows } = await exportCsv({ area: `${p} area` });
    expect(column(header, rows, 'notes')).toEqual(dangerous.map((d) => `'${d}`));
    expect(text).toContain(`"'=HYPERLINK(""http://evil.invalid"",""open"")"`);
  });

  it('a negative design temperature is a number and leaves without an apostrophe', async () => {
    const p = uniquePrefix('COLD');
    await makeLines(p, [{ designTemperatureF: -20 }]);
    const { header, rows } = await exportCsv({ area: `${p} area` });
    expect(column(header, rows, 'design_temperature_f')).toEqual(['-20']);
  });

  it('commas, quotes and line breaks inside a cell are quoted, and a semicolon is not taken for a delimiter', async () => {
    const p = uniquePrefix('QUOTE');
    await makeLines(p, [{ service: 'Acid, 30%', notes: 'Say "stop" first' }, { service: ';', notes: 'two\r\nlines' }]);
    const { text, header, rows } = await exportCsv({ area: `${p} area` });
    expect(text).toContain('"Acid, 30%"');
    expect(text).toContain('"Say ""stop"" first"');
    expect(text).toContain(',;,');
    expect(column(header, rows, 'service')).toEqual(['Acid, 30%', ';']);
    expect(column(header, rows, 'notes')).toEqual(['Say "stop" first', 'two\r\nlines']);
  });

  it('takes the list’s filters, search and sort, without paging', async () => {
    const p = uniquePrefix('EXPF');
    await makeLines(p, [
      { area: `${p} A`, nominalSize: '10', material: 'CPVC' },
      { area: `${p} A`, nominalSize: '3/4', material: 'CPVC' },
      { area: `${p} B`, nominalSize: '2', material: 'CPVC' },
      { area: `${p} A`, nominalSize: '4', material: 'PVC' },
      { area: `${p} C`, nominalSize: '1', material: 'CPVC' },
    ]);
    const sorted = await exportCsv({ area: [`${p} A`, `${p} B`], material: 'CPVC', sort: 'nominalSize', dir: 'desc', page: '2', pageSize: '1' });
    expect(column(sorted.header, sorted.rows, 'nominal_size')).toEqual(['10', '2', '3/4']);
    const searched = await exportCsv({ search: `${p.toLowerCase()}-00`, size: ['1', '4'] });
    expect(column(searched.header, searched.rows, 'line_number')).toEqual([`${p}-004`, `${p}-005`]);
  });

  it('an area whose name holds a comma is one area, alone or with a second one', async () => {
    const p = uniquePrefix('EXPCOMMA');
    const [north, caustic] = [`${p} Tank farm, north`, `${p} 200 Caustic`];
    await makeLines(p, [{ area: north }, { area: caustic }, { area: `${p} Tank farm` }]);
    const alone = await exportCsv({ area: north });
    expect(alone.res.status).toBe(200);
    expect(column(alone.header, alone.rows, 'line_number')).toEqual([`${p}-001`]);
    expect(column(alone.header, alone.rows, 'area')).toEqual([north]);
    const both = await exportCsv({ area: [north, caustic] });
    expect(column(both.header, both.rows, 'line_number')).toEqual([`${p}-001`, `${p}-002`]);
  });

  it('a register larger than one batch comes out whole, each line once and in order', async () => {
    const p = uniquePrefix('BULK');
    const count = EXPORT_BATCH + 7;
    await Line.bulkCreate(
      Array.from({ length: count }, (_, i) => ({
        lineNumber: `${p}-${String(i).padStart(5, '0')}`, area: `${p} area`, service: 'Water', material: 'PVC' as const,
        schedule: '80', sdr: null, nominalSize: '2', nominalSizeIn: 2, designPressurePsi: 100, designTemperatureF: 73, drawingRef: null, notes: null,
      })),
    );
    const { header, rows } = await exportCsv({ area: `${p} area` });
    const numbers = column(header, rows, 'line_number');
    expect(numbers.length).toBe(count);
    expect(numbers).toEqual([...numbers].sort());
    expect(new Set(numbers).size).toBe(count);
  });

  it('a filter the register does not know is refused in the one error shape, not as a file', async () => {
    const res = await users.fitter.get('/api/lines/export.csv?material=STEEL');
    expect(res.status).toBe(400);
    expect(res.headers.get('content-disposition')).toBeNull();
    expect(res.body.error).toMatchObject({ code: 'bad_request', details: { 'material.0': [expect.stringContaining('PVC')] } });
  });
});

describe('an export re-imports exactly', () => {
  /** The register's CSV export of lines whose numbers hold `p`, uploaded again as an import by a planner. */
  async function reimport(p: string) {
    const text = await (await users.planner.raw(`/api/lines/export.csv?search=${encodeURIComponent(p)}`)).text();
    const up = await users.planner.upload('/api/line-imports', `${p}-export.csv`, text);
    expect(up.status).toBe(201);
    const rows = (await users.planner.get(`/api/line-imports/${up.body.id}/rows?pageSize=500`)).body.rows as any[];
    return { text, imp: up.body, rows };
  }

  it('cells beginning with =, +, -, @, a tab, CR or LF come back unchanged: the apostrophe the export adds comes off again', async () => {
    const p = uniquePrefix('ROUND');
    const leads = ['=', '+', '-', '@', '\t', '\r', '\n'];
    await makeLines(p, leads.map((c, i) => ({
      area: `${c}${p} area ${i}`, service: `${c}SUM(A1:A9)`, drawingRef: `${c}P&ID-${i}`, notes: `${c}1+1\nsecond line "quoted", too`,
    })));
    const { text, imp, rows } = await reimport(p);
    expect(text).toContain(`"'=${p} area 0"`); // escaped on the way out …
    expect(imp).toMatchObject({ status: 'previewed', totalRows: leads.length, counts: { new: 0, changed: 0, unchanged: leads.length, rejected: 0 } });
    expect(rows.every((r) => r.outcome === 'unchanged')).toBe(true); // … and exactly as stored on the way back
  });

  it('a line number beginning with a formula character comes back rejected with the reason, never as a new line', async () => {
    const p = uniquePrefix('FLINE');
    await makeLines(p, [{ lineNumber: `=${p}-1` }, { lineNumber: `${p}-2` }]);
    const { imp, rows } = await reimport(p);
    expect(imp.counts).toEqual({ new: 0, changed: 0, unchanged: 1, rejected: 1 });
    const rejected = rows.find((r) => r.outcome === 'rejected');
    expect(rejected.data.lineNumber).toBe(`=${p}-1`);
    expect(rejected.problems).toEqual([{ column: 'line_number', message: expect.stringMatching(/begins with "=", which a spreadsheet takes for the start of a formula/) }]);
  });
});
