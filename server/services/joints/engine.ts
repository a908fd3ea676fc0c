// What the trade engine says about one joint on its line: socket depth and marks, the dry-fit
// window, the cement and primer it needs, the crew and joining device, the hold after assembly,
// and each step's cautions. The tablet shows these; the step checks use the same figures.

import type { Line } from '@server/db/models/line';
import {
  assemblyHoldSeconds, cautionsFor, cementBody, CEMENT_FOR_MATERIAL, chamferGuidance, crewAndTools, dryFitCheck, needsChemicalCaution,
  parsePipeMaterial, socketMarks, type Caution, type CautionStep, type PipeSchedule,
} from '@shared/trade';
import { JOINT_STEPS, type JointDetailDto, type JointStep } from '@shared/schemas/joint-steps';

type LineFacts = Pick<Line, 'material' | 'schedule' | 'service' | 'designPressurePsi'>;

/**
 * The socket schedule of the fittings: the line's schedule where it is 40 or 80; SDR pipe is joined
 * with Sch 40 socket fittings (ASTM D2466) [practice], and the joint's figures say so.
 */
export function socketSchedule(line: Pick<Line, 'schedule'>): { schedule: PipeSchedule; assumed: boolean } {
  const n = Number((line.schedule ?? '').replace(/\D/g, ''));
  return n === 80 ? { schedule: 80, assumed: false } : { schedule: 40, assumed: n !== 40 };
}

/** A line carries pressure when its design pressure is above zero: transition cement is refused there. */
export const onPressureService = (line: Pick<Line, 'designPressurePsi'>) => line.designPressurePsi > 0;

export function jointEngine(line: LineFacts, jointSize: string, forecastLowF: number | null): JointDetailDto['engine'] {
  const problems: string[] = [];
  const { schedule, assumed } = socketSchedule(line);
  if (assumed) problems.push(`The line has no Sch 40 or 80; socket figures are for Sch 40 fittings (ASTM D2466).`);
  const marks = socketMarks({ nominalSize: jointSize, schedule });
  if (!marks.ok) problems.push(marks.reason);
  const fit = dryFitCheck({ nominalSize: jointSize, schedule, dryInsertionIn: 0 });
  const body = cementBody(jointSize);
  const crew = crewAndTools(jointSize);
  const chamfer = chamferGuidance(jointSize);
  const hold = assemblyHoldSeconds(forecastLowF ?? 73);
  const material = parsePipeMaterial(line.material);
  return {
    socketDepthIn: marks.ok ? marks.socketDepthIn : null,
    dryFitMinIn: fit.ok ? fit.minIn : null,
    dryFitMaxIn: fit.ok ? fit.maxIn : null,
    insertionMarkIn: marks.ok ? marks.insertionMarkIn : null,
    checkMarkIn: marks.ok ? marks.checkMarkIn : null,
    cementStandard: material ? `ASTM ${CEMENT_FOR_MATERIAL[material]}` : 'unknown material',
    primerStandard: material && material !== 'ABS' ? 'ASTM F656' : null,
    cementBody: body.ok ? body.body : null,
    joiningDevice: crew.ok ? crew.mechanicalJoiningDevice : false,
    crewText: crew.ok ? crew.text : null,
    chamferText: chamfer.ok ? chamfer.text : null,
    assemblyHoldSeconds: hold.ok ? hold.seconds : 120,
    pressureService: onPressureService(line),
    problems,
  };
}

const STEP_CAUTIONS: Record<JointStep, readonly CautionStep[]> = {
  prep: ['prep'],
  'dry-fit': [],
  'depth-marks': [],
  primer: ['prime'],
  cement: ['cement'],
  assembly: ['cement', 'cure'],
  wipe: ['cure'],
};

/** Each step's cautions; a line in chemical service adds the chemical caution to preparing the ends. */
export function stepCautions(service: string): Record<JointStep, Caution[]> {
  const chemical = needsChemicalCaution(service);
  const out = {} as Record<JointStep, Caution[]>;
  for (const step of JOINT_STEPS) {
    const seen = new Set<string>();
    const steps = step === 'prep' && chemical ? [...STEP_CAUTIONS[step], 'chemical-service' as const] : STEP_CAUTIONS[step];
    out[step] = steps.flatMap((s) => cautionsFor(s)).filter((c) => !seen.has(c.id) && !!seen.add(c.id));
  }
  return out;
}
