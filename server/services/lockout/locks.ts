// Lock events (OSHA 29 CFR 1910.147): personal locks on points or on the group lock box, the box
// itself, removal by the owner or under the (e)(3) procedure, and shift handover without a gap.
// Each runs inside the caller's transaction with the order's row lock, checks the rules against
// the database, writes its audit entry, and answers the board.

import { Op, type Transaction } from 'sequelize';
import { now } from '@server/clock';
import { IsolationPlanEntry } from '@server/db/models/isolation-plan-entry';
import { IsolationVerification, Lock, LockBox } from '@server/db/models/lockout';
import { Person } from '@server/db/models/person';
import type { WorkOrder } from '@server/db/models/work-order';
import { AppError } from '@server/errors';
import { logger } from '@server/logger';
import { enqueueMail } from '@server/queues/mail';
import { recordAudit } from '@server/services/audit-service';
import { AUDIT_ENTITY } from '@server/services/work-orders/order-dto';
import { findOrder } from '@server/services/work-orders/order-facts';
import { stateWords } from '@server/services/work-orders/states';
import { may, refusalFor } from '@shared/permissions';
import type { Handover, LockBoxCreate, LockRemoval, LockTarget, LocksApply } from '@shared/schemas/lockout';
import type { Me } from '@shared/schemas/roles';
import { lastLockOnItsPlace, LOCKABLE, readProtection, WORK_OPEN } from './protection';

const audit = (me: Me, order: WorkOrder, action: string, after: Record<string, unknown>, t: Transaction, before?: Record<string, unknown>) =>
  recordAudit({ actorId: me.id, action, entity: AUDIT_ENTITY, entityId: order.id, before: before ?? null, after }, t);

async function lockableOrder(orderId: string, t: Transaction): Promise<WorkOrder> {
  const order = await findOrder(orderId, t, { lock: true });
  if (!LOCKABLE.includes(order.state)) {
    const when = order.state === 'draft' ? 'locks go on once its plan is submitted' : 'its section is no longer locked out by this order';
    throw AppError.conflict(`${order.number} is ${stateWords(order.state)}; ${when}.`);
  }
  return order;
}

/** Where a lock goes, in words: "HV-20013" or "lock box B-7". */
function placeOf(lock: Pick<Lock, 'isolationPlanEntryId' | 'lockBoxId'>, entries: IsolationPlanEntry[], box: LockBox | null): string {
  if (lock.lockBoxId) return `lock box ${box?.label ?? ''}`.trim();
  return entries.find((e) => e.id === lock.isolationPlanEntryId)?.tag ?? 'a point no longer in the plan';
}

/** Refuses a lock number already on this order, or a second lock of one person on one place. */
async function checkNewLocks(order: WorkOrder, personId: string, targets: LockTarget[], t: Transaction) {
  const p = await readProtection(order.id, t);
  const numbers = new Set(p.locks.map((l) => l.lockNumber.toLowerCase()));
  const seenNumbers = new Set<string>();
  const seenPlaces = new Set<string>();
  const rows = targets.map((target) => {
    const num = target.lockNumber.toLowerCase();
    if (numbers.has(num) || seenNumbers.has(num)) throw AppError.conflict(`Lock ${target.lockNumber} is already on ${order.number}; each lock goes on one place, and its number identifies who applied it.`);
    seenNumbers.add(num);
    if ('entryId' in target) {
      const entry = p.entries.find((e) => e.id === target.entryId);
      if (!entry) throw AppError.badRequest(`That point is not in ${order.number}'s isolation plan.`, { entryId: ['not a point of this order'] });
      if (entry.lockBoxId) throw AppError.conflict(`${entry.tag}'s key is in lock box ${p.box?.label ?? ''}; put your lock on the box instead.`);
      if (seenPlaces.has(entry.id) || p.locks.some((l) => l.isolationPlanEntryId === entry.id && l.personId === personId)) {
        throw AppError.conflict(`You already have a lock on ${entry.tag}.`);
      }
      seenPlaces.add(entry.id);
      return { isolationPlanEntryId: entry.id, lockBoxId: null, lockNumber: target.lockNumber, place: entry.tag };
    }
    if (!p.box || p.box.id !== target.lockBoxId) throw AppError.badRequest(`That lock box is not ${order.number}'s.`, { lockBoxId: ['not this order\'s lock box'] });
    if (seenPlaces.has(p.box.id) || p.locks.some((l) => l.lockBoxId === p.box!.id && l.personId === personId)) throw AppError.conflict(`You already have a lock on lock box ${p.box.label}.`);
    seenPlaces.add(p.box.id);
    return { isolationPlanEntryId: null, lockBoxId: p.box.id, lockNumber: target.lockNumber, place: `lock box ${p.box.label}` };
  });
  return rows;
}

