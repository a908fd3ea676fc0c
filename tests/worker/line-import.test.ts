import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Op } from 'sequelize';
import { sequelize } from '@server/db/sequelize';
import { AuditEntry } from '@server/db/models/audit-entry';
import { Line } from '@server/db/models/line';
import { LineImportRow } from '@server/db/models/line-import';
import { closeQueues } from '@server/queues/connection';
import { importJobState } from '@server/queues/line-imports';
import { startWorkers } from '../../worker/workers';
import { processImport } from '../../worker/processors/line-import';
import { useTestApp } from '../helpers/app';
import { mailMentioning } from '../helpers/mail';
import { lineRow, testPrefix, toCsv, waitFor } from '../helpers/import-csv';

const users = useTestApp({ signIn: ['planner'] });
let workers: ReturnType<typeof startWorkers>;
beforeAll(() => void (workers = startWorkers()));
afterAll(async () => {
  await workers.close();
  await closeQueues();
});

const importOf = (id: string) => async () => (await users.planner.get(`/api/line-imports/${id}`)).body;
const mailAbout = mailMentioning;
const runAgain = (importId: string, step: 'preview' | 'apply') => processImport({ data: { importId, step } });

describe('a large import goes through the worker', () => {
  it('is previewed and applied by the worker, progress reaches 100, and the planner who confirmed gets a mail', async () => {
    const p = testPrefix('WRK');
    const file = `${p}.csv`;
    const up = await users.planner.upload('/api/line-imports', file, toCsv(Array.from({ length: 60 }, (_, i) => lineRow(`${p}-${String(i).padStart(3, '0')}`, i === 7 ? { material: 'glass' } : {}))));
    expect(up.status).toBe(201);
    expect(up.body.status).toBe('previewing');

    const previewed = await waitFor('the preview', importOf(up.body.id), (b) => b.status !== 'previewing');
    expect(previewed).toMatchObject({ status: 'previewed', progress: 100, totalRows: 60, counts: { new: 59, changed: 0, unchanged: 0, rejected: 1 } });
    expect(await LineImportRow.count({ where: { importId: up.body.id } })).toBe(60);

    const confirm = await users.planner.post(`/api/line-imports/${up.body.id}/confirm`);
    expect(confirm.status).toBe(202);
    expect(confirm.body).toMatchObject({ status: 'applying', progress: 0 });
    const applied = await waitFor('the apply', importOf(up.body.id), (b) => b.status !== 'applying');
    expect(applied).toMatchObject({ status: 'applied', progress: 100, error: null });
    expect(await Line.count({ where: { lineNumber: { [Op.startsWith]: p } } })).toBe(59);
    expect(await AuditEntry.count({ where: { action: 'line-import-applied', entityId: up.body.id } })).toBe(1);

    const [mail, ...more] = await waitFor('the mail', () => mailAbout(file), (m) => m.length > 0);
    expect(more).toEqual([]);
    expect(mail!.to).toEqual(['ines.varga@marrowby.invalid']);
    expect(mail!.subject).toBe('Line register import finished: 59 new, 0 changed, 0 unchanged, 1 skipped');
    expect(mail!.text).toContain(`/imports/${up.body.id}`);
  });

  it('shows the apply progress while its transaction is still open', async () => {
    const p = testPrefix('PROG');
    const rows = Array.from({ length: 12_000 }, (_, i) => lineRow(`${p}-${String(i).padStart(5, "0")}`));
    const up = await users.planner.upload('/api/line-imports', `${p}.csv`, toCsv(rows));
    await waitFor('the preview', importOf(up.body.id), (b) => b.status === 'previewed', 60_000);
    // A line in the second chunk of 10,000 holds its statement for a moment, so the first chunk's progress shows.
    const fn = `lw_test_slow_${p.replace(/\W/g, '_').toLowerCase()}`;
    await sequelize.query(`create function ${fn}() returns trigger language plpgsql as $$ begin
      if new.line_number = '${p}-11000' then perform pg_sleep(1); end if; return new; end $$`);
    await sequelize.query(`create trigger ${fn} before insert on lines for each row execute function ${fn}()`);
    try {
      expect((await users.planner.post(`/api/line-imports/${up.body.id}/confirm`)).status).toBe(202);
      const midway = await waitFor('progress part-way', importOf(up.body.id), (b) => b.status !== 'applying' || (b.progress > 0 && b.progress < 100), 60_000);
      expect(midway.status).toBe('applying');
      expect(midway.progress).toBeGreaterThan(0);
      expect(midway.progress).toBeLessThan(100);
      // nothing visible before the commit: a large apply rebuilds the search indexes in its transaction,
      // so a reader either waits for the commit (here: gives up after 300 ms) or sees none of the lines
      const visible = await sequelize.transaction(async (t) => {
        await sequelize.query("set local lock_timeout = '300ms'", { transaction: t });
        return Line.count({ where: { lineNumber: { [Op.startsWith]: p } }, transaction: t }).catch((err: { parent?: { code?: string } }) => {
          if (err.parent?.code === '55P03') return 0; // lock_not_available: the apply holds the table until it commits
          throw err;
        });
      });
      expect(visible).toBe(0);
      const done = await waitFor('the apply', importOf(up.body.id), (b) => b.status !== 'applying', 60_000);
      expect(done).toMatchObject({ status: 'applied', progress: 100 });
    } finally {
      await sequelize.query(`drop trigger ${fn} on lines; drop function ${fn}()`);
    }
    expect(await Line.count({ where: { lineNumber: { [Op.startsWith]: p } } })).toBe(12_000);
  });

  it('running a finished preview or apply job again changes nothing and sends no second mail', async () => {
    const p = testPrefix('AGAIN');
    const file = `${p}.csv`;
    const up = await users.planner.upload('/api/line-imports', file, toCsv(Array.from({ length: 55 }, (_, i) => lineRow(`${p}-${i}`))));
    await waitFor('the preview', importOf(up.body.id), (b) => b.status === 'previewed');
    await runAgain(up.body.id, 'preview');
    expect(await LineImportRow.count({ where: { importId: up.body.id } })).toBe(55);

    await users.planner.post(`/api/line-imports/${up.body.id}/confirm`);
    await waitFor('the apply', importOf(up.body.id), (b) => b.status === 'applied');
    await waitFor('the mail', () => mailAbout(file), (m) => m.length === 1);
    const before = (await Line.findOne({ where: { lineNumber: `${p}-0` } }))!.updatedAt;
    await runAgain(up.body.id, 'apply');
    await runAgain(up.body.id, 'preview');

    expect((await Line.findOne({ where: { lineNumber: `${p}-0` } }))!.updatedAt).toEqual(before);
    expect(await AuditEntry.count({ where: { action: 'line-import-applied', entityId: up.body.id } })).toBe(1);
    expect(await LineImportRow.count({ where: { importId: up.body.id } })).toBe(55);
    await new Promise((r) => setTimeout(r, 300));
    expect(await mailAbout(file)).toHaveLength(1);
  });

  it('a failed apply in the worker writes nothing, marks the import failed and tells the planner', async () => {
    const p = testPrefix('WFAIL');
    const file = `${p}.csv`;
    const up = await users.planner.upload('/api/line-imports', file, toCsv(Array.from({ length: 60 }, (_, i) => lineRow(`${p}-${i}`))));
    await waitFor('the preview', importOf(up.body.id), (b) => b.status === 'previewed');
    const fn = `lw_test_refuse_${p.replace(/\W/g, '_').toLowerCase()}`;
    await sequelize.query(`create function ${fn}() returns trigger language plpgsql as $$ begin
      if new.line_number = '${p}-42' then raise exception 'line % refused by a test trigger', new.line_number; end if; return new; end $$`);
    await sequelize.query(`create trigger ${fn} before insert on lines for each row execute function ${fn}()`);
    try {
      expect((await users.planner.post(`/api/line-imports/${up.body.id}/confirm`)).status).toBe(202);
      const failed = await waitFor('the apply', importOf(up.body.id), (b) => b.status !== 'applying');
      expect(failed).toMatchObject({ status: 'failed', error: expect.stringMatching(/^Nothing was written: the database refused the import \(line .*-42 refused by a test trigger\)/) });
    } finally {
      await sequelize.query(`drop trigger ${fn} on lines; drop function ${fn}()`);
    }
    expect(await Line.count({ where: { lineNumber: { [Op.startsWith]: p } } })).toBe(0);
    const [mail] = await waitFor('the mail', () => mailAbout(file), (m) => m.length > 0);
    expect(mail!.subject).toBe(`Line register import failed: ${file}`);
  });
});

