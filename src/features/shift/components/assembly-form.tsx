import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { assemblyValuesSchema } from '@shared/schemas/joint-steps';
import { buttonClass } from '@/components/ui/button';
import { formatSeconds } from '../countdown';
import { assemblyHoldFor } from '../units';
import { useNow } from '../use-now';
import { BigCheck } from './big-check';
import { RecordButton, type StepFormProps } from './form-bits';

const checksSchema = assemblyValuesSchema.omit({ heldSeconds: true });
type In = z.input<typeof checksSchema>;
type Out = z.output<typeof checksSchema>;

/** Seconds since the hold was started, whole, up to the schema's hour. */
const heldSince = (startedAt: number | null, now: number) => (startedAt === null ? 0 : Math.min(3600, Math.max(0, Math.floor((now - startedAt) / 1000))));

/**
 * Assembled while wet, the joining device where the size needs one, and the hold: a countdown the
 * fitter starts as the pipe bottoms. The seconds actually counted are sent; recording opens when it has run out.
 */
export function AssemblyForm({ detail, disabled, onRecord, cementTemperatureF }: StepFormProps & { cementTemperatureF: number | null }) {
  const holdSeconds = assemblyHoldFor(detail.engine.assemblyHoldSeconds, cementTemperatureF);
  const needsDevice = detail.engine.joiningDevice;
  const form = useForm<In, unknown, Out>({ resolver: zodResolver(checksSchema), defaultValues: { joiningDeviceUsed: false } });
  const [startedAt, setStartedAt] = useState<number | null>(null);
  const now = useNow(250);
  const held = heldSince(startedAt, now);
  const left = holdSeconds - held;
  const done = startedAt !== null && left <= 0;
  const e = form.formState.errors;

  const submit = form.handleSubmit((values) => {
    if (needsDevice && !values.joiningDeviceUsed) return form.setError('joiningDeviceUsed', { message: `confirm a mechanical joining device bottomed the pipe (a ${detail.jointSize}" joint needs one)` });
    onRecord({ step: 'assembly', values: { ...values, heldSeconds: heldSince(startedAt, Date.now()) } });
  });

  return (
    <form noValidate onSubmit={submit}>
      <fieldset disabled={disabled} className="space-y-3">
        <legend className="sr-only">Assemble and hold</legend>
        {detail.engine.crewText && <p className="text-ink-soft">{detail.engine.crewText}</p>}
        <BigCheck label="The pipe went in while the cement was wet" error={e.assembledWet?.message} {...form.register('assembledWet')} />
        {needsDevice && (
          <BigCheck label="A mechanical joining device bottomed the pipe" hint={`Required at ${detail.jointSize}".`} error={e.joiningDeviceUsed?.message} {...form.register('joiningDeviceUsed')} />
        )}
        <div className="rounded-xl border-2 border-ink/15 bg-paper-sunk p-4 text-center">
          <p className="font-medium text-ink-soft">Hold the joint still for {formatSeconds(holdSeconds)}</p>
          <p role="timer" aria-label="Hold time left" className={`my-2 text-7xl font-bold tabular-nums ${done ? 'text-tide' : 'text-ink'}`}>
            {formatSeconds(startedAt === null ? holdSeconds : Math.max(0, left))}
          </p>
          <p aria-live="polite" className="min-h-6 font-medium">
            {startedAt === null ? 'Start as the pipe bottoms in the socket.' : done ? `Held ${formatSeconds(held)}: record it.` : 'Holding…'}
          </p>
          <button type="button" onClick={() => setStartedAt(Date.now())} className={buttonClass(startedAt === null ? 'primary' : 'secondary', { size: 'wide', className: 'mt-2' })}>
            {startedAt === null ? 'Start the hold' : 'Start the hold again'}
          </button>
        </div>
        <RecordButton step="assembly" disabled={!done}>
          {done ? `Record: assembled, held ${formatSeconds(held)}` : 'Record: once the hold has run out'}
        </RecordButton>
      </fieldset>
    </form>
  );
}
