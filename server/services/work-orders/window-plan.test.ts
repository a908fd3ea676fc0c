import { describe, expect, it } from 'vitest';
import { cureSchedule, MIN_TEST_HOLD_MINUTES, SUPERVISOR_MAY_ENTER } from '@shared/trade';
import { WINDOW_PLAN_DEFAULTS, WINDOW_PLAN_KEYS } from '@shared/schemas/plant-settings';
import { jointMinutes, windowPlan, type WindowPlanInput } from './window-plan';

const START = new Date('2026-12-07T12:00:00Z');
const hours = (h: number) => new Date(START.getTime() + h * 3_600_000);
const joints = (size: string, count: number, from = 1) => Array.from({ length: count }, (_, i) => ({ label: `J${from + i}`, jointSize: size }));

const input = (over: Partial<WindowPlanInput> = {}): WindowPlanInput => ({
  window: { start: START, end: hours(12) },
  forecast: { lowF: 70, highRh: 50 },
  material: 'PVC',
  joints: joints('2', 2),
  isolationPoints: 3,
  fitters: 0,
  test: { required: true, psi: 150, problem: null },
  settings: WINDOW_PLAN_DEFAULTS,
  defaults: WINDOW_PLAN_KEYS,
  cureScheduleId: 'A',
  timeZone: 'America/Chicago',
  ...over,
});

/** The engine's own cure for one size at the conditions, the figure the plan must use. */
const engineCure = (size: string, temperatureF: number, relativeHumidity: number, pressurePsi: number) => {
  const cure = cureSchedule({ material: 'PVC', nominalSize: size, temperatureF, relativeHumidity, pressurePsi, schedule: 'A' });
  if (!cure.ok) throw new Error(cure.reason);
  return cure.cureMinutes;
};
const minutesOf = (plan: ReturnType<typeof windowPlan>) => Object.fromEntries(plan.steps.map((s) => [s.step, s.minutes]));

