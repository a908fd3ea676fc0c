import { useQuery } from '@tanstack/react-query';
import { Link, useLocation, useParams, type LoaderFunctionArgs } from 'react-router-dom';
import { authQueries } from '@/lib/auth';
import { ApiRequestError } from '@/lib/api-client';
import { ensureOrShowRefusal } from '@/lib/loaders';
import { may } from '@shared/permissions';
import { PRIORITY_LABELS, WORK_ORDER_KIND_LABELS } from '@shared/schemas/work-orders';
import { workOrderQueries } from '@/features/work-orders/api';
import { StateMark } from '@/features/work-orders/components/state-mark';
import { OrderSummary } from '@/features/work-orders/components/order-summary';
import { OrderActions } from '@/features/work-orders/components/order-actions';
import { OverlapsNotice } from '@/features/work-orders/components/overlaps-notice';
import { JointTasksCard } from '@/features/work-orders/components/joint-tasks-card';
import { IsolationPlanCard } from '@/features/work-orders/components/isolation-plan-card';
import { WindowPlanCard, WindowPlanLine } from '@/features/work-orders/components/window-plan-card';
import { MaterialsCard } from '@/features/work-orders/components/materials-card';
import { TestPressureCard } from '@/features/work-orders/components/test-pressure-card';
import { HistoryList } from '@/features/work-orders/components/history-list';
import { HoldsCard } from '@/features/work-orders/components/holds-card';
import { PressureTestCard } from '@/features/release/components/pressure-test-card';
import { ReleaseCard } from '@/features/release/components/release-card';
import { RecordCard } from '@/features/release/components/record-card';
import { TemperatureLogCard } from '@/features/release/components/temperature-log-card';
import { ChemicalCaution } from '@/features/work-orders/components/chemical-caution';
import { lockoutQueries } from '@/features/lockout/api';
import { showsLockBoard } from '@/features/lockout/board';
import { LockBoardCard } from '@/features/lockout/components/lock-board-card';
import { queryClient } from '@/lib/query-client';
import { Card, PageHeader } from '@/components/ui/card';
import { Notice } from '@/components/ui/notice';

export async function loader({ params }: LoaderFunctionArgs) {
  await ensureOrShowRefusal(workOrderQueries.detail(params.id!));
  // The lock board loads beside the order, and never fails the page: its card shows its own error.
  const order = queryClient.getQueryData(workOrderQueries.detail(params.id!).queryKey);
  if (order && showsLockBoard(order.state)) await queryClient.prefetchQuery(lockoutQueries.board(order.id));
  return null;
}

export default function WorkOrderPage() {
  const { id } = useParams() as { id: string };
  const { state } = useLocation() as { state?: { listSearch?: string } };
  const { data: order, error, isPending } = useQuery(workOrderQueries.detail(id));
  const { data: me } = useQuery(authQueries.me());
  const backLink = (
    <Link to={`/work-orders${state?.listSearch ?? ''}`} className="inline-flex min-h-11 items-center font-medium text-tide hover:underline">
      ← Work orders
    </Link>
  );
  if (error) {
    return (
      <div className="max-w-2xl space-y-3">
        {backLink}
        <Notice tone="refusal" title={error instanceof ApiRequestError && error.status === 404 ? error.message : 'This work order could not be loaded'}>
          {error instanceof ApiRequestError && error.status === 404 ? 'Find the order in the list of work orders.' : error.message}
        </Notice>
      </div>
    );
  }
  if (isPending) return <p className="text-ink-soft">Loading the work order…</p>;

  const mayPlan = may(me, 'workOrders.plan');
  const mayEdit = mayPlan && (order.state === 'draft' || order.state === 'planned');
  return (
    <>
      {backLink}
      <PageHeader
        title={<span className="flex flex-wrap items-center gap-3">{order.number}<StateMark state={order.state} /></span>}
        subtitle={`${WORK_ORDER_KIND_LABELS[order.kind]} · ${PRIORITY_LABELS[order.priority]} · ${order.lines.map((l) => l.lineNumber).join(', ')}`}
      />
      <div className="mb-4 space-y-3">
        {order.state !== 'cancelled' && <WindowPlanLine plan={order.windowPlan} />}
        <OrderActions order={order} mayPlan={mayPlan} />
        {order.state === 'planned' && mayEdit && <p className="text-sm text-ink-soft">A change to joints, isolation or the order takes it back to draft; submit the plan again after.</p>}
        <OverlapsNotice overlaps={order.overlaps} />
      </div>
      <div className="grid gap-4 lg:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
        <div className="space-y-4">
          <Card title="Scope and lines"><OrderSummary order={order} /></Card>
          {showsLockBoard(order.state) && <LockBoardCard orderId={order.id} />}
          <HoldsCard holds={order.holds} tasks={order.jointTasks} />
          <TemperatureLogCard order={order} />
          <WindowPlanCard plan={order.windowPlan} />
          <JointTasksCard orderId={order.id} lines={order.lines} tasks={order.jointTasks} mayEdit={mayEdit} />
          <IsolationPlanCard orderId={order.id} lines={order.lines} entries={order.isolationPlan} mayEdit={mayEdit} />
        </div>
        <div className="space-y-4">
          <ChemicalCaution services={order.lines.map((l) => l.service)} />
          <MaterialsCard materials={order.materials} />
          <TestPressureCard orderId={order.id} version={order.version} test={order.testPressure} mayEdit={mayEdit} />
          <PressureTestCard order={order} />
          <ReleaseCard order={order} />
          <RecordCard order={order} />
          <Card title="History"><HistoryList history={order.history} /></Card>
        </div>
      </div>
    </>
  );
}