export async function applyLocks(me: Me, orderId: string, body: LocksApply, t: Transaction): Promise<void> {
  const order = await lockableOrder(orderId, t);
  const rows = await checkNewLocks(order, me.id, body.locks, t);
  const at = now();
  await Lock.bulkCreate(rows.map(({ place: _place, ...r }) => ({ ...r, workOrderId: order.id, personId: me.id, appliedAt: at })), { transaction: t });
  await audit(me, order, 'locks-applied', { person: me.name, locks: rows.map((r) => ({ lockNumber: r.lockNumber, on: r.place })) }, t);
}

export async function createLockBox(me: Me, orderId: string, body: LockBoxCreate, t: Transaction): Promise<void> {
  const order = await lockableOrder(orderId, t);
  const p = await readProtection(order.id, t);
  if (p.box) throw AppError.conflict(`${order.number} already has lock box ${p.box.label}.`);
  const chosen = body.entryIds.map((id) => p.entries.find((e) => e.id === id));
  if (chosen.some((e) => !e)) throw AppError.badRequest(`Some of those points are not in ${order.number}'s isolation plan.`, { entryIds: ['not a point of this order'] });
  const locked = chosen.filter((e) => p.locks.some((l) => l.isolationPlanEntryId === e!.id)).map((e) => e!.tag);
  if (locked.length) {
    throw AppError.conflict(`${locked.join(', ')} already carr${locked.length === 1 ? 'ies' : 'y'} personal locks; a point's key goes into the box before anyone locks the point. Have those locks removed first, or leave the point out of the box.`);
  }
  const box = await LockBox.create({ workOrderId: order.id, label: body.label, responsiblePersonId: me.id }, { transaction: t });
  await IsolationPlanEntry.update({ lockBoxId: box.id }, { where: { id: { [Op.in]: body.entryIds } }, transaction: t });
  await audit(me, order, 'lock-box-set-up', { lockBox: box.label, responsible: me.name, keysOf: chosen.map((e) => e!.tag) }, t);
}

/** 409 when removing `lock` would leave its point or the box unlocked while people may work on the section. */
function refuseGap(order: WorkOrder, lock: Lock, p: Awaited<ReturnType<typeof readProtection>>, owner: string): void {
  if (!WORK_OPEN.includes(order.state) || !lastLockOnItsPlace(p, lock)) return;
  const place = placeOf(lock, p.entries, p.box);
  throw AppError.conflict(
    `Lock ${lock.lockNumber} (${owner}) is the last lock on ${place} while ${order.number} is ${stateWords(order.state)}; removing it would leave ${place} unprotected. ` +
      'At a shift change the on-coming person puts their lock on first (OSHA 29 CFR 1910.147(f)(4)).',
  );
}

