// The window plan (DESIGN.md section 8): from the trade engine and the plant's minutes, the chain
// isolation and drain → joint making → set and cure → pressure test → release, counted from the
// window's start, the earliest release it allows and whether that fits the booked window.
// Pure: no database, no clock; the facts and settings come in. Rules:
// - isolation and drain: minutes per order + minutes per isolation-plan point (plant settings);
// - joint making: minutes per joint by size band (plant settings), shared among the crews the
//   assigned fitters make (crew size from the engine for the largest joint; at least one crew);
//   never shorter than the longest single joint;
// - set and cure: the longest cure of the order's joints at the forecast lowest temperature and
//   highest humidity and at the test pressure (the first and highest it sees), counted from the end
//   of joint making; an engine refusal is returned as a refusal, never a guessed number;
// - pressure test: fill and vent (plant setting) + the engine's minimum hold;
// - release: inspection and slow refill (plant setting).

import { crewAndTools, cureSchedule, MIN_TEST_HOLD_MINUTES, parseNominalSize, SOURCES, SUPERVISOR_MAY_ENTER, TEMPERATURE_BANDS } from '@shared/trade';
import type { WindowPlanSettings } from '@shared/schemas/plant-settings';
import type { WindowPlanDto, WindowStep } from '@shared/schemas/work-order-plan';

export interface WindowPlanInput {
  window: { start: Date; end: Date } | null;
  forecast: { lowF: number | null; highRh: number | null };
  material: string | null;
  joints: readonly { label: string; jointSize: string }[];
  isolationPoints: number;
  /** Distinct fitters assigned to the order's joint tasks. */
  fitters: number;
  /** The test the joints will first see; `psi` null with `problem` when it is not settled. */
  test: { required: boolean; psi: number | null; problem: string | null };
  settings: WindowPlanSettings;
  /** Which settings are still the shipped defaults (marked so in each step's source). */
  defaults: readonly (keyof WindowPlanSettings)[];
  cureScheduleId: string;
  timeZone: string;
}

type Refusal = WindowPlanDto['refusals'][number];
interface Step { step: WindowStep; label: string; minutes: number | null; source: string }
interface Cure { minutes: number; source: string; band: string }

export const STEP_LABELS: Record<WindowStep, string> = {
  isolation: 'Isolation and drain',
  joints: 'Joint making',
  cure: 'Set and cure',
  test: 'Pressure test',
  release: 'Release',
};

const MINUTE = 60_000;

export function jointMinutes(settings: WindowPlanSettings, size: string): number {
  const inches = parseNominalSize(size) ?? Infinity;
  const bands = settings.jointMinutesBySize;
  return (bands.find((b) => inches <= b.upToIn) ?? bands[bands.length - 1]!).minutes;
}

function isolationStep(input: WindowPlanInput): Step {
  const { isolationPerOrderMinutes: order, isolationPerPointMinutes: point } = input.settings;
  const d = (k: keyof WindowPlanSettings) => (input.defaults.includes(k) ? ' (default)' : '');
  const n = input.isolationPoints;
  return {
    step: 'isolation', label: STEP_LABELS.isolation, minutes: order + point * n,
    source: `plant settings: ${order} min per order${d('isolationPerOrderMinutes')} + ${point} min per point${d('isolationPerPointMinutes')} × ${n} point${n === 1 ? '' : 's'}`,
  };
}

function jointsStep(input: WindowPlanInput, missing: string[]): Step {
  const d = input.defaults.includes('jointMinutesBySize') ? ' (defaults)' : '';
  if (!input.joints.length) {
    missing.push('The order has no joint tasks.');
    return { step: 'joints', label: STEP_LABELS.joints, minutes: 0, source: 'no joint tasks yet' };
  }
  const each = input.joints.map((j) => ({ size: j.jointSize, minutes: jointMinutes(input.settings, j.jointSize) }));
  const total = each.reduce((sum, j) => sum + j.minutes, 0);
  const largest = [...each].sort((a, b) => (parseNominalSize(b.size) ?? 0) - (parseNominalSize(a.size) ?? 0))[0]!;
  const crew = crewAndTools(largest.size);
  const crewSize = crew.ok ? crew.crew : 1;
  const crews = Math.max(1, Math.floor(input.fitters / crewSize));
  const minutes = Math.max(Math.max(...each.map((j) => j.minutes)), Math.ceil(total / crews));
  const sizes = [...new Map(each.map((j) => [j.size, j.minutes])).entries()]
    .map(([size, m]) => `${each.filter((j) => j.size === size).length} × ${size}" at ${m} min`)
    .join(', ');
  return {
    step: 'joints', label: STEP_LABELS.joints, minutes,
    source: `plant settings, minutes per joint by size${d}: ${sizes} = ${total} min, shared among ${crews} crew${crews === 1 ? '' : 's'} ` +
      `(a crew of ${crewSize} for ${largest.size}", ${SOURCES.crew}; ${input.fitters} fitter${input.fitters === 1 ? '' : 's'} assigned)`,
  };
}

