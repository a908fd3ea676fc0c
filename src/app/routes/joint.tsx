import { onlineManager, useQuery } from '@tanstack/react-query';
import { Link, useParams, type LoaderFunctionArgs } from 'react-router-dom';
import { may } from '@shared/permissions';
import { ApiRequestError } from '@/lib/api-client';
import { useMe } from '@/lib/auth';
import { ensureOrShowRefusal } from '@/lib/loaders';
import { useOnline } from '@/lib/offline-writes';
import { Notice } from '@/components/ui/notice';
import { jointTaskQueries } from '@/features/shift/api';
import { BlockerList } from '@/features/shift/components/blockers';
import { HoldsSection } from '@/features/shift/components/hold-list';
import { JointHeader } from '@/features/shift/components/joint-header';
import { JointSteps } from '@/features/shift/components/joint-steps';
import { RedoAction } from '@/features/shift/components/redo-action';

/** Offline, the joint opens from what the tablet kept; with nothing kept the page says so rather than wait. */
export const loader = ({ params }: LoaderFunctionArgs) => (onlineManager.isOnline() ? ensureOrShowRefusal(jointTaskQueries.detail(params.id!)) : null);

const backLink = (
  <Link to="/shift" className="inline-flex min-h-12 items-center text-lg font-medium text-tide hover:underline">
    ← My shift
  </Link>
);

export default function JointPage() {
  const { id } = useParams() as { id: string };
  const me = useMe();
  const online = useOnline();
  const { data: detail, error, isPending } = useQuery(jointTaskQueries.detail(id));
  if (error && !detail) {
    const notFound = error instanceof ApiRequestError && error.status >= 400 && error.status < 500;
    return (
      <div className="max-w-2xl space-y-3">
        {backLink}
        <Notice tone="refusal" title={notFound ? error.message : 'This joint could not be loaded'}>
          {notFound ? 'Open your joints from your shift.' : error.message}
        </Notice>
      </div>
    );
  }
  if (isPending) {
    return (
      <div className="space-y-3">
        {backLink}
        <p className="text-lg text-ink-soft">{online ? 'Loading the joint…' : 'This tablet is offline and has not kept this joint; it loads when the network is back.'}</p>
      </div>
    );
  }
  const stops = detail.blockers.filter((b) => b.kind !== 'hold');
  return (
    <div className="space-y-5">
      {backLink}
      <JointHeader detail={detail} />
      {!online && <Notice tone="caution" title="Offline">Shown as this tablet last saw it. Steps you record are kept here and sent, in order, when the network is back.</Notice>}
      {stops.length > 0 && <BlockerList blockers={stops} orderId={detail.workOrder.id} />}
      <HoldsSection holds={detail.holds} />
      <JointSteps detail={detail} mayRecord={may(me, 'joints.record')} />
      {may(me, 'joints.redo') && !detail.redo && detail.steps.length > 0 && <RedoAction detail={detail} />}
    </div>
  );
}
