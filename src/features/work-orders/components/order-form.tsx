import { useState } from 'react';
import { Controller, useForm, type FieldPath } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { cToF, fToC } from '@shared/trade';
import {
  PRIORITIES, PRIORITY_LABELS, WORK_ORDER_KINDS, WORK_ORDER_KIND_LABELS, workOrderCreateSchema, type WorkOrderCreate,
} from '@shared/schemas/work-orders';
import { ApiRequestError } from '@/lib/api-client';
import { Button } from '@/components/ui/button';
import { Field, Input, Select } from '@/components/ui/field';
import { Notice } from '@/components/ui/notice';
import { LinePicker, type LineChoice } from '@/features/work-orders/components/line-picker';
import { isoToLocalInput, localInputToIso } from '@/features/work-orders/local-time';

type Values = z.input<typeof workOrderCreateSchema>;
export type LineSearch = { query: string; onQuery: (q: string) => void; options: LineChoice[]; searching: boolean };

const round1 = (x: number) => Math.round(x * 10) / 10;

/**
 * The planner's order: the shared schema validates it here and on the server. The window is typed
 * in the viewer's time zone and sent as instants; the forecast low in °F or °C, kept in °F.
 */
export function OrderForm({ initial, initialLines, lineSearch, submitLabel, busy, error, onSubmit, onCancel }: {
  initial?: Partial<WorkOrderCreate>;
  initialLines?: LineChoice[];
  lineSearch: LineSearch;
  submitLabel: string;
  busy: boolean;
  error: Error | null;
  onSubmit: (body: WorkOrderCreate) => Promise<unknown>;
  onCancel: () => void;
}) {
  const [lines, setLines] = useState<LineChoice[]>(initialLines ?? []);
  const [unit, setUnit] = useState<'F' | 'C'>('F');
  const form = useForm<Values, unknown, WorkOrderCreate>({
    resolver: zodResolver(workOrderCreateSchema),
    defaultValues: { kind: 'repair', priority: 'soon', scope: '', requestedBy: '', lineIds: [], windowStart: null, windowEnd: null, forecastLowF: null, forecastHighRh: null, testPressurePsi: null, componentRatingPsi: null, ...initial },
  });
  const { errors } = form.formState;
  const pickLines = (next: LineChoice[]) => {
    setLines(next);
    form.setValue('lineIds', next.map((l) => l.id), { shouldValidate: form.formState.isSubmitted });
  };
  const submit = form.handleSubmit(async (body) => {
    try {
      await onSubmit(body);
    } catch (err) {
      // The server's 400 names fields: put each message under its field.
      if (err instanceof ApiRequestError) for (const [k, m] of Object.entries(err.details ?? {})) form.setError(k as FieldPath<Values>, { message: m.join(' ') });
    }
  });
  const numberOrNull = (v: unknown) => (v === null || v === undefined || String(v).trim() === '' || Number.isNaN(Number(v)) ? null : Number(v));

  return (
    <form onSubmit={submit} noValidate className="space-y-5">
      {error && !(error instanceof ApiRequestError && error.details) && (
        <Notice tone="refusal" title="The order was not saved">{error.message}</Notice>
      )}
      {error instanceof ApiRequestError && error.details && <Notice tone="refusal" title="The order was not saved">Check the fields marked below. {error.message}</Notice>}
      <div className="grid gap-4 md:grid-cols-2">
        <Field label="Kind" error={errors.kind?.message}>
          <Select {...form.register('kind')}>
            {WORK_ORDER_KINDS.map((k) => <option key={k} value={k}>{WORK_ORDER_KIND_LABELS[k]}</option>)}
          </Select>
        </Field>
        <Field label="Priority" error={errors.priority?.message}>
          <Select {...form.register('priority')}>
            {PRIORITIES.map((p) => <option key={p} value={p}>{PRIORITY_LABELS[p]}</option>)}
          </Select>
        </Field>
      </div>
      <Field label="Scope: what is cut out, what is made" error={errors.scope?.message}>
        <textarea {...form.register('scope')} rows={3} className="min-h-11 w-full rounded-lg border border-ink/25 bg-paper-raised px-3 py-2 text-base focus:border-tide" />
      </Field>
      <Field label="Requested by" error={errors.requestedBy?.message}>
        <Input {...form.register('requestedBy')} autoComplete="off" />
      </Field>
      <LinePicker chosen={lines} onChange={pickLines} error={errors.lineIds?.message ?? errors.lineIds?.root?.message} {...lineSearch} />

      <fieldset className="grid gap-4 md:grid-cols-2">
        <legend className="mb-2 font-semibold">Repair window booked with operations</legend>
        {(['windowStart', 'windowEnd'] as const).map((name) => (
          <Controller key={name} control={form.control} name={name} render={({ field }) => (
            <Field label={name === 'windowStart' ? 'Window start' : 'Window end'} error={errors[name]?.message} hint={`Your time (${Intl.DateTimeFormat().resolvedOptions().timeZone})`}>
              <Input type="datetime-local" value={isoToLocalInput(field.value)} onChange={(e) => field.onChange(localInputToIso(e.target.value))} onBlur={field.onBlur} />
            </Field>
          )} />
        ))}
      </fieldset>

      <fieldset className="grid gap-4 md:grid-cols-2">
        <legend className="mb-2 font-semibold">Cure conditions forecast during the cure</legend>
        <Controller control={form.control} name="forecastLowF" render={({ field }) => (
          <div>
            <Field label={`Lowest temperature (°${unit})`} error={errors.forecastLowF?.message}>
              <Input
                type="number"
                step="0.1"
                inputMode="decimal"
                defaultValue={field.value == null ? '' : String(round1(unit === 'F' ? field.value : fToC(field.value)))}
                key={unit}
                onChange={(e) => {
                  const n = numberOrNull(e.target.value);
                  field.onChange(n === null ? null : round1(unit === 'F' ? n : cToF(n)));
                }}
              />
            </Field>
            <div role="radiogroup" aria-label="Temperature unit" className="mt-2 inline-flex rounded-lg border border-ink/20">
              {(['F', 'C'] as const).map((u) => (
                <label key={u} className={`flex min-h-11 min-w-14 cursor-pointer items-center justify-center px-3 text-sm font-medium ${unit === u ? 'bg-tide text-white' : ''}`}>
                  <input type="radio" className="sr-only" name="temperature-unit" checked={unit === u} onChange={() => setUnit(u)} />°{u}
                </label>
              ))}
            </div>
          </div>
        )} />
        <Field label="Highest relative humidity (%)" error={errors.forecastHighRh?.message}>
          <Input type="number" step="1" inputMode="numeric" {...form.register('forecastHighRh', { setValueAs: numberOrNull })} />
        </Field>
      </fieldset>

      <Field label="Weakest component other than the pipe (psi), if any" error={errors.componentRatingPsi?.message} hint="A valve or flange rated below the pipe caps the test pressure.">
        <Input type="number" step="1" inputMode="numeric" {...form.register('componentRatingPsi', { setValueAs: numberOrNull })} />
      </Field>

      <div className="flex flex-wrap gap-2">
        <Button type="submit" disabled={busy}>{busy ? 'Saving…' : submitLabel}</Button>
        <Button type="button" variant="secondary" onClick={onCancel}>Cancel</Button>
      </div>
    </form>
  );
}
