import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { ApiRequestError } from '@/lib/api-client';
import { listCureSchedules } from '@shared/trade';
import { plantSettingsBodySchema, TEST_CAP_LABELS, TEST_CAPS, type PlantSettings, type PlantSettingsBody } from '@shared/schemas/plant-settings';
import { useSetPlantSettings } from '../api';

function Option({ checked, children, ...input }: React.InputHTMLAttributes<HTMLInputElement> & { checked?: boolean }) {
  return (
    <label className={`flex min-h-11 cursor-pointer gap-3 rounded-lg border p-3 ${checked ? 'border-tide bg-tide-light/40' : 'border-ink/15'}`}>
      <input type="radio" className="mt-1 h-5 w-5 accent-tide" {...input} />
      <span className="min-w-0">{children}</span>
    </label>
  );
}

/** The admin's form; everyone else sees the same choices, disabled. */
export function PlantSettingsForm({ settings, canChange }: { settings: PlantSettings; canChange: boolean }) {
  const save = useSetPlantSettings();
  const form = useForm<PlantSettingsBody>({
    resolver: zodResolver(plantSettingsBodySchema),
    // The version the form was opened at: a save over someone else's newer one is refused (409).
    values: { cureScheduleId: settings.cureScheduleId, testCap: settings.testCap, version: settings.version, lockLeftOnMinutes: settings.lockLeftOnMinutes },
  });
  const chosen = form.watch();
  const lockMinutesAtDefault = settings.atDefault.includes('lockLeftOnMinutes');
  // a default left untouched stays the default (and follows it if a later version changes it)
  const onSubmit = form.handleSubmit(({ lockLeftOnMinutes, ...body }) => save.mutate(form.formState.dirtyFields.lockLeftOnMinutes ? { ...body, lockLeftOnMinutes } : body, {
    onError: (err) => {
      if (err instanceof ApiRequestError) for (const [k, m] of Object.entries(err.details ?? {})) form.setError(k as keyof PlantSettingsBody, { message: m.join(' ') });
    },
  }));
  return (
    <form onSubmit={onSubmit} className="space-y-5">
      <fieldset disabled={!canChange} className="space-y-2">
        <legend className="mb-1 font-semibold">Cure schedule: the one your cement maker publishes</legend>
        {listCureSchedules().map((s) => (
          <Option key={s.id} value={s.id} checked={chosen.cureScheduleId === s.id} {...form.register('cureScheduleId')}>
            <span className="block font-semibold">{s.name}</span>
            <span className="block text-sm text-ink-soft">Source: {s.source}</span>
          </Option>
        ))}
        {form.formState.errors.cureScheduleId && <p className="text-sm text-refuse">{form.formState.errors.cureScheduleId.message}</p>}
      </fieldset>
      <fieldset disabled={!canChange} className="space-y-2">
        <legend className="mb-1 font-semibold">Test cap: how the weakest component limits the hydrostatic test</legend>
        {TEST_CAPS.map((cap) => (
          <Option key={cap} value={cap} checked={chosen.testCap === cap} {...form.register('testCap')}>
            <span className="block font-semibold">{TEST_CAP_LABELS[cap]}</span>
          </Option>
        ))}
      </fieldset>
      <fieldset disabled={!canChange} className="space-y-2">
        <legend className="mb-1 font-semibold">Locks left on</legend>
        <label className="flex flex-wrap items-center gap-3">
          <span>Tell the supervisors when a lock is still on</span>
          <input
            type="number" inputMode="numeric" min={5} max={1440} step={1}
            className="min-h-11 w-24 rounded-lg border border-ink/25 px-3 tabular-nums"
            aria-describedby="lock-left-on-help"
            {...form.register('lockLeftOnMinutes', { valueAsNumber: true })}
          />
          <span>minutes after an order's cure holds have all run out{lockMinutesAtDefault && <span className="text-ink-soft"> (default)</span>}</span>
        </label>
        <p id="lock-left-on-help" className="text-sm text-ink-soft">The hydrostatic test waits on every lock coming off the test boundary; a lock still on is often someone who went home.</p>
        {form.formState.errors.lockLeftOnMinutes && <p className="text-sm text-refuse">{form.formState.errors.lockLeftOnMinutes.message}</p>}
      </fieldset>
      {save.isError && <Notice tone="refusal" title="Not saved">{save.error.message}</Notice>}
      {save.isSuccess && !form.formState.isDirty && <Notice tone="success" title="Saved">The calculator and the server use these from now on.</Notice>}
      {canChange && (
        <Button type="submit" disabled={save.isPending || !form.formState.isDirty}>
          {save.isPending ? 'Saving…' : 'Save plant settings'}
        </Button>
      )}
    </form>
  );
}
