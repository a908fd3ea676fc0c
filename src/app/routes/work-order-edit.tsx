import { useQuery } from '@tanstack/react-query';
import { Link, useNavigate, useParams, type LoaderFunctionArgs } from 'react-router-dom';
import { authQueries } from '@/lib/auth';
import { ensureOrShowRefusal } from '@/lib/loaders';
import { may, refusalFor } from '@shared/permissions';
import { useUpdateOrder, workOrderQueries } from '@/features/work-orders/api';
import { OrderForm } from '@/features/work-orders/components/order-form';
import { PageHeader } from '@/components/ui/card';
import { Notice } from '@/components/ui/notice';
import { useLineSearch } from '@/app/routes/work-order-new';

export const loader = ({ params }: LoaderFunctionArgs) => ensureOrShowRefusal(workOrderQueries.detail(params.id!));

const EDITABLE = ['draft', 'planned'];

export default function EditWorkOrderPage() {
  const { id } = useParams() as { id: string };
  const navigate = useNavigate();
  const { data: me } = useQuery(authQueries.me());
  const { data: order, error } = useQuery(workOrderQueries.detail(id));
  const update = useUpdateOrder(id);
  const lineSearch = useLineSearch();
  const back = (
    <Link to={`/work-orders/${id}`} className="inline-flex min-h-11 items-center font-medium text-tide hover:underline">
      ← {order?.number ?? 'The order'}
    </Link>
  );
  if (error) return <div className="max-w-2xl space-y-3">{back}<Notice tone="refusal" title="This order could not be loaded">{error.message}</Notice></div>;
  if (!order) return <p className="text-ink-soft">Loading the order…</p>;
  if (!may(me, 'workOrders.plan')) return <div className="max-w-2xl space-y-3">{back}<Notice tone="refusal" title="Editing orders is for planners and supervisors">{refusalFor('workOrders.plan', me?.roles ?? [])}</Notice></div>;
  if (!EDITABLE.includes(order.state)) return <div className="max-w-2xl space-y-3">{back}<Notice tone="refusal" title={`${order.number} can no longer be edited`}>Only a draft or planned order can be changed.</Notice></div>;

  return (
    <div className="max-w-3xl">
      {back}
      <PageHeader title={`Edit ${order.number}`} subtitle={order.state === 'planned' ? 'A change to a planned order takes it back to draft: submit the plan again after.' : undefined} />
      <div className="rounded-xl border border-ink/10 bg-paper-raised p-5 shadow-sm">
        <OrderForm
          initial={{
            kind: order.kind, priority: order.priority, scope: order.scope, requestedBy: order.requestedBy, lineIds: order.lines.map((l) => l.id),
            windowStart: order.windowStart, windowEnd: order.windowEnd, forecastLowF: order.forecastLowF, forecastHighRh: order.forecastHighRh,
            testPressurePsi: order.testPressurePsi, componentRatingPsi: order.componentRatingPsi,
          }}
          initialLines={order.lines}
          lineSearch={lineSearch}
          submitLabel="Save the changes"
          busy={update.isPending}
          error={update.error}
          onSubmit={async (body) => {
            await update.mutateAsync({ ...body, version: order.version });
            navigate(`/work-orders/${id}`);
          }}
          onCancel={() => navigate(`/work-orders/${id}`)}
        />
      </div>
    </div>
  );
}
