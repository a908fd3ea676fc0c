// Who hears that an order is ready for release: everyone holding the operations role.

import { config } from '@server/config';
import { Person } from '@server/db/models/person';
import { PressureTest } from '@server/db/models/release';
import { WorkOrder } from '@server/db/models/work-order';
import { currentPlantSettings } from '@server/services/plant-settings-service';
import { orderLines } from '@server/services/work-orders/order-facts';
import { plantTime } from '@server/services/work-orders/plant-time';
import { holdersOf } from './hold-mail';
import type { OutgoingMail } from './send-mail';
import { readyForRelease } from './templates/release-mail';

/** Record id: the order's id; no mail unless it is ready and its last test passed. */
export async function readyForReleaseMail(orderId: string): Promise<OutgoingMail | null> {
  const order = await WorkOrder.findByPk(orderId);
  const test = await PressureTest.findOne({ where: { workOrderId: orderId }, order: [['recordedAt', 'DESC']] });
  if (!order || !test || test.result !== 'passed') return null;
  const [to, lines, plant, witness] = await Promise.all([holdersOf(['operations']), orderLines(order.id), currentPlantSettings(), Person.findByPk(test.witnessId)]);
  if (!to.length) return null;
  const content = readyForRelease(
    { orderId: order.id, number: order.number, lines: lines.map((l) => l.lineNumber), testPsi: test.testPressurePsi, passedAt: plantTime(test.endedAt, plant.timeZone), witness: witness?.name ?? 'the witness' },
    config.origin,
  );
  return { to: to.join(', '), ...content };
}
