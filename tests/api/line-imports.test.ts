import { describe, expect, it } from 'vitest';
import { Op } from 'sequelize';
import { sequelize } from '@server/db/sequelize';
import { AuditEntry } from '@server/db/models/audit-entry';
import { IsolationPoint } from '@server/db/models/isolation-point';
import { Line } from '@server/db/models/line';
import { LineImport, LineImportRow } from '@server/db/models/line-import';
import { importQueue } from '@server/queues/line-imports';
import { mailJobId, mailQueue } from '@server/queues/mail';
import { importListResponseSchema, lineImportSchema } from '@shared/schemas/line-imports';
import { processImport } from '../../worker/processors/line-import';
import { useTestApp } from '../helpers/app';
import { signedIn } from '../helpers/browserless';
import { LINE_HEADER, POINT_HEADER, importRow, lineRow, testPrefix, toCsv, type CsvRow } from '../helpers/import-csv';

const users = useTestApp({ signIn: ['planner'] });

const upload = (name: string, text: string | Buffer, as = users.planner) => as.upload('/api/line-imports', name, text);
const rowsOf = async (id: string, query = '') => (await users.planner.get(`/api/line-imports/${id}/rows?pageSize=500${query}`)).body.rows as any[];
const linesNamed = (p: string) => Line.findAll({ where: { lineNumber: { [Op.startsWith]: p } }, order: [['lineNumber', 'ASC']] });

/** Uploads and confirms a small lines file: the register then holds these rows. */
async function registerHas(p: string, rows: CsvRow[]) {
  const up = await upload(`${p}-seed.csv`, toCsv(rows));
  expect(up.status).toBe(201);
  const done = await users.planner.post(`/api/line-imports/${up.body.id}/confirm`);
  expect(done.status).toBe(200);
  return done.body;
}

