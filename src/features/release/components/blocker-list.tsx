import type { ReleaseBlocker } from '@shared/schemas/release';
import { formatDateTime } from '@/lib/format';
import { timeLeft } from '@/lib/use-now';
import { BLOCKER_KIND } from '@/features/release/outlook';

/** The kind of a reason as a word in a box: LOCK, HOLD, TEST, STAGE. */
export function KindTag({ kind }: { kind: ReleaseBlocker['kind'] }) {
  const look = kind === 'hold' ? 'border-hold/50 bg-hold-light' : kind === 'state' ? 'border-ink/25 bg-paper-sunk' : 'border-refuse/40 bg-refuse-light';
  return (
    <span className={`inline-block w-14 shrink-0 rounded border px-1 text-center font-mono text-xs font-semibold leading-5 text-ink ${look}`} title={BLOCKER_KIND[kind].name}>
      {BLOCKER_KIND[kind].tag}
    </span>
  );
}

/** Time left until `until`, live; once it has passed, that the next refresh takes the hold away. */
export function Countdown({ until, now }: { until: string; now: number }) {
  const left = timeLeft(Date.parse(until), now);
  if (!left) return <span className="text-ink-soft">ran out {formatDateTime(until)}; the next refresh shows it</span>;
  return (
    <span>
      <span className="font-semibold tabular-nums">{left}</span>
      <span className="text-ink-soft"> left · ends {formatDateTime(until)}</span>
    </span>
  );
}

/** Every reason a release is refused, each with its kind; holds with their end and a live countdown. */
export function BlockerList({ blockers, now }: { blockers: readonly ReleaseBlocker[]; now: number }) {
  return (
    <ul className="space-y-1.5 text-sm">
      {blockers.map((b, i) => (
        <li key={`${b.kind}-${i}`} className="flex items-start gap-2">
          <KindTag kind={b.kind} />
          <span className="min-w-0">
            {b.message}
            {b.kind === 'hold' && b.until && (
              <span className="block text-[13px]"><Countdown until={b.until} now={now} /></span>
            )}
          </span>
        </li>
      ))}
    </ul>
  );
}
