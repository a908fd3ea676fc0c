// Counts and facets kept per process until the data under them changes. A statement trigger writes
// a change_log row (topic, writing transaction's id) for every statement that writes the register
// or the work orders (migration 20261209000100-list-speed). A value is kept with the snapshot of the
// statement that computed it; it is reused while no change_log row of a transaction that snapshot
// did not see is visible. That is exact: a write committed before a request starts is seen by the
// request's check, in this process or any other, and a write still running is not yet a change.

import { QueryTypes } from 'sequelize';
import { sequelize } from '@server/db/sequelize';

export type ChangeTopic = 'lines' | 'work-orders';

/** A value and `pg_current_snapshot()` of the very statement that computed it. */
export interface Snapshotted<T> {
  snapshot: string;
  value: T;
}

const MAX_ENTRIES = 500;
/** Kept at most this long whatever the log says (the sweep keeps a day of change_log rows). */
const MAX_AGE_MS = 10 * 60 * 1000;
const kept = new Map<string, { snapshot: string; value: unknown; at: number }>();

/** Whether a write under `topics` committed that `snapshot` did not see. */
async function changedSince(snapshot: string, topics: readonly ChangeTopic[]): Promise<boolean> {
  const [row] = await sequelize.query<{ changed: boolean }>(
    `select exists (select 1 from change_log
                     where xid >= pg_snapshot_xmin($1::pg_snapshot) and not pg_visible_in_snapshot(xid, $1::pg_snapshot)
                       and topic = any($2::text[])) as changed`,
    { type: QueryTypes.SELECT, bind: [snapshot, topics] },
  );
  return row?.changed !== false;
}

/** `compute()`'s value, or the one kept under `key` when nothing under `topics` has changed since it was computed. */
export async function untilChanged<T>(key: string, topics: readonly ChangeTopic[], compute: () => Promise<Snapshotted<T>>): Promise<T> {
  const hit = kept.get(key);
  if (hit && Date.now() - hit.at < MAX_AGE_MS && !(await changedSince(hit.snapshot, topics))) return hit.value as T;
  const fresh = await compute();
  kept.delete(key); // re-inserted last: the map's order is least recently computed first
  kept.set(key, { snapshot: fresh.snapshot, value: fresh.value, at: Date.now() });
  if (kept.size > MAX_ENTRIES) kept.delete(kept.keys().next().value!);
  return fresh.value;
}

/** Deletes change_log rows older than a day (the sweep); far older than anything kept. */
export async function pruneChangeLog(): Promise<number> {
  const [row] = await sequelize.query<{ n: number }>(
    `with gone as (delete from change_log where at < now() - interval '1 day' returning 1) select count(*)::int as n from gone`,
    { type: QueryTypes.SELECT },
  );
  return row?.n ?? 0;
}
