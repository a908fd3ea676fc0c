// Lockout of an order's section (OSHA 29 CFR 1910.147; DESIGN.md section 10) as its people would
// meet it: personal locks on the plan's points, the group lock box, the verification of zero
// energy, removal by the owner or under the (e)(3) procedure (with mail to the owner), a shift
// handover without a gap, and what the state machine refuses while locks are on.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { AuditEntry } from '@server/db/models/audit-entry';
import { JointStepRecord } from '@server/db/models/joint-record';
import { Line } from '@server/db/models/line';
import { IsolationVerification, Lock, LockBox } from '@server/db/models/lockout';
import { WorkOrder } from '@server/db/models/work-order';
import { closeQueues } from '@server/queues/connection';
import type { LockDto, LockoutDto } from '@shared/schemas/lockout';
import { startWorkers } from '../../worker/workers';
import { useTestApp } from '../helpers/app';
import type { Browserless } from '../helpers/browserless';
import { waitFor } from '../helpers/import-csv';
import { board, isolatedOrder, lockEveryPoint, lockNo, plannedOrder, recordStep, verificationOf } from '../helpers/lockout';
import { mailMentioning } from '../helpers/mail';
import { plantForWorkOrders } from '../helpers/work-orders';

const users = useTestApp({ signIn: ['planner', 'fitter', 'fitter2', 'operations', 'supervisor'], before: plantForWorkOrders });
let workers: ReturnType<typeof startWorkers>;
beforeAll(() => void (workers = startWorkers()));
afterAll(async () => {
  await workers.close();
  await closeQueues();
});

const ids = new Map<string, string>();
async function idOf(who: 'fitter' | 'fitter2' | 'operations' | 'supervisor'): Promise<string> {
  if (!ids.has(who)) ids.set(who, (await users[who].get('/api/me')).body.id as string);
  return ids.get(who)!;
}
const TOMAS = 'Tomas Lind';
const NOOR = 'Noor Haddad';
const RAFE = 'Rafe Adeyemi';

const auditOf = (orderId: string, action: string) => AuditEntry.findAll({ where: { entity: 'work-order', entityId: orderId, action }, order: [['id', 'ASC']] });
const locksOf = (orderId: string) => Lock.findAll({ where: { workOrderId: orderId }, order: [['appliedAt', 'ASC'], ['lockNumber', 'ASC']] });
const stateOf = async (orderId: string) => (await WorkOrder.findByPk(orderId))!.state;
const apply = (who: Browserless, orderId: string, locks: unknown[]) => who.tablet(`/api/work-orders/${orderId}/locks`, { locks });
const removal = (who: Browserless, lockId: string, body: unknown = {}) => who.tablet(`/api/locks/${lockId}/removal`, body);
const verify = (who: Browserless, orderId: string, body: unknown) => who.tablet(`/api/work-orders/${orderId}/verification`, body);
/** The order's plan points: the register valve first, then the drain the helper adds. */
async function pointsOf(orderId: string) {
  const b = await board(users.planner, orderId);
  const valve = b.points.find((p) => p.kind === 'valve')!;
  const drain = b.points.find((p) => p.kind === 'drain')!;
  expect(valve && drain, 'the plan has a valve and a drain').toBeTruthy();
  return { valve, drain, board: b };
}
const ABSENT = {
  notAtFacility: true,
  contactAttempts: 'Called his mobile twice & his home number <no answer>; texted him.',
  contactAttemptedAt: '2026-11-30T06:40:00-06:00',
  informBeforeReturn: 'The shift lead meets him at the gate before he clocks in.',
};

