import type { WindowPlanDto } from '@shared/schemas/work-order-plan';
import { Card } from '@/components/ui/card';
import { Notice } from '@/components/ui/notice';
import { duration, formatDateTime } from '@/lib/format';
import { WindowSteps, WindowTimeline } from '@/features/work-orders/components/window-timeline';

const WHO: Record<'supervisor' | 'planner', string> = {
  supervisor: 'A supervisor decides: an engineering cure time for this joint, recorded with its reason, comes with the holds step.',
  planner: 'The planner settles it on this order.',
};

/** DESIGN.md section 8: the chain against the booked window, whether it fits, and what would make it fit. */
export function WindowPlanCard({ plan }: { plan: WindowPlanDto }) {
  return (
    <Card title={<span id="window-plan">Window plan</span>}>
      <div className="space-y-3">
        <Verdict plan={plan} />
        {plan.refusals.map((r) => (
          <Notice key={r.step + r.reason} tone="refusal" title={`${plan.steps.find((s) => s.step === r.step)?.label ?? r.step}: the trade engine gives no figure`}>
            <p>{r.reason}</p>
            <p className="mt-1 font-medium">{WHO[r.whoMayDecide]}</p>
          </Notice>
        ))}
        {plan.missing.length > 0 && (
          <Notice tone="caution" title="The plan cannot be worked out yet">
            <ul className="list-disc pl-5">{plan.missing.map((m) => <li key={m}>{m}</li>)}</ul>
          </Notice>
        )}
        <WindowTimeline plan={plan} />
        <WindowSteps plan={plan} formatTime={formatDateTime} />
        <p className="text-xs text-ink-faint">Times in your time zone ({Intl.DateTimeFormat().resolvedOptions().timeZone}); the plant works in {plan.timeZone}.</p>
      </div>
    </Card>
  );
}

function Verdict({ plan }: { plan: WindowPlanDto }) {
  if (plan.fits === true && plan.window && plan.earliestRelease) {
    const spare = Math.round((Date.parse(plan.window.end) - Date.parse(plan.earliestRelease)) / 60_000);
    return (
      <Notice tone="success" title="The plan fits the window">
        Earliest release {formatDateTime(plan.earliestRelease)}, {duration(spare)} before the window ends at {formatDateTime(plan.window.end)}.
      </Notice>
    );
  }
  if (plan.fits === false && plan.late && plan.window) {
    const { late } = plan;
    return (
      <Notice tone="caution" title="The plan does not fit the window">
        <p>
          Earliest release {plan.earliestRelease ? formatDateTime(plan.earliestRelease) : '—'}: {duration(late.lateByMinutes)} after the window ends at {formatDateTime(plan.window.end)}.
        </p>
        <p className="mt-1"><span className="font-semibold">{late.stepLabel}</span> makes it late. To fit, the window must end at {formatDateTime(late.neededWindowEnd)} or later.</p>
        {late.warmer && (
          <p className="mt-1">
            In a heated enclosure that keeps the joints above {late.warmer.keepAboveF} °F ({late.warmer.band}), the cure takes {duration(late.warmer.cureMinutes)} and the earliest release is {formatDateTime(late.warmer.earliestRelease)}:{' '}
            <span className="font-semibold">{late.warmer.fits ? 'that fits the booked window.' : 'still after the window ends.'}</span>
          </p>
        )}
      </Notice>
    );
  }
  return null;
}

/** One line near the top of the order's page: does the plan fit, with a link down to the timeline. */
export function WindowPlanLine({ plan }: { plan: WindowPlanDto }) {
  const words =
    plan.fits === true ? 'The plan fits its window.'
    : plan.fits === false ? `The plan does not fit its window: ${plan.late?.stepLabel ?? 'a step'} runs past the end.`
    : plan.refusals.length ? 'The plan needs a decision the trade engine cannot make.'
    : 'The plan cannot be worked out yet.';
  return (
    <p className="text-sm">
      <span className={plan.fits === true ? 'font-semibold text-tide' : 'font-semibold text-hold'}>{words}</span>{' '}
      <a href="#window-plan" className="inline-flex min-h-11 items-center font-medium text-tide underline">See the window plan</a>
    </p>
  );
}