describe('previewing a lines file', () => {
  it('marks each row new, changed (with the changed fields) or unchanged, and writes nothing to the register', async () => {
    const p = testPrefix('PREV');
    await registerHas(p, [lineRow(`${p}-1`), lineRow(`${p}-2`, { notes: 'old note' })]);
    const res = await upload(`${p}.csv`, toCsv([lineRow(`${p}-1`), lineRow(`${p}-2`, { design_pressure_psi: '200', notes: 'new note' }), lineRow(`${p}-3`)]));

    expect(res.status).toBe(201);
    expect(lineImportSchema.parse(res.body)).toMatchObject({ kind: 'lines', filename: `${p}.csv`, status: 'previewed', totalRows: 3, progress: 100, counts: { new: 1, changed: 1, unchanged: 1, rejected: 0 } });
    const rows = await rowsOf(res.body.id);
    expect(rows.map((r) => [r.rowNumber, r.key, r.outcome])).toEqual([[2, `${p}-1`, 'unchanged'], [3, `${p}-2`, 'changed'], [4, `${p}-3`, 'new']]);
    expect(rows[1].changes).toEqual({ designPressurePsi: { from: 150, to: 200 }, notes: { from: 'old note', to: 'new note' } });
    expect(rows[2].data).toMatchObject({ lineNumber: `${p}-3`, material: 'PVC', schedule: '80', nominalSize: '1-1/2', nominalSizeIn: 1.5, designPressurePsi: 150 });
    expect((await importRow(res.body.id))?.source).toContain(`${p}-3`);
    expect(await LineImportRow.count({ where: { importId: res.body.id } })).toBe(3);
    expect((await linesNamed(p)).map((l) => [l.lineNumber, l.designPressurePsi])).toEqual([[`${p}-1`, 150], [`${p}-2`, 150]]);
  });

  it('keeps the file name as the planner saved it, accents and all, without any folder', async () => {
    const p = testPrefix('NAME');
    const res = await upload(`Régistre ${p}.csv`, toCsv([lineRow(`${p}-1`)]));
    expect(res.body.filename).toBe(`Régistre ${p}.csv`);
  });

  it('lists only the rows of one outcome, a page at a time', async () => {
    const p = testPrefix('PAGE');
    const res = await upload(`${p}.csv`, toCsv([lineRow(`${p}-1`), lineRow(`${p}-2`, { material: 'steel' }), lineRow(`${p}-3`), lineRow(`${p}-4`)]));
    const page = await users.planner.get(`/api/line-imports/${res.body.id}/rows?outcome=new&page=2&pageSize=2`);
    expect(page.status).toBe(200);
    expect(page.body.total).toBe(3);
    expect(page.body.rows.map((r: any) => r.key)).toEqual([`${p}-4`]);
    expect((await users.planner.get(`/api/line-imports/${res.body.id}/rows?outcome=maybe`)).status).toBe(400);
  });

  it('rejects each kind of bad row with its column and a reason a planner can act on', async () => {
    const p = testPrefix('BAD');
    const res = await upload(`${p}.csv`, toCsv([
      lineRow(`${p}-MAT`, { material: 'HDPE' }),
      lineRow(`${p}-SIZE`, { nominal_size: '7' }),
      lineRow(`${p}-UNIT`, { design_pressure_psi: '10 bar' }),
      lineRow(`${p}-HOT`, { material: 'PVC', design_temperature_f: '150' }),
      lineRow(`${p}-OK`),
      lineRow(`${p}-OK`, { area: '200 Caustic & brine' }),
      lineRow(`${p}-EMPTY`, { service: '' }),
      lineRow(`${p}-NEG`, { design_pressure_psi: '-5' }),
      lineRow(`${p}-WORD`, { design_pressure_psi: 'high' }),
      lineRow(`${p}-SCH`, { schedule: '120' }),
    ]));
    expect(res.body.counts).toEqual({ new: 1, changed: 0, unchanged: 0, rejected: 9 });
    const problems = Object.fromEntries((await rowsOf(res.body.id, '&outcome=rejected')).map((r) => [`${r.key}@${r.rowNumber}`, r.problems]));
    expect(problems[`${p}-MAT@2`]).toEqual([{ column: 'material', message: '"HDPE" is not a material the register takes (PVC, CPVC or ABS).' }]);
    expect(problems[`${p}-SIZE@3`]).toEqual([{ column: 'nominal_size', message: expect.stringMatching(/^"7" is not a listed nominal pipe size/) }]);
    expect(problems[`${p}-UNIT@4`]).toEqual([{ column: 'design_pressure_psi', message: expect.stringMatching(/^"10 bar" is in bar, but this column is in psi/) }]);
    expect(problems[`${p}-HOT@5`]).toEqual([{ column: 'design_temperature_f', message: expect.stringMatching(/^150 °F is above PVC's maximum service temperature of 140 °F/) }]);
    expect(problems[`${p}-OK@7`]).toEqual([{ column: 'line_number', message: `Line ${p}-OK is already on row 6 of this file; each may appear only once.` }]);
    expect(problems[`${p}-EMPTY@8`]).toEqual([{ column: 'service', message: 'Missing value: every row needs a service.' }]);
    expect(problems[`${p}-NEG@9`]).toEqual([{ column: 'design_pressure_psi', message: 'Pressure must be 0 or more (gauge).' }]);
    expect(problems[`${p}-WORD@10`]).toEqual([{ column: 'design_pressure_psi', message: '"high" is not a pressure: give a number of psi.' }]);
    expect(problems[`${p}-SCH@11`]).toEqual([{ column: 'schedule', message: expect.stringMatching(/^"120" is not a schedule the register takes/) }]);
    const rejected = await rowsOf(res.body.id, '&outcome=rejected');
    expect(rejected[0].data).toMatchObject({ material: 'HDPE' }); // the cells as the planner wrote them
  });

  it('reads a header in bar and °C, with a byte-order mark and spreadsheet-style names, and converts to psi and °F', async () => {
    const p = testPrefix('UNITS');
    const text = '\uFEFFLine Number,Area,Service,Material,Schedule,Nominal Size,Design Pressure (bar),Design Temperature (°C)\n' +
      `${p}-1,300 Water treatment,Ferric chloride,CPVC,SDR 21,"2""",10,40\n${p}-2,300 Water treatment,Brine,ABS,Sch 40,3/4 in,6.9 bar,20 C\n`;
    const res = await upload(`${p}.csv`, text);
    expect(res.status).toBe(201);
    expect(res.body.counts).toMatchObject({ new: 2, rejected: 0 });
    expect((await users.planner.post(`/api/line-imports/${res.body.id}/confirm`)).status).toBe(200);
    const [one, two] = await linesNamed(p);
    expect(one).toMatchObject({ material: 'CPVC', schedule: null, sdr: 21, nominalSize: '2', nominalSizeIn: 2, designPressurePsi: 145, designTemperatureF: 104, drawingRef: null });
    expect(two).toMatchObject({ material: 'ABS', schedule: '40', nominalSize: '3/4', designPressurePsi: 100.1, designTemperatureF: 68 });
  });

  it('a cell in °C under a °F header is rejected, naming the column', async () => {
    const p = testPrefix('TUNIT');
    const res = await upload(`${p}.csv`, toCsv([lineRow(`${p}-1`, { design_temperature_f: '40 C' })]));
    const [row] = await rowsOf(res.body.id);
    expect(row.problems).toEqual([{ column: 'design_temperature_f', message: expect.stringMatching(/^"40 C" is in °C, but this column is in °F/) }]);
  });

  it('an unknown column refuses the whole file (400) and nothing is stored', async () => {
    const p = testPrefix('UNK');
    const res = await upload(`${p}.csv`, toCsv([{ ...lineRow(`${p}-1`), colour: 'grey' }], ['line_number', 'area', 'service', 'material', 'schedule', 'nominal_size', 'design_pressure_psi', 'design_temperature_f', 'colour']));
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(/^The column "colour" is not one Linewright knows\. A lines file has the columns line_number, area/);
    expect(await LineImport.count({ where: { filename: `${p}.csv` } })).toBe(0);
  });

  it('a missing required column, two pressure columns, a header without rows and a non-CSV file are each refused whole', async () => {
    const p = testPrefix('HDR');
    const noService = await upload(`${p}.csv`, 'line_number,area,material,schedule,nominal_size,design_pressure_psi,design_temperature_f\nX,A,PVC,40,1,10,70\n');
    expect(noService.status).toBe(400);
    expect(noService.body.error.message).toMatch(/^A lines file needs the column service; the file does not have it/);
    const twice = await upload(`${p}.csv`, 'line_number,area,service,material,schedule,nominal_size,design_pressure_psi,design_pressure_bar,design_temperature_f\n');
    expect(twice.body.error.message).toBe('The columns "design_pressure_psi" and "design_pressure_bar" both give the design pressure; keep one of them.');
    const empty = await upload(`${p}.csv`, 'line_number,area,service,material,schedule,nominal_size,design_pressure_psi,design_temperature_f\n\n');
    expect(empty.body.error.message).toBe('The file has a header but no rows.');
    const sheet = await upload(`${p}.xlsx`, 'PK\u0003\u0004');
    expect(sheet.status).toBe(400);
    expect(sheet.body.error.message).toMatch(/is not a CSV file/);
    const none = await users.planner.post('/api/line-imports', {});
    expect(none.status).toBe(400);
    expect(none.body.error.message).toMatch(/Choose a CSV file/);
    expect(await LineImport.count({ where: { filename: { [Op.startsWith]: p } } })).toBe(0);
  });
});

describe('who may import', () => {
  it('a pipefitter and an operations shift lead are refused (403) on every import route', async () => {
    const p = testPrefix('ROLE');
    const mine = await upload(`${p}.csv`, toCsv([lineRow(`${p}-1`)]));
    for (const role of ['fitter', 'operations']) {
      const b = await signedIn(role);
      const up = await upload(`${p}-${role}.csv`, toCsv([lineRow(`${p}-2`)]), b);
      expect(up.status, role).toBe(403);
      expect(up.body.error.message, role).toMatch(/^Only a maintenance planner or administrator may do this/);
      expect((await b.get(`/api/line-imports/${mine.body.id}`)).status, role).toBe(403);
      expect((await b.get(`/api/line-imports/${mine.body.id}/rows`)).status, role).toBe(403);
      expect((await b.post(`/api/line-imports/${mine.body.id}/confirm`)).status, role).toBe(403);
    }
    expect((await importRow(mine.body.id))?.status).toBe('previewed');
    expect(await Line.count({ where: { lineNumber: { [Op.startsWith]: p } } })).toBe(0);
  });

  it('an administrator may import', async () => {
    const p = testPrefix('ADMIN');
    const admin = await signedIn('admin');
    const res = await upload(`${p}.csv`, toCsv([lineRow(`${p}-1`)]), admin);
    expect(res.status).toBe(201);
    expect((await admin.post(`/api/line-imports/${res.body.id}/confirm`)).status).toBe(200);
  });
});

describe('confirming an import', () => {
  it('writes the new and changed lines, skips the rejected ones, says so, and records one audit entry', async () => {
    const p = testPrefix('CONF');
    await registerHas(p, [lineRow(`${p}-1`)]);
    const up = await upload(`${p}.csv`, toCsv([lineRow(`${p}-1`, { nominal_size: '2', drawing: 'MRW-P&ID-104-03' }), lineRow(`${p}-2`, { material: 'CPVC', design_temperature_f: '180' }), lineRow(`${p}-3`, { material: 'wood' })]));
    const res = await users.planner.post(`/api/line-imports/${up.body.id}/confirm`);

    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ status: 'applied', progress: 100, counts: { new: 1, changed: 1, unchanged: 0, rejected: 1 } });
    expect(res.body.appliedAt).toBeTruthy();
    const lines = await linesNamed(p);
    expect(lines.map((l) => [l.lineNumber, l.material, l.nominalSize, l.nominalSizeIn, l.drawingRef])).toEqual([
      [`${p}-1`, 'PVC', '2', 2, 'MRW-P&ID-104-03'],
      [`${p}-2`, 'CPVC', '1-1/2', 1.5, 'MRW-P&ID-104-02'],
    ]);
    const audit = await AuditEntry.findAll({ where: { action: 'line-import-applied', entityId: up.body.id } });
    expect(audit).toHaveLength(1);
    expect(audit[0]!.after).toEqual({ kind: 'lines', filename: `${p}.csv`, new: 1, changed: 1, unchanged: 0, skipped: 1 });
  });

  it('leaves drawing and notes alone when the file has no such columns', async () => {
    const p = testPrefix('KEEP');
    await registerHas(p, [lineRow(`${p}-1`, { notes: 'keep me' })]);
    const header = ['line_number', 'area', 'service', 'material', 'schedule', 'nominal_size', 'design_pressure_psi', 'design_temperature_f'];
    const up = await upload(`${p}.csv`, toCsv([lineRow(`${p}-1`, { design_pressure_psi: '120' })], header));
    expect((await rowsOf(up.body.id))[0].changes).toEqual({ designPressurePsi: { from: 150, to: 120 } });
    await users.planner.post(`/api/line-imports/${up.body.id}/confirm`);
    expect(await linesNamed(p)).toMatchObject([{ designPressurePsi: 120, notes: 'keep me', drawingRef: 'MRW-P&ID-104-02' }]);
  });

  it('confirming twice is refused (409) and writes nothing more', async () => {
    const p = testPrefix('TWICE');
    const up = await upload(`${p}.csv`, toCsv([lineRow(`${p}-1`)]));
    expect((await users.planner.post(`/api/line-imports/${up.body.id}/confirm`)).status).toBe(200);
    const again = await users.planner.post(`/api/line-imports/${up.body.id}/confirm`);
    expect(again.status).toBe(409);
    expect(again.body.error.message).toBe('This import has already been confirmed.');
    expect(await AuditEntry.count({ where: { action: 'line-import-applied', entityId: up.body.id } })).toBe(1);
  });

  it('a preview made before another import was applied is stale (409): upload the file again', async () => {
    const p = testPrefix('STALE');
    const first = await upload(`${p}-a.csv`, toCsv([lineRow(`${p}-1`, { service: 'Brine' })]));
    const second = await upload(`${p}-b.csv`, toCsv([lineRow(`${p}-1`, { service: 'RO permeate' })]));
    expect((await users.planner.post(`/api/line-imports/${second.body.id}/confirm`)).status).toBe(200);
    const res = await users.planner.post(`/api/line-imports/${first.body.id}/confirm`);
    expect(res.status).toBe(409);
    expect(res.body.error).toEqual({ code: 'stale_preview', message: `The register changed since this preview ("${p}-b.csv" was applied after it); upload the file again.` });
    expect(await linesNamed(p)).toMatchObject([{ service: 'RO permeate' }]);
    expect((await importRow(first.body.id))?.status).toBe('previewed');
  });

  it('a database failure part-way writes nothing at all and marks the import failed with a reason', async () => {
    const p = testPrefix('FAIL');
    await registerHas(p, [lineRow(`${p}-1`)]);
    const rows = [lineRow(`${p}-1`, { service: 'Changed' }), ...Array.from({ length: 20 }, (_, i) => lineRow(`${p}-${i + 2}`))];
    const up = await upload(`${p}.csv`, toCsv(rows));
    const fn = `lw_test_refuse_${p.replace(/\W/g, '_').toLowerCase()}`;
    await sequelize.query(`create function ${fn}() returns trigger language plpgsql as $$ begin
      if new.line_number = '${p}-15' then raise exception 'line % refused by a test trigger', new.line_number; end if; return new; end $$`);
    await sequelize.query(`create trigger ${fn} before insert or update on lines for each row execute function ${fn}()`);
    try {
      const res = await users.planner.post(`/api/line-imports/${up.body.id}/confirm`);
      expect(res.status).toBe(422);
      expect(res.body.error.code).toBe('import_failed');
      expect(res.body.error.message).toMatch(/^Nothing was written: the database refused the import \(line .*-15 refused by a test trigger\)\. The register is as it was before/);
    } finally {
      await sequelize.query(`drop trigger ${fn} on lines; drop function ${fn}()`);
    }
    expect(await linesNamed(p)).toMatchObject([{ lineNumber: `${p}-1`, service: 'Sulphuric acid 93%' }]);
    const imp = await users.planner.get(`/api/line-imports/${up.body.id}`);
    expect(imp.body).toMatchObject({ status: 'failed', appliedAt: null, error: expect.stringMatching(/^Nothing was written/) });
    expect(await AuditEntry.count({ where: { action: 'line-import-applied', entityId: up.body.id } })).toBe(0);
    expect((await users.planner.post(`/api/line-imports/${up.body.id}/confirm`)).body.error.message).toMatch(/^This import failed and cannot be confirmed/);
  });

  it('an import that is not there answers 404, and a malformed id 400', async () => {
    expect((await users.planner.get('/api/line-imports/00000000-0000-4000-8000-000000000000')).status).toBe(404);
    expect((await users.planner.post('/api/line-imports/not-an-id/confirm')).status).toBe(400);
  });
});

describe('a file over the inline limit', () => {
  it('is stored as previewing and queued for the worker under a deterministic job id', async () => {
    const p = testPrefix('BIG');
    const res = await upload(`${p}.csv`, toCsv(Array.from({ length: 60 }, (_, i) => lineRow(`${p}-${i}`))));
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ status: 'previewing', progress: 0, totalRows: 0 });
    const job = await importQueue().getJob(`preview-${res.body.id}`);
    expect(job?.data).toEqual({ importId: res.body.id, step: 'preview' });
    await job?.remove(); // the worker test runs this path end to end
    expect(await LineImportRow.count({ where: { importId: res.body.id } })).toBe(0);
  });
});