describe('applying locks', () => {
  it('puts the fitter\'s own locks on the points: rows, an audit entry, and a board that shows who is locked on where', async () => {
    const { order } = await plannedOrder(users);
    const { valve, drain } = await pointsOf(order.id);
    const [n1, n2] = [lockNo('T'), lockNo('T')];
    const res = await apply(users.fitter, order.id, [{ entryId: valve.entryId, lockNumber: n1 }, { entryId: drain.entryId, lockNumber: n2 }]);
    expect(res.status).toBe(201);
    expect(res.body.myLocks.map((l: LockDto) => l.lockNumber).sort()).toEqual([n1, n2].sort());

    const rows = await locksOf(order.id);
    expect(rows).toHaveLength(2);
    const fitterId = await idOf('fitter');
    for (const r of rows) expect(r).toMatchObject({ personId: fitterId, removedAt: null, removal: null, lockBoxId: null });
    expect(rows.find((r) => r.lockNumber === n1)!.isolationPlanEntryId).toBe(valve.entryId);
    expect(rows.find((r) => r.lockNumber === n2)!.isolationPlanEntryId).toBe(drain.entryId);

    const [entry, ...more] = await auditOf(order.id, 'locks-applied');
    expect(more).toEqual([]);
    expect(entry!.actorId).toBe(fitterId);
    expect(entry!.after).toEqual({ person: TOMAS, locks: [{ lockNumber: n1, on: valve.tag }, { lockNumber: n2, on: drain.tag }] });

    // Anyone reading the board (here operations) sees whose lock is on which point.
    const seen = await board(users.operations, order.id);
    const v = seen.points.find((p) => p.entryId === valve.entryId)!;
    const d = seen.points.find((p) => p.entryId === drain.entryId)!;
    expect(v).toMatchObject({ protected: true, locks: [{ lockNumber: n1, person: { id: fitterId, name: TOMAS }, removedAt: null }] });
    expect(d).toMatchObject({ protected: true, locks: [{ lockNumber: n2, person: { name: TOMAS } }] });
    expect(seen.myLocks).toEqual([]);
    expect(seen).toMatchObject({ isolated: false, state: 'planned', missing: ['Zero energy has not been verified for the section.'] });
  });

  it('refuses a lock number already on the order, even on another point and from another person', async () => {
    const { order } = await plannedOrder(users);
    const { valve, drain } = await pointsOf(order.id);
    const n = lockNo('DUP');
    expect((await apply(users.fitter, order.id, [{ entryId: valve.entryId, lockNumber: n }])).status).toBe(201);
    const res = await apply(users.fitter2, order.id, [{ entryId: drain.entryId, lockNumber: n }]);
    expect(res.status).toBe(409);
    expect(res.body.error.message).toBe(`Lock ${n} is already on ${order.number}; each lock goes on one place, and its number identifies who applied it.`);
    expect((await locksOf(order.id)).map((l) => l.lockNumber)).toEqual([n]);
    expect(await auditOf(order.id, 'locks-applied')).toHaveLength(1);
  });

  it('refuses a second lock of the same person on one point, whether sent later or twice in one request', async () => {
    const { order } = await plannedOrder(users);
    const { valve, drain } = await pointsOf(order.id);
    expect((await apply(users.fitter, order.id, [{ entryId: valve.entryId, lockNumber: lockNo() }])).status).toBe(201);
    const later = await apply(users.fitter, order.id, [{ entryId: valve.entryId, lockNumber: lockNo() }]);
    expect(later.status).toBe(409);
    expect(later.body.error.message).toBe(`You already have a lock on ${valve.tag}.`);
    const twice = await apply(users.fitter, order.id, [{ entryId: drain.entryId, lockNumber: lockNo() }, { entryId: drain.entryId, lockNumber: lockNo() }]);
    expect(twice.status).toBe(409);
    expect(twice.body.error.message).toBe(`You already have a lock on ${drain.tag}.`);
    // The refused request kept nothing, not even its first lock.
    expect(await locksOf(order.id)).toHaveLength(1);
    // Another person may put their own lock on the same point.
    expect((await apply(users.fitter2, order.id, [{ entryId: valve.entryId, lockNumber: lockNo() }])).status).toBe(201);
    expect((await board(users.planner, order.id)).points.find((p) => p.entryId === valve.entryId)!.locks.map((l) => l.person.name)).toEqual([TOMAS, NOOR]);
  });

  it('an operations person cannot apply locks (403), and nothing is kept', async () => {
    const { order } = await plannedOrder(users);
    const { valve } = await pointsOf(order.id);
    const res = await apply(users.operations, order.id, [{ entryId: valve.entryId, lockNumber: lockNo() }]);
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('forbidden');
    expect(res.body.error.message).toBe('Only a pipefitter or supervisor may do this; your roles are operations shift lead.');
    expect(await locksOf(order.id)).toEqual([]);
  });
});

