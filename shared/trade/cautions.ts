// Cautions shown where a step can hurt someone. Each ends by deferring to local codes, the
// plant's own procedures and licensed engineering judgement. Sources: ASTM F402 for solvents
// [pub], OSHA 29 CFR 1910.147 for lockout [pub], a plastic pipe trade association user
// bulletin and ASTM D1785 §1.2 on gas testing [pub]; the rest is common practice [practice].

export interface Caution {
  id: string;
  title: string;
  text: string;
}

export const CAUTION_STEPS = [
  'prep', 'prime', 'cement', 'cure', 'pressure-test', 'lockout', 'chemical-service', 'release', 'joint',
] as const;
export type CautionStep = (typeof CAUTION_STEPS)[number];

export const DEFERENCE =
  "Local codes, the plant's own procedures and licensed engineering judgement come first.";

const c = (id: string, title: string, body: string): Caution => ({ id, title, text: `${body} ${DEFERENCE}` });

export const CAUTIONS: Readonly<Record<string, Caution>> = {
  flammable: c('flammable', 'Primer and cement are flammable',
    'Primers and solvent cements are flammable and their vapours are harmful (ASTM F402). Keep containers closed when not in use and take to the job only what it needs.'),
  ventilation: c('ventilation', 'Ventilate; no ignition sources',
    'Ventilate so vapour cannot collect, in enclosed spaces and inside the pipe as well. No smoking, flame, sparks or hot work near primer, cement or fresh joints until the vapour has cleared (ASTM F402).'),
  eyesGloves: c('eyes-gloves', 'Eye protection and impervious gloves',
    'Wear eye protection and impervious gloves (for example nitrile) when priming and cementing; primer and cement attack eyes and skin (ASTM F402).'),
  cementCondition: c('cement-condition', 'Cement in date and fluid',
    'Use cement within about two years of its stamped date; discard cement that has gelled or thickened and never thin it. Store and apply within about 40–100 °F; in sun, pipe runs 20–30 °F above the air, so shade pipe and cement.'),
  residual: c('residual', 'What the line held is still there',
    'A drained line can still hold liquid at low points and behind valves. Cut only after isolation is verified, with a catch pan, standing out of the path of a release.'),
  chemical: c('chemical', 'Chemical service',
    "Acids, caustics and other chemicals leave residue on the pipe wall and in fittings. Drain and flush as the plant's procedure for that service requires, and wear the protective equipment its safety data sheet calls for."),
  lockoutSequence: c('lockout-sequence', 'Isolate, relieve, verify',
    'Know the energy, shut down, operate the isolating devices, each authorized person applies a personal lock and tag, relieve stored energy (drain, vent) and verify isolation before work starts (OSHA 29 CFR 1910.147(d)). Keep verifying where pressure or liquid can build up again.'),
  personalLock: c('personal-lock', 'Your own lock, removed by you',
    'Each lock identifies the person who applied it and is removed by that person (OSHA 29 CFR 1910.147(c)(5), (e)(3)). Removing an absent person\'s lock needs the documented procedure and a supervisor\'s approval; shift changes transfer protection in order.'),
  cureFirst: c('cure-first', 'No pressure before the cure ends',
    'A joint pressurised before its cure has run out can blow apart and spray the line\'s contents. Count the cure at the lowest temperature during it and against the test pressure, the first and highest the joint sees. Do not move a joint before its set time has run out.'),
  storedPressure: c('stored-pressure', 'Stored pressure',
    'A section under test holds stored energy. Keep people clear while pressure is applied and held, relieve it through the vent or drain before touching fittings, and never disturb a joint under pressure.'),
  noGas: c('no-gas', 'Never test with air or gas',
    'Test thermoplastic piping hydrostatically, with water, vented of air. Compressed air or gas stores far more energy than water, and a failing joint can shatter the pipe into fragments (a plastic pipe trade association user bulletin; ASTM D1785 §1.2).'),
  release: c('release', 'Before release',
    'Inspect the area, make sure everyone is clear and affected people are told (OSHA 29 CFR 1910.147(e)). Confirm every cure hold has run out and the test passed, close vents and drains, and refill slowly, watching new joints.'),
};

const K = CAUTIONS;
const BY_STEP: Readonly<Record<Exclude<CautionStep, 'joint'>, readonly (Caution | undefined)[]>> = {
  prep: [K.residual, K.eyesGloves],
  prime: [K.flammable, K.ventilation, K.eyesGloves],
  cement: [K.flammable, K.ventilation, K.eyesGloves, K.cementCondition],
  cure: [K.cureFirst, K.ventilation],
  'pressure-test': [K.noGas, K.storedPressure, K.cureFirst],
  lockout: [K.lockoutSequence, K.personalLock, K.residual],
  'chemical-service': [K.chemical, K.eyesGloves],
  release: [K.release, K.personalLock, K.storedPressure, K.cureFirst],
};

function unique(list: readonly (Caution | undefined)[]): Caution[] {
  const seen = new Set<string>();
  return list.filter((x): x is Caution => x !== undefined && !seen.has(x.id) && seen.add(x.id) !== undefined);
}

/** Cautions for a step; 'joint' is prep + prime + cement + cure. An unknown step gets them all. */
export function cautionsFor(step: CautionStep | string): Caution[] {
  if (step === 'joint') return unique([...BY_STEP.prep, ...BY_STEP.prime, ...BY_STEP.cement, ...BY_STEP.cure]);
  const known = Object.hasOwn(BY_STEP, step) ? BY_STEP[step as Exclude<CautionStep, 'joint'>] : undefined;
  return unique(known ?? Object.values(CAUTIONS));
}

/**
 * Whether a service name reads like a chemical rather than water or air: a deliberately wide net,
 * because showing the chemical caution on a water line costs less than missing it on an acid line.
 * Only a plain water, air, drain, vent, permeate or condensate service (with the listed words
 * before it, such as "potable" or "RO") is left out; anything else gets the caution [practice].
 */
const NOT_CHEMICAL = /^(?:(?:potable|process|service|cooling|chilled|fire|raw|city|soft(?:ened)?|filtered|hot|cold|ro|di|deionized|demin(?:eralized)?|ultrapure|upw)\s+)*(?:water|air|drain|vent|permeate|condensate)s?$/i;
export const needsChemicalCaution = (service: string): boolean => !NOT_CHEMICAL.test(service.trim());
