import type { HoldDto } from '@shared/schemas/joint-steps';
import { clockTime, formatCountdown, msUntil } from '../countdown';
import { useNow } from '../use-now';

const WORDS = { set: 'Do not handle until', cure: 'No pressure until' } as const;
const NAMES = { set: 'Set hold', cure: 'Cure hold' } as const;

/** One hold: its end and a live countdown; a hold waiting for engineering says who must act. */
export function HoldLine({ hold, large = false }: { hold: HoldDto; large?: boolean }) {
  const now = useNow(1000);
  if (hold.status === 'awaiting-engineering') {
    return (
      <p className="text-ink">
        <span className="font-semibold">{NAMES[hold.kind]}: waits for engineering.</span> A supervisor must enter an engineering cure time
        before this joint sees pressure. <span className="text-ink-soft">{hold.basis}</span>
      </p>
    );
  }
  if (hold.status === 'void') return <p className="text-ink-soft">{NAMES[hold.kind]} void{hold.voidReason ? `: ${hold.voidReason}` : ''}.</p>;
  const left = hold.endsAt ? msUntil(hold.endsAt, now) : 0;
  if (hold.status === 'ended' || !hold.endsAt || left <= 0) {
    return <p className="text-ink-soft">{NAMES[hold.kind]} over{hold.endsAt ? ` at ${clockTime(hold.endsAt, now)}` : ''}.</p>;
  }
  return (
    <p className="flex flex-wrap items-baseline gap-x-3">
      <span className="font-semibold">{WORDS[hold.kind]} {clockTime(hold.endsAt, now)}</span>
      <span role="timer" aria-label={`${NAMES[hold.kind]} time left`} className={`font-bold tabular-nums text-hold ${large ? 'text-3xl' : 'text-xl'}`}>
        {formatCountdown(left)}
      </span>
      <span className="text-sm text-ink-soft">left</span>
    </p>
  );
}

/** The joint's holds, with their basis (temperature band, size, pressure) and source. */
export function HoldsSection({ holds }: { holds: HoldDto[] }) {
  if (!holds.length) return null;
  return (
    <section aria-labelledby="holds" className="rounded-xl border border-hold/40 bg-paper-raised p-4">
      <h2 id="holds" className="mb-2 text-lg font-semibold">Holds</h2>
      <ul className="space-y-3">
        {holds.map((h) => (
          <li key={h.id}>
            <HoldLine hold={h} large />
            {h.status !== 'awaiting-engineering' && (
              <p className="text-sm text-ink-soft">
                {h.basis}
                {h.source ? ` · ${h.source}` : ''}
              </p>
            )}
          </li>
        ))}
      </ul>
    </section>
  );
}
