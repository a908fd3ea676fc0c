import { cloneElement, useId, type ReactElement, type ReactNode } from 'react';
import { Controller, type UseFormReturn } from 'react-hook-form';
import { Select } from '@/components/ui/field';
import { CEMENT_FOR_MATERIAL, NOMINAL_SIZES } from '@shared/trade';
import { CEMENT_STANDARDS, convertUnits, type CalculatorField, type CalculatorValues } from '../form';
import { PRESSURE_UNIT_LABEL, pressureIn, TEMPERATURE_UNIT_LABEL, temperatureIn, type PressureUnit, type TemperatureUnit } from '@/lib/format';
import { Segmented } from './segmented';
import { UnitInput } from './unit-input';

type Form = UseFormReturn<CalculatorValues>;

const CEMENT_NOTE: Record<(typeof CEMENT_STANDARDS)[number], string> = {
  'ASTM D2564': 'PVC cement', 'ASTM F493': 'CPVC cement', 'ASTM D2235': 'ABS cement', 'ASTM D3138': 'ABS-to-PVC transition, non-pressure',
};
const YES_NO = [{ value: 'yes', label: 'Yes' }, { value: 'no', label: 'No' }] as const;

/** Label and control; the hint or error sits outside the label, so it is a description, not part of the name. */
function Labelled({ label, error, hint, children }: { label: ReactNode; error?: string; hint?: ReactNode; children: ReactElement<{ 'aria-describedby'?: string }> }) {
  const id = useId();
  const said = error ?? hint;
  return (
    <div className="min-w-0">
      <label className="block">
        <span className="mb-1 block text-sm font-medium text-ink-soft">{label}</span>
        {said ? cloneElement(children, { 'aria-describedby': id }) : children}
      </label>
      {said && <p id={id} className={error ? 'mt-1 text-sm text-refuse' : 'mt-1 text-xs text-ink-faint'}>{said}</p>}
    </div>
  );
}

function Group({ title, children }: { title: string; children: ReactNode }) {
  return (
    <div className="border-t border-ink/10 pt-3 first:border-t-0 first:pt-0">
      <h3 className="mb-2 text-xs font-bold uppercase tracking-wider text-ink-soft">{title}</h3>
      <div className="grid grid-cols-2 gap-3 md:grid-cols-3 lg:grid-cols-2">{children}</div>
    </div>
  );
}

function Choice<K extends CalculatorField>({ form, name, legend, options, refuse }: {
  form: Form; name: K; legend: string; options: readonly { value: CalculatorValues[K] & string; label: ReactNode }[]; refuse?: (v: string) => boolean;
}) {
  return (
    <Controller
      control={form.control}
      name={name}
      render={({ field }) => (
        <Segmented legend={legend} name={name} options={options} value={field.value as string} onChange={field.onChange} tone={(v) => (refuse?.(v) ? 'refuse' : undefined)} />
      )}
    />
  );
}

