import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { prepValuesSchema } from '@shared/schemas/joint-steps';
import { BigCheck } from './big-check';
import { RecordButton, type StepFormProps } from './form-bits';

type In = z.input<typeof prepValuesSchema>;
type Out = z.output<typeof prepValuesSchema>;

export function PrepForm({ detail, disabled, onRecord }: StepFormProps) {
  const form = useForm<In, unknown, Out>({ resolver: zodResolver(prepValuesSchema) });
  const e = form.formState.errors;
  return (
    <form noValidate onSubmit={form.handleSubmit((values) => onRecord({ step: 'prep', values }))}>
      <fieldset disabled={disabled} className="space-y-2">
        <legend className="sr-only">Preparing the ends</legend>
        <BigCheck label="The cut is square" error={e.squareCut?.message} {...form.register('squareCut')} />
        <BigCheck label="Inside and outside are deburred" error={e.deburred?.message} {...form.register('deburred')} />
        <BigCheck label="The end is chamfered" hint={detail.engine.chamferText ?? undefined} error={e.chamfered?.message} {...form.register('chamfered')} />
        <BigCheck label="The surfaces are clean and dry" error={e.cleanDry?.message} {...form.register('cleanDry')} />
        <RecordButton step="prep" />
      </fieldset>
    </form>
  );
}
