import { WORK_ORDER_STATES, WORK_ORDER_STATE_LABELS, type WorkOrderState } from '@shared/schemas/work-orders';
import { STATE_LOOK } from '@/features/work-orders/state-words';

export function StateMark({ state }: { state: WorkOrderState }) {
  const look = STATE_LOOK[state];
  return (
    <span className={`inline-flex items-center gap-1.5 whitespace-nowrap rounded-full border px-2.5 py-0.5 text-sm font-medium text-ink ${look.chip}`}>
      <span aria-hidden>{look.mark}</span>
      {WORK_ORDER_STATE_LABELS[state]}
    </span>
  );
}

/** What each state means, in words; shown beside the list and the schedule. */
export function StateLegend({ states = WORK_ORDER_STATES, open = false }: { states?: readonly WorkOrderState[]; open?: boolean }) {
  return (
    <details open={open} className="rounded-lg border border-ink/10 bg-paper-raised px-3 text-sm">
      <summary className="flex min-h-11 cursor-pointer items-center font-medium text-ink-soft">What the states mean</summary>
      <dl className="grid gap-x-6 gap-y-2 pb-3 sm:grid-cols-2 lg:grid-cols-3">
        {states.map((s) => (
          <div key={s} className="flex items-start gap-2">
            <dt className="shrink-0">
              <StateMark state={s} />
            </dt>
            <dd className="text-ink-soft">{STATE_LOOK[s].meaning}</dd>
          </div>
        ))}
      </dl>
    </details>
  );
}
