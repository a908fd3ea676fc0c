// Every sweep the repeating sweep job runs, in order. A feature whose timed work must survive a
// lost job or a flushed Redis adds its sweep here: a function that reads PostgreSQL, does what is
// due and is safe to run from several workers at once.

import { recoverStalledImports } from '@server/services/line-imports/recovery';
import { liftDueHolds } from '@server/services/holds/lift';
import { watchLeftLocks, watchWindows } from '@server/services/holds/watches';
import { pruneChangeLog } from '@server/db/change-log';

export interface Sweep {
  name: string;
  /** Returns what it did, for the log; an empty object or nothing when there was nothing to do. */
  run: () => Promise<Record<string, unknown[]> | void>;
}

export const SWEEPS: readonly Sweep[] = [
  { name: 'line-import-recovery', run: () => recoverStalledImports().then((r) => ({ ...r })) },
  { name: 'hold-lifts', run: () => liftDueHolds().then((r) => ({ ...r })) },
  { name: 'window-watch', run: () => watchWindows().then((r) => ({ ...r })) },
  { name: 'lock-left-on-watch', run: () => watchLeftLocks().then((r) => ({ ...r })) },
  { name: 'change-log-prune', run: async () => { await pruneChangeLog(); } },
];
