// The calculator's form: what a person types (text with a unit chosen per group) and how it
// becomes a joint specification. The shared jointSpecSchema has the last word on every value,
// so the form and the API refuse the same things.

import { z } from 'zod';
import { jointSpecSchema, NOMINAL_SIZES, parsePressure, parseTemperature, type JointSpecInput } from '@shared/trade';
import { PRESSURE_UNITS, TEMPERATURE_UNITS, type PressureUnit, type TemperatureUnit } from '@/lib/format';

export const TEST_MEDIA = ['water', 'air', 'nitrogen'] as const;
export const CEMENT_STANDARDS = ['ASTM D2564', 'ASTM F493', 'ASTM D2235', 'ASTM D3138'] as const;

const shape = jointSpecSchema.shape;
const yesNo = z.enum(['yes', 'no']);

export const calculatorFields = z.object({
  material: shape.material,
  schedule: z.enum(['40', '80']),
  nominalSize: z.enum(NOMINAL_SIZES),
  designPressure: z.string(),
  designTemperature: z.string(),
  cureTemperature: z.string(),
  relativeHumidity: z.string(),
  testPressure: z.string(),
  lowestComponentRating: z.string(),
  testMedium: z.enum(TEST_MEDIA),
  cementStandard: z.union([z.literal(''), z.enum(CEMENT_STANDARDS)]),
  pressureService: yesNo,
  chemicalService: yesNo,
  pressureUnit: z.enum(PRESSURE_UNITS),
  temperatureUnit: z.enum(TEMPERATURE_UNITS),
});
export type CalculatorValues = z.infer<typeof calculatorFields>;
export type CalculatorField = keyof CalculatorValues;

export const DEFAULT_VALUES: CalculatorValues = {
  material: 'PVC', schedule: '80', nominalSize: '2', designPressure: '100', designTemperature: '73',
  cureTemperature: '70', relativeHumidity: '40', testPressure: '', lowestComponentRating: '', testMedium: 'water',
  cementStandard: '', pressureService: 'yes', chemicalService: 'yes', pressureUnit: 'psi', temperatureUnit: 'F',
};

export type SpecResult = { ok: true; spec: JointSpecInput } | { ok: false; errors: Partial<Record<CalculatorField, string>> };

/** Which form field a jointSpecSchema issue belongs to. */
const FIELD_OF: Partial<Record<string, CalculatorField>> = {
  material: 'material', schedule: 'schedule', nominalSize: 'nominalSize', designPressurePsi: 'designPressure',
  designTemperatureF: 'designTemperature', cureTemperatureF: 'cureTemperature', relativeHumidity: 'relativeHumidity',
  testPressurePsi: 'testPressure', lowestComponentRatingPsi: 'lowestComponentRating', testMedium: 'testMedium',
  cementStandard: 'cementStandard', pressureService: 'pressureService', chemicalService: 'chemicalService',
};

/** To 0.1 psi or 0.1 °F: far finer than any gauge or thermometer, and it keeps reasons readable. */
const tenth = (x: number) => Math.round(x * 10) / 10;

type Read = { value?: number; error?: string };

function readPressure(text: string, unit: PressureUnit, what: string, required: boolean): Read {
  if (text.trim() === '') return required ? { error: `Enter the ${what}.` } : {};
  const r = parsePressure(text, unit);
  return r.ok ? { value: tenth(r.psi) } : { error: r.reason };
}

function readTemperature(text: string, unit: TemperatureUnit, what: string): Read {
  if (text.trim() === '') return { error: `Enter the ${what}.` };
  const r = parseTemperature(text, unit);
  return r.ok ? { value: tenth(r.temperatureF) } : { error: r.reason };
}

function readHumidity(text: string): Read {
  if (text.trim() === '') return { error: 'Enter the relative humidity.' };
  const n = Number(text.trim().replace(/\s*%$/, ''));
  return Number.isFinite(n) && n >= 0 && n <= 100 ? { value: n } : { error: 'Relative humidity is 0 to 100 %.' };
}

function positive(r: Read, what: string): Read {
  return r.value !== undefined && r.value <= 0 ? { error: `The ${what} must be above 0.` } : r;
}

