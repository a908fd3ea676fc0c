// The fitter's shift view: their joint tasks on open orders, grouped by order and line, each with
// its next step and what blocks it (isolation, their own lock, a hold).

import { literal, Op } from 'sequelize';
import { sequelize } from '@server/db/sequelize';
import { JointTask } from '@server/db/models/joint-task';
import { Line } from '@server/db/models/line';
import { WorkOrder } from '@server/db/models/work-order';
import { namesOf } from '@server/services/lockout/board';
import { readProtection } from '@server/services/lockout/protection';
import { jointLabel } from '@server/services/work-orders/order-facts';
import { needsChemicalCaution } from '@shared/trade';
import type { ShiftDto } from '@shared/schemas/joint-steps';
import type { Me } from '@shared/schemas/roles';
import { blockersFor, jointRows, nextStepOf, toHoldDto } from './joint-view';

/** Orders whose joints are on someone's shift: planned (to lock on) up to the test. */
const ON_SHIFT = ['planned', 'isolated', 'in-work', 'curing', 'testing'];

export async function shiftOf(me: Me): Promise<ShiftDto> {
  const orders = await WorkOrder.findAll({
    where: { state: { [Op.in]: ON_SHIFT }, id: { [Op.in]: literal(`(select work_order_id from joint_tasks where fitter_id = ${sequelize.escape(me.id)})`) } },
    order: [['windowStart', 'ASC'], ['number', 'ASC']],
  });
  const tasks = await JointTask.findAll({ where: { fitterId: me.id, workOrderId: { [Op.in]: orders.map((o) => o.id) } }, order: [['number', 'ASC']] });
  const mine = tasks.filter((j) => orders.some((o) => o.id === j.workOrderId));
  const lines = new Map((await Line.findAll({ where: { id: { [Op.in]: [...new Set(mine.map((j) => j.lineId))] } } })).map((l) => [l.id, l]));
  const rows = await jointRows(mine.map((j) => j.id));
  const engineers = await namesOf([...rows.holds.values()].flat().map((h) => h.engineeringById));
  const out: ShiftDto['orders'] = [];
  for (const order of orders) {
    const protection = await readProtection(order.id);
    const tasksHere = mine.filter((j) => j.workOrderId === order.id);
    const byLine = new Map<string, JointTask[]>();
    for (const j of tasksHere) (byLine.get(j.lineId) ?? byLine.set(j.lineId, []).get(j.lineId)!).push(j);
    out.push({
      id: order.id,
      number: order.number,
      state: order.state,
      windowStart: order.windowStart?.toISOString() ?? null,
      windowEnd: order.windowEnd?.toISOString() ?? null,
      isolated: protection.isolated,
      myLockOn: protection.locks.some((l) => l.personId === me.id),
      chemicalService: [...byLine.keys()].some((id) => needsChemicalCaution(lines.get(id)?.service ?? '')),
      lines: [...byLine.entries()].map(([lineId, joints]) => {
        const line = lines.get(lineId)!;
        return {
          id: line.id, lineNumber: line.lineNumber, service: line.service, material: line.material,
          joints: joints.map((j) => {
            const steps = (rows.steps.get(j.id) ?? []).map((s) => s.step);
            const redone = !!j.redoneAt;
            const holds = (rows.holds.get(j.id) ?? []).map((h) => toHoldDto(h, engineers));
            const nextStep = nextStepOf(steps, redone);
            const replacedBy = rows.replacedBy.get(j.id);
            return {
              id: j.id, label: jointLabel(j.number), fittingKind: j.fittingKind, jointSize: j.reducingSize ?? j.nominalSize, stepsDone: steps.length, nextStep, holds, redone,
              blockers: blockersFor({ order, protection, personId: me.id, redone, replacedByLabel: replacedBy ? jointLabel(replacedBy.number) : null, holds, nextStep }),
            };
          }),
        };
      }),
    });
  }
  return { person: { id: me.id, name: me.name }, orders: out };
}
