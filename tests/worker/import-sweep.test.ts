import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Op } from 'sequelize';
import { sequelize } from '@server/db/sequelize';
import { AuditEntry } from '@server/db/models/audit-entry';
import { Line } from '@server/db/models/line';
import { LineImport } from '@server/db/models/line-import';
import { Person } from '@server/db/models/person';
import { closeQueues, redis } from '@server/queues/connection';
import { importJobState, importQueue } from '@server/queues/line-imports';
import { SWEEP, sweepQueue } from '@server/queues/sweeps';
import { STOPPED_MESSAGE, recoverStalledImports, recoveryFor } from '@server/services/line-imports/recovery';
import { confirmImport, previewImport, uploadImport } from '@server/services/line-imports/import-service';
import type { Me } from '@shared/schemas/roles';
import { startWorkers } from '../../worker/workers';
import { processSweep } from '../../worker/processors/sweep';
import { lineRow, testPrefix, toCsv, waitFor } from '../helpers/import-csv';
import { mailMentioning } from '../helpers/mail';

// Workers are started only once the stuck state is set up, so no worker can take a job first.
let workers: ReturnType<typeof startWorkers> | null = null;
let me: Me;
const SWEEP_PLANNER_MAIL = 'sweep.planner@marrowby.invalid';
beforeAll(async () => {
  const [person] = await Person.findOrCreate({
    where: { issuer: 'linewright-test', subject: 'import-sweep' },
    defaults: { issuer: 'linewright-test', subject: 'import-sweep', name: 'Import sweep test', email: SWEEP_PLANNER_MAIL, lastSignInAt: null },
  });
  // A person with an address, so the sweep's mail to whoever confirmed really goes somewhere.
  await person.update({ email: SWEEP_PLANNER_MAIL });
  me = { id: person.id, name: person.name, email: SWEEP_PLANNER_MAIL, roles: ['planner'] };
});
afterAll(async () => {
  await workers?.close();
  await closeQueues();
});

const statusOf = async (id: string) => (await LineImport.findByPk(id))!;
const linesWith = (p: string) => Line.count({ where: { lineNumber: { [Op.startsWith]: p } } });
const sweep = () => processSweep({ data: {} });
/** As if the row had been left alone past the sweep's grace period. */
const age = (id: string) => sequelize.query(`update line_imports set updated_at = now() - interval '5 minutes' where id = $1`, { bind: [id] });

/** A large (queued) lines import, previewed and confirmed, with no worker having run its apply job yet. */
async function confirmedLarge(p: string, rows = 60) {
  const up = await uploadImport(me, { filename: `${p}.csv`, buffer: Buffer.from(toCsv(Array.from({ length: rows }, (_, i) => lineRow(`${p}-${i}`)))) });
  expect(up.status).toBe('previewing');
  await importQueue().remove(`preview-${up.id}`);
  await previewImport(up.id); // what the worker would have done
  const confirmed = await confirmImport(me, up.id);
  expect(confirmed.status).toBe('applying');
  expect(await importJobState({ importId: up.id, step: 'apply' })).toBe('waiting');
  return up.id;
}

