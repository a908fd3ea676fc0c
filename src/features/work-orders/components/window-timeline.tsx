import type { WindowPlanDto, WindowStep } from '@shared/schemas/work-order-plan';
import { duration } from '@/lib/format';
import { timeTicks } from '@/features/work-orders/time-axis';
import { useWidth } from '@/features/work-orders/use-width';

// Palette colours (tailwind.config.ts): tide for the work, amber for holds, brick past the window's end.
const COLOUR: Record<WindowStep, string> = { isolation: '#3d4a57', joints: '#0b655e', cure: '#92400e', test: '#0a4d47', release: '#566270' };
const LATE = '#a61f15';
const LABEL_W = 150;
const ROW = 34;
const TOP = 28;

/**
 * The chain as a bar per step against the booked window: the window is the shaded band, its end a
 * line; any part of a bar after the end is drawn in brick and hatched. The list beside it says the same in words.
 */
export function WindowTimeline({ plan }: { plan: WindowPlanDto }) {
  const [ref, width] = useWidth<HTMLDivElement>();
  const drawn = plan.steps.filter((s) => s.start && s.end);
  const times = [
    ...drawn.flatMap((s) => [Date.parse(s.start!), Date.parse(s.end!)]),
    ...(plan.window ? [Date.parse(plan.window.start), Date.parse(plan.window.end)] : []),
  ];
  if (times.length === 0) return null;
  const span = Math.max(...times) - Math.min(...times) || 3_600_000;
  const from = Math.min(...times) - span * 0.02;
  const to = Math.max(...times) + span * 0.04;
  const chartW = Math.max(200, width - LABEL_W - 12);
  const x = (t: number) => LABEL_W + ((t - from) / (to - from)) * chartW;
  const height = TOP + plan.steps.length * ROW + 8;
  const svgHeight = height + 18; // the window end's label sits under the chart, clear of the time labels
  const windowEnd = plan.window ? Date.parse(plan.window.end) : null;

  return (
    <div ref={ref} className="w-full overflow-hidden">
      <svg width={width} height={svgHeight} aria-hidden className="block font-sans">
        <defs>
          <pattern id="late-hatch" width="6" height="6" patternUnits="userSpaceOnUse" patternTransform="rotate(45)">
            <rect width="6" height="6" fill={LATE} />
            <line x1="0" y1="0" x2="0" y2="6" stroke="#fee4e2" strokeWidth="2" />
          </pattern>
        </defs>
        {plan.window && (
          <rect x={x(Date.parse(plan.window.start))} y={TOP - 6} width={x(Date.parse(plan.window.end)) - x(Date.parse(plan.window.start))} height={height - TOP} fill="#ccfbf1" opacity="0.55" />
        )}
        {timeTicks(from, to, chartW).map((t) => (
          <g key={t.at}>
            <line x1={x(t.at)} x2={x(t.at)} y1={TOP - 6} y2={height} stroke="#1d2731" strokeOpacity={t.day ? 0.25 : 0.1} />
            {/* A line too near the right edge for its label keeps the line only. */}
            {x(t.at) < width - 75 && <text x={x(t.at) + 3} y={12} fontSize="12" fill="#3d4a57">{t.label}</text>}
          </g>
        ))}
        {plan.steps.map((s, i) => {
          const y = TOP + i * ROW;
          const late = plan.late?.step === s.step;
          return (
            <g key={s.step}>
              <text x={0} y={y + ROW / 2 + 4} fontSize="13" fontWeight={late ? 700 : 500} fill="#1d2731">{s.label}</text>
              {s.start && s.end ? (
                <StepBar x0={x(Date.parse(s.start))} x1={x(Date.parse(s.end))} cut={windowEnd === null ? null : x(windowEnd)} y={y + 6} h={ROW - 12} colour={COLOUR[s.step]} />
              ) : (
                <text x={LABEL_W} y={y + ROW / 2 + 4} fontSize="12" fill="#a61f15">cannot be computed</text>
              )}
            </g>
          );
        })}
        {windowEnd !== null && (
          <g>
            <line x1={x(windowEnd)} x2={x(windowEnd)} y1={TOP - 8} y2={height} stroke="#1d2731" strokeWidth="2.5" />
            <text x={x(windowEnd)} y={height + 14} fontSize="12" fontWeight="700" fill="#1d2731" textAnchor={x(windowEnd) > width - 60 ? 'end' : 'middle'}>window ends</text>
          </g>
        )}
      </svg>
    </div>
  );
}

function StepBar({ x0, x1, cut, y, h, colour }: { x0: number; x1: number; cut: number | null; y: number; h: number; colour: string }) {
  const w = Math.max(3, x1 - x0);
  if (cut === null || x0 + w <= cut) return <rect x={x0} y={y} width={w} height={h} rx="3" fill={colour} />;
  const inside = Math.max(0, cut - x0);
  return (
    <g>
      {inside > 0 && <rect x={x0} y={y} width={inside} height={h} rx="3" fill={colour} />}
      <rect x={Math.max(x0, cut)} y={y} width={x0 + w - Math.max(x0, cut)} height={h} rx="3" fill="url(#late-hatch)" />
    </g>
  );
}

/** The steps in words: what the chart draws, readable by anyone. */
export function WindowSteps({ plan, formatTime }: { plan: WindowPlanDto; formatTime: (iso: string) => string }) {
  return (
    <ol className="divide-y divide-ink/10 text-sm">
      {plan.steps.map((s) => (
        <li key={s.step} className="flex flex-wrap items-baseline justify-between gap-x-4 gap-y-0.5 py-2">
          <span className="font-medium">
            <span aria-hidden className="mr-2 inline-block h-3 w-3 rounded-sm align-middle" style={{ background: COLOUR[s.step] }} />
            {s.label}
            {plan.late?.step === s.step && <span className="ml-2 font-semibold text-refuse">makes it late</span>}
          </span>
          <span className="tabular-nums text-ink-soft">
            {s.minutes === null ? 'cannot be computed' : duration(s.minutes)}
            {s.start && s.end && ` · ${formatTime(s.start)} → ${formatTime(s.end)}`}
          </span>
          <span className="w-full text-xs text-ink-faint">{s.source}</span>
        </li>
      ))}
    </ol>
  );
}