/** Form values → the joint specification the rules take (psi, °F), or an error per field. */
export function formToSpec(v: CalculatorValues): SpecResult {
  const read: Partial<Record<CalculatorField, Read>> = {
    designPressure: readPressure(v.designPressure, v.pressureUnit, 'design pressure', true),
    testPressure: positive(readPressure(v.testPressure, v.pressureUnit, 'test pressure', false), 'test pressure'),
    lowestComponentRating: positive(readPressure(v.lowestComponentRating, v.pressureUnit, 'component rating', false), 'component rating'),
    designTemperature: readTemperature(v.designTemperature, v.temperatureUnit, 'service temperature'),
    cureTemperature: readTemperature(v.cureTemperature, v.temperatureUnit, 'lowest temperature during the cure'),
    relativeHumidity: readHumidity(v.relativeHumidity),
  };
  const errors: Partial<Record<CalculatorField, string>> = {};
  for (const [field, r] of Object.entries(read)) if (r.error) errors[field as CalculatorField] = r.error;
  const spec: JointSpecInput = {
    material: v.material,
    schedule: v.schedule === '40' ? 40 : 80,
    nominalSize: v.nominalSize,
    designPressurePsi: read.designPressure?.value ?? Number.NaN,
    designTemperatureF: read.designTemperature?.value ?? Number.NaN,
    cureTemperatureF: read.cureTemperature?.value ?? Number.NaN,
    relativeHumidity: read.relativeHumidity?.value ?? Number.NaN,
    ...(read.testPressure?.value !== undefined ? { testPressurePsi: read.testPressure.value } : {}),
    ...(read.lowestComponentRating?.value !== undefined ? { lowestComponentRatingPsi: read.lowestComponentRating.value } : {}),
    testMedium: v.testMedium,
    ...(v.cementStandard ? { cementStandard: v.cementStandard } : {}),
    pressureService: v.pressureService === 'yes',
    chemicalService: v.chemicalService === 'yes',
  };
  if (Object.keys(errors).length) return { ok: false, errors };
  const checked = jointSpecSchema.safeParse(spec);
  if (checked.success) return { ok: true, spec };
  for (const issue of checked.error.issues) errors[FIELD_OF[String(issue.path[0])] ?? 'material'] ??= issue.message;
  return { ok: false, errors };
}

/** The resolver's schema: the fields above, then every value through formToSpec (and so jointSpecSchema). */
export const calculatorFormSchema = calculatorFields.superRefine((values, ctx) => {
  const r = formToSpec(values);
  if (!r.ok) for (const [field, message] of Object.entries(r.errors)) ctx.addIssue({ code: 'custom', path: [field], message });
});

const PRESSURE_FIELDS = ['designPressure', 'testPressure', 'lowestComponentRating'] as const;
const TEMPERATURE_FIELDS = ['designTemperature', 'cureTemperature'] as const;

/**
 * The values rewritten for another unit: what was typed is converted, never re-read, so "10"
 * meant as psi does not become 10 bar. Text that does not parse is left for the person to fix.
 */
export function convertUnits(v: CalculatorValues, to: { pressureUnit?: PressureUnit; temperatureUnit?: TemperatureUnit }, write: {
  pressure: (psi: number, unit: PressureUnit) => string;
  temperature: (f: number, unit: TemperatureUnit) => string;
}): Partial<CalculatorValues> {
  const out: Partial<CalculatorValues> = {};
  if (to.pressureUnit && to.pressureUnit !== v.pressureUnit) {
    for (const f of PRESSURE_FIELDS) {
      const r = v[f].trim() === '' ? null : parsePressure(v[f], v.pressureUnit);
      if (r?.ok) out[f] = write.pressure(r.psi, to.pressureUnit);
    }
    out.pressureUnit = to.pressureUnit;
  }
  if (to.temperatureUnit && to.temperatureUnit !== v.temperatureUnit) {
    for (const f of TEMPERATURE_FIELDS) {
      const r = v[f].trim() === '' ? null : parseTemperature(v[f], v.temperatureUnit);
      if (r?.ok) out[f] = write.temperature(r.temperatureF, to.temperatureUnit);
    }
    out.temperatureUnit = to.temperatureUnit;
  }
  return out;
}
