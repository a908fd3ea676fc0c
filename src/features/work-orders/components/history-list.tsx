import type { WorkOrderDto } from '@shared/schemas/work-orders';
import { formatDateTime } from '@/lib/format';

const ACTIONS: Record<string, string> = {
  'work-order-created': 'Created the order',
  'work-order-updated': 'Changed the order',
  'work-order-planned': 'Submitted the plan',
  'work-order-cancelled': 'Cancelled the order',
  'joint-tasks-added': 'Added joints',
  'joint-task-removed': 'Removed a joint',
  'joint-task-fitter-set': 'Assigned a fitter',
  'isolation-plan-set': 'Set the isolation plan',
  'isolation-point-added': 'Added a point to the register',
  'locks-applied': 'Put locks on',
  'lock-box-set-up': 'Set up the lock box',
  'lock-removed': 'Took a lock off',
  'lock-removed-absent': "Removed an absent person's lock (1910.147(e)(3))",
  'locks-handed-over': 'Took over locks at a shift change',
  'isolation-verified': 'Verified zero energy',
  'joint-step-recorded': 'Recorded a joint step',
  'dry-fit-refused': 'Dry fit outside the socket window (retry)',
  'joint-redo': 'Cut a joint out for redo',
  'pressure-test-passed': 'Recorded the hydrostatic test: passed',
  'pressure-test-failed': 'Recorded the hydrostatic test: failed',
  'order-released': 'Released the lines to service',
  'work-order-closed': 'Closed the order with its record',
  'hold-ended': 'A hold ran out',
  'engineering-cure-time': 'Entered an engineering cure time',
  'temperature-log-applied': 'Applied a temperature log to the holds',
  'window-at-risk': 'Told the planner and operations: the work will run past its window',
  'lock-left-on': 'Told the supervisors: a lock is still on after the cure ended',
};

const FIELDS: Record<string, string> = {
  kind: 'kind', priority: 'priority', scope: 'scope', requestedBy: 'requested by', lines: 'lines', number: 'number', state: 'state',
  windowStart: 'window start', windowEnd: 'window end', forecastLowF: 'forecast low (°F)', forecastHighRh: 'forecast high humidity (%)',
  testPressurePsi: 'raised test pressure (psi)', componentRatingPsi: 'weakest component (psi)', lateReason: 'late because', reason: 'reason',
  jointTasks: 'joints', line: 'line', fittingKind: 'fitting', size: 'size', reducingSize: 'reducing size', isolationPlan: 'isolation plan',
  jointTask: 'joint', step: 'step', lockNumber: 'lock', on: 'on', owner: 'owner', removedBy: 'removed by', from: 'from', to: 'to', person: 'person', locks: 'locks',
  lockBox: 'lock box', responsible: 'responsible', keysOf: 'keys of', verifiedBy: 'verified by', method: 'method', reading: 'reading', points: 'positions found',
  replacedBy: 'replaced by', holdsVoided: 'holds made void', procedure: '(e)(3) record',
  medium: 'medium', readings: 'readings', holdMinutes: 'held (min)', witness: 'witness', examiner: 'examiner', redone: 'cut out for redo',
  releasedBy: 'released by', checklist: 'checklist', notes: 'notes', linesInService: 'lines back in service',
  curesEndedAt: 'every cure ended', minutes: 'after (min)',
  fits: 'fits the window', testPsi: 'test pressure (psi)', earliestRelease: 'earliest release', neededWindowEnd: 'window end needed', lateStep: 'late step',
};
const INSTANT = /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}/;

const show = (v: unknown): string => {
  if (v === null || v === undefined) return '—';
  if (typeof v === 'string' && INSTANT.test(v)) return formatDateTime(v);
  if (typeof v === 'boolean') return v ? 'yes' : 'no';
  if (Array.isArray(v)) return v.map(show).join(', ');
  if (typeof v === 'object') return Object.entries(v as Record<string, unknown>).map(([k, x]) => `${k}: ${show(x)}`).join('; ');
  return String(v);
};

/** What changed, field by field: before → after where both are known. */
function Change({ before, after }: { before: unknown; after: unknown }) {
  const b = (before && typeof before === 'object' ? before : {}) as Record<string, unknown>;
  const a = (after && typeof after === 'object' ? after : {}) as Record<string, unknown>;
  const keys = [...new Set([...Object.keys(b), ...Object.keys(a)])].filter((k) => k !== 'version' && k !== 'lockId'); // ids mean nothing to a reader
  if (!keys.length) return null;
  return (
    <ul className="mt-0.5 text-ink-soft">
      {keys.map((k) => (
        <li key={k} className="break-words">
          <span className="font-medium">{FIELDS[k] ?? k}</span>: {k in b && k in a ? `${show(b[k])} → ${show(a[k])}` : show(k in a ? a[k] : b[k])}
        </li>
      ))}
    </ul>
  );
}

export function HistoryList({ history }: { history: WorkOrderDto['history'] }) {
  return (
    <ol className="space-y-3 text-sm">
      {[...history].reverse().map((h, i) => (
        <li key={`${h.at}-${i}`} className="border-l-2 border-ink/15 pl-3">
          <p>
            <span className="font-semibold">{ACTIONS[h.action] ?? h.action}</span>
            <span className="text-ink-soft"> · {h.actor?.name ?? 'the system'} · {formatDateTime(h.at)}</span>
          </p>
          <Change before={h.before} after={h.after} />
        </li>
      ))}
    </ol>
  );
}