/** The longest cure of the joints at `temperatureF`, or the refusals that keep it from being known. */
function longestCure(input: WindowPlanInput, temperatureF: number, psi: number): Cure | Refusal[] {
  const refusals: Refusal[] = [];
  let longest: (Cure & { size: string }) | null = null;
  for (const size of new Set(input.joints.map((j) => j.jointSize))) {
    const cure = cureSchedule({
      material: input.material ?? '', nominalSize: size, temperatureF, relativeHumidity: input.forecast.highRh ?? 0, pressurePsi: psi, schedule: input.cureScheduleId,
    });
    if (!cure.ok) {
      const labels = input.joints.filter((j) => j.jointSize === size).map((j) => j.label).join(', ');
      refusals.push({ step: 'cure', reason: `${labels} (${size}"): ${cure.reason}`, whoMayDecide: cure.reason.includes(SUPERVISOR_MAY_ENTER) ? 'supervisor' : 'planner' });
    } else if (!longest || cure.cureMinutes > longest.minutes) {
      const humid = cure.humidityAdjusted ? ', 50% more for humidity' : '';
      longest = {
        size, minutes: cure.cureMinutes, band: cure.temperatureBand,
        source: `schedule ${cure.schedule}, longest cure ${size}" at ${cure.temperatureBand}, ${cure.pressureBand} (${psi} psi)${humid}: ${cure.source}`,
      };
    }
  }
  return refusals.length || !longest ? refusals : longest;
}

function cureConditions(input: WindowPlanInput, missing: string[], refusals: Refusal[]): { temperatureF: number; psi: number } | null {
  const { lowF, highRh } = input.forecast;
  if (lowF === null) missing.push('No forecast lowest temperature during the cure is given.');
  if (highRh === null) missing.push('No forecast highest humidity during the cure is given.');
  if (input.test.required && input.test.psi === null) {
    refusals.push({ step: 'cure', reason: `The test pressure is not settled, so the cure column is not known: ${input.test.problem ?? ''}`.trim(), whoMayDecide: 'planner' });
  }
  if (!input.joints.length || lowF === null || highRh === null || (input.test.required && input.test.psi === null)) return null;
  return { temperatureF: lowF, psi: input.test.required ? input.test.psi! : 0 };
}

function chain(steps: Step[], start: Date | null) {
  let at = start?.getTime() ?? null;
  return steps.map((s) => {
    const from = at;
    at = at !== null && s.minutes !== null ? at + s.minutes * MINUTE : null;
    return { ...s, start: from === null ? null : new Date(from).toISOString(), end: at === null ? null : new Date(at).toISOString() };
  });
}

/** The cure if the area is kept in the next warmer band (a heated enclosure), and whether the plan would then fit. */
function warmerCure(input: WindowPlanInput, cure: Cure, psi: number, releaseMs: number) {
  const i = TEMPERATURE_BANDS.findIndex((b) => b.label === cure.band);
  const warmer = i > 0 ? TEMPERATURE_BANDS[i - 1]! : null;
  if (!warmer || !input.window) return null;
  const better = longestCure(input, warmer.maxF, psi);
  if (Array.isArray(better)) return null;
  const release = releaseMs - (cure.minutes - better.minutes) * MINUTE;
  return { band: warmer.label, keepAboveF: warmer.minF, cureMinutes: better.minutes, earliestRelease: new Date(release).toISOString(), fits: release <= input.window.end.getTime() };
}

export function windowPlan(input: WindowPlanInput): WindowPlanDto {
  const missing: string[] = [];
  const refusals: Refusal[] = [];
  if (!input.window) missing.push('No repair window is booked.');
  const { settings } = input;
  const d = (k: keyof WindowPlanSettings) => (input.defaults.includes(k) ? ' (default)' : '');
  const conditions = cureConditions(input, missing, refusals);
  const cure = conditions ? longestCure(input, conditions.temperatureF, conditions.psi) : null;
  if (Array.isArray(cure)) refusals.push(...cure);
  const cureKnown = cure && !Array.isArray(cure) ? cure : null;
  const steps = chain(
    [
      isolationStep(input),
      jointsStep(input, missing),
      { step: 'cure', label: STEP_LABELS.cure, minutes: cureKnown?.minutes ?? null, source: cureKnown?.source ?? 'not known: see the refusals and what is missing' },
      input.test.required
        ? { step: 'test', label: STEP_LABELS.test, minutes: settings.fillAndVentMinutes + MIN_TEST_HOLD_MINUTES, source: `plant settings: fill and vent ${settings.fillAndVentMinutes} min${d('fillAndVentMinutes')} + minimum hold ${MIN_TEST_HOLD_MINUTES} min (${SOURCES.testHold})` }
        : { step: 'test', label: STEP_LABELS.test, minutes: 0, source: 'no hydrostatic test: no line of the order is on pressure service' },
      { step: 'release', label: STEP_LABELS.release, minutes: settings.releaseMinutes, source: `plant settings: inspection and slow refill ${settings.releaseMinutes} min${d('releaseMinutes')}` },
    ],
    input.window?.start ?? null,
  );
  const release = steps[steps.length - 1]!.end;
  const fits = input.window && release && !missing.length && !refusals.length ? Date.parse(release) <= input.window.end.getTime() : null;
  let late: WindowPlanDto['late'] = null;
  if (fits === false && input.window && release && cureKnown && conditions) {
    const endMs = input.window.end.getTime();
    const lateStep = steps.find((s) => s.end !== null && Date.parse(s.end) > endMs)!;
    late = {
      step: lateStep.step, stepLabel: lateStep.label, neededWindowEnd: release, lateByMinutes: Math.ceil((Date.parse(release) - endMs) / MINUTE),
      warmer: warmerCure(input, cureKnown, conditions.psi, Date.parse(release)),
    };
  }
  return {
    timeZone: input.timeZone,
    window: input.window ? { start: input.window.start.toISOString(), end: input.window.end.toISOString() } : null,
    steps,
    earliestRelease: missing.length || refusals.length ? null : release,
    fits,
    late,
    refusals,
    missing,
  };
}
