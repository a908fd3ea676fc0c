import { Link } from 'react-router-dom';
import { ButtonLink } from '@/components/ui/button';
import { formatDateTime } from '@/lib/format';
import { useNow } from '@/lib/use-now';
import { splitQueue, stateLabel, type QueueRow } from '@/features/release/outlook';
import { BlockerList } from '@/features/release/components/blocker-list';

const orderLink = 'inline-flex min-h-11 items-center text-base font-semibold text-tide hover:underline';

function WindowEnd({ at, now }: { at: string | null; now: number }) {
  if (!at) return null;
  const past = Date.parse(at) <= now;
  return <span className={past ? 'font-semibold text-refuse' : 'text-ink-soft'}>{past ? 'window ended' : 'window ends'} {formatDateTime(at)}</span>;
}

function OrderHead({ row, now }: { row: QueueRow; now: number }) {
  return (
    <div className="flex flex-wrap items-baseline gap-x-3 gap-y-0.5">
      <Link to={`/work-orders/${row.id}`} className={orderLink}>{row.number}</Link>
      <span className="text-sm">{stateLabel(row.state)}</span>
      <span className="text-sm text-ink-soft">{row.lines.join(', ') || 'no lines'}</span>
      <span className="text-sm"><WindowEnd at={row.windowEnd} now={now} /></span>
    </div>
  );
}

/**
 * Operations' queue: the orders that may be released now, as their own group, then every blocked one
 * with each reason it waits (locks, holds with live countdowns, the test, the stage it is at).
 */
export function ReleaseQueue({ orders }: { orders: readonly QueueRow[] }) {
  const now = useNow(1000);
  const { ready, blocked } = splitQueue(orders);
  return (
    <div className="space-y-5">
      <section aria-labelledby="queue-ready">
        <h3 id="queue-ready" className="mb-2 text-sm font-semibold uppercase tracking-wide text-tide">Ready to release ({ready.length})</h3>
        {ready.length === 0 ? (
          <p className="text-sm text-ink-soft">No order is ready: each one below still waits for something.</p>
        ) : (
          <ul className="divide-y divide-tide/20 rounded-lg border border-tide/40 bg-tide-light/40">
            {ready.map((row) => (
              <li key={row.id} className="flex flex-wrap items-center justify-between gap-2 px-3 py-2">
                <OrderHead row={row} now={now} />
                <ButtonLink to={`/work-orders/${row.id}`}>
                  Release checklist<span className="sr-only"> for {row.number}</span>
                </ButtonLink>
              </li>
            ))}
          </ul>
        )}
      </section>
      <section aria-labelledby="queue-blocked">
        <h3 id="queue-blocked" className="mb-2 text-sm font-semibold uppercase tracking-wide text-ink-soft">Not yet ({blocked.length})</h3>
        {blocked.length === 0 ? (
          <p className="text-sm text-ink-soft">Nothing is waiting.</p>
        ) : (
          <ul className="divide-y divide-ink/10">
            {blocked.map((row) => (
              <li key={row.id} className="py-3">
                <OrderHead row={row} now={now} />
                <div className="mt-1"><BlockerList blockers={row.blockers} now={now} /></div>
              </li>
            ))}
          </ul>
        )}
      </section>
    </div>
  );
}