describe('the import sweep', () => {
  it('decides from the job alone: missing runs again, finished has stopped, anything else is left to BullMQ', () => {
    expect(recoveryFor(null)).toBe('requeue');
    expect(recoveryFor('failed')).toBe('fail');
    expect(recoveryFor('completed')).toBe('fail');
    for (const s of ['waiting', 'delayed', 'prioritized', 'active', 'waiting-children'] as const) expect(recoveryFor(s)).toBe('leave');
  });

  it('queues an apply whose job Redis lost again, and the import is applied with its lines written', async () => {
    const p = testPrefix('SWEEP');
    const id = await confirmedLarge(p);
    await importQueue().remove(`apply-${id}`); // as if Redis were flushed or the job lost
    expect(await importJobState({ importId: id, step: 'apply' })).toBeNull();

    // Stuck: a later confirm of the same kind is refused as busy.
    const other = await uploadImport(me, { filename: `${p}-small.csv`, buffer: Buffer.from(toCsv([lineRow(`${p}-small`)])) });
    await expect(confirmImport(me, other.id)).rejects.toMatchObject({ status: 409, message: expect.stringContaining('is being written') });

    expect((await recoverStalledImports()).requeued).not.toContain(id); // still within the grace period
    await age(id);
    await sweep();
    expect(await importJobState({ importId: id, step: 'apply' })).toBe('waiting');

    workers = startWorkers();
    await waitFor('the apply', () => statusOf(id), (imp) => imp.status !== 'applying', 30_000);
    expect(await statusOf(id)).toMatchObject({ status: 'applied', progress: 100, error: null });
    expect(await linesWith(`${p}-`)).toBe(60); // the small file was refused
    expect(await AuditEntry.count({ where: { action: 'line-import-applied', entityId: id } })).toBe(1);

    // Once applied, sweeping again changes nothing.
    await age(id);
    expect(await recoverStalledImports()).toMatchObject({ requeued: expect.not.arrayContaining([id]), failed: expect.not.arrayContaining([id]) });
    expect((await statusOf(id)).status).toBe('applied');
    await workers.close();
    workers = null;
  });

  it('marks an import whose apply job failed as failed, with the reason, and writes nothing', async () => {
    const p = testPrefix('SWFAIL');
    const id = await confirmedLarge(p);
    // A job that fails before it touches the import (as a job that stalled too often, or whose worker died, would).
    await importQueue().remove(`apply-${id}`);
    await importQueue().add('apply', { importId: 'not-an-id', step: 'apply' }, { jobId: `apply-${id}`, attempts: 1 });
    workers = startWorkers();
    await waitFor('the job to fail', () => importJobState({ importId: id, step: 'apply' }), (s) => s === 'failed');
    expect((await statusOf(id)).status).toBe('applying');

    await age(id);
    await sweep();
    expect(await statusOf(id)).toMatchObject({ status: 'failed', error: STOPPED_MESSAGE });
    expect(await linesWith(`${p}-`)).toBe(0);
    expect(await AuditEntry.count({ where: { action: 'line-import-applied', entityId: id } })).toBe(0);

    // The planner who confirmed it is told, once, in plain text and HTML, with the reason.
    const [mail, ...more] = await waitFor('the failure mail', () => mailMentioning(`${p}.csv`), (m) => m.length > 0);
    expect(mail!.to).toEqual([SWEEP_PLANNER_MAIL]);
    expect(mail!.subject).toBe(`Line register import failed: ${p}.csv`);
    expect(mail!.text).toContain(STOPPED_MESSAGE);
    expect(mail!.html).toContain('could not be written to the line register');
    expect(more).toEqual([]);
    await sweep(); // sweeping again finds nothing to do and sends nothing more
    expect(await mailMentioning(`${p}.csv`)).toHaveLength(1);

    // The kind is no longer busy: a new file can be confirmed.
    const again = await uploadImport(me, { filename: `${p}-again.csv`, buffer: Buffer.from(toCsv([lineRow(`${p}-again`)])) });
    expect((await confirmImport(me, again.id)).status).toBe('applied');
  });
});

describe('the sweep schedule', () => {
  it('comes back after Redis is flushed under a running worker, and the sweep then recovers what the flush lost', async () => {
    await workers?.close();
    workers = startWorkers({ sweepWatchMs: 200 });
    await waitFor('the schedule', () => sweepQueue().getJobScheduler(SWEEP), (s) => !!s);

    // A large import the worker previews; then, as if confirmed and its apply job lost, it waits for ever.
    const p = testPrefix('FLUSH');
    const up = await uploadImport(me, { filename: `${p}.csv`, buffer: Buffer.from(toCsv(Array.from({ length: 60 }, (_, i) => lineRow(`${p}-${i}`)))) });
    await waitFor('the preview', () => statusOf(up.id), (imp) => imp.status === 'previewed');
    await LineImport.update({ status: 'applying', confirmedById: me.id }, { where: { id: up.id } });
    await age(up.id);

    await redis().flushall();
    expect(await sweepQueue().getJobScheduler(SWEEP)).toBeFalsy();
    await waitFor('the schedule to come back', () => sweepQueue().getJobScheduler(SWEEP), (s) => !!s, 10_000);
    await waitFor('the lost apply to be recovered and run', () => statusOf(up.id), (imp) => imp.status === 'applied', 30_000);
    expect(await linesWith(`${p}-`)).toBe(60);
  });
});
