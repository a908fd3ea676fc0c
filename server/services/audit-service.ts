import type { Transaction } from 'sequelize';
import { AuditEntry } from '@server/db/models/audit-entry';

export interface AuditInput {
  actorId: string | null;
  action: string;
  entity: string;
  entityId: string | null;
  before?: unknown;
  after?: unknown;
}

export async function recordAudit(entry: AuditInput, transaction?: Transaction): Promise<void> {
  await AuditEntry.create({ before: null, after: null, ...entry }, { transaction });
}
