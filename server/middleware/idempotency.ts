// Writes from the shift tablet carry an Idempotency-Key (STYLE.md, "Idempotency"). The key and the
// write's answer are kept in the write's own transaction, so a replay of the same request answers
// the first result and records nothing twice, and two replays racing wait for each other on the
// key's row. A write that throws keeps nothing: its replay is tried afresh.

import { createHash } from 'node:crypto';
import type { Request, Response } from 'express';
import { QueryTypes, type Transaction } from 'sequelize';
import { sequelize } from '@server/db/sequelize';
import { IdempotencyKey } from '@server/db/models/joint-record';
import { AppError } from '@server/errors';

export const IDEMPOTENCY_HEADER = 'Idempotency-Key';
const KEY = /^[A-Za-z0-9._:-]{8,200}$/;

/** A write's answer: its HTTP status and JSON body (an error body for a refusal kept on purpose). */
export interface WriteResult {
  status: number;
  body: unknown;
}

function keyOf(req: Request): string {
  const key = req.get(IDEMPOTENCY_HEADER);
  if (!key) throw AppError.badRequest(`This write needs an ${IDEMPOTENCY_HEADER} header, so that sending it again records nothing twice.`);
  if (!KEY.test(key)) throw AppError.badRequest(`The ${IDEMPOTENCY_HEADER} must be 8–200 letters, digits, dots, colons, dashes or underscores.`);
  return key;
}

/** What makes two requests the same: method, path and body (a file by its bytes). */
function requestHash(req: Request): string {
  const h = createHash('sha256').update(`${req.method} ${req.baseUrl}${req.path}\n`).update(JSON.stringify(req.body ?? null));
  if (req.file) h.update(req.file.buffer);
  return h.digest('hex');
}

/**
 * Runs `write` once per key: inside one transaction it claims the key, runs the write, and stores
 * the answer beside it. A replay with the same key and request gets the stored answer; the same
 * key with another request is refused (422).
 */
export async function idempotently(req: Request, res: Response, write: (t: Transaction) => Promise<WriteResult>): Promise<void> {
  const me = res.locals.me as { id: string };
  const key = keyOf(req);
  const hash = requestHash(req);
  const result = await sequelize.transaction(async (t) => {
    const claimed = await sequelize.query(
      `insert into idempotency_keys (person_id, key, method, path, request_hash) values (:person, :key, :method, :path, :hash)
       on conflict (person_id, key) do nothing returning key`,
      { replacements: { person: me.id, key, method: req.method, path: `${req.baseUrl}${req.path}`, hash }, type: QueryTypes.SELECT, transaction: t },
    );
    if (claimed.length === 0) {
      const first = await IdempotencyKey.findOne({ where: { personId: me.id, key }, transaction: t });
      if (!first || first.status === null) throw new AppError(409, 'write_in_progress', 'This write is still being recorded; try again in a moment.');
      if (first.requestHash !== hash) {
        throw new AppError(422, 'idempotency_key_reused', `The ${IDEMPOTENCY_HEADER} was already used for a different write; each write needs its own key.`);
      }
      return { status: first.status, body: first.body, replayed: true };
    }
    const answer = await write(t);
    await IdempotencyKey.update({ status: answer.status, body: answer.body }, { where: { personId: me.id, key }, transaction: t });
    return { ...answer, replayed: false };
  });
  if (result.replayed) res.set('Idempotent-Replayed', 'true');
  res.status(result.status).json(result.body);
}

/** The API's error shape, for a refusal that is kept as the write's answer (a dry fit recorded as a retry). */
export const errorBody = (code: string, message: string) => ({ error: { code, message } });
