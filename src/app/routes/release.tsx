import { useQuery } from '@tanstack/react-query';
import { ensureOrShowRefusal } from '@/lib/loaders';
import { releaseQueries } from '@/features/release/api';
import { LineStatusBoard } from '@/features/release/components/line-status-board';
import { ReleaseQueue } from '@/features/release/components/release-queue';
import { Card, PageHeader } from '@/components/ui/card';
import { Notice } from '@/components/ui/notice';

export async function loader() {
  await Promise.all([ensureOrShowRefusal(releaseQueries.queue()), ensureOrShowRefusal(releaseQueries.lineStatus())]);
  return null;
}

const TIME = new Intl.DateTimeFormat('en-US', { timeStyle: 'medium' });

/** When the board was last read; both boards read again every 15 s on their own. */
function Freshness({ at }: { at: number }) {
  return <p className="text-xs text-ink-soft">As of {TIME.format(at)}; refreshes every 15 s</p>;
}

function QueueCard() {
  const { data, error, isPending, dataUpdatedAt } = useQuery(releaseQueries.queue());
  return (
    <Card title="Release queue" actions={data && <Freshness at={dataUpdatedAt} />}>
      {error && <Notice tone="refusal" title="The release queue could not be loaded">{error.message}</Notice>}
      {isPending && <p className="text-sm text-ink-soft">Loading the queue…</p>}
      {data && (data.orders.length ? <ReleaseQueue orders={data.orders} /> : <p className="text-sm text-ink-soft">No order holds a line out of service.</p>)}
    </Card>
  );
}

function LinesCard() {
  const { data, error, isPending, dataUpdatedAt } = useQuery(releaseQueries.lineStatus());
  return (
    <Card title={data ? `Lines out of service (${data.lines.length})` : 'Lines out of service'} actions={data && <Freshness at={dataUpdatedAt} />}>
      {error && <Notice tone="refusal" title="The line status board could not be loaded">{error.message}</Notice>}
      {isPending && <p className="text-sm text-ink-soft">Loading the lines…</p>}
      {data && <LineStatusBoard lines={data.lines} />}
    </Card>
  );
}

/** Operations' page: what may be released now and what each other order waits for; every line out and when it can come back. */
export default function ReleasePage() {
  return (
    <>
      <PageHeader title="Release" subtitle="A line goes back into service when every lock is off, every hold has run out and the test has passed." />
      <div className="grid gap-4 lg:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
        <QueueCard />
        <LinesCard />
      </div>
    </>
  );
}
