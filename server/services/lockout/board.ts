// The order's lock board: who is locked on where, right now, and what is missing (LockoutDto).

import { Op, type Transaction } from 'sequelize';
import { Line } from '@server/db/models/line';
import { Lock } from '@server/db/models/lockout';
import { Person } from '@server/db/models/person';
import { findOrder } from '@server/services/work-orders/order-facts';
import type { LockDto, LockoutDto } from '@shared/schemas/lockout';
import { readProtection } from './protection';

type Names = Map<string, string>;
const ref = (names: Names, id: string) => ({ id, name: names.get(id) ?? 'someone no longer listed' });

export function toLockDto(l: Lock, names: Names): LockDto {
  return {
    id: l.id,
    lockNumber: l.lockNumber,
    person: ref(names, l.personId),
    entryId: l.isolationPlanEntryId,
    lockBoxId: l.lockBoxId,
    appliedAt: l.appliedAt.toISOString(),
    handedOverFromLockId: l.handedOverFromLockId ?? null,
    removedAt: l.removedAt?.toISOString() ?? null,
    removedBy: l.removedById ? ref(names, l.removedById) : null,
    removal: l.removal ?? null,
  };
}

export async function namesOf(ids: Iterable<string | null | undefined>, t?: Transaction): Promise<Names> {
  const wanted = [...new Set([...ids].filter((x): x is string => !!x))];
  if (!wanted.length) return new Map();
  return new Map((await Person.findAll({ where: { id: { [Op.in]: wanted } }, attributes: ['id', 'name'], transaction: t })).map((p) => [p.id, p.name]));
}

export async function lockoutBoard(orderId: string, meId: string, t?: Transaction): Promise<LockoutDto> {
  const order = await findOrder(orderId, t);
  const p = await readProtection(orderId, t);
  const removed = await Lock.findAll({ where: { workOrderId: orderId, removedAt: { [Op.not]: null } }, order: [['removedAt', 'DESC']], limit: 100, transaction: t });
  const lines = new Map((await Line.findAll({ where: { id: { [Op.in]: [...new Set(p.entries.map((e) => e.lineId))] } }, attributes: ['id', 'lineNumber'], transaction: t })).map((l) => [l.id, l.lineNumber]));
  const names = await namesOf(
    [...[...p.locks, ...removed].flatMap((l) => [l.personId, l.removedById]), p.box?.responsiblePersonId, p.verification?.verifiedById],
    t,
  );
  const found = new Map((p.verification?.points ?? []).map((x) => [x.entryId, x.positionFound]));
  const dto = (l: Lock) => toLockDto(l, names);
  return {
    workOrderId: order.id,
    number: order.number,
    state: order.state,
    points: p.entries.map((e) => ({
      entryId: e.id,
      tag: e.tag,
      kind: e.kind,
      lineNumber: lines.get(e.lineId) ?? '?',
      requiredPosition: e.requiredPosition,
      lockBoxId: e.lockBoxId ?? null,
      locks: p.locks.filter((l) => l.isolationPlanEntryId === e.id).map(dto),
      protected: p.protectedEntry.get(e.id) ?? false,
      positionFound: found.get(e.id) ?? null,
    })),
    lockBox: p.box
      ? {
          id: p.box.id,
          label: p.box.label,
          responsible: ref(names, p.box.responsiblePersonId),
          locks: p.locks.filter((l) => l.lockBoxId === p.box!.id).map(dto),
          createdAt: p.box.createdAt.toISOString(),
        }
      : null,
    verification: p.verification
      ? {
          id: p.verification.id,
          verifiedBy: ref(names, p.verification.verifiedById),
          verifiedAt: p.verification.verifiedAt.toISOString(),
          method: p.verification.method,
          reading: p.verification.reading,
          points: p.verification.points,
        }
      : null,
    isolated: p.isolated,
    missing: p.missing,
    removedLocks: removed.map(dto),
    myLocks: p.locks.filter((l) => l.personId === meId).map(dto),
  };
}
