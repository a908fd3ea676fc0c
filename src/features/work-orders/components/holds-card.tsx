import type { HoldDto } from '@shared/schemas/joint-steps';
import type { JointTaskDto } from '@shared/schemas/joint-tasks';
import { cautionsFor } from '@shared/trade';
import { Card } from '@/components/ui/card';
import { Notice } from '@/components/ui/notice';
import { formatDateTime } from '@/lib/format';
import { timeLeft, useNow } from '@/lib/use-now';

const KIND_WORDS: Record<HoldDto['kind'], { name: string; rule: string }> = {
  set: { name: 'Set', rule: 'do not handle the joint' },
  cure: { name: 'Cure', rule: 'no pressure on the joint' },
};

function HoldState({ hold, now }: { hold: HoldDto; now: number }) {
  if (hold.status === 'void') return <span className="text-ink-soft">void — {hold.voidReason}</span>;
  if (hold.status === 'awaiting-engineering') return <span className="font-semibold text-refuse">waits for a supervisor's engineering cure time</span>;
  if (!hold.endsAt) return null;
  const left = hold.status === 'running' ? timeLeft(Date.parse(hold.endsAt), now) : null;
  return left ? (
    <span>
      <span className="font-semibold tabular-nums" aria-label={`${left} left`}>{left}</span>
      <span className="text-ink-soft"> left · ends {formatDateTime(hold.endsAt)}</span>
    </span>
  ) : (
    <span className="text-ink-soft">ran out {formatDateTime(hold.endsAt)}</span>
  );
}

/** The set and cure holds of the order's joints, with live countdowns. */
export function HoldsCard({ holds, tasks }: { holds: HoldDto[]; tasks: JointTaskDto[] }) {
  const now = useNow(1000);
  if (!holds.length) return null;
  const label = new Map(tasks.map((t) => [t.id, t.label]));
  const caution = cautionsFor('cure').find((c) => c.id === 'cure-first');
  return (
    <Card title={`Holds (${holds.filter((h) => h.status !== 'void').length})`}>
      <ul className="divide-y divide-ink/10 text-sm">
        {holds.map((h) => (
          <li key={h.id} className="flex flex-wrap items-baseline justify-between gap-x-4 gap-y-1 py-2">
            <span>
              <span className="font-semibold">{h.jointTaskId ? label.get(h.jointTaskId) : ''} {KIND_WORDS[h.kind].name}</span>
              <span className="text-ink-soft"> · {KIND_WORDS[h.kind].rule}</span>
              <span className="block text-[13px] text-ink-soft">
                counted at {h.temperatureF} °F, {h.relativeHumidity} % RH, {h.pressurePsi} psi{h.schedule ? ` · schedule ${h.schedule}` : ''} · {h.basis}
              </span>
            </span>
            <HoldState hold={h} now={now} />
          </li>
        ))}
      </ul>
      {caution && (
        <div className="mt-3">
          <Notice tone="caution" title={caution.title}>{caution.text}</Notice>
        </div>
      )}
    </Card>
  );
}
