// Who hears of a lock removed under (e)(3) (the lock's owner, from the lock row and its recorded
// procedure) and of a lock left on after the cure ended (the supervisors), rendered by the worker
// when it sends.

import { config } from '@server/config';
import { AuditEntry } from '@server/db/models/audit-entry';
import { IsolationPlanEntry } from '@server/db/models/isolation-plan-entry';
import { Lock, LockBox } from '@server/db/models/lockout';
import { Person } from '@server/db/models/person';
import { WorkOrder } from '@server/db/models/work-order';
import { currentPlantSettings } from '@server/services/plant-settings-service';
import { orderLines } from '@server/services/work-orders/order-facts';
import { plantTime } from '@server/services/work-orders/plant-time';
import type { OutgoingMail } from './send-mail';
import { holdersOf } from './hold-mail';
import { lockLeftOn } from './templates/lock-left-on';
import { lockRemovedAbsent } from './templates/lock-removed-absent';

/** "lock box B-1" or the point's tag. */
async function placeOf(lock: Lock): Promise<string> {
  return lock.lockBoxId
    ? `lock box ${(await LockBox.findByPk(lock.lockBoxId))?.label ?? ''}`.trim()
    : ((await IsolationPlanEntry.findByPk(lock.isolationPlanEntryId!))?.tag ?? 'an isolation point');
}

/** Record id: the lock's id. A lock without a recorded (e)(3) removal, or an owner without an address, is no mail. */
export async function absentLockMail(lockId: string): Promise<OutgoingMail | null> {
  const lock = await Lock.findByPk(lockId);
  if (!lock || lock.removal !== 'absent' || !lock.absentRecord || !lock.removedAt) return null;
  const [owner, remover, order] = await Promise.all([Person.findByPk(lock.personId), lock.removedById ? Person.findByPk(lock.removedById) : null, WorkOrder.findByPk(lock.workOrderId)]);
  if (!owner?.email || !order) return null;
  const place = await placeOf(lock);
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

/** Record id: the lock's id, from the watch's audit entry. To everyone holding the supervisor role; a lock already off is no mail. */
export async function lockLeftOnMail(lockId: string): Promise<OutgoingMail | null> {
  const lock = await Lock.findByPk(lockId);
  if (!lock || lock.removedAt) return null;
  const entry = await AuditEntry.findOne({ where: { entity: 'work-order', entityId: lock.workOrderId, action: 'lock-left-on', after: { lockId } } });
  const seen = entry?.after as { curesEndedAt: string; minutes: number } | undefined;
  const [owner, order, to] = await Promise.all([Person.findByPk(lock.personId), WorkOrder.findByPk(lock.workOrderId), holdersOf(['supervisor'])]);
  if (!seen || !order || !to.length) return null;
  const [lines, plant, place] = await Promise.all([orderLines(order.id), currentPlantSettings(), placeOf(lock)]);
  const at = (d: Date | string) => plantTime(d, plant.timeZone);
  const content = lockLeftOn(
    {
      orderId: order.id, number: order.number, lines: lines.map((l) => l.lineNumber), ownerName: owner?.name ?? 'Someone', lockNumber: lock.lockNumber, place,
      appliedAt: at(lock.appliedAt), curesEndedAt: at(seen.curesEndedAt), minutes: seen.minutes,
    },
    config.origin,
  );
  return { to: to.join(', '), ...content };
}
