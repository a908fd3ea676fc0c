import { useState } from 'react';
import { useQuery } from '@tanstack/react-query';
import { may } from '@shared/permissions';
import type { WorkOrderDto } from '@shared/schemas/work-orders';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Notice } from '@/components/ui/notice';
import { api, ApiRequestError, saveFile } from '@/lib/api-client';
import { authQueries } from '@/lib/auth';
import { releaseQueries, useCloseOrder } from '@/features/release/api';

/** A released order's record: what it still lacks, the planner's close, and the PDF. */
export function RecordCard({ order }: { order: WorkOrderDto }) {
  const { data: me } = useQuery(authQueries.me());
  const shown = order.state === 'released' || order.state === 'closed';
  const gaps = useQuery({ ...releaseQueries.recordGaps(order.id), enabled: shown && order.state === 'released' });
  const close = useCloseOrder(order.id);
  const [pdfError, setPdfError] = useState<string | null>(null);
  const [fetching, setFetching] = useState(false);
  if (!shown) return null;

  async function downloadRecord() {
    setPdfError(null);
    setFetching(true);
    try {
      const { blob, filename } = await api.download(`/api/work-orders/${order.id}/record.pdf`);
      saveFile(blob, filename ?? `${order.number}-record.pdf`);
    } catch (err) {
      setPdfError(err instanceof ApiRequestError ? err.message : 'The record could not be fetched.');
    } finally {
      setFetching(false);
    }
  }

  const missing = gaps.data?.gaps ?? [];
  return (
    <Card title="The record">
      <div className="space-y-3 text-sm">
        {order.state === 'closed' ? (
          <p>The order is closed: its record is complete and does not change.</p>
        ) : missing.length ? (
          <Notice tone="caution" title="Before the order can be closed">
            <ul className="list-disc pl-5">{missing.map((g) => <li key={g}>{g}</li>)}</ul>
          </Notice>
        ) : gaps.isSuccess ? (
          <p>Every step, photo and the passed test are on record.</p>
        ) : null}
        <div className="flex flex-wrap gap-2">
          <Button size="lg" variant="secondary" onClick={() => void downloadRecord()} disabled={fetching}>
            {fetching ? 'Preparing the PDF…' : 'Download the record (PDF)'}
          </Button>
          {order.state === 'released' && may(me, 'workOrders.close') && (
            <Button size="lg" onClick={() => close.mutate()} disabled={close.isPending || missing.length > 0 || !gaps.isSuccess}>
              Close the order
            </Button>
          )}
        </div>
        {close.error && <Notice tone="refusal" title="Not closed">{close.error.message}</Notice>}
        {pdfError && <Notice tone="refusal" title="No PDF">{pdfError}</Notice>}
      </div>
    </Card>
  );
}
