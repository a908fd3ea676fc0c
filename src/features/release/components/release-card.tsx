import { useState } from 'react';
import { useQuery } from '@tanstack/react-query';
import { may, whoMay } from '@shared/permissions';
import type { WorkOrderDto } from '@shared/schemas/work-orders';
import { authQueries } from '@/lib/auth';
import { Card } from '@/components/ui/card';
import { Notice } from '@/components/ui/notice';
import { formatDateTime } from '@/lib/format';
import { useNow } from '@/lib/use-now';
import { releaseQueries, type ReleaseResultDto } from '@/features/release/api';
import { releaseRecord } from '@/features/release/test-form';
import { BlockerList } from '@/features/release/components/blocker-list';
import { ReleaseChecklist } from '@/features/release/components/release-checklist';
import { StepCautions } from '@/features/release/components/step-cautions';

/** States in which the order holds its lines out and the page shows what stands between them and service. */
const CHECK_STATES: readonly string[] = ['isolated', 'in-work', 'curing', 'testing', 'ready'];
const DONE_STATES: readonly string[] = ['released', 'closed'];

/** Who released the order and when, and which of its lines are back in service. */
function Released({ order, just }: { order: WorkOrderDto; just: ReleaseResultDto | null }) {
  const { data: me } = useQuery(authQueries.me());
  const rec = releaseRecord(order.history) ?? (just?.releasedAt ? { by: me?.name ?? 'you', at: just.releasedAt, notes: null } : null);
  const out = order.lines.filter((l) => l.status !== 'in-service');
  // Until the order is read again, its lines still show the status from before the release.
  const fresh = DONE_STATES.includes(order.state);
  return (
    <div className="space-y-2 text-sm">
      <Notice tone="success" title={rec ? `Released by ${rec.by}, ${formatDateTime(rec.at)}` : 'Released'}>
        {!fresh
          ? 'Its lines go back into service, except any line another open order still holds out.'
          : out.length === 0
            ? `${order.lines.length === 1 ? 'Its line is' : 'Its lines are'} back in service.`
            : `Back in service except ${out.map((l) => l.lineNumber).join(', ')}, which another open order still holds out.`}
      </Notice>
      {rec?.notes && <p><span className="text-ink-soft">Notes: </span>{rec.notes}</p>}
    </div>
  );
}

function Check({ order }: { order: WorkOrderDto }) {
  const now = useNow(1000);
  const { data: me } = useQuery(authQueries.me());
  const { data: check, error, isPending } = useQuery(releaseQueries.check(order.id));
  const [just, setJust] = useState<ReleaseResultDto | null>(null);
  if (just) return <Released order={order} just={just} />;
  if (error) return <Notice tone="refusal" title="The release check could not be loaded">{error.message}</Notice>;
  if (isPending) return <p className="text-sm text-ink-soft">Checking what stands in the way…</p>;
  const mayRelease = may(me, 'lines.release');
  // The checklist belongs to the last steps; before the test it would only be a row of closed boxes.
  const nearly = order.state === 'testing' || order.state === 'ready' || check.ready;
  return (
    <div className="space-y-4">
      {check.ready ? (
        <Notice tone="success" title="Ready to release">Every lock is off, no hold runs and the test passed.</Notice>
      ) : (
        <div>
          <p className="mb-2 text-sm font-semibold">Not yet: {check.blockers.length === 1 ? 'one thing stands' : `${check.blockers.length} things stand`} in the way</p>
          <BlockerList blockers={check.blockers} now={now} />
        </div>
      )}
      {nearly && <StepCautions step="release" title="Before the release" />}
      {nearly && mayRelease && <ReleaseChecklist orderId={order.id} ready={check.ready} lineCount={order.lines.length} onReleased={setJust} />}
      {nearly && !mayRelease && <p className="text-sm text-ink-soft">The lines are released by {whoMay('lines.release')}.</p>}
    </div>
  );
}

/** What stands between the order's lines and service, operations' release checklist, and after it who released them. */
export function ReleaseCard({ order }: { order: WorkOrderDto }) {
  if (DONE_STATES.includes(order.state)) return <Card title="Release"><Released order={order} just={null} /></Card>;
  if (!CHECK_STATES.includes(order.state)) return null;
  return <Card title="Release"><Check order={order} /></Card>;
}