describe('removing one\'s own lock', () => {
  it('records who removed it and when, as the owner, with an audit entry', async () => {
    const { order } = await plannedOrder(users);
    const { valve } = await pointsOf(order.id);
    const n = lockNo();
    const applied = await apply(users.fitter, order.id, [{ entryId: valve.entryId, lockNumber: n }]);
    const lockId = (applied.body as LockoutDto).myLocks[0]!.id;

    const res = await removal(users.fitter, lockId);
    expect(res.status).toBe(200);
    expect(res.body.myLocks).toEqual([]);
    expect(res.body.points.find((p: { entryId: string }) => p.entryId === valve.entryId)).toMatchObject({ locks: [], protected: false });
    expect(res.body.removedLocks).toMatchObject([{ id: lockId, lockNumber: n, removal: 'owner', removedBy: { name: TOMAS } }]);

    const row = (await Lock.findByPk(lockId))!;
    expect(row.removedAt).toBeInstanceOf(Date);
    expect(row).toMatchObject({ removedById: await idOf('fitter'), removal: 'owner', absentRecord: null });
    const [entry] = await auditOf(order.id, 'lock-removed');
    expect(entry!.after).toEqual({ lockNumber: n, on: valve.tag, owner: TOMAS, removedBy: TOMAS });

    const again = await removal(users.fitter, lockId);
    expect(again.status).toBe(409);
    expect(again.body.error.message).toMatch(new RegExp(`^Lock ${n} was already removed at `));
  });
});

describe('the group lock box', () => {
  it('takes the keys of some points; a personal lock on those is refused, the box without a lock leaves the order not isolated, a lock on the box protects them', async () => {
    const { order } = await plannedOrder(users);
    const { valve, drain } = await pointsOf(order.id);
    const label = `B-${lockNo('BOX')}`;
    const set = await users.fitter.tablet(`/api/work-orders/${order.id}/lock-box`, { label, entryIds: [valve.entryId] });
    expect(set.status).toBe(201);
    expect(set.body.lockBox).toMatchObject({ label, responsible: { name: TOMAS }, locks: [] });
    const box = (await LockBox.findOne({ where: { workOrderId: order.id } }))!;
    expect(box).toMatchObject({ label, responsiblePersonId: await idOf('fitter') });
    expect(set.body.points.find((p: { entryId: string }) => p.entryId === valve.entryId)).toMatchObject({ lockBoxId: box.id, protected: false });
    expect(set.body.points.find((p: { entryId: string }) => p.entryId === drain.entryId)).toMatchObject({ lockBoxId: null });
    expect((await auditOf(order.id, 'lock-box-set-up'))[0]!.after).toEqual({ lockBox: label, responsible: TOMAS, keysOf: [valve.tag] });

    // A personal lock on a point whose key is in the box is refused: the lock goes on the box.
    const onPoint = await apply(users.fitter2, order.id, [{ entryId: valve.entryId, lockNumber: lockNo() }]);
    expect(onPoint.status).toBe(409);
    expect(onPoint.body.error.message).toBe(`${valve.tag}'s key is in lock box ${label}; put your lock on the box instead.`);

    // The drain is locked point by point; the box carries no lock yet: not isolated, and the board says why.
    expect((await apply(users.fitter, order.id, [{ entryId: drain.entryId, lockNumber: lockNo() }])).status).toBe(201);
    const bare = await board(users.operations, order.id);
    expect(bare.isolated).toBe(false);
    expect(bare.missing).toEqual([
      `Lock box ${label} holds the keys of ${valve.tag} but carries no personal lock.`,
      'Zero energy has not been verified for the section.',
    ]);
    expect(bare.points.find((p) => p.entryId === valve.entryId)!.protected).toBe(false);
    const early = await verify(users.operations, order.id, verificationOf(bare));
    expect(early.status).toBe(409);
    expect(early.body.error.message).toContain(`Lock box ${label} holds the keys of ${valve.tag} but carries no personal lock.`);
    expect(await stateOf(order.id)).toBe('planned');

    // Each person's lock on the box protects every point whose key is in it.
    const onBox = await apply(users.fitter2, order.id, [{ lockBoxId: box.id, lockNumber: lockNo() }]);
    expect(onBox.status).toBe(201);
    expect(onBox.body.lockBox.locks).toMatchObject([{ person: { name: NOOR }, lockBoxId: box.id, entryId: null }]);
    expect(onBox.body.points.find((p: { entryId: string }) => p.entryId === valve.entryId)).toMatchObject({ protected: true, locks: [] });
    expect(onBox.body.missing).toEqual(['Zero energy has not been verified for the section.']);
    const twice = await apply(users.fitter2, order.id, [{ lockBoxId: box.id, lockNumber: lockNo() }]);
    expect(twice.status).toBe(409);
    expect(twice.body.error.message).toBe(`You already have a lock on lock box ${label}.`);

    const verified = await verify(users.operations, order.id, verificationOf(onBox.body));
    expect(verified.status).toBe(201);
    expect(verified.body).toMatchObject({ isolated: true, missing: [], state: 'isolated' });
  });

  it('is refused over a point that already carries a personal lock', async () => {
    const { order } = await isolatedOrder(users);
    const { valve } = await pointsOf(order.id);
    const res = await users.supervisor.tablet(`/api/work-orders/${order.id}/lock-box`, { label: lockNo('BX'), entryIds: [valve.entryId] });
    expect(res.status).toBe(409);
    expect(res.body.error.message).toBe(
      `${valve.tag} already carries personal locks; a point's key goes into the box before anyone locks the point. Have those locks removed first, or leave the point out of the box.`,
    );
    expect(await LockBox.count({ where: { workOrderId: order.id } })).toBe(0);
    expect((await board(users.planner, order.id)).points.find((p) => p.entryId === valve.entryId)).toMatchObject({ lockBoxId: null, protected: true });
  });
});

