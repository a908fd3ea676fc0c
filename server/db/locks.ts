// Every PostgreSQL advisory lock the product takes, in one place, so two features never pick the
// same number by accident. One-key locks are ids here; two-key locks are a space here plus
// hashtext(<record id>) for the record they guard.

import type { Transaction } from 'sequelize';
import { sequelize } from '@server/db/sequelize';

/**
 * The whole line register: an import's apply takes it exclusively, a preview's read of the
 * register takes it shared. So a preview sees either all of an import or none of it, and
 * `applied_at > previewed_at` means exactly "applied after this preview read the register".
 */
export const REGISTER_LOCK = 73_201_001;
/** Confirming imports, one at a time: the "another import is being written" check and the claim are one step. */
export const IMPORT_CONFIRM_LOCK = 73_201_002;
/** Space of the two-key lock on one import (with hashtext(id)): two runs of one job never interleave. */
export const IMPORT_LOCK_SPACE = 7_321;

/** Waits for an exclusive (or shared) one-key lock, held until the transaction ends. */
export async function lockForTransaction(t: Transaction, id: number, opts: { shared?: boolean } = {}): Promise<void> {
  const fn = opts.shared ? 'pg_advisory_xact_lock_shared' : 'pg_advisory_xact_lock';
  await sequelize.query(`select ${fn}($1)`, { bind: [id], transaction: t });
}

/** Waits for the two-key lock on one record of `space`, held until the transaction ends. */
export async function lockRecordForTransaction(t: Transaction, space: number, recordId: string): Promise<void> {
  await sequelize.query('select pg_advisory_xact_lock($1, hashtext($2))', { bind: [space, recordId], transaction: t });
}
