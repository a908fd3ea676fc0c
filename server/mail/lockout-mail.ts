// Who hears of a lock removed under (e)(3), and what the mail says: the lock's owner, from the lock
// row and its recorded procedure, rendered by the worker when it sends.

import { config } from '@server/config';
import { IsolationPlanEntry } from '@server/db/models/isolation-plan-entry';
import { Lock, LockBox } from '@server/db/models/lockout';
import { Person } from '@server/db/models/person';
import { WorkOrder } from '@server/db/models/work-order';
import { currentPlantSettings } from '@server/services/plant-settings-service';
import { orderLines } from '@server/services/work-orders/order-facts';
import { plantTime } from '@server/services/work-orders/plant-time';
import type { OutgoingMail } from './send-mail';
import { lockRemovedAbsent } from './templates/lock-removed-absent';

/** Record id: the lock's id. A lock without a recorded (e)(3) removal, or an owner without an address, is no mail. */
export async function absentLockMail(lockId: string): Promise<OutgoingMail | null> {
  const lock = await Lock.findByPk(lockId);
  if (!lock || lock.removal !== 'absent' || !lock.absentRecord || !lock.removedAt) return null;
  const [owner, remover, order] = await Promise.all([Person.findByPk(lock.personId), lock.removedById ? Person.findByPk(lock.removedById) : null, WorkOrder.findByPk(lock.workOrderId)]);
  if (!owner?.email || !order) return null;
  const place = lock.lockBoxId
    ? `lock box ${(await LockBox.findByPk(lock.lockBoxId))?.label ?? ''}`.trim()
    : ((await IsolationPlanEntry.findByPk(lock.isolationPlanEntryId!))?.tag ?? 'an isolation point');
  const [lines, plant] = await Promise.all([orderLines(order.id), currentPlantSettings()]);
  const at = (d: Date | string) => plantTime(d, plant.timeZone);
  const r = lock.absentRecord;
  const content = lockRemovedAbsent(
    {
      orderId: order.id, number: order.number, lines: lines.map((l) => l.lineNumber), ownerName: owner.name, lockNumber: lock.lockNumber, place,
      removedBy: remover?.name ?? 'A supervisor', removedAt: at(lock.removedAt), contactAttempts: r.contactAttempts, contactAttemptedAt: at(r.contactAttemptedAt),
      informBeforeReturn: r.informBeforeReturn,
    },
    config.origin,
  );
  return { to: owner.email, ...content };
}
