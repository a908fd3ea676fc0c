import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { cementCheck, cementShelfLife } from '@shared/trade';
import { cementValuesSchema } from '@shared/schemas/joint-steps';
import { Notice } from '@/components/ui/notice';
import { useNow } from '../use-now';
import { BigField, RecordButton, type StepFormProps } from './form-bits';
import { UnitToggle } from './unit-toggle';

type In = z.input<typeof cementValuesSchema>;
type Out = z.output<typeof cementValuesSchema>;
const UNITS = [{ value: 'F', label: '°F' }, { value: 'C', label: '°C' }] as const;

/** What the browser can tell before the server does: the cement's shelf life and whether it suits the pipe. */
function useCementWarnings(detail: StepFormProps['detail'], standard: string, manufacturedOn: string): string[] {
  const now = useNow(60_000);
  const out: string[] = [];
  if (standard.trim()) {
    out.push(...cementCheck({ pipeMaterial: detail.line.material, cementStandard: standard, nominalSize: detail.jointSize, pressureService: detail.engine.pressureService }).problems);
  }
  if (/^\d{4}-\d{2}-\d{2}$/.test(manufacturedOn)) {
    const life = cementShelfLife({ manufacturedOn: `${manufacturedOn}T00:00:00Z`, now });
    if (!life.ok) out.push(life.reason);
    else if (life.expired) out.push(`Made ${manufacturedOn}: ${life.text}`);
  }
  return out;
}

/** Cement standard (the engine's), lot, the date stamped on the can, and the air it goes on in. */
export function CementForm({ detail, disabled, onRecord }: StepFormProps) {
  const form = useForm<In, unknown, Out>({
    resolver: zodResolver(cementValuesSchema),
    defaultValues: { standard: detail.engine.cementStandard, lot: '', manufacturedOn: '', temperatureUnit: 'F' },
  });
  const e = form.formState.errors;
  const unit = form.watch('temperatureUnit');
  const warnings = useCementWarnings(detail, form.watch('standard') ?? '', form.watch('manufacturedOn') ?? '');
  return (
    <form noValidate onSubmit={form.handleSubmit((values) => onRecord({ step: 'cement', values }))}>
      <fieldset disabled={disabled} className="space-y-3">
        <legend className="sr-only">Cement</legend>
        <div className="grid gap-3 sm:grid-cols-2">
          <BigField
            label="Cement standard"
            hint={`${detail.line.material}${detail.engine.cementBody ? `, ${detail.engine.cementBody} body` : ''}: ${detail.engine.cementStandard}.`}
            error={e.standard?.message}
            autoComplete="off"
            {...form.register('standard')}
          />
          <BigField label="Lot number (on the can)" error={e.lot?.message} autoComplete="off" {...form.register('lot')} />
          <BigField label="Date stamped on the can" type="date" error={e.manufacturedOn?.message} {...form.register('manufacturedOn')} />
          <BigField label="Relative humidity (%)" type="number" inputMode="decimal" step="any" min={0} max={100} error={e.relativeHumidity?.message} {...form.register('relativeHumidity', { valueAsNumber: true })} />
        </div>
        <div className="grid grid-cols-[minmax(0,1fr)_auto] items-end gap-3">
          <BigField label="Ambient temperature" type="number" inputMode="decimal" step="any" error={e.ambientTemperature?.message} {...form.register('ambientTemperature', { valueAsNumber: true })} />
          <UnitToggle legend="Unit" name="cement-temperature-unit" options={UNITS} value={unit} onChange={(u) => form.setValue('temperatureUnit', u)} />
        </div>
        {warnings.length > 0 && (
          <Notice tone="caution" title="The server will likely refuse this cement">
            {warnings.map((w) => <p key={w}>{w}</p>)}
          </Notice>
        )}
        <RecordButton step="cement" />
      </fieldset>
    </form>
  );
}