describe('importing isolation points', () => {
  it('previews new points, refuses unknown lines and wrong kinds or positions, then writes the good ones', async () => {
    const p = testPrefix('ISO');
    await registerHas(p, [lineRow(`${p}-L1`), lineRow(`${p}-L2`)]);
    const points: CsvRow[] = [
      { tag: `${p}-V1`, line_number: `${p}-L1`, kind: 'valve', normal_position: 'Open', notes: 'upstream of the dosing pump' },
      { tag: `${p}-B1`, line_number: `${p}-L2`, kind: 'blind', normal_position: 'removed' },
      { tag: `${p}-V2`, line_number: `${p}-NOPE`, kind: 'valve', normal_position: 'closed' },
      { tag: `${p}-X1`, line_number: `${p}-L1`, kind: 'gate', normal_position: 'open' },
      { tag: `${p}-V3`, line_number: `${p}-L1`, kind: 'valve', normal_position: 'installed' },
    ];
    const up = await upload(`${p}-points.csv`, toCsv(points, POINT_HEADER));
    expect(up.status).toBe(201);
    expect(up.body).toMatchObject({ kind: 'isolation-points', status: 'previewed', counts: { new: 2, changed: 0, unchanged: 0, rejected: 3 } });
    const rejected = await rowsOf(up.body.id, '&outcome=rejected');
    expect(rejected.map((r) => r.problems)).toEqual([
      [{ column: 'line_number', message: `Line ${p}-NOPE is not in the register; import the lines first.` }],
      [{ column: 'kind', message: '"gate" is not a kind of isolation point (valve, blind or disconnect).' }],
      [{ column: 'normal_position', message: 'A valve stands open or closed; "installed" is not one of them.' }],
    ]);
    expect((await users.planner.post(`/api/line-imports/${up.body.id}/confirm`)).status).toBe(200);
    const written = await IsolationPoint.findAll({ where: { tag: { [Op.startsWith]: p } }, include: ['line'], order: [['tag', 'ASC']] });
    expect(written.map((ip: any) => [ip.tag, ip.line.lineNumber, ip.kind, ip.normalPosition, ip.notes])).toEqual([
      [`${p}-B1`, `${p}-L2`, 'blind', 'removed', null],
      [`${p}-V1`, `${p}-L1`, 'valve', 'open', 'upstream of the dosing pump'],
    ]);

    const moved = await upload(`${p}-points-2.csv`, toCsv([{ ...points[0]!, line_number: `${p}-L2`, normal_position: 'closed' }, points[1]!], POINT_HEADER));
    expect(moved.body.counts).toMatchObject({ changed: 1, unchanged: 1 });
    expect((await rowsOf(moved.body.id))[0].changes).toEqual({ lineNumber: { from: `${p}-L1`, to: `${p}-L2` }, normalPosition: { from: 'open', to: 'closed' } });
  });
});

