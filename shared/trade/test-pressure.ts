// Hydrostatic test pressure for a repaired thermoplastic section.
// - test ≥ 1.5 × design pressure, rounded UP to whole psi (ASME B31.3 A345.4.2 [memory]);
// - capped by the lowest-rated component: at its rating (default, the stricter; many plants do
//   this) or at 1.5 × its rating (B31.3's limit [memory]); a plant setting chooses; above the
//   cap the test is refused rather than lowered, since below 1.5 × design it proves too little;
// - hold at least 10 minutes (ASME B31.3 345.2.2(a) [memory]);
// - water only: compressed air or gas stores energy and shatters thermoplastic pipe
//   (a plastic pipe trade association user bulletin; ASTM D1785 §1.2 [pub]).

import { isFiniteNumber, refuse, show, type Refusal } from './result';
import { SOURCES } from './sources';

/** How the test is capped by the weakest component: at its rating, or at 1.5 × it. A plant setting chooses. */
export const TEST_CAPS = ['rating', 'one-and-a-half-rating'] as const;
export type TestCap = (typeof TEST_CAPS)[number];

export interface TestPressureInput {
  designPressurePsi: number;
  /** The rating of the weakest component at the test temperature, psi. */
  lowestComponentRatingPsi: number;
  medium: 'water' | 'air' | 'nitrogen' | string;
  cap?: TestCap;
}

export interface TestPressureResult {
  ok: true;
  testPsi: number;
  minHoldMinutes: number;
  capPsi: number;
  cap: TestCap;
  medium: 'water';
  source: string;
}

export const TEST_FACTOR = 1.5;
export const MIN_TEST_HOLD_MINUTES = 10;

const GAS_WORDS = /\b(air|nitrogen|n2|gas|gases|helium|argon|co2|carbon dioxide|oxygen|compressed|pneumatic|steam)\b/i;

export function checkTestMedium(medium: unknown): Refusal | null {
  const m = typeof medium === 'string' ? medium.trim().toLowerCase() : '';
  if (m === 'water' || m === 'hydrostatic') return null;
  if (GAS_WORDS.test(m)) {
    return refuse(
      `Testing with ${m} is refused: compressed air or gas stores energy and can shatter thermoplastic ` +
        `pipe. Test hydrostatically, with water (${SOURCES.noGasTest}).`,
    );
  }
  return refuse(`Test medium "${show(medium)}" is not accepted: the hydrostatic test uses water.`);
}

export function testPressure(input: TestPressureInput): TestPressureResult | Refusal {
  const { designPressurePsi: design, lowestComponentRatingPsi: rating } = input;
  const cap: TestCap = input.cap ?? 'rating';
  if (!(TEST_CAPS as readonly string[]).includes(cap)) return refuse(`Unknown test cap "${show(cap)}".`);
  if (!isFiniteNumber(design) || design <= 0) return refuse('Design pressure must be a positive number of psi.');
  if (!isFiniteNumber(rating) || rating <= 0) return refuse('The lowest component rating must be a positive number of psi.');
  const medium = checkTestMedium(input.medium);
  if (medium) return medium;
  const testPsi = Math.ceil(design * TEST_FACTOR);
  const capPsi = cap === 'rating' ? Math.floor(rating) : Math.floor(rating * TEST_FACTOR);
  if (testPsi > capPsi) {
    const capText = cap === 'rating' ? 'the lowest component rating' : '1.5 × the lowest component rating';
    return refuse(
      `The test pressure of ${testPsi} psi (1.5 × ${design} psi design) is above ${capText}, ${capPsi} psi. ` +
        'Lower the design pressure or replace the weakest component; the test is not lowered to fit.',
    );
  }
  return {
    ok: true,
    testPsi,
    minHoldMinutes: MIN_TEST_HOLD_MINUTES,
    capPsi,
    cap,
    medium: 'water',
    source: `${SOURCES.testPressure}; ${SOURCES.testCap}; ${SOURCES.testHold}; water only: ${SOURCES.noGasTest}`,
  };
}
