import { Link } from 'react-router-dom';
import { useNow } from '@/lib/use-now';
import { blockerSummary, lineOutlook, lineReady, stateLabel, type StatusLine } from '@/features/release/outlook';
import { Countdown } from '@/features/release/components/blocker-list';

const STATUS_LOOK: Record<StatusLine['status'], { words: string; look: string }> = {
  'locked-out': { words: 'Locked out', look: 'border-refuse/40 bg-refuse-light' },
  'out-of-service': { words: 'Out of service', look: 'border-hold/50 bg-hold-light' },
};

function WhenBack({ line, now }: { line: StatusLine; now: number }) {
  if (!line.orders.length) return <p className="text-ink-soft">No open work order holds it out; ask the planner why it is out.</p>;
  if (lineReady(line)) return <p className="font-semibold text-tide">Can go back now: it needs only operations' release checklist.</p>;
  const { notBefore, needs } = lineOutlook(line, now);
  return notBefore ? (
    <div>
      <p><span className="font-medium">Not before the last hold ends:</span> <Countdown until={notBefore} now={now} /></p>
      <p className="text-ink-soft">Then it needs {needs.join(', then ')}.</p>
    </div>
  ) : (
    <p><span className="font-medium">No hold is counting down;</span> it needs {needs.join(', then ')}.</p>
  );
}

/** Every line out of service: its status, the orders holding it out and why, and when it can come back. */
export function LineStatusBoard({ lines }: { lines: readonly StatusLine[] }) {
  const now = useNow(1000);
  if (!lines.length) return <p className="text-sm text-ink-soft">Every line in the register is in service.</p>;
  return (
    <ul className="divide-y divide-ink/10">
      {lines.map((line) => (
        <li key={line.id} className="space-y-1 py-3 text-sm">
          <div className="flex flex-wrap items-baseline gap-x-3 gap-y-1">
            <Link to={`/lines/${encodeURIComponent(line.lineNumber)}`} className="inline-flex min-h-11 items-center text-base font-semibold text-tide hover:underline">{line.lineNumber}</Link>
            <span className={`rounded border px-1.5 text-xs font-semibold uppercase leading-5 tracking-wide text-ink ${STATUS_LOOK[line.status].look}`}>{STATUS_LOOK[line.status].words}</span>
            <span className="text-ink-soft">{line.area} · {line.service}</span>
          </div>
          {line.orders.length > 0 && (
            <ul className="space-y-0.5">
              {line.orders.map((o) => (
                <li key={o.id} className="flex flex-wrap items-center gap-x-2">
                  <Link to={`/work-orders/${o.id}`} className="inline-flex min-h-11 items-center font-semibold text-tide hover:underline">{o.number}</Link>
                  <span className="text-ink-soft">{stateLabel(o.state)}</span>
                  {o.ready ? <span className="font-medium text-tide">ready to release</span> : <span>{blockerSummary(o.blockers)}</span>}
                </li>
                ))}
              </ul>
            )}
            <WhenBack line={line} now={now} />
          </li>
      ))}
    </ul>
  );
}
