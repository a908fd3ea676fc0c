// Everything the trade rules say about one joint, from one specification. The API and the
// client preview both call this, so they agree.
// - the pipe is rated at the design (service) temperature; on pressure service a missing rating or
//   a design pressure above it is a problem;
// - the test is 1.5 × design unless given, capped by the weakest component AND the pipe's own
//   rating at the test temperature (default: the design temperature, the stricter);
// - the cure column is picked by the TEST pressure when the joint will be tested (the first and
//   highest pressure it sees [practice]), else by the design pressure; at the lowest cure temperature;
// - problems block (rating, test, cure, cement); notes do not (no socket depth or quantity in a table).

import { cautionsFor, type Caution } from './cautions';
import { cementBody, cementCheck, CEMENT_FOR_MATERIAL } from './cement';
import { cureSchedule } from './cure-schedule';
import { applicatorSize, assemblyHoldSeconds, crewAndTools } from './joint-handling';
import { jointSpecSchema, type JointSpec } from './joint-spec';
import { cementQuantities } from './materials';
import { pipeRating } from './pipe-rating';
import { refuse, type Refusal } from './result';
import { chamferGuidance, socketMarks } from './socket';
import { TEST_FACTOR, testPressure } from './test-pressure';

function ratings(spec: JointSpec) {
  const base = { material: spec.material, schedule: spec.schedule, nominalSize: spec.nominalSize };
  const rating = pipeRating({ ...base, temperatureF: spec.designTemperatureF });
  const atTest = pipeRating({ ...base, temperatureF: spec.testTemperatureF ?? spec.designTemperatureF });
  return { rating, atTest };
}

function plannedTest(spec: JointSpec, pipeAtTestPsi: number | null) {
  if (!spec.pressureService && spec.testPressurePsi === undefined) return null;
  const ratings = [spec.lowestComponentRatingPsi, pipeAtTestPsi ?? undefined].filter((x): x is number => x !== undefined);
  if (ratings.length === 0) return refuse('No rating to cap the test: the pipe has no rating here; give the lowest component rating.');
  const lowest = Math.min(...ratings);
  const derived = testPressure({ designPressurePsi: spec.designPressurePsi, lowestComponentRatingPsi: lowest, medium: spec.testMedium, cap: spec.testCap });
  if (spec.testPressurePsi === undefined || !derived.ok) return derived;
  const testPsi = spec.testPressurePsi;
  if (testPsi > derived.capPsi) return refuse(`The test pressure of ${testPsi} psi is above the cap of ${derived.capPsi} psi.`);
  if (testPsi < derived.testPsi) return refuse(`The test pressure of ${testPsi} psi is below 1.5 × design (${derived.testPsi} psi).`);
  return { ...derived, testPsi };
}

function curePressure(spec: JointSpec, tested: boolean): { psi: number; basis: 'test' | 'design' } {
  if (!tested) return { psi: spec.designPressurePsi, basis: 'design' };
  const test = spec.testPressurePsi ?? Math.ceil(spec.designPressurePsi * TEST_FACTOR);
  return { psi: Math.max(test, spec.designPressurePsi), basis: 'test' };
}

function reasonOf(r: { ok: boolean } | Refusal | null, label: string): string[] {
  return r && !r.ok && 'reason' in r ? [`${label}: ${r.reason}`] : [];
}

function pictureOf(spec: JointSpec) {
  const { rating, atTest } = ratings(spec);
  const test = plannedTest(spec, atTest.ok ? atTest.psi : null);
  const pressure = curePressure(spec, test !== null);
  const cure = cureSchedule({
    material: spec.material, nominalSize: spec.nominalSize, temperatureF: spec.cureTemperatureF,
    relativeHumidity: spec.relativeHumidity, pressurePsi: pressure.psi, schedule: spec.cureScheduleId,
  });
  const cement = cementCheck({
    pipeMaterial: spec.material, cementStandard: spec.cementStandard ?? `ASTM ${CEMENT_FOR_MATERIAL[spec.material]}`,
    nominalSize: spec.nominalSize, pressureService: spec.pressureService, cementBody: spec.cementBody,
  });
  const socket = socketMarks({ nominalSize: spec.nominalSize, schedule: spec.schedule });
  const quantities = cementQuantities([{ nominalSize: spec.nominalSize, count: 1 }]);
  return {
    spec, rating, ratingAtTest: atTest, test, curePressurePsi: pressure.psi, curePressureBasis: pressure.basis, cure,
    socket, chamfer: chamferGuidance(spec.nominalSize), cement, body: cementBody(spec.nominalSize), quantities,
    applicator: applicatorSize(spec.nominalSize), crew: crewAndTools(spec.nominalSize),
    hold: assemblyHoldSeconds(spec.cureTemperatureF), cautions: pictureCautions(spec),
  };
}

function pictureCautions(spec: JointSpec): Caution[] {
  const steps = ['joint', ...(spec.pressureService ? ['pressure-test'] : []), ...(spec.chemicalService ? ['chemical-service'] : []), 'release'];
  const seen = new Set<string>();
  return steps.flatMap((s) => cautionsFor(s)).filter((c) => !seen.has(c.id) && seen.add(c.id) !== undefined);
}

export type JointPicture = ReturnType<typeof pictureOf> & { ok: boolean; problems: string[]; notes: string[] };

export function jointPicture(input: unknown): JointPicture | (Refusal & { issues: string[] }) {
  const parsed = jointSpecSchema.safeParse(input);
  if (!parsed.success) {
    const issues = parsed.error.issues.map((i) => `${i.path.join('.') || 'spec'}: ${i.message}`);
    return { ...refuse(`The joint specification is not valid: ${issues.join('; ')}`), issues };
  }
  const p = pictureOf(parsed.data);
  const rated = p.spec.pressureService; // a non-pressure line needs no pressure rating
  const problems = [
    ...(rated ? reasonOf(p.rating, 'Rating') : []),
    ...(rated && p.rating.ok && p.spec.designPressurePsi > p.rating.psi
      ? [`Rating: the design pressure of ${p.spec.designPressurePsi} psi is above the pipe's ${p.rating.psi} psi at ${p.spec.designTemperatureF} °F.`]
      : []),
    ...reasonOf(p.test, 'Test'),
    ...reasonOf(p.cure, 'Cure'),
    ...p.cement.problems.map((x) => `Cement: ${x}`),
  ];
  const notes = [...reasonOf(p.socket, 'Socket'), ...reasonOf(p.quantities, 'Quantities')];
  return { ok: problems.length === 0, problems, notes, ...p };
}
