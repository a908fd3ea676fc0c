// Who hears of a late plan, and what the mail says: rendered by the worker from the order and the
// audit entry of that planning, so the mail tells what was decided then.

import { Op, fn, col, where } from 'sequelize';
import { config } from '@server/config';
import { AuditEntry } from '@server/db/models/audit-entry';
import { Person } from '@server/db/models/person';
import { WorkOrder } from '@server/db/models/work-order';
import { effectiveRoles } from '@server/services/people-service';
import { currentPlantSettings } from '@server/services/plant-settings-service';
import { orderLines } from '@server/services/work-orders/order-facts';
import { plantTime } from '@server/services/work-orders/plant-time';
import { STEP_LABELS } from '@server/services/work-orders/window-plan';
import type { WindowStep } from '@shared/schemas/work-order-plan';
import type { OutgoingMail } from './send-mail';
import { workOrderPlannedLate } from './templates/work-order-planned-late';

interface PlannedAfter {
  earliestRelease: string;
  windowEnd: string;
  lateStep: WindowStep | null;
  lateReason: string | null;
}

/** Every person holding the operations role with an address, and the requester when the free-text name matches a person's name or address. */
async function recipients(requestedBy: string): Promise<string[]> {
  const withEmail = await Person.findAll({ where: { email: { [Op.ne]: null } }, order: [['name', 'ASC']] });
  const operations = withEmail.filter((p) => effectiveRoles(p).includes('operations'));
  const wanted = requestedBy.trim().toLowerCase();
  const requester = await Person.findAll({
    where: { email: { [Op.ne]: null }, [Op.or]: [where(fn('lower', col('name')), wanted), where(fn('lower', col('email')), wanted)] },
  });
  return [...new Set([...operations, ...requester].map((p) => p.email!))];
}

/** Record id `<order id>.<version>`: the order as planned at that version. Nobody to tell is no mail. */
export async function latePlanMail(recordId: string): Promise<OutgoingMail | null> {
  const [orderId, version] = recordId.split('.');
  const order = orderId ? await WorkOrder.findByPk(orderId) : null;
  if (!order) return null;
  const entry = await AuditEntry.findOne({ where: { entity: 'work-order', entityId: order.id, action: 'work-order-planned', after: { version: Number(version) } } });
  const planned = entry?.after as PlannedAfter | undefined;
  if (!entry || !planned?.lateReason || !order.windowStart) return null;
  const [to, lines, plant, planner] = await Promise.all([
    recipients(order.requestedBy), orderLines(order.id), currentPlantSettings(), entry.actorId ? Person.findByPk(entry.actorId) : null,
  ]);
  if (!to.length) return null;
  const at = (d: Date | string) => plantTime(d, plant.timeZone);
  const content = workOrderPlannedLate(
    {
      id: order.id, number: order.number, scope: order.scope, lines: lines.map((l) => l.lineNumber), requestedBy: order.requestedBy,
      plannedBy: planner?.name ?? 'The planner', windowStart: at(order.windowStart), windowEnd: at(planned.windowEnd), earliestRelease: at(planned.earliestRelease),
      lateStep: planned.lateStep ? STEP_LABELS[planned.lateStep] : 'not known', lateReason: planned.lateReason,
    },
    config.origin,
  );
  return { to: to.join(', '), ...content };
}
