import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { primerValuesSchema } from '@shared/schemas/joint-steps';
import { BigCheck } from './big-check';
import { BigField, RecordButton, type StepFormProps } from './form-bits';

type In = z.input<typeof primerValuesSchema>;
type Out = z.output<typeof primerValuesSchema>;

/** Primer standard (the engine's, or "none" where the material takes none), lot, and the softening check. */
export function PrimerForm({ detail, disabled, onRecord }: StepFormProps) {
  const standard = detail.engine.primerStandard ?? 'none';
  const form = useForm<In, unknown, Out>({ resolver: zodResolver(primerValuesSchema), defaultValues: { standard, lot: '' } });
  const e = form.formState.errors;
  return (
    <form noValidate onSubmit={form.handleSubmit((values) => onRecord({ step: 'primer', values }))}>
      <fieldset disabled={disabled} className="space-y-3">
        <legend className="sr-only">Primer</legend>
        <div className="grid gap-3 sm:grid-cols-2">
          <BigField
            label="Primer standard"
            hint={detail.engine.primerStandard ? `${detail.line.material} takes ${detail.engine.primerStandard} primer.` : `${detail.line.material} takes no primer: record “none”.`}
            error={e.standard?.message}
            autoComplete="off"
            {...form.register('standard')}
          />
          <BigField label="Lot number (on the can)" error={e.lot?.message} autoComplete="off" {...form.register('lot')} />
        </div>
        <BigCheck label="The primer softened a scrap of the pipe" error={e.softeningChecked?.message} {...form.register('softeningChecked')} />
        <RecordButton step="primer" />
      </fieldset>
    </form>
  );
}
