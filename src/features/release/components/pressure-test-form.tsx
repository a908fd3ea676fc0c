import { useState, type FormEvent } from 'react';
import { checkTestMedium, MIN_TEST_HOLD_MINUTES } from '@shared/trade';
import type { PressureTestDto } from '@shared/schemas/release';
import type { WorkOrderDto } from '@shared/schemas/work-orders';
import { ApiRequestError } from '@/lib/api-client';
import { Button } from '@/components/ui/button';
import { Field, Input } from '@/components/ui/field';
import { Notice } from '@/components/ui/notice';
import { useRecordPressureTest } from '@/features/release/api';
import { heldMinutes, initialTestForm, leakCandidates, testBodyFrom, toNumber, type TestForm } from '@/features/release/test-form';
import { CheckRow } from '@/features/release/components/check-row';

const TOUCH = 'min-h-12';
const textarea = `${TOUCH} w-full rounded-lg border border-ink/25 bg-paper-raised px-3 py-2 text-base focus:border-tide`;
const RESULT_WORDS = { passed: 'Passed: held, no leak', failed: 'Failed: a joint leaked or the pressure fell' } as const;

type Order = Pick<WorkOrderDto, 'id' | 'lines' | 'testPressure' | 'jointTasks'>;

/**
 * The witness records the test after it ran: the (f)(1) sequence first, then the record B31.3
 * 345.2.7 asks for. The same schema as the route checks it before sending; the server decides.
 */
