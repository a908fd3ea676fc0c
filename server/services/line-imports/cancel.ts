// Cancelling an import that is not yet written: while it is previewing, previewed or applying.
// The cancel commits at once; a preview or an apply still running (in the worker, or in another
// request) sees it between chunks, or at the latest when it moves the import on (which it does only
// from the state it started in), and rolls back: nothing reaches the register.

import { sequelize } from '@server/db/sequelize';
import { LineImport } from '@server/db/models/line-import';
import { databaseNow, deletePreviewRows } from '@server/db/queries/line-imports';
import { AppError } from '@server/errors';
import { recordAudit } from '@server/services/audit-service';
import type { ImportStatus, LineImportDto } from '@shared/schemas/line-imports';
import type { Me } from '@shared/schemas/roles';
import { getImport, NO_SUCH_IMPORT } from './import-dto';

const CANCELLABLE: readonly ImportStatus[] = ['previewing', 'previewed', 'applying'];

const REFUSALS: Partial<Record<ImportStatus, string>> = {
  applied: 'This import has already been written to the register, so it can no longer be cancelled.',
  failed: 'This import failed, so nothing of it was written and there is nothing to cancel.',
  cancelled: 'This import has already been cancelled.',
};

/** Cancels import `id` for `me`: its preview rows go, an audit entry says who; 409 once it is applied, failed or cancelled. */
export async function cancelImport(me: Me, id: string): Promise<LineImportDto> {
  await sequelize.transaction(async (t) => {
    // The row lock waits for a confirm, or for a step that is committing its last move, to finish.
    const imp = await LineImport.findByPk(id, { transaction: t, lock: t.LOCK.UPDATE });
    if (!imp) throw AppError.notFound(NO_SUCH_IMPORT);
    if (!CANCELLABLE.includes(imp.status)) throw AppError.conflict(REFUSALS[imp.status] ?? 'This import cannot be cancelled now.');
    const before = imp.status;
    await imp.update({ status: 'cancelled', cancelledAt: await databaseNow(t) }, { transaction: t });
    await deletePreviewRows(id, t);
    await recordAudit(
      { actorId: me.id, action: 'line-import-cancelled', entity: 'line-import', entityId: id, before: { status: before }, after: { status: 'cancelled', kind: imp.kind, filename: imp.filename } },
      t,
    );
  });
  return getImport(id);
}
