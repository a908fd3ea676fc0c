import type { LineStatus } from '@shared/schemas/lines';
import { LINE_STATUS_LABELS } from '@shared/schemas/line-values';

/** Each status has its own shape as well as a word, so it reads without colour too. */
const MARKS: Record<LineStatus, React.ReactNode> = {
  // A filled disc: the line carries its fluid.
  'in-service': <circle cx="7" cy="7" r="5" className="fill-tide" />,
  // A hollow ring with a bar: stopped, but not locked.
  'out-of-service': (
    <>
      <circle cx="7" cy="7" r="4.5" className="fill-none stroke-ink-soft" strokeWidth="1.6" />
      <path d="M4.5 7h5" className="stroke-ink-soft" strokeWidth="1.6" />
    </>
  ),
  // A padlock: someone's lock is on it.
  'locked-out': (
    <>
      <path d="M4.5 6V4.5a2.5 2.5 0 0 1 5 0V6" className="fill-none stroke-hold" strokeWidth="1.6" />
      <rect x="3" y="6" width="8" height="6.5" rx="1.2" className="fill-hold" />
    </>
  ),
};

/** The line's status; `openOrders` adds that work is planned or under way on it (the register's list). */
export function LineStatusMark({ status, openOrders = 0 }: { status: LineStatus; openOrders?: number }) {
  return (
    <span className={`inline-flex items-center gap-1.5 whitespace-nowrap text-sm ${status === 'locked-out' ? 'font-semibold text-hold' : status === 'out-of-service' ? 'text-ink-soft' : 'text-ink'}`}>
      <svg aria-hidden width="14" height="14" viewBox="0 0 14 14" className="shrink-0">
        {MARKS[status]}
      </svg>
      {LINE_STATUS_LABELS[status]}
      {openOrders > 0 && (
        <span className="ml-1 rounded border border-ink/20 px-1.5 text-xs font-semibold text-ink">
          {openOrders === 1 ? '1 open order' : `${openOrders} open orders`}
        </span>
      )}
    </span>
  );
}
