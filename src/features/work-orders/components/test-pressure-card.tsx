import { useState } from 'react';
import type { TestPressureDto } from '@shared/schemas/work-order-plan';
import { ApiRequestError } from '@/lib/api-client';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Field, Input } from '@/components/ui/field';
import { Notice } from '@/components/ui/notice';
import { duration, formatPressure, formatPressureBar } from '@/lib/format';
import { useUpdateOrder } from '@/features/work-orders/api';

/** 1.5 × the highest design pressure, capped by the weakest component; the planner may raise it within the cap. */
export function TestPressureCard({ orderId, version, test, mayEdit }: { orderId: string; version: number; test: TestPressureDto; mayEdit: boolean }) {
  const update = useUpdateOrder(orderId);
  const [raiseTo, setRaiseTo] = useState('');
  const details = update.error instanceof ApiRequestError ? update.error.details : undefined;
  if (!test.required) {
    return <Card title="Test pressure"><p className="text-sm">No hydrostatic test: no line of this order is on pressure service.</p></Card>;
  }
  const raise = (psiValue: number | null) => update.mutate({ version, testPressurePsi: psiValue }, { onSuccess: () => setRaiseTo('') });
  return (
    <Card title="Test pressure">
      {test.problems.length > 0 && (
        <div className="mb-3">
          <Notice tone="refusal" title="The test pressure cannot be set">
            <ul className="list-disc pl-5">{test.problems.map((p) => <li key={p}>{p}</li>)}</ul>
          </Notice>
        </div>
      )}
      {test.testPsi !== null && (
        <p className="text-2xl font-bold tabular-nums">
          {formatPressure(test.testPsi)} <span className="text-base font-normal text-ink-soft">({formatPressureBar(test.testPsi)}){test.raised && ', raised by the planner'}</span>
        </p>
      )}
      <dl className="mt-2 space-y-1 text-sm">
        {test.minimumPsi !== null && (
          <div><dt className="inline text-ink-soft">Minimum: </dt><dd className="inline">{formatPressure(test.minimumPsi)}{test.highestDesign && ` (1.5 × ${formatPressure(test.highestDesign.psi)}, the design pressure of ${test.highestDesign.lineNumber})`}</dd></div>
        )}
        {test.capPsi !== null && (
          <div><dt className="inline text-ink-soft">Cap: </dt><dd className="inline">{formatPressure(test.capPsi)}{test.weakest && ` (${test.weakest.what}, ${formatPressure(test.weakest.psi)})`}</dd></div>
        )}
        {test.holdMinutes !== null && <div><dt className="inline text-ink-soft">Hold: </dt><dd className="inline">at least {duration(test.holdMinutes)}</dd></div>}
      </dl>
      {test.source && <p className="mt-2 text-xs text-ink-faint">Source: {test.source}</p>}
      {mayEdit && test.minimumPsi !== null && test.capPsi !== null && test.capPsi > test.minimumPsi && (
        <form
          className="mt-3 flex flex-wrap items-end gap-2"
          onSubmit={(e) => (e.preventDefault(), raise(Number(raiseTo)))}
        >
          <div className="w-44">
            <Field label={`Raise to (psi, ${test.minimumPsi}–${test.capPsi})`} error={details?.testPressurePsi?.join(' ')}>
              <Input type="number" min={test.minimumPsi} max={test.capPsi} step={1} value={raiseTo} onChange={(e) => setRaiseTo(e.target.value)} required />
            </Field>
          </div>
          <Button type="submit" variant="secondary" disabled={update.isPending || !raiseTo}>Raise the test pressure</Button>
          {test.raised && <Button type="button" variant="ghost" onClick={() => raise(null)}>Back to the minimum</Button>}
        </form>
      )}
      {update.error && !details && <div className="mt-2"><Notice tone="refusal" title="The test pressure was not changed">{update.error.message}</Notice></div>}
    </Card>
  );
}