describe('the verification of zero energy', () => {
  it('is refused while a point has no lock, naming the point', async () => {
    const { order } = await plannedOrder(users);
    const { valve, drain, board: b } = await pointsOf(order.id);
    await apply(users.fitter, order.id, [{ entryId: valve.entryId, lockNumber: lockNo() }]);
    const res = await verify(users.operations, order.id, verificationOf(b));
    expect(res.status).toBe(409);
    expect(res.body.error.message).toBe(`Zero energy cannot be verified yet: 1 of 2 isolation points have no lock: ${drain.tag}.`);
    expect(await stateOf(order.id)).toBe('planned');
    expect(await IsolationVerification.count({ where: { workOrderId: order.id } })).toBe(0);
    expect(await auditOf(order.id, 'isolation-verified')).toEqual([]);
  });

  it('is refused when a point is found out of its required position', async () => {
    const { order } = await plannedOrder(users);
    const locked = await lockEveryPoint(users.fitter, order.id);
    const valve = locked.points.find((p) => p.kind === 'valve')!;
    expect(valve.requiredPosition).toBe('closed');
    const body = verificationOf(locked);
    body.points = body.points.map((p) => (p.entryId === valve.entryId ? { ...p, positionFound: 'half open' } : p));
    const res = await verify(users.operations, order.id, body);
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('not_isolated');
    expect(res.body.error.message).toBe(`The section is not isolated: ${valve.tag} was found half open and must be closed. Put each point in its required position, then verify again.`);
    expect(await stateOf(order.id)).toBe('planned');
    expect(await IsolationVerification.count({ where: { workOrderId: order.id } })).toBe(0);
  });

  it('once every point is locked and found in position, isolates the order and locks out its line, with the positions in the audit; a second one is refused', async () => {
    const { order, lines } = await plannedOrder(users);
    const locked = await lockEveryPoint(users.fitter, order.id);
    expect((await Line.findByPk(lines[0]!.id))!.status).not.toBe('locked-out');
    const body = verificationOf(locked);
    const res = await verify(users.operations, order.id, body);
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ state: 'isolated', isolated: true, missing: [], verification: { verifiedBy: { name: 'Maud Okafor' }, method: body.method, reading: body.reading } });
    expect(await stateOf(order.id)).toBe('isolated');
    expect((await Line.findByPk(lines[0]!.id))!.status).toBe('locked-out');
    const rows = await IsolationVerification.findAll({ where: { workOrderId: order.id } });
    expect(rows).toHaveLength(1);
    expect(rows[0]).toMatchObject({ verifiedById: await idOf('operations'), method: body.method, reading: body.reading, supersededAt: null });

    const positions = locked.points.map((p) => ({ tag: p.tag, positionFound: p.requiredPosition }));
    expect(positions).toEqual([expect.objectContaining({ positionFound: 'closed' }), expect.objectContaining({ positionFound: 'open' })]);
    const [entry, ...more] = await auditOf(order.id, 'isolation-verified');
    expect(more).toEqual([]);
    expect(entry).toMatchObject({ actorId: await idOf('operations'), before: { state: 'planned' } });
    expect(entry!.after).toEqual({ state: 'isolated', verifiedBy: 'Maud Okafor', method: body.method, reading: body.reading, points: positions });

    const again = await verify(users.operations, order.id, body);
    expect(again.status).toBe(409);
    expect(again.body.error.message).toContain(order.number);
    expect(await IsolationVerification.count({ where: { workOrderId: order.id } })).toBe(1);
    expect(await auditOf(order.id, 'isolation-verified')).toHaveLength(1);
  });

  it('a fitter cannot verify (403)', async () => {
    const { order } = await plannedOrder(users);
    const locked = await lockEveryPoint(users.fitter, order.id);
    const res = await verify(users.fitter, order.id, verificationOf(locked));
    expect(res.status).toBe(403);
    expect(res.body.error.message).toBe('Only an operations shift lead or supervisor may do this; your roles are pipefitter.');
    expect(await stateOf(order.id)).toBe('planned');
    expect(await IsolationVerification.count({ where: { workOrderId: order.id } })).toBe(0);
  });

  it('no joint step is recorded before the verification: 409 naming what is missing', async () => {
    const { order, jointIds } = await plannedOrder(users);
    const { valve, drain } = await pointsOf(order.id);
    await apply(users.fitter, order.id, [{ entryId: valve.entryId, lockNumber: lockNo() }]);
    const res = await recordStep(users.fitter, jointIds[0]!, 'prep');
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('state_conflict');
    expect(res.body.error.message).toBe(
      `No joint step can be recorded on ${order.number} before its section is isolated: 1 of 2 isolation points have no lock: ${drain.tag}. Zero energy has not been verified for the section.`,
    );
    expect(await JointStepRecord.count({ where: { jointTaskId: jointIds[0]! } })).toBe(0);
    expect(await stateOf(order.id)).toBe('planned');
  });
});

