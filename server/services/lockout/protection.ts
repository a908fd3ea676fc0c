// What protects an order's section right now, read from the database: the plan's points, the group
// lock box, the locks still on and the current verification of zero energy. The board, the lock
// rules, the joint steps and the shift view all ask this one module.

import { col, fn, Op, type Transaction } from 'sequelize';
import { IsolationPlanEntry } from '@server/db/models/isolation-plan-entry';
import { IsolationVerification, Lock, LockBox } from '@server/db/models/lockout';
import type { WorkOrderState } from '@shared/schemas/work-orders';

/** States in which people may be working on the opened section: no point may be left unlocked. */
export const WORK_OPEN: readonly WorkOrderState[] = ['isolated', 'in-work', 'curing'];
/** States in which locks may go on. */
export const LOCKABLE: readonly WorkOrderState[] = ['planned', 'isolated', 'in-work', 'curing', 'testing'];

export interface Protection {
  entries: IsolationPlanEntry[];
  box: LockBox | null;
  locks: Lock[];
  verification: IsolationVerification | null;
  /** Entry id → whether a lock protects it now (its own, or the box's when its key is in the box). */
  protectedEntry: Map<string, boolean>;
  /** Sentences naming what is missing before the section counts as isolated. */
  missing: string[];
  isolated: boolean;
}

const listTags = (tags: string[]) => (tags.length > 6 ? `${tags.slice(0, 6).join(', ')} and ${tags.length - 6} more` : tags.join(', '));

export async function readProtection(orderId: string, t?: Transaction): Promise<Protection> {
  const entries = await IsolationPlanEntry.findAll({ where: { workOrderId: orderId }, order: [['sortOrder', 'ASC']], transaction: t });
  const box = await LockBox.findOne({ where: { workOrderId: orderId }, transaction: t });
  // locks put on in one request share a time: then by number, as the release queue lists them
  const locks = await Lock.findAll({
    where: { workOrderId: orderId, removedAt: { [Op.is]: null } }, order: [['appliedAt', 'ASC'], [fn('lower', col('lock_number')), 'ASC']], transaction: t,
  });
  const verification = await IsolationVerification.findOne({
    where: { workOrderId: orderId, supersededAt: { [Op.is]: null } }, order: [['verifiedAt', 'DESC']], transaction: t,
  });
  const boxLocked = !!box && locks.some((l) => l.lockBoxId === box.id);
  const protectedEntry = new Map(entries.map((e) => [e.id, e.lockBoxId ? boxLocked : locks.some((l) => l.isolationPlanEntryId === e.id)]));
  const missing: string[] = [];
  if (entries.length === 0) missing.push('The order has no isolation plan.');
  const bare = entries.filter((e) => !e.lockBoxId && !protectedEntry.get(e.id)).map((e) => e.tag);
  if (bare.length) missing.push(`${bare.length} of ${entries.length} isolation points have no lock: ${listTags(bare)}.`);
  if (box && !boxLocked && entries.some((e) => e.lockBoxId === box.id)) {
    const inBox = entries.filter((e) => e.lockBoxId === box.id).map((e) => e.tag);
    missing.push(`Lock box ${box.label} holds the keys of ${listTags(inBox)} but carries no personal lock.`);
  }
  if (!verification) missing.push('Zero energy has not been verified for the section.');
  return { entries, box, locks, verification, protectedEntry, missing, isolated: missing.length === 0 };
}

/** What the section is protected by, apart from `lock`: whether removing it leaves its point or the box unlocked. */
export function lastLockOnItsPlace(p: Protection, lock: Lock): boolean {
  const others = p.locks.filter((l) => l.id !== lock.id);
  return lock.lockBoxId ? !others.some((l) => l.lockBoxId === lock.lockBoxId) : !others.some((l) => l.isolationPlanEntryId === lock.isolationPlanEntryId);
}