/** Everything a person enters about one joint; the page previews as they type. */
export function CalculatorForm({ form, testHint }: { form: Form; testHint: string }) {
  const { register, formState: { errors }, watch } = form;
  const pUnit = PRESSURE_UNIT_LABEL[watch('pressureUnit')];
  const tUnit = TEMPERATURE_UNIT_LABEL[watch('temperatureUnit')];
  const material = watch('material');
  const switchUnits = (to: { pressureUnit?: PressureUnit; temperatureUnit?: TemperatureUnit }) => {
    const changed = convertUnits(form.getValues(), to, { pressure: pressureIn, temperature: temperatureIn });
    for (const [k, v] of Object.entries(changed)) form.setValue(k as CalculatorField, v as never, { shouldDirty: true });
    void form.trigger();
  };
  const pressureField = (name: 'designPressure' | 'testPressure' | 'lowestComponentRating', placeholder?: string) => (
    <UnitInput unit={pUnit} inputMode="decimal" placeholder={placeholder} invalid={!!errors[name]} {...register(name)} />
  );
  const temperatureField = (name: 'designTemperature' | 'cureTemperature') => (
    <UnitInput unit={tUnit} invalid={!!errors[name]} {...register(name)} />
  );

  return (
    <form className="space-y-4" onSubmit={(e) => e.preventDefault()} noValidate aria-labelledby="joint-spec">
      {/* The groups' headings sit under this one, as the results' sections sit beside it; seen, the form needs no title. */}
      <h2 id="joint-spec" className="sr-only">Joint specification</h2>
      <div className="grid grid-cols-2 gap-3">
        <Segmented legend="Pressure in" name="pressureUnit" value={watch('pressureUnit')} onChange={(u) => switchUnits({ pressureUnit: u })}
          options={[{ value: 'psi', label: 'psi' }, { value: 'bar', label: 'bar' }, { value: 'kPa', label: 'kPa' }]} />
        <Segmented legend="Temperature in" name="temperatureUnit" value={watch('temperatureUnit')} onChange={(u) => switchUnits({ temperatureUnit: u })}
          options={[{ value: 'F', label: '°F' }, { value: 'C', label: '°C' }]} />
      </div>
      <Group title="Pipe">
        <Choice form={form} name="material" legend="Material" options={[{ value: 'PVC', label: 'PVC' }, { value: 'CPVC', label: 'CPVC' }, { value: 'ABS', label: 'ABS' }]} />
        <Choice form={form} name="schedule" legend="Schedule" options={[{ value: '40', label: 'Sch 40' }, { value: '80', label: 'Sch 80' }]} />
        <Labelled label="Nominal size" error={errors.nominalSize?.message}>
          <Select className="min-h-12 text-lg" {...register('nominalSize')}>
            {NOMINAL_SIZES.map((s) => <option key={s} value={s}>{s}"</option>)}
          </Select>
        </Labelled>
      </Group>
      <Group title="Service">
        <Choice form={form} name="pressureService" legend="Pressure service" options={YES_NO} />
        <Choice form={form} name="chemicalService" legend="Chemical service" options={YES_NO} />
        <Labelled label="Design pressure" error={errors.designPressure?.message}>{pressureField('designPressure')}</Labelled>
        <Labelled label="Service temperature" error={errors.designTemperature?.message} hint="The pipe is rated at this.">{temperatureField('designTemperature')}</Labelled>
      </Group>
      <Group title="During the cure">
        <Labelled label="Coldest during cure" error={errors.cureTemperature?.message} hint="The lowest temperature expected while it cures, overnight too.">{temperatureField('cureTemperature')}</Labelled>
        <Labelled label="Relative humidity" error={errors.relativeHumidity?.message}>
          <UnitInput unit="%" inputMode="decimal" invalid={!!errors.relativeHumidity} {...register('relativeHumidity')} />
        </Labelled>
      </Group>
      <Group title="Pressure test">
        <div className="col-span-2 md:col-span-1 lg:col-span-2">
          <Choice form={form} name="testMedium" legend="Test medium" refuse={(v) => v !== 'water'}
            options={[{ value: 'water', label: 'Water' }, { value: 'air', label: 'Air' }, { value: 'nitrogen', label: 'Nitrogen' }]} />
        </div>
        <Labelled label="Test pressure" error={errors.testPressure?.message} hint={testHint}>{pressureField('testPressure', 'auto')}</Labelled>
        <Labelled label="Weakest component" error={errors.lowestComponentRating?.message} hint="Optional: its rating (valve, flange …). The pipe's own rating always counts.">
          {pressureField('lowestComponentRating', 'Pipe only')}
        </Labelled>
      </Group>
      <Group title="Cement">
        <div className="col-span-full">
        <Labelled label="Cement standard (optional)" error={errors.cementStandard?.message}>
          <Select className="min-h-12 text-lg" {...register('cementStandard')}>
            <option value="">The one for {material}: ASTM {CEMENT_FOR_MATERIAL[material]}</option>
            {CEMENT_STANDARDS.map((s) => <option key={s} value={s}>{s} ({CEMENT_NOTE[s]})</option>)}
          </Select>
        </Labelled>
        </div>
      </Group>
    </form>
  );
}