describe('removing someone else\'s lock', () => {
  it('is forbidden to another fitter, needs the (e)(3) record from a supervisor, and with it is recorded, audited and mailed to the owner', async () => {
    const { order, lines } = await isolatedOrder(users);
    const { valve } = await pointsOf(order.id);
    const mine = (await locksOf(order.id)).find((l) => l.isolationPlanEntryId === valve.entryId)!;
    // The (e)(3) procedure does not open a gap either: Tomas's is the only lock on the valve of an isolated order.
    const gap = await removal(users.supervisor, mine.id, { absent: ABSENT });
    expect(gap.status).toBe(409);
    expect(gap.body.error.message).toContain(`is the last lock on ${valve.tag} while ${order.number} is isolated`);
    expect((await Lock.findByPk(mine.id))!.removedAt).toBeNull();
    // Noor also has her lock on the valve, so removing Tomas's leaves no gap.
    expect((await apply(users.fitter2, order.id, [{ entryId: valve.entryId, lockNumber: lockNo('N') }])).status).toBe(201);

    const byFitter = await removal(users.fitter2, mine.id);
    expect(byFitter.status).toBe(403);
    expect(byFitter.body.error.message).toMatch(new RegExp(`^Only ${TOMAS}, who applied lock ${mine.lockNumber}, may remove it \\(OSHA 29 CFR 1910\\.147\\(e\\)\\(3\\)\\)`));
    expect((await Lock.findByPk(mine.id))!.removedAt).toBeNull();

    const future = await removal(users.supervisor, mine.id, { absent: { ...ABSENT, contactAttemptedAt: new Date(Date.now() + 3_600_000).toISOString() } });
    expect(future.status).toBe(400);
    expect(future.body.error.message).toBe('The attempt to reach the person cannot be in the future.');
    expect((await Lock.findByPk(mine.id))!.removedAt).toBeNull();

    const bare = await removal(users.supervisor, mine.id);
    expect(bare.status).toBe(409);
    expect(bare.body.error.code).toBe('absent_procedure_needed');
    expect(bare.body.error.message).toContain(`Lock ${mine.lockNumber} is ${TOMAS}'s.`);
    expect(bare.body.error.message).toContain('1910.147(e)(3)');
    expect((await Lock.findByPk(mine.id))!.removedAt).toBeNull();

    const res = await removal(users.supervisor, mine.id, { absent: ABSENT });
    expect(res.status).toBe(200);
    expect(res.body.removedLocks).toMatchObject([{ id: mine.id, removal: 'absent', removedBy: { name: RAFE }, person: { name: TOMAS } }]);
    const row = (await Lock.findByPk(mine.id))!;
    expect(row.removedAt).toBeInstanceOf(Date);
    expect(row).toMatchObject({ removal: 'absent', removedById: await idOf('supervisor'), absentRecord: ABSENT });
    const [entry, ...more] = await auditOf(order.id, 'lock-removed-absent');
    expect(more).toEqual([]);
    expect(entry!.actorId).toBe(await idOf('supervisor'));
    expect(entry!.after).toEqual({ lockNumber: mine.lockNumber, on: valve.tag, owner: TOMAS, removedBy: RAFE, procedure: ABSENT });
    expect(await auditOf(order.id, 'lock-removed')).toEqual([]);

    const [mail, ...others] = await waitFor('the absent-lock mail', () => mailMentioning(`your lock ${mine.lockNumber} from`), (m) => m.length > 0);
    expect(others).toEqual([]);
    expect(mail!.to).toEqual(['tomas.lind@marrowby.invalid']);
    expect(mail!.subject).toBe(`${order.number} (${lines[0]!.lineNumber}): your lock ${mine.lockNumber} on ${valve.tag} was removed while you were away`);
    expect(mail!.text).toContain(`${TOMAS}, ${RAFE} removed your lock ${mine.lockNumber} from ${valve.tag} on ${order.number}`);
    expect(mail!.text).toContain(ABSENT.contactAttempts);
    expect(mail!.text).toContain(ABSENT.informBeforeReturn);
    expect(mail!.text).toContain(`/work-orders/${order.id}`);
    expect(mail!.html).toContain(order.number);
    expect(mail!.html).toContain('Called his mobile twice &amp; his home number &lt;no answer&gt;; texted him.');
    expect(mail!.html).not.toContain('<no answer>');
    expect(mail!.html).toContain(`/work-orders/${order.id}`);
  });
});

