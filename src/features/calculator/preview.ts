// The client's preview: form values → specification → the same jointPicture() the server runs.
// Pure, so tests/api/calc.test.ts can hold it against the API's answer.

import { dryFitCheck, jointPicture, type JointPicture, type JointSpecInput } from '@shared/trade';
import type { PlantSettings } from '@shared/schemas/plant-settings';
import { formToSpec, type CalculatorField, type CalculatorValues } from './form';

type Plant = Pick<PlantSettings, 'cureScheduleId' | 'testCap'>;

export type Preview =
  | { ok: true; spec: JointSpecInput; picture: JointPicture; dryFit: DryFitWindow | null }
  | { ok: false; errors: Partial<Record<CalculatorField, string>> };

export interface DryFitWindow {
  minIn: number;
  maxIn: number;
  makerMinIn?: number;
  source: string;
}

/** The plant's schedule and test cap go into the spec, as the server fills them in. */
export function withPlant(spec: JointSpecInput, plant: Plant): JointSpecInput {
  return { ...spec, cureScheduleId: plant.cureScheduleId, testCap: plant.testCap };
}

export function pictureFor(spec: JointSpecInput): JointPicture | null {
  const p = jointPicture(spec);
  return 'spec' in p ? p : null;
}

function dryFitWindow(spec: JointSpecInput): DryFitWindow | null {
  const d = dryFitCheck({ nominalSize: spec.nominalSize, schedule: spec.schedule, dryInsertionIn: 0 });
  return d.ok ? { minIn: d.minIn, maxIn: d.maxIn, makerMinIn: d.makerMinIn, source: d.source } : null;
}

export function previewJoint(values: CalculatorValues, plant: Plant): Preview {
  const r = formToSpec(values);
  if (!r.ok) return r;
  const spec = withPlant(r.spec, plant);
  const picture = pictureFor(spec);
  if (!picture) return { ok: false, errors: { material: 'The specification is not valid.' } };
  return { ok: true, spec, picture, dryFit: dryFitWindow(spec) };
}

/** JSON with sorted keys: what crosses the wire, in an order that does not matter. */
export function stableJson(value: unknown): string {
  return JSON.stringify(value, (_k, v: unknown) =>
    v && typeof v === 'object' && !Array.isArray(v)
      ? Object.fromEntries(Object.entries(v as Record<string, unknown>).sort(([a], [b]) => a.localeCompare(b)))
      : v,
  );
}

/** The sections of the picture where the server's answer differs from the preview ([] when they agree). */
export function differingSections(preview: JointPicture, server: unknown): string[] {
  const s = (server ?? {}) as Record<string, unknown>;
  const p = preview as unknown as Record<string, unknown>;
  const keys = [...new Set([...Object.keys(p), ...Object.keys(s)])];
  return keys.filter((k) => stableJson(p[k]) !== stableJson(s[k]));
}
