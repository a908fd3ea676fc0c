// Past one machine: two API processes and two workers on the same PostgreSQL and Redis, as a plant
// with more users would run them. Every hold is lifted once, every mail sent once, and of two
// releases of one order sent to different API processes exactly one succeeds.
import { spawn, type ChildProcess } from 'node:child_process';
import { createHmac, randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { config } from '@server/config';
import { sequelize } from '@server/db/sequelize';
import { AuditEntry } from '@server/db/models/audit-entry';
import { Hold } from '@server/db/models/joint-record';
import { Person } from '@server/db/models/person';
import { PressureTest } from '@server/db/models/release';
import { WorkOrder } from '@server/db/models/work-order';
import { closeQueues } from '@server/queues/connection';
import { scheduleHoldLift } from '@server/queues/holds';
import { useTestApp } from '../helpers/app';
import { TEST_PORTS } from '../helpers/ports';
import { waitFor } from '../helpers/import-csv';
import { makeLines, uniquePrefix } from '../helpers/line-rows';
import { isolatedOrder, recordStepsThrough } from '../helpers/lockout';
import { mailMentioning } from '../helpers/mail';
import { plantForWorkOrders } from '../helpers/work-orders';

const users = useTestApp({ signIn: ['planner', 'fitter', 'operations'], before: plantForWorkOrders });
const API_PORTS = [TEST_PORTS.app + 20, TEST_PORTS.app + 21];
const children: ChildProcess[] = [];
const env = { ...process.env, APP_ORIGIN: config.origin, LOG_LEVEL: 'warn' };
const start = (file: string, extra: Record<string, string> = {}) => {
  const child = spawn(process.execPath, ['--import', 'tsx', file], { env: { ...env, ...extra }, stdio: 'ignore' });
  children.push(child);
  return child;
};
const exited = (c: ChildProcess) => new Promise<void>((ok) => (c.exitCode !== null || c.signalCode !== null ? ok() : c.once('exit', () => ok())));

beforeAll(async () => {
  for (const port of API_PORTS) start('server/index.ts', { PORT: String(port), LW_PROCESS: 'api' });
  for (let i = 0; i < 2; i++) start('worker/index.ts', { LW_PROCESS: 'worker' });
  for (const port of API_PORTS) await waitFor(`the API on ${port}`, () => fetch(`http://127.0.0.1:${port}/api/health`).then((r) => r.status).catch(() => 0), (s) => s === 200, 30_000);
}, 60_000);
afterAll(async () => {
  for (const c of children) c.kill('SIGTERM');
  await Promise.all(children.map(exited));
  await closeQueues();
});

/** A session for `personId` written straight into the session store, with express-session's signed cookie. */
async function sessionCookie(personId: string): Promise<string> {
  const sid = randomUUID();
  const expires = new Date(Date.now() + 3_600_000);
  const sess = { cookie: { originalMaxAge: 3_600_000, expires: expires.toISOString(), httpOnly: true, path: '/', sameSite: 'lax' }, personId };
  await sequelize.query('insert into user_sessions (sid, sess, expire) values (:sid, :sess, :expire)', { replacements: { sid, sess: JSON.stringify(sess), expire: expires } });
  const mac = createHmac('sha256', config.sessionSecret).update(sid).digest('base64').replace(/=+$/, '');
  return `lw.sid=${encodeURIComponent(`s:${sid}.${mac}`)}`;
}

describe('two API processes and two workers', () => {
  it('lift each hold once and send each mail once', async () => {
    const { order, jointIds } = await isolatedOrder(users, { joints: 2 });
    for (const j of jointIds) await recordStepsThrough(users.fitter, j, 'assembly');
    const holds = await Hold.findAll({ where: { workOrderId: order.id } });
    for (const h of holds) {
      await h.update({ endsAt: new Date(Date.now() + 1500) }); // due in a moment: both workers are waiting
      await scheduleHoldLift(h.id, 1500);
    }
    await waitFor('every hold lifted', () => Hold.findAll({ where: { workOrderId: order.id } }), (hs) => hs.every((h) => h.status === 'ended'), 20_000);
    const ended = await AuditEntry.findAll({ where: { entity: 'work-order', entityId: order.id, action: 'hold-ended' } });
    expect(ended).toHaveLength(holds.length);
    expect((await WorkOrder.findByPk(order.id))!.state).toBe('testing');
    const mails = await waitFor('the mails', () => mailMentioning(order.number), (m) => m.filter((x) => x.subject.includes('run out')).length >= 2 && m.some((x) => x.subject.includes('hydrostatic test')), 20_000);
    await new Promise((r) => setTimeout(r, 2000)); // time for a duplicate to arrive, if there were one
    const again = await mailMentioning(order.number);
    expect(again.filter((x) => x.subject.includes('cure hold has run out'))).toHaveLength(2);
    expect(again.filter((x) => x.subject.includes('ready for its hydrostatic test'))).toHaveLength(1);
    expect(mails.length).toBeLessThanOrEqual(again.length);
  }, 60_000);

  it('of two releases of one order sent to different API processes, exactly one succeeds', async () => {
    const { order } = await isolatedOrder(users, { joints: 1 });
    // A ready order as the test and the lock removals would leave it.
    await sequelize.query('update locks set removed_at = now(), removal = \'owner\', removed_by_id = person_id where work_order_id = :id', { replacements: { id: order.id } });
    await WorkOrder.update({ state: 'ready' }, { where: { id: order.id } });
    const witness = (await Person.findOne({ where: { subject: 'operations' } }))!;
    await PressureTest.create({ workOrderId: order.id, result: 'passed', medium: 'water', testPressurePsi: 150, gauge: 'PI-T1', startedAt: new Date(Date.now() - 1_200_000), startReadingPsi: 150, endedAt: new Date(Date.now() - 60_000), endReadingPsi: 150, pipingIdentified: 'test', examiner: 'test', notes: null, witnessId: witness.id, recordedAt: new Date() });
    const cookie = await sessionCookie(witness.id);
    const body = JSON.stringify({ areaInspected: true, peopleClear: true, affectedTold: true, ventsDrainsSet: true, slowRefill: true });
    const statuses = await Promise.all(API_PORTS.map((port) =>
      fetch(`http://127.0.0.1:${port}/api/work-orders/${order.id}/release`, { method: 'POST', headers: { cookie, origin: config.origin, 'content-type': 'application/json' }, body }).then((r) => r.status)));
    expect(statuses.sort()).toEqual([201, 409]);
    expect((await WorkOrder.findByPk(order.id))!.state).toBe('released');
  }, 30_000);

  it('a withdrawn role ends on the next request to either API process, and a register count kept by one follows a write made elsewhere', async () => {
    const fitter = (await Person.findOne({ where: { subject: 'fitter' } }))!;
    const cookie = await sessionCookie(fitter.id);
    const get = (port: number, p: string) => fetch(`http://127.0.0.1:${port}${p}`, { headers: { cookie } }).then(async (r) => ({ status: r.status, body: await r.json() }));
    const p = uniquePrefix('TWO');
    await makeLines(p, [{}]);
    for (const port of API_PORTS) {
      expect((await get(port, '/api/me')).body.roles).toContain('fitter');
      expect((await get(port, `/api/lines?area=${encodeURIComponent(`${p} area`)}`)).body.total).toBe(1);
    }
    await makeLines(`${p}-2`, [{ area: `${p} area` }]);
    for (const port of API_PORTS) expect((await get(port, `/api/lines?area=${encodeURIComponent(`${p} area`)}`)).body.total, String(port)).toBe(2);
    await Person.update({ rolesWithdrawn: ['fitter'] }, { where: { id: fitter.id } });
    try {
      for (const port of API_PORTS) {
        expect((await get(port, '/api/me')).body.roles, String(port)).toEqual([]);
        expect((await get(port, '/api/shift')).status, String(port)).toBe(403);
      }
    } finally {
      await Person.update({ rolesWithdrawn: [] }, { where: { id: fitter.id } });
    }
  }, 30_000);
});