export function PressureTestForm({ order, onRecorded }: { order: Order; onRecorded: (test: PressureTestDto) => void }) {
  const record = useRecordPressureTest(order.id);
  const [form, setForm] = useState<TestForm>(() => initialTestForm(order));
  const [key, setKey] = useState(() => crypto.randomUUID());
  const [problems, setProblems] = useState<Record<string, string[]>>({});
  const set = <K extends keyof TestForm>(k: K, v: TestForm[K]) => setForm((f) => ({ ...f, [k]: v }));

  const tp = order.testPressure;
  const server = record.error instanceof ApiRequestError && record.error.status === 400 ? record.error.details ?? {} : {};
  const err = (k: string) => [...(problems[k] ?? []), ...(server[k] ?? [])].join(' ') || undefined;
  const mediumRefusal = form.medium.trim() ? checkTestMedium(form.medium) : null;
  const held = heldMinutes(form.startedAt, form.endedAt);
  const minHold = tp.holdMinutes ?? MIN_TEST_HOLD_MINUTES;
  const typedPsi = toNumber(form.testPressurePsi);
  const outside = typedPsi !== undefined && tp.minimumPsi !== null && tp.capPsi !== null && (typedPsi < tp.minimumPsi || typedPsi > tp.capPsi);

  const submit = (ev: FormEvent) => {
    ev.preventDefault();
    const checked = testBodyFrom(form);
    if (!checked.body) {
      const p = checked.problems;
      if (p.result) p.result = ['choose passed or failed'];
      setProblems(p);
      return;
    }
    setProblems({});
    record.mutate({ body: checked.body, key }, {
      onSuccess: (test) => {
        setKey(crypto.randomUUID());
        onRecorded(test);
      },
    });
  };

  return (
    <form onSubmit={submit} aria-label="Record the hydrostatic test" className="space-y-4" noValidate>
      <fieldset className="space-y-2">
        <legend className="mb-1 text-sm font-semibold">Before pressure goes on (OSHA 29 CFR 1910.147(f)(1))</legend>
        <CheckRow checked={form.toolsClear} onChange={(v) => set('toolsClear', v)} error={err('toolsClear')}>Tools and materials are clear of the section.</CheckRow>
        <CheckRow checked={form.peopleClear} onChange={(v) => set('peopleClear', v)} error={err('peopleClear')}>People are clear of the section.</CheckRow>
        <p className="rounded-lg bg-paper-sunk px-3 py-2 text-sm">
          Each lock on the test boundary is removed by the person who put it on, before the test. The record is refused while any lock is still on.
        </p>
      </fieldset>

      <div className="grid gap-3 sm:grid-cols-2">
        <Field label="Test medium" error={err('medium') ?? mediumRefusal?.reason} hint="Water only. Air or any gas is never allowed on thermoplastic pipe.">
          <Input className={TOUCH} value={form.medium} onChange={(e) => set('medium', e.target.value)} maxLength={40} required />
        </Field>
        <Field
          label="Test pressure (psi)"
          error={err('testPressurePsi') ?? (outside ? `outside ${tp.minimumPsi}–${tp.capPsi} psi: the record would be refused` : undefined)}
          hint={tp.minimumPsi !== null && tp.capPsi !== null ? `Between ${tp.minimumPsi} psi (1.5 × design) and ${tp.capPsi} psi (the cap).` : undefined}
        >
          <Input className={TOUCH} type="number" inputMode="decimal" min={tp.minimumPsi ?? 0} max={tp.capPsi ?? undefined} step="any" value={form.testPressurePsi} onChange={(e) => set('testPressurePsi', e.target.value)} required />
        </Field>
      </div>
      <Field label="Gauge" error={err('gauge')} hint="Tag, range and calibration, e.g. PI-T3, 0–300 psi, calibrated 2026-09.">
        <Input className={TOUCH} value={form.gauge} onChange={(e) => set('gauge', e.target.value)} maxLength={200} required />
      </Field>

      <div className="grid gap-3 sm:grid-cols-2">
        <Field label="Pressure reached at" error={err('startedAt')}>
          <Input className={TOUCH} type="datetime-local" value={form.startedAt} onChange={(e) => set('startedAt', e.target.value)} required />
        </Field>
        <Field label="Reading at the start (psi)" error={err('startReadingPsi')}>
          <Input className={TOUCH} type="number" inputMode="decimal" min={0} step="any" value={form.startReadingPsi} onChange={(e) => set('startReadingPsi', e.target.value)} required />
        </Field>
        <Field label="Test ended at" error={err('endedAt')}>
          <Input className={TOUCH} type="datetime-local" value={form.endedAt} onChange={(e) => set('endedAt', e.target.value)} required />
        </Field>
        <Field label="Reading at the end (psi)" error={err('endReadingPsi')}>
          <Input className={TOUCH} type="number" inputMode="decimal" min={0} step="any" value={form.endReadingPsi} onChange={(e) => set('endReadingPsi', e.target.value)} required />
        </Field>
      </div>
      <p className="text-sm text-ink-soft" aria-live="polite">
        {held === null ? `A pass is held at least ${minHold} min` : held <= 0 ? 'The end must come after the start.' : `Held ${held} min; a pass needs at least ${minHold} min`}
        {tp.minimumPsi !== null && `, with both readings at or above ${tp.minimumPsi} psi`}.
      </p>

      <fieldset>
        <legend className="mb-1 text-sm font-semibold">Result</legend>
        <div className="grid gap-2 sm:grid-cols-2">
          {(['passed', 'failed'] as const).map((r) => (
            <label key={r} className="flex min-h-12 cursor-pointer items-center gap-3 rounded-lg border border-ink/15 bg-paper-raised px-3 py-2 text-sm has-[:checked]:border-tide has-[:checked]:bg-tide-light/40">
              <input type="radio" name="result" value={r} className="h-6 w-6 accent-tide" checked={form.result === r} onChange={() => set('result', r)} />
              {RESULT_WORDS[r]}
            </label>
          ))}
        </div>
        {err('result') && <p className="mt-1 text-sm text-refuse">{err('result')}</p>}
      </fieldset>

      {form.result === 'failed' && (
        <fieldset className="space-y-2">
          <legend className="mb-1 text-sm font-semibold">Joints that leaked (each is cut out for redo)</legend>
          {leakCandidates(order.jointTasks).map((j) => (
            <CheckRow key={j.id} checked={form.leakingJointIds.includes(j.id)} onChange={(v) => set('leakingJointIds', v ? [...form.leakingJointIds, j.id] : form.leakingJointIds.filter((x) => x !== j.id))}>
              <span className="font-semibold">{j.label}</span> · {j.lineNumber} · {j.jointSize}" {j.fittingKind}
            </CheckRow>
          ))}
          {err('leakingJointIds') && <p className="text-sm text-refuse">{err('leakingJointIds')}</p>}
        </fieldset>
      )}

      <Field label="Piping tested" error={err('pipingIdentified')} hint="Lines, from and to, drawing.">
        <textarea className={textarea} rows={2} value={form.pipingIdentified} onChange={(e) => set('pipingIdentified', e.target.value)} maxLength={500} required />
      </Field>
      <Field label="Examiner who certifies the record" error={err('examiner')}>
        <Input className={TOUCH} value={form.examiner} onChange={(e) => set('examiner', e.target.value)} maxLength={200} required />
      </Field>
      <Field label="Notes (optional)" error={err('notes')}>
        <textarea className={textarea} rows={2} value={form.notes} onChange={(e) => set('notes', e.target.value)} maxLength={2000} />
      </Field>

      {record.error && (
        <Notice tone="refusal" title="The test was not recorded">{record.error.message}</Notice>
      )}
      <Button type="submit" size="lg" disabled={record.isPending}>{record.isPending ? 'Recording…' : 'Record the test'}</Button>
    </form>
  );
}
