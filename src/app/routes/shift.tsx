import { useQuery } from '@tanstack/react-query';
import { ApiRequestError } from '@/lib/api-client';
import { useFailedWrites, useOnline } from '@/lib/offline-writes';
import { FailedWriteList } from '@/components/ui/write-list';
import { PageHeader } from '@/components/ui/card';
import { Notice } from '@/components/ui/notice';
import { shiftQueries } from '@/features/shift/api';
import { ShiftOrderCard } from '@/features/shift/components/shift-order';

// Its loader is in src/app/first-screen-loaders.ts, so the shift is asked for before this chunk arrives.

export default function ShiftPage() {
  const { data: shift, error, isPending, dataUpdatedAt } = useQuery(shiftQueries.mine());
  const online = useOnline();
  const failed = useFailedWrites();
  if (error && !shift) {
    return (
      <Notice tone="refusal" title="Your shift could not be loaded">
        {error instanceof ApiRequestError ? error.message : 'Try again in a moment.'}
      </Notice>
    );
  }
  if (isPending) {
    return <p className="text-lg text-ink-soft">{!online ? 'This tablet is offline and has not kept your shift yet; it loads when the network is back.' : 'Loading your shift…'}</p>;
  }
  const joints = shift.orders.reduce((n, o) => n + o.lines.reduce((m, l) => m + l.joints.length, 0), 0);
  return (
    <div className="space-y-5">
      <PageHeader
        title="My shift"
        subtitle={`${shift.person.name} · ${joints === 1 ? '1 joint' : `${joints} joints`} on ${shift.orders.length === 1 ? '1 order' : `${shift.orders.length} orders`}`}
      />
      {!online && (
        <Notice tone="caution" title="Offline">
          Shown as this tablet last saw it, at {new Date(dataUpdatedAt).toLocaleTimeString('en-US', { hour: 'numeric', minute: '2-digit' })}. Steps you record are kept and sent when the network is back.
        </Notice>
      )}
      <FailedWriteList failed={failed} />
      {shift.orders.length === 0 ? (
        <Notice title="No joints on your shift">No joint task on an open work order is assigned to you. Your planner assigns joints on the work order.</Notice>
      ) : (
        shift.orders.map((o) => <ShiftOrderCard key={o.id} order={o} />)
      )}
    </div>
  );
}
