import { Link } from 'react-router-dom';
import type { BlockerDto } from '@shared/schemas/joint-steps';
import { clockTime, formatCountdown, msUntil } from '../countdown';
import { useNow } from '../use-now';

/** Blockers that stop the next step (a hold is told, not a stop: the fitter still wipes a bead while it sets). */
export const STOPS: readonly BlockerDto['kind'][] = ['isolation', 'my-lock', 'order-state', 'redone'];
export const stopsWork = (blockers: readonly BlockerDto[]) => blockers.filter((b) => STOPS.includes(b.kind));

const MARK: Record<BlockerDto['kind'], string> = { isolation: '×', 'my-lock': '×', 'order-state': '×', 'previous-step': '…', hold: '◔', redone: '✂' };

function Until({ iso }: { iso: string }) {
  const now = useNow(1000);
  const left = msUntil(iso, now);
  if (left <= 0) return <span className="text-ink-soft"> (over at {clockTime(iso, now)})</span>;
  return (
    <span className="whitespace-nowrap">
      {' '}until {clockTime(iso, now)} · <span role="timer" className="font-bold tabular-nums">{formatCountdown(left)}</span> left
    </span>
  );
}

/**
 * What stops or holds a joint, in the server's words. Isolation and the fitter's own lock link to the
 * order, where locks are put on; `orderId` null leaves the links out (the caller links the order).
 */
export function BlockerList({ blockers, orderId, compact = false }: { blockers: readonly BlockerDto[]; orderId: string | null; compact?: boolean }) {
  if (!blockers.length) return null;
  return (
    <ul className={compact ? 'space-y-0.5 text-sm' : 'space-y-2'}>
      {blockers.map((b, i) => {
        const stop = STOPS.includes(b.kind);
        return (
          <li key={`${b.kind}-${i}`} className={`flex gap-2 ${stop ? 'text-refuse' : 'text-hold'} ${compact ? '' : 'rounded-lg border p-3 text-base ' + (stop ? 'border-refuse/40 bg-refuse-light' : 'border-hold/40 bg-hold-light')}`}>
            <span aria-hidden className="shrink-0">{MARK[b.kind]}</span>
            <span className="min-w-0 font-medium text-ink">
              {b.message}
              {b.until && <Until iso={b.until} />}
              {!compact && orderId && (b.kind === 'isolation' || b.kind === 'my-lock') && (
                <>
                  {' '}
                  <Link to={`/work-orders/${orderId}`} className="inline-flex min-h-12 items-center font-semibold text-tide underline">
                    Open the order’s locks
                  </Link>
                </>
              )}
            </span>
          </li>
        );
      })}
    </ul>
  );
}