describe('a shift handover', () => {
  it('refuses a removal that would leave a point without a lock; after the on-coming fitter takes over, the off-going one may remove theirs', async () => {
    const { order } = await isolatedOrder(users);
    const { valve, drain } = await pointsOf(order.id);
    const theirs = await locksOf(order.id);
    expect(theirs).toHaveLength(2);
    const onValve = theirs.find((l) => l.isolationPlanEntryId === valve.entryId)!;
    const onDrain = theirs.find((l) => l.isolationPlanEntryId === drain.entryId)!;

    const gap = await removal(users.fitter, onValve.id);
    expect(gap.status).toBe(409);
    expect(gap.body.error.message).toBe(
      `Lock ${onValve.lockNumber} (${TOMAS}) is the last lock on ${valve.tag} while ${order.number} is isolated; removing it would leave ${valve.tag} unprotected. ` +
        'At a shift change the on-coming person puts their lock on first (OSHA 29 CFR 1910.147(f)(4)).',
    );
    expect((await Lock.findByPk(onValve.id))!.removedAt).toBeNull();

    const [n1, n2] = [lockNo('N'), lockNo('N')];
    const handOver = (locks: unknown[]) => users.fitter2.tablet(`/api/work-orders/${order.id}/handovers`, { fromPersonId: ids.get('fitter'), locks });
    await idOf('fitter');
    // Noor takes over the valve only: Tomas may then remove his valve lock, not his drain lock.
    expect((await handOver([{ replacesLockId: onValve.id, lockNumber: n1 }])).status).toBe(201);
    expect((await auditOf(order.id, 'locks-handed-over'))[0]!.after).toEqual({ from: TOMAS, to: NOOR, locks: [{ on: valve.tag, lockNumber: n1, replaces: onValve.lockNumber }] });
    expect((await removal(users.fitter, onValve.id)).status).toBe(200);
    const stillGap = await removal(users.fitter, onDrain.id);
    expect(stillGap.status).toBe(409);
    expect(stillGap.body.error.message).toContain(`is the last lock on ${drain.tag}`);
    expect((await Lock.findByPk(onDrain.id))!.removedAt).toBeNull();

    expect((await handOver([{ replacesLockId: onDrain.id, lockNumber: n2 }])).status).toBe(201);
    expect((await auditOf(order.id, 'locks-handed-over'))[1]!.after).toEqual({ from: TOMAS, to: NOOR, locks: [{ on: drain.tag, lockNumber: n2, replaces: onDrain.lockNumber }] });
    const last = await removal(users.fitter, onDrain.id);
    expect(last.status).toBe(200);
    const after = last.body as LockoutDto;
    expect(after).toMatchObject({ isolated: true, state: 'isolated', myLocks: [] });
    expect(after.points.find((p) => p.entryId === valve.entryId)!.locks).toMatchObject([{ lockNumber: n1, person: { name: NOOR }, handedOverFromLockId: onValve.id }]);
    expect(after.points.find((p) => p.entryId === drain.entryId)!.locks).toMatchObject([{ lockNumber: n2, person: { name: NOOR }, handedOverFromLockId: onDrain.id }]);
    const rows = await Lock.findAll({ where: { workOrderId: order.id, personId: await idOf('fitter2') } });
    expect(rows.map((r) => r.handedOverFromLockId).sort()).toEqual([onValve.id, onDrain.id].sort());
    expect(await stateOf(order.id)).toBe('isolated');
  });
});