describe('the window plan', () => {
  it('warm case (schedule A, 60–100 °F, 1-1/2"–2" ≤160 psi): each step from the settings and the engine, chained from the window start, and it fits', () => {
    const plan = windowPlan(input());
    const cure = engineCure('2', 70, 50, 150);
    expect(minutesOf(plan)).toEqual({ isolation: 30 + 10 * 3, joints: 2 * 20, cure, test: 30 + MIN_TEST_HOLD_MINUTES, release: 45 });
    const total = 60 + 40 + cure + 40 + 45;
    expect(plan.earliestRelease).toBe(new Date(START.getTime() + total * 60_000).toISOString());
    expect(plan.steps[0]).toMatchObject({ start: START.toISOString(), source: expect.stringContaining('30 min per order (default)') });
    expect(plan.steps.map((s) => s.start).slice(1)).toEqual(plan.steps.map((s) => s.end).slice(0, -1));
    expect(plan.steps[2]!.source).toMatch(/schedule A, longest cure 2" at 60–100 °F, ≤160 psi \(150 psi\)/);
    expect(plan).toMatchObject({ fits: true, late: null, refusals: [], missing: [] });
  });

  it('cold case (schedule A, 0–40 °F, 2-1/2"–8" ≤160 psi): the cure makes it late; it names the step, the window end it needs and the cure kept above 40 °F', () => {
    const plan = windowPlan(input({ forecast: { lowF: 35, highRh: 50 }, joints: [...joints('6', 2), ...joints('2', 1, 3)], isolationPoints: 2 }));
    const cold = engineCure('6', 35, 50, 150);
    const mild = engineCure('6', 60, 50, 150); // 60 °F is the warm edge of the 40–60 °F band
    expect(cold).toBe(72 * 60);
    expect(minutesOf(plan)).toMatchObject({ isolation: 50, joints: 45 + 45 + 20, cure: cold });
    expect(plan.fits).toBe(false);
    const release = START.getTime() + (50 + 110 + cold + 40 + 45) * 60_000;
    expect(plan.late).toEqual({
      step: 'cure',
      stepLabel: 'Set and cure',
      neededWindowEnd: new Date(release).toISOString(),
      lateByMinutes: (release - hours(12).getTime()) / 60_000,
      warmer: { band: '40–60 °F', keepAboveF: 40, cureMinutes: mild, earliestRelease: new Date(release - (cold - mild) * 60_000).toISOString(), fits: true },
    });
  });

  it('in humid air (above 60%) the cure is the engine\'s, 50% longer', () => {
    const plan = windowPlan(input({ forecast: { lowF: 50, highRh: 80 } }));
    expect(minutesOf(plan).cure).toBe(engineCure('2', 50, 80, 150));
    expect(minutesOf(plan).cure).toBe(Math.ceil(engineCure('2', 50, 50, 150) * 1.5));
  });

  it('the cure is counted at the test pressure: above 160 psi the small joint takes the higher column', () => {
    expect(minutesOf(windowPlan(input({ test: { required: true, psi: 200, problem: null } }))).cure).toBe(engineCure('2', 70, 50, 200));
    expect(engineCure('2', 70, 50, 200)).toBeGreaterThan(engineCure('2', 70, 50, 150));
  });

  it('a cure outside the published table is a refusal naming the supervisor, not a number, and nothing after it is timed', () => {
    const plan = windowPlan(input({ forecast: { lowF: 20, highRh: 40 }, joints: joints('12', 1) }));
    expect(plan.refusals).toEqual([{ step: 'cure', reason: expect.stringContaining(SUPERVISOR_MAY_ENTER), whoMayDecide: 'supervisor' }]);
    expect(plan.refusals[0]!.reason).toMatch(/^J1 \(12"\): Pressure 150 psi is above the highest column/);
    expect(plan.steps.find((s) => s.step === 'cure')).toMatchObject({ minutes: null, end: null });
    expect(plan.steps.find((s) => s.step === 'release')).toMatchObject({ start: null, end: null });
    expect(plan).toMatchObject({ earliestRelease: null, fits: null, late: null });
  });

  it('joint making is shared among the crews the assigned fitters make, crew size from the engine, never shorter than one joint', () => {
    const eight = joints('8', 4);
    expect(minutesOf(windowPlan(input({ joints: eight, fitters: 0 }))).joints).toBe(4 * 45);
    expect(minutesOf(windowPlan(input({ joints: eight, fitters: 3 }))).joints).toBe(4 * 45); // 8" needs a crew of 2: one crew
    expect(minutesOf(windowPlan(input({ joints: eight, fitters: 4 }))).joints).toBe(2 * 45);
    expect(minutesOf(windowPlan(input({ joints: joints('8', 1), fitters: 8 }))).joints).toBe(45);
  });

  it('without a window the steps have minutes but no times, and whether it fits is not said', () => {
    const plan = windowPlan(input({ window: null }));
    expect(plan.steps.every((s) => s.start === null && s.minutes !== null)).toBe(true);
    expect(plan).toMatchObject({ fits: null, earliestRelease: null, missing: ['No repair window is booked.'] });
  });

  it('without the forecast or the joints it says what is missing', () => {
    expect(windowPlan(input({ forecast: { lowF: null, highRh: null } })).missing).toEqual([
      'No forecast lowest temperature during the cure is given.',
      'No forecast highest humidity during the cure is given.',
    ]);
    expect(windowPlan(input({ joints: [] })).missing).toEqual(['The order has no joint tasks.']);
  });

  it('a line without pressure service has no test step time and cures at 0 psi', () => {
    const plan = windowPlan(input({ test: { required: false, psi: null, problem: null } }));
    expect(minutesOf(plan)).toMatchObject({ test: 0, cure: engineCure('2', 70, 50, 0) });
  });

  it("the plant's own minutes replace the defaults, and are no longer marked as defaults", () => {
    const settings = { ...WINDOW_PLAN_DEFAULTS, isolationPerOrderMinutes: 90, releaseMinutes: 120 };
    const plan = windowPlan(input({ settings, defaults: WINDOW_PLAN_KEYS.filter((k) => k !== 'isolationPerOrderMinutes' && k !== 'releaseMinutes') }));
    expect(minutesOf(plan)).toMatchObject({ isolation: 90 + 30, release: 120 });
    expect(plan.steps[0]!.source).toMatch(/^plant settings: 90 min per order \+ 10 min per point \(default\)/);
    expect(plan.steps[4]!.source).toBe('plant settings: inspection and slow refill 120 min');
  });

  it('minutes per joint go by the first size band that holds the size', () => {
    expect(['1/2', '1-1/4', '1-1/2', '2-1/2', '4', '6', '10', '14', '24'].map((s) => jointMinutes(WINDOW_PLAN_DEFAULTS, s))).toEqual([15, 15, 20, 30, 30, 45, 75, 120, 120]);
  });
});