describe('a file within the inline limit', () => {
  it('is previewed and written inside the requests, and nothing is queued for the worker', async () => {
    const p = testPrefix('INLINE');
    const up = await upload(`${p}.csv`, toCsv([lineRow(`${p}-1`), lineRow(`${p}-2`)]));
    expect(up.body).toMatchObject({ status: 'previewed', counts: { new: 2 } });
    const confirmed = await users.planner.post(`/api/line-imports/${up.body.id}/confirm`);
    expect(confirmed.status).toBe(200);
    expect(confirmed.body.status).toBe('applied');
    expect(await linesNamed(p)).toHaveLength(2);
    expect(await importQueue().getJob(`preview-${up.body.id}`)).toBeUndefined();
    expect(await importQueue().getJob(`apply-${up.body.id}`)).toBeUndefined();
    expect(await mailQueue().getJob(mailJobId({ purpose: 'line-import-applied', recordId: up.body.id }))).toBeUndefined();
  });
});

describe('reading the file as a spreadsheet saved it', () => {
  it('a Windows-1252 file keeps its curly quotes, dashes, ½ and €; a byte that stands for nothing rejects its row', async () => {
    const p = testPrefix('CP1252');
    const text = toCsv([
      lineRow(`${p}-1`, { service: 'Brine \x96 20\x80/m\xb3', notes: '\x93Keep\x94 \xbd" drain \x85 don\x92t' }),
      lineRow(`${p}-2`, { notes: 'odd \x81 byte' }),
    ]);
    const up = await upload(`${p}.csv`, Buffer.from(text, 'latin1'));
    expect(up.body.counts).toMatchObject({ new: 1, rejected: 1 });
    const [good, odd] = await rowsOf(up.body.id);
    expect(good.data).toMatchObject({ service: 'Brine – 20€/m³', notes: '“Keep” ½" drain … don’t' });
    expect(odd.problems).toEqual([{ column: 'notes', message: expect.stringMatching(/could not be read.*save the file as "CSV UTF-8"/) }]);
  });

  it('a cell with a quote that is never closed rejects its own row, naming it, and the rows below are previewed as usual', async () => {
    const p = testPrefix('QUOTE');
    const text = `${LINE_HEADER.join(',')}\n${toCsv([lineRow(`${p}-1`)]).split('\n')[1]}\n${p}-2,A,S,PVC,80,2,100,70,D,"5 in. reducer\n` +
      toCsv([lineRow(`${p}-3`), lineRow(`${p}-4`)]).split('\n').slice(1).join('\n');
    const up = await upload(`${p}.csv`, text);
    expect(up.body).toMatchObject({ status: 'previewed', totalRows: 4, counts: { new: 3, rejected: 1 } });
    const rows = await rowsOf(up.body.id);
    expect(rows.map((r) => [r.rowNumber, r.key, r.outcome])).toEqual([[2, `${p}-1`, 'new'], [3, `${p}-2`, 'rejected'], [4, `${p}-3`, 'new'], [5, `${p}-4`, 'new']]);
    expect(rows[1].problems).toEqual([{ column: 'notes', message: expect.stringMatching(/^A quote \(".*never closed on its row/) }]);
  });

  it('a CRLF header with LF rows, and a file with CR alone between rows, each preview every row', async () => {
    const p = testPrefix('EOL');
    const [head, ...body] = toCsv([lineRow(`${p}-1`), lineRow(`${p}-2`), lineRow(`${p}-3`)]).trimEnd().split('\n');
    const mixed = await upload(`${p}-mixed.csv`, `${head}\r\n${body.join('\n')}\n`);
    expect(mixed.body).toMatchObject({ totalRows: 3, counts: { new: 3, rejected: 0 } });
    const crOnly = await upload(`${p}-cr.csv`, `${head}\r${body.join('\r')}\r`);
    expect((await rowsOf(crOnly.body.id)).map((r) => [r.rowNumber, r.key, r.outcome])).toEqual([[2, `${p}-1`, 'new'], [3, `${p}-2`, 'new'], [4, `${p}-3`, 'new']]);
  });

  it('a CR-only file over the inline limit goes to the worker like any other large file', async () => {
    const p = testPrefix('CRBIG');
    const text = toCsv(Array.from({ length: 60 }, (_, i) => lineRow(`${p}-${i}`))).replace(/\n/g, '\r');
    const res = await upload(`${p}.csv`, text);
    expect(res.body).toMatchObject({ status: 'previewing', totalRows: 0 });
    const job = await importQueue().getJob(`preview-${res.body.id}`);
    expect(job?.data).toEqual({ importId: res.body.id, step: 'preview' });
    await job?.remove();
  });

  it('blank lines before the header and before the first row are skipped; rows keep the numbers the spreadsheet shows', async () => {
    const p = testPrefix('BLANK');
    const [head, one, two] = toCsv([lineRow(`${p}-1`), lineRow(`${p}-2`, { material: 'clay' })]).split('\n');
    const up = await upload(`${p}.csv`, `\n\n${head}\n\n,,,,,,,,,\n${one}\n\n${two}\n`);
    expect(up.status).toBe(201);
    expect((await rowsOf(up.body.id)).map((r) => [r.rowNumber, r.key, r.outcome])).toEqual([[6, `${p}-1`, 'new'], [8, `${p}-2`, 'rejected']]);
  });
});

describe('an import with nothing to write', () => {
  it('every row rejected: confirming is refused (409 nothing_to_write), nothing is applied, and another preview stays good', async () => {
    const p = testPrefix('NONE');
    const other = await upload(`${p}-other.csv`, toCsv([lineRow(`${p}-9`)]));
    const up = await upload(`${p}.csv`, toCsv([lineRow(`${p}-1`, { material: 'clay' }), lineRow(`${p}-2`, { material: 'glass' })]));
    const res = await users.planner.post(`/api/line-imports/${up.body.id}/confirm`);
    expect(res.status).toBe(409);
    expect(res.body.error).toEqual({ code: 'nothing_to_write', message: 'There is nothing to write: all 2 rows of the file are rejected. The register is left as it is; correct the file and upload it again if something should change.' });
    expect(await importRow(up.body.id)).toMatchObject({ status: 'previewed', appliedAt: null, confirmedById: null });
    expect(await AuditEntry.count({ where: { action: 'line-import-applied', entityId: up.body.id } })).toBe(0);
    expect((await users.planner.post(`/api/line-imports/${other.body.id}/confirm`)).status).toBe(200);
  });

  it('every row unchanged, or some unchanged and the rest rejected: refused the same way, in so many words', async () => {
    const p = testPrefix('SAME');
    await registerHas(p, [lineRow(`${p}-1`)]);
    const same = await upload(`${p}-same.csv`, toCsv([lineRow(`${p}-1`)]));
    const res = await users.planner.post(`/api/line-imports/${same.body.id}/confirm`);
    expect(res.status).toBe(409);
    expect(res.body.error.message).toBe("There is nothing to write: the file's only row already matches the register. The register is left as it is; correct the file and upload it again if something should change.");
    const mixed = await upload(`${p}-mixed.csv`, toCsv([lineRow(`${p}-1`), lineRow(`${p}-2`, { material: 'clay' }), lineRow(`${p}-3`, { material: 'clay' })]));
    const refused = await users.planner.post(`/api/line-imports/${mixed.body.id}/confirm`);
    expect(refused.body.error).toEqual({ code: 'nothing_to_write', message: expect.stringMatching(/^There is nothing to write: of the file's 3 rows, 2 are rejected and 1 already matches the register\./) });
  });
});

describe('past imports', () => {
  it('lists imports newest first, a page at a time, each with who uploaded it', async () => {
    const p = testPrefix('LIST');
    const first = await upload(`${p}-1.csv`, toCsv([lineRow(`${p}-1`)]));
    const second = await upload(`${p}-2.csv`, toCsv([lineRow(`${p}-2`)]));
    const page = await users.planner.get('/api/line-imports?page=1&pageSize=2');
    expect(page.status).toBe(200);
    expect(importListResponseSchema.strict().parse(page.body).rows.map((r) => r.id)).toEqual([second.body.id, first.body.id]);
    expect(page.body.rows[0]).toMatchObject({ filename: `${p}-2.csv`, status: 'previewed', uploadedBy: 'Ines Varga', cancelledAt: null });
    expect(page.body.total).toBe(await LineImport.count());
    const next = await users.planner.get('/api/line-imports?page=2&pageSize=1');
    expect(next.body.rows.map((r: any) => r.id)).toEqual([first.body.id]);
    const dflt = await users.planner.get('/api/line-imports');
    expect(dflt.body.rows.length).toBe(Math.min(20, dflt.body.total));
    expect((await users.planner.get('/api/line-imports?pageSize=101')).status).toBe(400);
    expect((await users.planner.get('/api/line-imports?page=0')).status).toBe(400);
  });
});

describe('cancelling an import', () => {
  const cancel = (id: string) => users.planner.post(`/api/line-imports/${id}/cancellation`, {});

  it('a previewed import: 200 with status cancelled, its preview rows gone, nothing written, and an audit entry names who', async () => {
    const p = testPrefix('CANCEL');
    const up = await upload(`${p}.csv`, toCsv([lineRow(`${p}-1`), lineRow(`${p}-2`)]));
    const res = await cancel(up.body.id);
    expect(res.status).toBe(200);
    expect(lineImportSchema.parse(res.body)).toMatchObject({ id: up.body.id, status: 'cancelled', appliedAt: null, uploadedBy: 'Ines Varga' });
    expect(Date.parse(res.body.cancelledAt)).toBeGreaterThan(Date.parse(res.body.createdAt) - 1);
    expect(await LineImportRow.count({ where: { importId: up.body.id } })).toBe(0);
    expect(await linesNamed(p)).toEqual([]);
    const me = (await users.planner.get('/api/me')).body;
    const audit = await AuditEntry.findAll({ where: { action: 'line-import-cancelled', entityId: up.body.id } });
    expect(audit.map((a) => [a.actorId, a.before, a.after])).toEqual([[me.id, { status: 'previewed' }, { status: 'cancelled', kind: 'lines', filename: `${p}.csv` }]]);

    const again = await cancel(up.body.id);
    expect(again.status).toBe(409);
    expect(again.body.error.message).toBe('This import has already been cancelled.');
    const confirm = await users.planner.post(`/api/line-imports/${up.body.id}/confirm`);
    expect(confirm.status).toBe(409);
    expect(confirm.body.error.message).toMatch(/^This import was cancelled/);
  });

  it('an applied or a failed import cannot be cancelled (409), and stays as it was', async () => {
    const p = testPrefix('NOCANCEL');
    const applied = await registerHas(p, [lineRow(`${p}-1`)]);
    const res = await cancel(applied.id);
    expect(res.status).toBe(409);
    expect(res.body.error.message).toBe('This import has already been written to the register, so it can no longer be cancelled.');
    expect((await importRow(applied.id))?.status).toBe('applied');

    const up = await upload(`${p}-2.csv`, toCsv([lineRow(`${p}-2`)]));
    await LineImport.update({ status: 'failed', error: 'The import stopped.' }, { where: { id: up.body.id } });
    const failed = await cancel(up.body.id);
    expect(failed.status).toBe(409);
    expect(failed.body.error.message).toBe('This import failed, so nothing of it was written and there is nothing to cancel.');
    expect(await AuditEntry.count({ where: { action: 'line-import-cancelled', entityId: [applied.id, up.body.id] } })).toBe(0);
    expect((await users.planner.post('/api/line-imports/00000000-0000-4000-8000-000000000000/cancellation', {})).status).toBe(404);
  });

  it('a large import still waiting for its preview: cancelled, and the worker\'s preview then writes nothing', async () => {
    const p = testPrefix('CANPRE');
    const up = await upload(`${p}.csv`, toCsv(Array.from({ length: 60 }, (_, i) => lineRow(`${p}-${i}`))));
    expect(up.body.status).toBe('previewing');
    expect((await cancel(up.body.id)).body.status).toBe('cancelled');
    await processImport({ data: { importId: up.body.id, step: 'preview' } }); // what the worker does with the job
    expect(await importRow(up.body.id)).toMatchObject({ status: 'cancelled', totalRows: 0 });
    expect(await LineImportRow.count({ where: { importId: up.body.id } })).toBe(0);
    await importQueue().remove(`preview-${up.body.id}`);
  });

  it('a large import confirmed and waiting for the worker: cancelled, and the worker\'s apply then writes nothing and mails nobody', async () => {
    const p = testPrefix('CANAPP');
    const up = await upload(`${p}.csv`, toCsv(Array.from({ length: 60 }, (_, i) => lineRow(`${p}-${i}`))));
    await importQueue().remove(`preview-${up.body.id}`);
    await processImport({ data: { importId: up.body.id, step: 'preview' } });
    const confirmed = await users.planner.post(`/api/line-imports/${up.body.id}/confirm`);
    expect(confirmed.body.status).toBe('applying');
    const res = await cancel(up.body.id);
    expect(res.body).toMatchObject({ status: 'cancelled', appliedAt: null });
    expect(await LineImportRow.count({ where: { importId: up.body.id } })).toBe(0);
    await processImport({ data: { importId: up.body.id, step: 'apply' } });
    expect((await importRow(up.body.id))?.status).toBe('cancelled');
    expect(await linesNamed(p)).toEqual([]);
    expect(await AuditEntry.count({ where: { action: 'line-import-applied', entityId: up.body.id } })).toBe(0);
    expect(await mailQueue().getJob(mailJobId({ purpose: 'line-import-applied', recordId: up.body.id }))).toBeUndefined();
    expect(await mailQueue().getJob(mailJobId({ purpose: 'line-import-failed', recordId: up.body.id }))).toBeUndefined();
    await importQueue().remove(`apply-${up.body.id}`);
    // The kind is not left busy: another file can be confirmed.
    expect((await registerHas(`${p}-X`, [lineRow(`${p}-X-1`)])).status).toBe('applied');
  });
});