describe('cancelling an order', () => {
  it('is refused while locks are on, and allowed once they are off', async () => {
    const { order } = await plannedOrder(users);
    const { valve } = await pointsOf(order.id);
    const n = lockNo();
    const applied = await apply(users.fitter, order.id, [{ entryId: valve.entryId, lockNumber: n }]);
    const reason = { reason: 'The repair moves to the spring shutdown.' };
    const refused = await users.planner.post(`/api/work-orders/${order.id}/cancellation`, reason);
    expect(refused.status).toBe(409);
    expect(refused.body.error.message).toBe(`${order.number} is cancelled only once every lock is off; still on: ${n} on ${valve.tag}.`);
    expect(await stateOf(order.id)).toBe('planned');
    expect(await auditOf(order.id, 'work-order-cancelled')).toEqual([]);

    expect((await removal(users.fitter, (applied.body as LockoutDto).myLocks[0]!.id)).status).toBe(200);
    const done = await users.planner.post(`/api/work-orders/${order.id}/cancellation`, reason);
    expect(done.status).toBe(200);
    expect(await stateOf(order.id)).toBe('cancelled');
  });

  it('is refused on an isolated order with locks on, even for a supervisor', async () => {
    const { order } = await isolatedOrder(users);
    const refused = await users.supervisor.post(`/api/work-orders/${order.id}/cancellation`, { reason: 'Scope changed.' });
    expect(refused.status).toBe(409);
    expect(refused.body.error.message).toMatch(new RegExp(`^${order.number} is cancelled only once every lock is off; still on: `));
    expect(await stateOf(order.id)).toBe('isolated');
  });
});
