// Answers kept per process until the data under them changes. A statement trigger writes a
// change_log row (topic, writing transaction's id) for every statement that writes a table a list
// reads (migrations 20261209000100-list-speed and 20261210000100-change-topics). Two ways to know
// that nothing changed, both exact — a write committed before a request starts is seen by that
// request, in this process or any other; a write still running is not yet a change:
//
// - A request's freshness check (its `ChangeView`): the session read of every signed-in request
//   (server/db/session-store.ts) also asks which topics have change_log rows that this process's
//   last check did not see, in the same statement. Each topic has a generation number in this
//   process, raised when its topic changed; a request keeps the generations as they were after its
//   own check. An answer computed under those generations is reused by any request whose view
//   carries the same ones. Concurrent requests share one session read (a batch), so under load a
//   check costs a fraction of a round trip per request.
// - Without a view (a write's own reads, a request with no session): the value's snapshot is
//   checked — is there a change_log row of a transaction that snapshot did not see?
//
// Why a view's generations are exact: a check sent with the process's last checked snapshot V
// reports every topic written by a transaction committed after V and before its own snapshot, and
// raises those generations before V moves on; an answer stored under generations g was computed
// after g was reached, so it sees every write any check had reported by then.

import { QueryTypes } from 'sequelize';
import { now } from '@server/clock';
import { sequelize } from '@server/db/sequelize';

export const CHANGE_TOPICS = ['lines', 'work-orders', 'release'] as const;
export type ChangeTopic = (typeof CHANGE_TOPICS)[number];

/** A value and `pg_current_snapshot()` of the very statement that computed it. */
export interface Snapshotted<T> {
  snapshot: string;
  value: T;
}

/** A kept value and the encodings of it made for answers so far (sent by server/middleware/kept-answer.ts). */
export interface KeptAnswer<T> {
  value: T;
  encoded: Map<string, Buffer>;
}

/** The topics' generations as one request's freshness check left them. */
export type ChangeView = Readonly<Record<ChangeTopic, number>>;

const generations: Record<ChangeTopic, number> = { lines: 0, 'work-orders': 0, release: 0 };
/** The snapshot of this process's last freshness check; null before the first. */
let checkedAt: string | null = null;

/**
 * The freshness check as SQL columns, for a statement that has $n bound to `checkSnapshot()`:
 * `snapshot` (pg_current_snapshot) and `changed` (the topics written since $n, or every topic when null).
 */
export function freshnessColumns(param: string): string {
  return `pg_current_snapshot()::text as snapshot,
    case when ${param}::text is null then null else array(
      select distinct topic from change_log
       where xid >= pg_snapshot_xmin(${param}::pg_snapshot) and not pg_visible_in_snapshot(xid, ${param}::pg_snapshot)) end as changed`;
}

/** The snapshot a freshness check is to be made against (bind it to the `freshnessColumns` parameter). */
export function checkSnapshot(): string | null {
  return checkedAt;
}

/** Takes a freshness check's answer: raises the changed topics' generations, then moves the checked snapshot on. */
export function applyFreshness(sentWith: string | null, answer: { snapshot: string; changed: string[] | null }): ChangeView {
  const changed = answer.changed ?? CHANGE_TOPICS;
  for (const topic of changed) if (topic in generations) generations[topic as ChangeTopic] += 1;
  // Another check may have moved it meanwhile; only the check made against the current one may move it.
  if (sentWith === checkedAt) checkedAt = answer.snapshot;
  return { ...generations };
}

export interface KeepOptions<T> {
  /** The request's freshness view (GET requests only: a write's own reads must not trust it). */
  view?: ChangeView;
  /** When the value stops being true by the clock alone (a hold running out), if it ever does. */
  until?: (value: T) => Date | null;
}

interface Kept {
  value: unknown;
  snapshot: string;
  /** The generations it was computed under, when computed for a request with a view. */
  generations?: string;
  computedAt: number;
  until: number;
  at: number;
  /** Encodings of the value made for answers (server/middleware/kept-answer.ts), kept with it. */
  encoded?: Map<string, Buffer>;
}

const MAX_ENTRIES = 500;
/** Kept at most this long whatever the log says (the sweep keeps a day of change_log rows). */
const MAX_AGE_MS = 10 * 60 * 1000;
const kept = new Map<string, Kept>();

const generationKey = (view: ChangeView, topics: readonly ChangeTopic[]) => topics.map((t) => view[t]).join('.');

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

async function stillTrue(hit: Kept, topics: readonly ChangeTopic[], view: ChangeView | undefined): Promise<boolean> {
  const clock = now().getTime();
  if (Date.now() - hit.at >= MAX_AGE_MS || clock < hit.computedAt || clock >= hit.until) return false;
  if (view) return hit.generations === generationKey(view, topics);
  return !(await changedSince(hit.snapshot, topics));
}

/** The entry kept under `key` — `compute()`'s, or the one kept when nothing under `topics` has changed since. */
export async function keptEntry<T>(key: string, topics: readonly ChangeTopic[], compute: () => Promise<Snapshotted<T>>, opts: KeepOptions<T> = {}): Promise<KeptAnswer<T>> {
  const hit = kept.get(key);
  if (hit && (await stillTrue(hit, topics, opts.view))) {
    hit.encoded ??= new Map();
    return { value: hit.value as T, encoded: hit.encoded };
  }
  const generations = opts.view && generationKey(opts.view, topics);
  const computedAt = now().getTime();
  const fresh = await compute();
  const until = opts.until?.(fresh.value)?.getTime() ?? Number.POSITIVE_INFINITY;
  const entry: Kept = { value: fresh.value, snapshot: fresh.snapshot, generations, computedAt, until, at: Date.now(), encoded: new Map() };
  kept.delete(key); // re-inserted last: the map's order is least recently computed first
  kept.set(key, entry);
  if (kept.size > MAX_ENTRIES) kept.delete(kept.keys().next().value!);
  return { value: fresh.value, encoded: entry.encoded! };
}

/** `compute()`'s value, or the one kept under `key` when nothing under `topics` has changed since it was computed. */
export async function untilChanged<T>(key: string, topics: readonly ChangeTopic[], compute: () => Promise<Snapshotted<T>>, opts: KeepOptions<T> = {}): Promise<T> {
  return (await keptEntry(key, topics, compute, opts)).value;
}

/** The snapshot of a statement run now, for values computed by several statements (take it before the first). */
export async function currentSnapshot(): Promise<string> {
  const [row] = await sequelize.query<{ snapshot: string }>('select pg_current_snapshot()::text as snapshot', { type: QueryTypes.SELECT });
  return row!.snapshot;
}

/** Deletes change_log rows older than a day (the sweep); far older than anything kept. */
export async function pruneChangeLog(): Promise<number> {
  const [row] = await sequelize.query<{ n: number }>(
    `with gone as (delete from change_log where at < now() - interval '1 day' returning 1) select count(*)::int as n from gone`,
    { type: QueryTypes.SELECT },
  );
  return row?.n ?? 0;
}
