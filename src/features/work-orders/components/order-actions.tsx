import { useState } from 'react';
import type { WorkOrderDto } from '@shared/schemas/work-orders';
import { ApiRequestError } from '@/lib/api-client';
import { Button, ButtonLink } from '@/components/ui/button';
import { Field } from '@/components/ui/field';
import { Notice } from '@/components/ui/notice';
import { useCancelOrder, usePlanOrder } from '@/features/work-orders/api';

const textarea = 'min-h-11 w-full rounded-lg border border-ink/25 bg-paper-raised px-3 py-2 text-base focus:border-tide';
type Open = null | 'plan' | 'cancel';

/** Edit, submit the plan (with a reason when it does not fit), cancel with a reason: offered by permission and state. */
export function OrderActions({ order, mayPlan }: { order: WorkOrderDto; mayPlan: boolean }) {
  const [open, setOpen] = useState<Open>(null);
  const editable = order.state === 'draft' || order.state === 'planned';
  if (!mayPlan || !editable) return null;
  return (
    <div className="space-y-3">
      <div className="flex flex-wrap gap-2">
        <ButtonLink to={`/work-orders/${order.id}/edit`} variant="secondary">Edit the order</ButtonLink>
        {order.state === 'draft' && <Button onClick={() => setOpen('plan')} aria-expanded={open === 'plan'}>Submit the plan</Button>}
        <Button variant="secondary" onClick={() => setOpen('cancel')} aria-expanded={open === 'cancel'}>Cancel the order</Button>
      </div>
      {open === 'plan' && <SubmitPlan order={order} onClose={() => setOpen(null)} />}
      {open === 'cancel' && <CancelOrder order={order} onClose={() => setOpen(null)} />}
    </div>
  );
}

function SubmitPlan({ order, onClose }: { order: WorkOrderDto; onClose: () => void }) {
  const plan = usePlanOrder(order.id);
  const [reason, setReason] = useState('');
  const late = order.windowPlan.fits === false;
  const err = plan.error instanceof ApiRequestError ? plan.error : null;
  return (
    <form className="space-y-3 rounded-lg border border-ink/15 bg-paper p-3" onSubmit={(e) => (e.preventDefault(), plan.mutate(late ? { lateReason: reason } : {}, { onSuccess: onClose }))}>
      {late ? (
        <Field label="The plan does not fit its window: why plan it anyway? Operations and the requester are told by e-mail." error={err?.details?.lateReason?.join(' ')}>
          <textarea className={textarea} rows={2} value={reason} onChange={(e) => setReason(e.target.value)} required />
        </Field>
      ) : (
        <p className="text-sm">Submitting books the order as planned with its joints, isolation plan and window.</p>
      )}
      {plan.error && (
        <Notice tone="refusal" title="The plan was not submitted">
          {err?.details?.plan ? <ul className="list-disc pl-5">{err.details.plan.map((m) => <li key={m}>{m}</li>)}</ul> : plan.error.message}
        </Notice>
      )}
      <div className="flex gap-2">
        <Button type="submit" disabled={plan.isPending || (late && !reason.trim())}>{late ? 'Plan it late, with this reason' : 'Plan the order'}</Button>
        <Button type="button" variant="secondary" onClick={onClose}>Not now</Button>
      </div>
    </form>
  );
}

function CancelOrder({ order, onClose }: { order: WorkOrderDto; onClose: () => void }) {
  const cancel = useCancelOrder(order.id);
  const [reason, setReason] = useState('');
  return (
    <form className="space-y-3 rounded-lg border border-refuse/30 bg-refuse-light/40 p-3" onSubmit={(e) => (e.preventDefault(), cancel.mutate({ reason }, { onSuccess: onClose }))}>
      <Field label={`Why is ${order.number} cancelled?`}>
        <textarea className={textarea} rows={2} value={reason} onChange={(e) => setReason(e.target.value)} required />
      </Field>
      {cancel.error && <Notice tone="refusal" title="The order was not cancelled">{cancel.error.message}</Notice>}
      <div className="flex gap-2">
        <Button type="submit" variant="danger" disabled={cancel.isPending || !reason.trim()}>Cancel it, with this reason</Button>
        <Button type="button" variant="secondary" onClick={onClose}>Keep it</Button>
      </div>
    </form>
  );
}