export async function removeLock(me: Me, lockId: string, body: LockRemoval, t: Transaction): Promise<string> {
  const found = await Lock.findByPk(lockId, { transaction: t });
  if (!found) throw AppError.notFound('There is no such lock.');
  const order = await findOrder(found.workOrderId, t, { lock: true });
  const lock = (await Lock.findByPk(lockId, { transaction: t, lock: t.LOCK.UPDATE }))!;
  const owner = await Person.findByPk(lock.personId, { transaction: t });
  const ownerName = owner?.name ?? 'its owner';
  if (lock.removedAt) throw AppError.conflict(`Lock ${lock.lockNumber} was already removed at ${lock.removedAt.toISOString()}.`);
  const own = lock.personId === me.id;
  if (!own) {
    if (!may(me, 'locks.removeAbsent')) {
      throw AppError.forbidden(`Only ${ownerName}, who applied lock ${lock.lockNumber}, may remove it (OSHA 29 CFR 1910.147(e)(3)). ${refusalFor('locks.removeAbsent', me.roles)}`);
    }
    if (body.absent && Date.parse(body.absent.contactAttemptedAt) > now().getTime() + 60_000) {
      throw AppError.badRequest('The attempt to reach the person cannot be in the future.', { 'absent.contactAttemptedAt': ['in the future'] });
    }
    if (!body.absent) {
      throw new AppError(409, 'absent_procedure_needed',
        `Lock ${lock.lockNumber} is ${ownerName}'s. To remove it without them, record the three steps of 1910.147(e)(3): that ${ownerName} is not at the facility, how and when you tried to reach them, and how they will be told before they resume work.`);
    }
  }
  const p = await readProtection(order.id, t);
  refuseGap(order, lock, p, ownerName);
  const at = now();
  await lock.update({ removedAt: at, removedById: me.id, removal: own ? 'owner' : 'absent', absentRecord: own ? null : body.absent! }, { transaction: t });
  if (lastLockOnItsPlace(p, lock) && p.verification) {
    // Protection lapsed on a point or the box (for the test): the verification no longer stands.
    await IsolationVerification.update({ supersededAt: at }, { where: { id: p.verification.id }, transaction: t });
  }
  const place = placeOf(lock, p.entries, p.box);
  await audit(me, order, own ? 'lock-removed' : 'lock-removed-absent', {
    lockNumber: lock.lockNumber, on: place, owner: ownerName, removedBy: me.name, ...(own ? {} : { procedure: body.absent }),
  }, t);
  if (!own) {
    // The owner hears of it by mail; queued after the commit so a rolled-back removal sends nothing.
    t.afterCommit(() => void enqueueMail({ purpose: 'lock-removed-absent', recordId: lock.id }).catch((err) => logger.error({ err, lockId: lock.id }, 'could not queue the mail to the lock\'s owner')));
  }
  return order.id;
}

export async function handOver(me: Me, orderId: string, body: Handover, t: Transaction): Promise<void> {
  const order = await lockableOrder(orderId, t);
  if (body.fromPersonId === me.id) throw AppError.badRequest('A handover passes protection from another person to you; you cannot take over your own locks.');
  const from = await Person.findByPk(body.fromPersonId, { transaction: t });
  if (!from) throw AppError.badRequest('There is no such person.', { fromPersonId: ['no such person'] });
  const p = await readProtection(order.id, t);
  const theirs = p.locks.filter((l) => l.personId === from.id);
  if (!theirs.length) throw AppError.conflict(`${from.name} has no lock on ${order.number} to hand over.`);
  const targets: (LockTarget & { replaces: Lock })[] = body.locks.map((x) => {
    const replaces = theirs.find((l) => l.id === x.replacesLockId);
    if (!replaces) throw AppError.badRequest(`That lock is not one of ${from.name}'s locks on ${order.number}.`, { locks: ['not a lock of the off-going person'] });
    return replaces.lockBoxId ? { lockBoxId: replaces.lockBoxId, lockNumber: x.lockNumber, replaces } : { entryId: replaces.isolationPlanEntryId!, lockNumber: x.lockNumber, replaces };
  });
  const rows = await checkNewLocks(order, me.id, targets, t);
  const at = now();
  await Lock.bulkCreate(
    rows.map(({ place: _place, ...r }, i) => ({ ...r, workOrderId: order.id, personId: me.id, appliedAt: at, handedOverFromLockId: targets[i]!.replaces.id })),
    { transaction: t },
  );
  await audit(me, order, 'locks-handed-over', {
    from: from.name, to: me.name, locks: rows.map((r, i) => ({ on: r.place, lockNumber: r.lockNumber, replaces: targets[i]!.replaces.lockNumber })),
  }, t);
}
