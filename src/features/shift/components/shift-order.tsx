import { cautionsFor, needsChemicalCaution } from '@shared/trade';
import type { ShiftDto } from '@shared/schemas/joint-steps';
import { ButtonLink } from '@/components/ui/button';
import { formatDateTime } from '@/lib/format';
import { orderStateWords } from '../state-words';
import { ORDER_WIDE, ShiftJointRow } from './shift-joint-row';
import { StepCautions } from './step-cautions';

type ShiftOrder = ShiftDto['orders'][number];

function Fact({ ok, yes, no }: { ok: boolean; yes: string; no: string }) {
  return (
    <li className={`flex min-h-12 items-center gap-2 rounded-lg border-2 px-3 font-semibold ${ok ? 'border-tide/50 bg-tide-light text-ink' : 'border-refuse/50 bg-refuse-light text-ink'}`}>
      <span aria-hidden className={`grid h-7 w-7 place-items-center rounded-full text-sm text-white ${ok ? 'bg-tide' : 'bg-refuse'}`}>{ok ? '✓' : '×'}</span>
      {ok ? yes : no}
    </li>
  );
}

/** One order of the shift: its lockout as it stands for me, the chemical caution, and my joints by line. */
export function ShiftOrderCard({ order }: { order: ShiftOrder }) {
  const joints = order.lines.flatMap((l) => l.joints);
  // What stops work on the whole order (isolation, my lock), in the server's words, once.
  const orderStops = [...new Set(joints.flatMap((j) => j.blockers.filter((b) => ORDER_WIDE.includes(b.kind)).map((b) => b.message)))];
  const chemicals = [...new Set(order.lines.map((l) => l.service).filter(needsChemicalCaution))];
  const booked = order.windowStart && order.windowEnd ? `${formatDateTime(order.windowStart)} – ${formatDateTime(order.windowEnd)}` : 'no window booked';
  return (
    <section aria-labelledby={`order-${order.id}`} className="rounded-xl border border-ink/15 bg-paper-raised p-4 shadow-sm">
      <div className="mb-3 flex flex-wrap items-start justify-between gap-3">
        <div>
          <h2 id={`order-${order.id}`} className="text-2xl font-bold tracking-tight">{order.number}</h2>
          <p className="text-ink-soft">{orderStateWords(order.state)} · window {booked}</p>
        </div>
        <ButtonLink to={`/work-orders/${order.id}`} variant="secondary" size="lg">
          Locks and order {order.number}
        </ButtonLink>
      </div>
      <ul className="mb-3 flex flex-wrap gap-2" aria-label={`Lockout of ${order.number}`}>
        <Fact ok={order.isolated} yes="Section isolated and verified" no="Section not isolated yet" />
        <Fact ok={order.myLockOn} yes="Your lock is on" no="Your lock is not on" />
      </ul>
      {orderStops.length > 0 && (
        <ul className="mb-3 space-y-1">
          {orderStops.map((m) => (
            <li key={m} className="flex gap-2 font-medium">
              <span aria-hidden className="text-refuse">×</span>
              {m}
            </li>
          ))}
        </ul>
      )}
      {order.chemicalService && (
        <div className="mb-3">
          <StepCautions title={`Chemical service${chemicals.length ? `: ${chemicals.join(', ')}` : ''}`} cautions={cautionsFor('chemical-service')} />
        </div>
      )}
      <div className="space-y-4">
        {order.lines.map((line) => (
          <div key={line.id}>
            <h3 className="mb-2 text-lg font-semibold">
              Line {line.lineNumber} <span className="font-normal text-ink-soft">· {line.service} · {line.material}</span>
            </h3>
            <ul className="space-y-2">
              {line.joints.map((j) => (
                <ShiftJointRow key={j.id} joint={j} />
              ))}
            </ul>
          </div>
        ))}
      </div>
    </section>
  );
}
