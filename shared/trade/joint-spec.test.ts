import { describe, expect, it } from 'vitest';
import { jointSpecSchema, temperatureFSchema, type JointSpecInput } from './joint-spec';
import { BELOW_ABSOLUTE_ZERO, parseTemperature } from './units';

const spec: JointSpecInput = {
  material: 'PVC', schedule: 80, nominalSize: '2', designPressurePsi: 100, designTemperatureF: 73, cureTemperatureF: 70, relativeHumidity: 40,
};

describe('the joint specification refuses temperatures below absolute zero, as the importer does', () => {
  it.each(['designTemperatureF', 'cureTemperatureF', 'testTemperatureF'] as const)('%s below −459.67 °F is refused with the importer’s reason', (field) => {
    const r = jointSpecSchema.safeParse({ ...spec, [field]: -500 });
    expect(r.success).toBe(false);
    expect(r.error?.issues).toEqual([expect.objectContaining({ path: [field], message: BELOW_ABSOLUTE_ZERO })]);
  });

  it('the schema and the importer agree on every temperature, at absolute zero and either side of it', () => {
    for (const f of [-1000, -459.68, -459.67, -459.66, -40, 0, 73, 500]) {
      const importer = parseTemperature(f, 'F');
      const schema = temperatureFSchema.safeParse(f);
      expect(schema.success, `${f} °F`).toBe(importer.ok);
      if (!importer.ok) expect(schema.error?.issues[0]?.message).toBe(importer.reason);
    }
  });

  it('a cold but possible cure temperature is taken', () => {
    expect(jointSpecSchema.safeParse({ ...spec, cureTemperatureF: -40 }).success).toBe(true);
  });
});