describe('cancelling while the worker runs the import', () => {
  const cancel = (id: string) => users.planner.post(`/api/line-imports/${id}/cancellation`, {});
  const jobDone = (importId: string, step: 'preview' | 'apply') =>
    waitFor(`the ${step} job`, () => importJobState({ importId, step }), (s) => s === 'completed' || s === 'failed', 60_000);

  it('cancelled part-way through its preview, the worker stops between chunks and writes no preview row', async () => {
    const p = testPrefix('WCANPRE');
    // A row of the first chunk holds its COPY for a moment, so the cancel lands while the preview runs.
    const fn = `lw_test_slow_${p.replace(/\W/g, '_').toLowerCase()}`;
    await sequelize.query(`create function ${fn}() returns trigger language plpgsql as $$ begin
      if new.key = '${p}-00500' then perform pg_sleep(1.5); end if; return new; end $$`);
    await sequelize.query(`create trigger ${fn} before insert on line_import_rows for each row execute function ${fn}()`);
    try {
      const rows = Array.from({ length: 25_000 }, (_, i) => lineRow(`${p}-${String(i).padStart(5, '0')}`));
      const up = await users.planner.upload('/api/line-imports', `${p}.csv`, toCsv(rows));
      await waitFor('progress part-way', importOf(up.body.id), (b) => b.status !== 'previewing' || b.progress > 0, 60_000);
      const res = await cancel(up.body.id);
      expect(res.status).toBe(200);
      expect(res.body.status).toBe('cancelled');
      expect(await jobDone(up.body.id, 'preview')).toBe('completed');
      expect(await importOf(up.body.id)()).toMatchObject({ status: 'cancelled', totalRows: 0, error: null });
      expect(await LineImportRow.count({ where: { importId: up.body.id } })).toBe(0);
    } finally {
      await sequelize.query(`drop trigger ${fn} on line_import_rows; drop function ${fn}()`);
    }
  });

  it('cancelled while its apply is writing, the apply rolls back: no line, no audit entry, no mail', async () => {
    const p = testPrefix('WCANAPP');
    const file = `${p}.csv`;
    const rows = Array.from({ length: 12_000 }, (_, i) => lineRow(`${p}-${String(i).padStart(5, '0')}`));
    const up = await users.planner.upload('/api/line-imports', file, toCsv(rows));
    await waitFor('the preview', importOf(up.body.id), (b) => b.status === 'previewed', 60_000);
    const fn = `lw_test_slow_${p.replace(/\W/g, '_').toLowerCase()}`;
    await sequelize.query(`create function ${fn}() returns trigger language plpgsql as $$ begin
      if new.line_number = '${p}-11000' then perform pg_sleep(1.5); end if; return new; end $$`);
    await sequelize.query(`create trigger ${fn} before insert on lines for each row execute function ${fn}()`);
    try {
      expect((await users.planner.post(`/api/line-imports/${up.body.id}/confirm`)).status).toBe(202);
      await waitFor('progress part-way', importOf(up.body.id), (b) => b.status !== 'applying' || b.progress > 0, 60_000);
      const res = await cancel(up.body.id);
      expect(res.body).toMatchObject({ status: 'cancelled', appliedAt: null });
      expect(await jobDone(up.body.id, 'apply')).toBe('completed');
    } finally {
      await sequelize.query(`drop trigger ${fn} on lines; drop function ${fn}()`);
    }
    expect((await importOf(up.body.id)()).status).toBe('cancelled');
    expect(await Line.count({ where: { lineNumber: { [Op.startsWith]: p } } })).toBe(0);
    expect(await AuditEntry.count({ where: { action: 'line-import-applied', entityId: up.body.id } })).toBe(0);
    expect(await AuditEntry.count({ where: { action: 'line-import-cancelled', entityId: up.body.id } })).toBe(1);
    await new Promise((r) => setTimeout(r, 300));
    expect(await mailAbout(file)).toEqual([]);
  });
});
