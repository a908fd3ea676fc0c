import { useQuery } from '@tanstack/react-query';
import { Link, useLocation, useParams, type LoaderFunctionArgs } from 'react-router-dom';
import { ApiRequestError } from '@/lib/api-client';
import { ensureOrShowRefusal } from '@/lib/loaders';
import { lineQueries } from '@/features/lines/api';
import { LineStatusMark } from '@/features/lines/components/line-status';
import { ChemicalServiceCaution, LineFacts } from '@/features/lines/components/line-facts';
import { IsolationPointsTable } from '@/features/lines/components/isolation-points-table';
import { workOrderQueries } from '@/features/work-orders/api';
import { LineOrdersList } from '@/features/work-orders/components/line-orders-list';
import { authQueries } from '@/lib/auth';
import { may } from '@shared/permissions';
import { Card, PageHeader } from '@/components/ui/card';
import { Notice } from '@/components/ui/notice';

// A line that is not in the register is shown inside the page, not as a broken page.
export const loader = ({ params }: LoaderFunctionArgs) => ensureOrShowRefusal(lineQueries.detail(params.lineNumber!));

export default function LineDetailPage() {
  const { lineNumber } = useParams() as { lineNumber: string };
  const { state } = useLocation() as { state?: { registerSearch?: string } };
  const back = `/lines${state?.registerSearch ?? ''}`;
  const { data: line, error, isPending } = useQuery(lineQueries.detail(lineNumber));
  const { data: me } = useQuery(authQueries.me());
  const orders = useQuery({ ...workOrderQueries.list({ line: [lineNumber], sort: 'windowStart', dir: 'desc', pageSize: 20 }), enabled: may(me, 'workOrders.read') });

  const backLink = (
    <Link to={back} className="inline-flex min-h-11 items-center font-medium text-tide hover:underline">
      ← Line register
    </Link>
  );
  if (error) {
    return (
      <div className="max-w-2xl space-y-3">
        {backLink}
        {error instanceof ApiRequestError && error.status === 404 ? (
          <Notice tone="refusal" title={error.message}>
            Check the line number, or find the line by searching the register.
          </Notice>
        ) : (
          <Notice tone="refusal" title="This line could not be loaded">
            {error.message}
          </Notice>
        )}
      </div>
    );
  }
  if (isPending) return <p className="text-ink-soft">Loading line {lineNumber}…</p>;

  return (
    <>
      {backLink}
      <PageHeader
        title={line.lineNumber}
        subtitle={`${line.service} · ${line.area}`}
        actions={
          <span className="inline-flex min-h-11 items-center rounded-lg border border-ink/10 bg-paper-raised px-3">
            <LineStatusMark status={line.status} />
          </span>
        }
      />
      <div className="grid gap-4 lg:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
        <div className="space-y-4">
          <Card title="Line">
            <LineFacts line={line} />
          </Card>
          <Card title={`Isolation points (${line.isolationPoints.length})`}>
            <IsolationPointsTable points={line.isolationPoints} />
          </Card>
        </div>
        <div className="space-y-4">
          <ChemicalServiceCaution service={line.service} />
          <Card title="Notes">
            {line.notes ? <p className="whitespace-pre-line text-sm">{line.notes}</p> : <p className="text-sm text-ink-faint">No notes.</p>}
          </Card>
          <Card title={orders.data ? `Work orders (${orders.data.total})` : 'Work orders'}>
            {orders.error && <Notice tone="refusal" title="The line's work orders could not be loaded">{orders.error.message}</Notice>}
            {orders.data && orders.data.total === 0 && <p className="text-sm text-ink-soft">No work orders on this line yet. Repairs and tie-ins planned on it will be listed here.</p>}
            {orders.data && orders.data.total > 0 && <LineOrdersList rows={orders.data.rows} />}
            {orders.data && orders.data.total > orders.data.rows.length && (
              <Link to={`/work-orders?line=${encodeURIComponent(lineNumber)}`} className="inline-flex min-h-11 items-center font-medium text-tide hover:underline">All {orders.data.total} orders on this line</Link>
            )}
          </Card>
        </div>
      </div>
    </>
  );
}
