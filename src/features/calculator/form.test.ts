import { describe, expect, it } from 'vitest';
import { calculatorFormSchema, convertUnits, DEFAULT_VALUES, formToSpec, type CalculatorValues } from './form';
import { pressureIn, temperatureIn } from '@/lib/format';

const form = (over: Partial<CalculatorValues>): CalculatorValues => ({ ...DEFAULT_VALUES, ...over });
const spec = (over: Partial<CalculatorValues>) => {
  const r = formToSpec(form(over));
  if (!r.ok) throw new Error(JSON.stringify(r.errors));
  return r.spec;
};
const write = { pressure: pressureIn, temperature: temperatureIn };

describe('the calculator form becomes a joint specification in psi and °F', () => {
  it('metric values are converted, to 0.1 psi and 0.1 °F', () => {
    expect(spec({ pressureUnit: 'bar', temperatureUnit: 'C', designPressure: '7', cureTemperature: '-5', designTemperature: '21' }))
      .toMatchObject({ designPressurePsi: 101.5, cureTemperatureF: 23, designTemperatureF: 69.8 });
    expect(spec({ pressureUnit: 'kPa', designPressure: '690' }).designPressurePsi).toBe(100.1);
  });

  it('a unit typed into the field wins over the chosen unit', () => {
    expect(spec({ designPressure: '10 bar' }).designPressurePsi).toBe(145);
  });

  it('blank optional fields are left out, so the test is 1.5 × design and the cement the matching one', () => {
    const s = spec({});
    expect(s).not.toHaveProperty('testPressurePsi');
    expect(s).not.toHaveProperty('lowestComponentRatingPsi');
    expect(s).not.toHaveProperty('cementStandard');
  });

  it('each unreadable value is an error on its own field', () => {
    const r = formToSpec(form({ designPressure: '', relativeHumidity: '120', cureTemperature: '20 K', testPressure: '0' }));
    expect(r.ok).toBe(false);
    expect(!r.ok && r.errors).toMatchObject({
      designPressure: 'Enter the design pressure.',
      relativeHumidity: 'Relative humidity is 0 to 100 %.',
      cureTemperature: expect.stringContaining('Unknown temperature unit'),
      testPressure: 'The test pressure must be above 0.',
    });
  });

  it("the resolver's schema reports the same errors by field", () => {
    const r = calculatorFormSchema.safeParse(form({ designPressure: 'lots' }));
    expect(r.success).toBe(false);
    expect(r.error?.issues.map((i) => i.path[0])).toEqual(['designPressure']);
  });

  it('switching units converts what was typed and comes back to the same psi and °F', () => {
    const start = form({ designPressure: '120', lowestComponentRating: '150', cureTemperature: '40' });
    const metric = { ...start, ...convertUnits(start, { pressureUnit: 'bar', temperatureUnit: 'C' }, write) };
    expect(metric).toMatchObject({ designPressure: '8.274', lowestComponentRating: '10.342', cureTemperature: '4.44', pressureUnit: 'bar', temperatureUnit: 'C' });
    expect(spec(metric)).toEqual(spec(start));
    const back = { ...metric, ...convertUnits(metric, { pressureUnit: 'psi', temperatureUnit: 'F' }, write) };
    expect(back).toMatchObject({ designPressure: '120', lowestComponentRating: '150', cureTemperature: '40' });
  });
});
