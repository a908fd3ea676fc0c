// Does the solvent cement suit the pipe and the service? [pub]
// PVC → ASTM D2564, CPVC → ASTM F493, ABS → ASTM D2235; primer ASTM F656 for PVC/CPVC two-step.
// ASTM D3138 (ABS-to-PVC transition) only for non-pressure service, 25 psi or less.
// Body by largest size: regular ≤2", medium ≤6", heavy beyond [mfr].

import { parseNominalSize, unknownSizeReason } from './nominal-size';
import { parsePipeMaterial, type Material } from './pipe-materials';
import { refuse, show, type Refusal } from './result';
import { SOURCES } from './sources';

export type CementBody = 'regular' | 'medium' | 'heavy';

export const CEMENT_FOR_MATERIAL: Readonly<Record<Material, string>> = {
  PVC: 'D2564',
  CPVC: 'F493',
  ABS: 'D2235',
};
export const PRIMER_STANDARD = 'F656';
export const TRANSITION_CEMENT = 'D3138';
/** Materials the transition cement joins (ABS to PVC). */
const TRANSITION_MATERIALS: readonly Material[] = ['PVC', 'ABS'];

const BODY_ORDER: readonly CementBody[] = ['regular', 'medium', 'heavy'];

/** "ASTM D2564", "astm d 2564-12", "D2564" → "D2564"; null when it is no standard number. */
export function normaliseStandard(s: unknown): string | null {
  if (typeof s !== 'string') return null;
  const m = /^\s*(?:astm\s*)?([a-z])\s*-?\s*(\d{3,4})\b/i.exec(s);
  return m && m[1] && m[2] ? `${m[1].toUpperCase()}${m[2]}` : null;
}

export function cementBody(nominalSize: string): { ok: true; body: CementBody; source: string } | Refusal {
  const inches = parseNominalSize(nominalSize);
  if (inches === null) return refuse(unknownSizeReason(nominalSize));
  const body: CementBody = inches <= 2 ? 'regular' : inches <= 6 ? 'medium' : 'heavy';
  return { ok: true, body, source: SOURCES.cementBody };
}

export interface CementCheckInput {
  pipeMaterial: Material | string;
  cementStandard: string;
  nominalSize: string;
  pressureService: boolean;
  /** The body of the can in hand, if known: checked against the size. */
  cementBody?: CementBody;
}

function standardProblems(material: Material, std: string, pressureService: boolean): string[] {
  const wanted = CEMENT_FOR_MATERIAL[material];
  if (std === wanted) return [];
  if (std === TRANSITION_CEMENT) {
    const problems: string[] = [];
    if (pressureService) problems.push('ASTM D3138 transition cement is for non-pressure service only (25 psi or less).');
    if (!TRANSITION_MATERIALS.includes(material)) problems.push(`ASTM D3138 joins ABS to PVC, not ${material}; use ASTM ${wanted}.`);
    return problems;
  }
  const forOther = (Object.keys(CEMENT_FOR_MATERIAL) as Material[]).find((k) => CEMENT_FOR_MATERIAL[k] === std);
  if (forOther) return [`ASTM ${std} is the cement for ${forOther}, not ${material} pipe; use ASTM ${wanted}.`];
  if (std === PRIMER_STANDARD) return [`ASTM ${PRIMER_STANDARD} is a primer, not a cement; ${material} pipe needs ASTM ${wanted} cement.`];
  return [`ASTM ${std} is not a solvent cement standard for ${material} pipe; use ASTM ${wanted}.`];
}

export function cementCheck(input: CementCheckInput): { ok: boolean; problems: string[]; requiredStandard?: string; requiredBody?: CementBody; primerStandard?: string; source: string } {
  const problems: string[] = [];
  const material = parsePipeMaterial(input.pipeMaterial);
  const std = normaliseStandard(input.cementStandard);
  const body = cementBody(input.nominalSize);
  if (!material) problems.push(`Unknown pipe material "${show(input.pipeMaterial)}": PVC, CPVC or ABS.`);
  if (!std) problems.push(`"${show(input.cementStandard)}" is not a cement standard number (e.g. ASTM D2564).`);
  if (!body.ok) problems.push(body.reason);
  if (material && std) problems.push(...standardProblems(material, std, input.pressureService));
  if (body.ok && input.cementBody && BODY_ORDER.indexOf(input.cementBody) < BODY_ORDER.indexOf(body.body)) {
    problems.push(`A ${input.cementBody}-bodied cement is too thin for ${input.nominalSize}": use ${body.body} body or heavier.`);
  }
  return {
    ok: problems.length === 0,
    problems,
    ...(material ? { requiredStandard: `ASTM ${CEMENT_FOR_MATERIAL[material]}` } : {}),
    ...(body.ok ? { requiredBody: body.body } : {}),
    ...(material && material !== 'ABS' ? { primerStandard: `ASTM ${PRIMER_STANDARD}` } : {}),
    source: `${SOURCES.cementStandards}; ${SOURCES.transitionCement}; ${SOURCES.cementBody}`,
  };
}

/**
 * Does the primer suit the pipe? PVC and CPVC two-step joints take an ASTM F656 primer [pub]. ABS is
 * joined with its ASTM D2235 cement alone, without primer [practice]: "none" is the answer there.
 */
export function primerCheck(input: { pipeMaterial: Material | string; primerStandard: string }): { ok: boolean; problems: string[]; requiredStandard: string | null; source: string } {
  const material = parsePipeMaterial(input.pipeMaterial);
  if (!material) return { ok: false, problems: [`Unknown pipe material "${show(input.pipeMaterial)}": PVC, CPVC or ABS.`], requiredStandard: null, source: SOURCES.cementStandards };
  const none = /^\s*(none|no primer|n\/a)\s*$/i.test(input.primerStandard);
  const std = normaliseStandard(input.primerStandard);
  const problems: string[] = [];
  if (material === 'ABS') {
    if (!none) problems.push(`ABS pipe is joined with ASTM ${CEMENT_FOR_MATERIAL.ABS} cement alone, without primer; record "none".`);
  } else if (none) {
    problems.push(`${material} two-step joints need an ASTM ${PRIMER_STANDARD} primer before the cement.`);
  } else if (std !== PRIMER_STANDARD) {
    const what = std ? `ASTM ${std} is not a primer for ${material}` : `"${show(input.primerStandard)}" is not a primer standard number`;
    problems.push(`${what}; use an ASTM ${PRIMER_STANDARD} primer.`);
  }
  return {
    ok: problems.length === 0,
    problems,
    requiredStandard: material === 'ABS' ? null : `ASTM ${PRIMER_STANDARD}`,
    source: material === 'ABS' ? 'common practice (ABS solvent cement is applied without primer)' : SOURCES.cementStandards,
  };
}
