// The watches the sweep runs, each telling people once (remembered in the audit log, so a
// restarted worker or a flushed Redis does not tell them twice):
// - windows: an order under way whose earliest release has moved past its window's end (a long
//   cure, an engineering entry, a redo) alerts the planner and operations;
// - locks left on: an order whose cure holds have all run out waits on its test, and the test
//   waits on every lock coming off ((f)(1)); a lock still on longer than the plant's setting after
//   that (often someone who went home) alerts the supervisors, once per lock.

import { Op } from 'sequelize';
import { now } from '@server/clock';
import { sequelize } from '@server/db/sequelize';
import { AuditEntry } from '@server/db/models/audit-entry';
import { Hold } from '@server/db/models/joint-record';
import { Lock } from '@server/db/models/lockout';
import { WorkOrder } from '@server/db/models/work-order';
import { logger } from '@server/logger';
import { enqueueMail } from '@server/queues/mail';
import { recordAudit } from '@server/services/audit-service';
import { currentPlantSettings } from '@server/services/plant-settings-service';
import { AUDIT_ENTITY } from '@server/services/work-orders/order-dto';
import { MIN_TEST_HOLD_MINUTES } from '@shared/trade';

const MINUTE = 60_000;
const WATCHED = ['in-work', 'curing', 'testing'];
export const WINDOW_AT_RISK = 'window-at-risk';

/** The earliest the order's lines can be back: the last running hold's end (or now), then the test and the release, in the plant's minutes. */
export function earliestRelease(lastHoldEnd: Date | null, at: Date, minutes: { fillAndVentMinutes: number; releaseMinutes: number }): Date {
  const from = Math.max(lastHoldEnd?.getTime() ?? 0, at.getTime());
  return new Date(from + (minutes.fillAndVentMinutes + MIN_TEST_HOLD_MINUTES + minutes.releaseMinutes) * MINUTE);
}

export async function watchWindows(): Promise<{ told: string[] }> {
  const at = now();
  const plant = await currentPlantSettings();
  const orders = await WorkOrder.findAll({ where: { state: { [Op.in]: WATCHED }, windowEnd: { [Op.not]: null } } });
  const told: string[] = [];
  for (const order of orders) {
    const last = (await Hold.max('endsAt', { where: { workOrderId: order.id, status: 'running' } })) as Date | null;
    const release = earliestRelease(last, at, plant.windowPlan);
    if (release.getTime() <= order.windowEnd!.getTime()) continue;
    const first = await sequelize.transaction(async (t) => {
      await WorkOrder.findByPk(order.id, { transaction: t, lock: t.LOCK.UPDATE }); // two workers: one tells
      if (await AuditEntry.findOne({ where: { entity: AUDIT_ENTITY, entityId: order.id, action: WINDOW_AT_RISK }, transaction: t })) return false;
      await recordAudit({ actorId: null, action: WINDOW_AT_RISK, entity: AUDIT_ENTITY, entityId: order.id, after: { earliestRelease: release.toISOString(), windowEnd: order.windowEnd!.toISOString() } }, t);
      return true;
    });
    if (!first) continue;
    told.push(order.number);
    await enqueueMail({ purpose: 'window-at-risk', recordId: order.id }).catch((err) => logger.error({ err, orderId: order.id }, 'could not queue the window-at-risk mail'));
  }
  return { told };
}

export const LOCK_LEFT_ON = 'lock-left-on';

/** When the order's last cure hold ended (null while one still runs or awaits an engineering entry). */
async function curesEndedAt(orderId: string): Promise<Date | null> {
  const open = await Hold.count({ where: { workOrderId: orderId, kind: 'cure', status: { [Op.in]: ['running', 'awaiting-engineering'] } } });
  if (open) return null;
  return ((await Hold.max('endedAt', { where: { workOrderId: orderId, kind: 'cure', status: 'ended' } })) as Date | null) ?? null;
}

export async function watchLeftLocks(): Promise<{ told: string[] }> {
  const at = now();
  const plant = await currentPlantSettings();
  const orders = await WorkOrder.findAll({ where: { state: 'testing' } });
  const told: string[] = [];
  for (const order of orders) {
    const ended = await curesEndedAt(order.id);
    if (!ended || at.getTime() - ended.getTime() < plant.lockLeftOnMinutes * MINUTE) continue;
    const locks = await Lock.findAll({ where: { workOrderId: order.id, removedAt: null }, order: [['lockNumber', 'ASC']] });
    for (const lock of locks) {
      const first = await sequelize.transaction(async (t) => {
        await WorkOrder.findByPk(order.id, { transaction: t, lock: t.LOCK.UPDATE }); // two workers: one tells
        const seen = await AuditEntry.findOne({ where: { entity: AUDIT_ENTITY, entityId: order.id, action: LOCK_LEFT_ON, after: { lockId: lock.id } }, transaction: t });
        if (seen) return false;
        await recordAudit({ actorId: null, action: LOCK_LEFT_ON, entity: AUDIT_ENTITY, entityId: order.id, after: { lockId: lock.id, lockNumber: lock.lockNumber, curesEndedAt: ended.toISOString(), minutes: plant.lockLeftOnMinutes } }, t);
        return true;
      });
      if (!first) continue;
      told.push(`${order.number} ${lock.lockNumber}`);
      await enqueueMail({ purpose: 'lock-left-on', recordId: lock.id }).catch((err) => logger.error({ err, lockId: lock.id }, 'could not queue the lock-left-on mail'));
    }
  }
  return { told };
}
