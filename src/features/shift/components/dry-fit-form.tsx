import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { dryFitValuesSchema } from '@shared/schemas/joint-steps';
import { Notice } from '@/components/ui/notice';
import { formatDateTime } from '@/lib/format';
import { dryFitVerdict, dryFitWindow, lengthText } from '../units';
import { BigField, RecordButton, type StepFormProps } from './form-bits';
import { UnitToggle } from './unit-toggle';

type In = z.input<typeof dryFitValuesSchema>;
type Out = z.output<typeof dryFitValuesSchema>;
const UNITS = [{ value: 'in', label: 'in' }, { value: 'mm', label: 'mm' }] as const;
const WARN = {
  short: 'Shorter than the window: the pipe enters too little dry (too tight a fit). The server will refuse it and keep it as a retry.',
  deep: 'Deeper than the window: the pipe enters too far dry (a loose fit). The server will refuse it and keep it as a retry.',
} as const;

/** The dry insertion, with the engine's window shown in the unit measured in and a live warning; the server decides. */
export function DryFitForm({ detail, disabled, onRecord }: StepFormProps) {
  const form = useForm<In, unknown, Out>({ resolver: zodResolver(dryFitValuesSchema), defaultValues: { unit: 'in' } });
  const unit = form.watch('unit');
  const insertion = form.watch('insertion');
  const { dryFitMinIn: min, dryFitMaxIn: max, socketDepthIn } = detail.engine;
  const range = dryFitWindow(min, max, unit);
  const verdict = dryFitVerdict(Number(insertion), unit, min, max);
  return (
    <form noValidate onSubmit={form.handleSubmit((values) => onRecord({ step: 'dry-fit', values }))}>
      <fieldset disabled={disabled} className="space-y-3">
        <legend className="sr-only">Dry fit</legend>
        <p className="text-lg">
          {range ? (
            <>
              Dry, the pipe should enter <span className="font-bold">{range.text}</span>
              {socketDepthIn !== null && <span className="text-ink-soft"> (⅓–⅔ of a {lengthText(socketDepthIn, unit)} socket)</span>}.
            </>
          ) : (
            <span className="text-ink-soft">The engine has no dry-fit window for this joint: {detail.engine.problems.join(' ') || 'size not tabled'}.</span>
          )}
        </p>
        <div className="grid grid-cols-[minmax(0,1fr)_auto] items-end gap-3">
          <BigField
            label="Measured dry insertion"
            type="number"
            inputMode="decimal"
            step="any"
            min={0}
            error={form.formState.errors.insertion?.message}
            className="text-3xl font-semibold tabular-nums"
            {...form.register('insertion', { valueAsNumber: true })}
          />
          <UnitToggle legend="Unit" name="dry-fit-unit" options={UNITS} value={unit} onChange={(u) => form.setValue('unit', u)} />
        </div>
        {verdict === 'short' || verdict === 'deep' ? (
          <Notice tone="caution" title="Outside the dry-fit window">{WARN[verdict]}</Notice>
        ) : verdict === 'ok' ? (
          <p className="font-medium text-tide">✓ Inside the window.</p>
        ) : null}
        {detail.dryFitRetries.length > 0 && (
          <div>
            <p className="font-semibold">Dry fits refused before</p>
            <ul className="mt-1 space-y-1 text-sm">
              {detail.dryFitRetries.map((r, i) => (
                <li key={i} className="rounded-lg bg-paper-sunk px-3 py-2">
                  <span className="font-medium">{lengthText(r.insertionIn, 'in')}</span> · {r.by.name}, {formatDateTime(r.at)}: {r.message}
                </li>
              ))}
            </ul>
          </div>
        )}
        <RecordButton step="dry-fit" />
      </fieldset>
    </form>
  );
}
