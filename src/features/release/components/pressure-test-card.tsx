import { useState } from 'react';
import { useQuery } from '@tanstack/react-query';
import { may, whoMay } from '@shared/permissions';
import type { PressureTestDto } from '@shared/schemas/release';
import type { WorkOrderDto } from '@shared/schemas/work-orders';
import { authQueries } from '@/lib/auth';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Notice } from '@/components/ui/notice';
import { releaseQueries } from '@/features/release/api';
import { PressureTestForm } from '@/features/release/components/pressure-test-form';
import { PressureTestList } from '@/features/release/components/pressure-test-list';
import { StepCautions } from '@/features/release/components/step-cautions';

/** States in which the test belongs on the order's page even before one is recorded. */
const TEST_STATES: readonly string[] = ['testing', 'ready', 'released', 'closed'];

function Recorded({ test }: { test: PressureTestDto }) {
  if (test.result === 'passed') {
    return <Notice tone="success" title="Recorded as passed">The order is ready for release: operations signs the release checklist to put its lines back into service.</Notice>;
  }
  return (
    <Notice tone="caution" title="Recorded as failed">
      {test.leakingJoints.map((j) => j.label).join(', ')} {test.leakingJoints.length === 1 ? 'is' : 'are'} cut out for redo and the order is back in work.
      Locks go back on and zero energy is verified again before anyone touches the line.
    </Notice>
  );
}

/**
 * The order's hydrostatic tests, and for a witness while the order is testing, the form to record one.
 * Shown for an order being tested or past it, or any order with a test on record.
 */
export function PressureTestCard({ order }: { order: WorkOrderDto }) {
  const { data: me } = useQuery(authQueries.me());
  const { data: tests, error, isPending } = useQuery(releaseQueries.tests(order.id));
  const [open, setOpen] = useState(false);
  const [recorded, setRecorded] = useState<PressureTestDto | null>(null);
  const tp = order.testPressure;
  if (!TEST_STATES.includes(order.state) && !tests?.length && !recorded) return null;

  const testing = order.state === 'testing';
  const mayWitness = may(me, 'tests.witness');
  const canRecord = testing && mayWitness && tp.required && tp.testPsi !== null;
  return (
    <Card title="Hydrostatic test">
      <div className="space-y-4">
        {recorded && <Recorded test={recorded} />}
        {!tp.required && <p className="text-sm">No hydrostatic test: no line of this order is on pressure service.</p>}
        {error && <Notice tone="refusal" title="The recorded tests could not be loaded">{error.message}</Notice>}
        {isPending && <p className="text-sm text-ink-soft">Loading the recorded tests…</p>}
        {tests && (tests.length ? <PressureTestList tests={tests} /> : tp.required && <p className="text-sm text-ink-soft">No test is recorded yet.</p>)}
        {testing && tp.required && tp.testPsi === null && (
          <Notice tone="refusal" title="The test pressure cannot be worked out">{tp.problems.join(' ')}</Notice>
        )}
        {testing && tp.required && <StepCautions step="pressure-test" title="Before and during the test" />}
        {testing && tp.required && !mayWitness && <p className="text-sm text-ink-soft">The test is witnessed and recorded by {whoMay('tests.witness')}.</p>}
        {canRecord && !open && (
          <Button size="lg" onClick={() => { setOpen(true); setRecorded(null); }}>Record the test</Button>
        )}
        {canRecord && open && (
          <div className="space-y-3 border-t border-ink/10 pt-4">
            <PressureTestForm order={order} onRecorded={(t) => { setRecorded(t); setOpen(false); }} />
            <Button variant="ghost" size="lg" onClick={() => setOpen(false)}>Close the form</Button>
          </div>
        )}
      </div>
    </Card>
  );
}
