// The interlock: a line goes back into service only when every lock is off, every cure hold has run
// out by the clock and a hydrostatic test has passed — refused with every reason otherwise, also
// with no worker running, and exactly one of two racing releases succeeds. A failed test cuts the
// leaking joints out and puts the order back in work.
import { afterEach, describe, expect, it } from 'vitest';
import { setClockOffsetForTests } from '@server/clock';
import { Hold } from '@server/db/models/joint-record';
import { JointTask } from '@server/db/models/joint-task';
import { Line } from '@server/db/models/line';
import { IsolationVerification, Lock } from '@server/db/models/lockout';
import { PressureTest, Release } from '@server/db/models/release';
import { WorkOrder } from '@server/db/models/work-order';
import { useTestApp } from '../helpers/app';
import { jpegPicture, lockEveryPoint, recordStep, uploadPhoto, verificationOf } from '../helpers/lockout';
import { plantForWorkOrders } from '../helpers/work-orders';
import { CHECKLIST, cureEnds, curingOrder as curingOrderOf, release, removeMyLocks, testBody as testBodyOf } from '../helpers/release';

const users = useTestApp({ signIn: ['planner', 'fitter', 'operations', 'supervisor'], before: plantForWorkOrders });
afterEach(() => setClockOffsetForTests(0));

const curingOrder = () => curingOrderOf(users);
const testBody = (orderId: string, over: Record<string, unknown> = {}) => testBodyOf(users.planner, orderId, over);

