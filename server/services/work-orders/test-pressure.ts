// The order's hydrostatic test pressure, from the trade engine: 1.5 × the highest design pressure
// of its lines, capped by the weakest component — each line's pipe at its design temperature (the
// stricter choice, as the joint calculator makes it) and any weaker component the planner names —
// at its rating or 1.5 × it, as the plant setting says. The planner may raise it within the cap,
// never lower it below the minimum. Pure: the facts come in.

import { pipeRating, testPressure, type Material, type PipeSchedule, type TestCap } from '@shared/trade';
import type { TestPressureDto } from '@shared/schemas/work-order-plan';

export interface TestPressureLine {
  lineNumber: string;
  material: Material;
  schedule: string | null;
  sdr: number | null;
  nominalSize: string;
  designPressurePsi: number;
  designTemperatureF: number;
}

export interface TestPressureInput {
  lines: readonly TestPressureLine[];
  componentRatingPsi: number | null;
  raisedPsi: number | null;
  cap: TestCap;
}

function scheduleOf(text: string | null): PipeSchedule | undefined {
  const n = Number((text ?? '').replace(/\D/g, ''));
  return n === 40 || n === 80 ? n : undefined;
}

/** Each line's pipe rating at its design temperature, or the engine's refusal. */
function lineRatings(lines: readonly TestPressureLine[]) {
  return lines.map((l) => {
    const r = pipeRating({ material: l.material, schedule: scheduleOf(l.schedule), sdr: l.sdr ?? undefined, nominalSize: l.nominalSize, temperatureF: l.designTemperatureF });
    return { line: l, rating: r };
  });
}

/** Why a raised test pressure is refused, or null when it is within minimum and cap. */
export function raisedTestProblem(raisedPsi: number, minimumPsi: number, capPsi: number): string | null {
  if (raisedPsi < minimumPsi) return `The test pressure of ${raisedPsi} psi is below the minimum of ${minimumPsi} psi (1.5 × the highest design pressure); it may be raised, never lowered.`;
  if (raisedPsi > capPsi) return `The test pressure of ${raisedPsi} psi is above the cap of ${capPsi} psi set by the weakest component.`;
  return null;
}

export function testPressureFor(input: TestPressureInput): TestPressureDto {
  const base: TestPressureDto = {
    ok: false, required: true, minimumPsi: null, capPsi: null, testPsi: null, raised: false, highestDesign: null, weakest: null, holdMinutes: null, problems: [], source: null,
  };
  const highest = [...input.lines].sort((a, b) => b.designPressurePsi - a.designPressurePsi)[0];
  if (!highest) return { ...base, problems: ['The order has no lines, so there is no design pressure to test at.'] };
  const highestDesign = { lineNumber: highest.lineNumber, psi: highest.designPressurePsi };
  if (highest.designPressurePsi <= 0) {
    return { ...base, ok: true, required: false, highestDesign, source: 'no line of the order is on pressure service (design 0 psi): no hydrostatic test' };
  }
  const problems: string[] = [];
  const candidates: { what: string; psi: number }[] = [];
  for (const { line, rating } of lineRatings(input.lines)) {
    if (rating.ok) candidates.push({ what: `line ${line.lineNumber} (${line.nominalSize}" ${line.material} at ${line.designTemperatureF} °F)`, psi: rating.psi });
    else problems.push(`Line ${line.lineNumber}: ${rating.reason}`);
  }
  if (input.componentRatingPsi !== null) candidates.push({ what: 'the weakest other component named on the order', psi: input.componentRatingPsi });
  const weakest = [...candidates].sort((a, b) => a.psi - b.psi)[0] ?? null;
  if (problems.length || !weakest) return { ...base, highestDesign, weakest, problems: problems.length ? problems : ['No rating to cap the test.'] };
  const engine = testPressure({ designPressurePsi: highest.designPressurePsi, lowestComponentRatingPsi: weakest.psi, medium: 'water', cap: input.cap });
  if (!engine.ok) return { ...base, highestDesign, weakest, problems: [engine.reason] };
  const raisedProblem = input.raisedPsi === null ? null : raisedTestProblem(input.raisedPsi, engine.testPsi, engine.capPsi);
  return {
    ok: raisedProblem === null,
    required: true,
    minimumPsi: engine.testPsi,
    capPsi: engine.capPsi,
    testPsi: raisedProblem === null ? (input.raisedPsi ?? engine.testPsi) : null,
    raised: input.raisedPsi !== null,
    highestDesign,
    weakest,
    holdMinutes: engine.minHoldMinutes,
    problems: raisedProblem ? [raisedProblem] : [],
    source: engine.source,
  };
}
