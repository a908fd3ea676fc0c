// What every change to an order shares: the row lock, the edit rule (draft or planned only), the
// version check, the step back from planned to draft, and the audit entry — all in one transaction.
//
// An edit of a planned order sends it back to draft. "Planned" says that a complete plan was
// checked and, when late, that operations was told; after a change of lines, joints, isolation
// points, window or cure conditions that check no longer holds, so the planner submits the plan
// again, which checks it again and tells operations again if it is still late.

import type { Transaction } from 'sequelize';
import { sequelize } from '@server/db/sequelize';
import { AuditEntry } from '@server/db/models/audit-entry';
import { Lock } from '@server/db/models/lockout';
import { Person } from '@server/db/models/person';
import type { WorkOrder } from '@server/db/models/work-order';
import { AppError } from '@server/errors';
import { recordAudit } from '@server/services/audit-service';
import type { Me } from '@shared/schemas/roles';
import { AUDIT_ENTITY } from './order-dto';
import { findOrder } from './order-facts';
import { moveTo, stateWords } from './states';

const minuteUtc = (d: Date) => `${d.toISOString().slice(0, 16).replace('T', ' ')} UTC`;

/** 409 unless the order is a draft or planned, saying why. */
export function assertEditable(order: WorkOrder): void {
  if (order.state === 'draft' || order.state === 'planned') return;
  if (order.state === 'cancelled') {
    throw AppError.conflict(`${order.number} was cancelled${order.cancelledAt ? ` at ${minuteUtc(order.cancelledAt)}` : ''} ("${order.cancelReason ?? ''}"); a cancelled order cannot be edited.`);
  }
  throw AppError.conflict(`${order.number} is ${stateWords(order.state)}; only a draft or planned order can be edited.`);
}

/** 409 naming who changed the order, and when, after the form was opened at `version`. */
async function staleEdit(order: WorkOrder, t: Transaction): Promise<AppError> {
  const last = await AuditEntry.findOne({ where: { entity: AUDIT_ENTITY, entityId: order.id }, order: [['id', 'DESC']], transaction: t });
  const who = last?.actorId ? await Person.findByPk(last.actorId, { transaction: t }) : null;
  return new AppError(
    409,
    'stale_order',
    `${who?.name ?? 'Someone'} changed ${order.number} at ${minuteUtc(last?.at ?? order.updatedAt)}, after you opened it. Look at what changed, then save again if your change should stand.`,
  );
}

export interface OrderChange {
  action: string;
  before?: Record<string, unknown>;
  after?: Record<string, unknown>;
}

/**
 * Runs `change` on order `id` inside one transaction, holding its row lock: refuses an order that
 * may not be edited (and, given `version`, an edit from an older version), raises the version,
 * sends a planned order back to draft, and writes the audit entry the change returns.
 */
export async function editOrder<T>(
  me: Me,
  id: string,
  opts: { version?: number },
  change: (order: WorkOrder, t: Transaction) => Promise<{ audit: OrderChange | null; result: T }>,
): Promise<T> {
  return sequelize.transaction(async (t) => {
    const order = await findOrder(id, t, { lock: true });
    assertEditable(order);
    if (await Lock.count({ where: { workOrderId: order.id }, transaction: t })) {
      throw AppError.conflict(`Locks have gone on ${order.number}'s isolation points, so its plan is fixed; to change it, have every lock removed and cancel the order, then plan a new one.`);
    }
    if (opts.version !== undefined && opts.version !== order.version) throw await staleEdit(order, t);
    const { audit, result } = await change(order, t);
    if (!audit) return result;
    const wasPlanned = order.state === 'planned';
    await order.update(
      { version: order.version + 1, ...(wasPlanned ? { state: moveTo(order, 'draft'), lateReason: null, plannedAt: null } : {}) },
      { transaction: t },
    );
    const state = wasPlanned ? { state: 'planned' } : {};
    await recordAudit(
      {
        actorId: me.id, action: audit.action, entity: AUDIT_ENTITY, entityId: order.id,
        before: { ...state, ...audit.before }, after: { ...(wasPlanned ? { state: 'draft' } : {}), ...audit.after },
      },
      t,
    );
    return result;
  });
}