describe('release refused while anything is open', () => {
  it('a curing order: refused (409) naming the state, each lock and whose, each hold with its end, and the missing test — with no worker running', async () => {
    const { order, lines } = await curingOrder();
    const res = await release(users.operations, order.id);
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('release_refused');
    const reasons: string[] = res.body.error.details.reasons;
    expect(reasons.some((r) => r.includes('is curing'))).toBe(true);
    expect(reasons.filter((r) => /^Lock .* \(Tomas Lind\) is still on /.test(r)).length).toBe(2); // the valve and the drain
    expect(reasons.some((r) => /^J1's cure hold runs until /.test(r))).toBe(true);
    expect(reasons).toContain('No hydrostatic test is recorded.');
    expect(await Release.count({ where: { workOrderId: order.id } })).toBe(0);
    expect((await Line.findByPk(lines[0]!.id))!.status).toBe('locked-out');
  });

  it('the test is refused while a cure hold runs, while a lock is on the test boundary ((f)(1)), and with air', async () => {
    const early = await curingOrder();
    await WorkOrder.update({ state: 'testing' }, { where: { id: early.order.id } }); // as if the worker had moved it too soon
    const tooSoon = await users.operations.tablet(`/api/work-orders/${early.order.id}/pressure-tests`, await testBody(early.order.id));
    expect(tooSoon.status).toBe(409);
    expect(tooSoon.body.error.message).toMatch(/J1's cure hold runs until/);

    const { order } = await curingOrder();
    await cureEnds(order.id);
    let res = await users.operations.tablet(`/api/work-orders/${order.id}/pressure-tests`, await testBody(order.id));
    expect(res.status).toBe(409);
    expect(res.body.error.message).toMatch(/removes their own lock.*\(f\)\(1\)/);
    await removeMyLocks(users.fitter, order.id);
    res = await users.operations.tablet(`/api/work-orders/${order.id}/pressure-tests`, await testBody(order.id, { medium: 'compressed air' }));
    expect(res.status).toBe(409); // never air
    expect(await PressureTest.count({ where: { workOrderId: order.id } })).toBe(0);
  });
});

describe('the way to release', () => {
  it('cure ends by the clock → locks off → test passed → ready → released: the lines go back into service', async () => {
    const { order, lines } = await curingOrder();
    await cureEnds(order.id);
    await removeMyLocks(users.fitter, order.id);
    const test = await users.operations.tablet(`/api/work-orders/${order.id}/pressure-tests`, await testBody(order.id));
    expect(test.status).toBe(201);
    expect(test.body).toMatchObject({ result: 'passed', medium: 'water', holdMinutes: 15, witness: { name: 'Maud Okafor' } });
    expect((await WorkOrder.findByPk(order.id))!.state).toBe('ready');
    expect(await IsolationVerification.count({ where: { workOrderId: order.id, supersededAt: null } })).toBe(0);

    expect((await users.planner.get(`/api/work-orders/${order.id}/release-check`)).body).toEqual({ ready: true, blockers: [] });
    expect((await release(users.fitter, order.id)).status).toBe(403); // only operations
    const res = await release(users.operations, order.id);
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ state: 'released' });
    expect((await Line.findByPk(lines[0]!.id))!.status).toBe('in-service');
    expect(await Release.findOne({ where: { workOrderId: order.id } })).toMatchObject({ checklist: CHECKLIST });
    const again = await release(users.operations, order.id);
    expect(again.status).toBe(409);
  });

  it('the planner closes a released order only once its record is complete, and the record prints as a PDF with a QR code per joint', async () => {
    const { order, jointIds } = await curingOrder();
    expect((await users.planner.get(`/api/work-orders/${order.id}/record.pdf`)).status).toBe(409); // not released yet
    await cureEnds(order.id);
    await removeMyLocks(users.fitter, order.id);
    expect((await users.operations.tablet(`/api/work-orders/${order.id}/pressure-tests`, await testBody(order.id))).status).toBe(201);
    expect((await release(users.operations, order.id)).status).toBe(201);

    let res = await users.planner.post(`/api/work-orders/${order.id}/close`);
    expect(res.status).toBe(409);
    expect(res.body.error.details.gaps).toEqual(['J1 has no photo of the depth marks or the finished joint.']);
    for (const step of ['depth-marks', 'wipe'] as const) expect((await uploadPhoto(users.fitter, jointIds[0]!, step, await jpegPicture())).status).toBe(201);
    expect((await users.planner.get(`/api/work-orders/${order.id}/record-gaps`)).body).toEqual({ gaps: [] });
    expect((await users.fitter.post(`/api/work-orders/${order.id}/close`)).status).toBe(403);
    res = await users.planner.post(`/api/work-orders/${order.id}/close`);
    expect(res.status).toBe(200);
    expect(res.body.state).toBe('closed');

    const pdf = await users.planner.raw(`/api/work-orders/${order.id}/record.pdf`);
    expect(pdf.status).toBe(200);
    expect(pdf.headers.get('content-type')).toBe('application/pdf');
    expect(pdf.headers.get('content-disposition')).toContain(`${order.number}-record.pdf`);
    const bytes = Buffer.from(await pdf.arrayBuffer());
    expect(bytes.subarray(0, 5).toString()).toBe('%PDF-');
    // the joint's QR code (an image and its transparency mask) and its two photos
    expect(bytes.toString('latin1').match(/\/Subtype \/Image/g)?.length).toBe(4);
  });

  it('of two releases racing, exactly one succeeds', async () => {
    const { order } = await curingOrder();
    await cureEnds(order.id);
    await removeMyLocks(users.fitter, order.id);
    expect((await users.operations.tablet(`/api/work-orders/${order.id}/pressure-tests`, await testBody(order.id))).status).toBe(201);
    const [a, b] = await Promise.all([release(users.operations, order.id), release(users.operations, order.id)]);
    expect([a.status, b.status].sort()).toEqual([201, 409]);
    expect(await Release.count({ where: { workOrderId: order.id } })).toBe(1);
  });

  it('a failed test cuts the leaking joint out, puts the order back in work, and no step is recorded before locks and a new verification', async () => {
    const { order, jointIds } = await curingOrder();
    await cureEnds(order.id);
    await removeMyLocks(users.fitter, order.id);
    const res = await users.supervisor.tablet(`/api/work-orders/${order.id}/pressure-tests`, await testBody(order.id, { result: 'failed', leakingJointIds: [jointIds[0]], endReadingPsi: 10 }));
    expect(res.status).toBe(201);
    expect(res.body.leakingJoints).toEqual([{ id: jointIds[0], label: 'J1' }]);
    expect((await WorkOrder.findByPk(order.id))!.state).toBe('in-work');
    const old = (await JointTask.findByPk(jointIds[0]))!;
    expect(old.redoReason).toMatch(/leaked at the hydrostatic test/);
    const redo = (await JointTask.findOne({ where: { replacesTaskId: old.id } }))!;
    expect(redo.number).toBe(2);
    expect(await Hold.count({ where: { jointTaskId: old.id, status: 'ended' } })).toBe(2); // its holds had ended; none left running

    const refused = await recordStep(users.fitter, redo.id, 'prep');
    expect(refused.status).toBe(409);
    expect(refused.body.error.message).toMatch(/not isolated now/);
    const locked = await lockEveryPoint(users.fitter, order.id);
    expect((await users.operations.tablet(`/api/work-orders/${order.id}/verification`, verificationOf(locked))).status).toBe(201);
    expect((await recordStep(users.fitter, redo.id, 'prep')).status).toBe(201);
    expect(await Lock.count({ where: { workOrderId: order.id, removedAt: null } })).toBe(2);
  });
});
