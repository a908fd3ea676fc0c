import { useState } from 'react';
import { useQuery } from '@tanstack/react-query';
import { useNavigate } from 'react-router-dom';
import { authQueries } from '@/lib/auth';
import { useDebouncedValue } from '@/lib/use-debounced-value';
import { may, refusalFor } from '@shared/permissions';
import { lineQueries } from '@/features/lines/api';
import { filtersFromSearch as lineFiltersFromSearch } from '@/features/lines/filters';
import { useCreateOrder } from '@/features/work-orders/api';
import { OrderForm, type LineSearch } from '@/features/work-orders/components/order-form';
import { PageHeader } from '@/components/ui/card';
import { Notice } from '@/components/ui/notice';

/** The register's search for the line picker (GET /api/lines?search=), settled while typing. */
export function useLineSearch(): LineSearch {
  const [query, setQuery] = useState('');
  const settled = useDebouncedValue(query.trim(), 250);
  const { data, isFetching } = useQuery({
    ...lineQueries.list(lineFiltersFromSearch(new URLSearchParams({ search: settled, pageSize: '25' }))),
    enabled: settled.length > 0,
  });
  return { query, onQuery: setQuery, options: settled ? (data?.rows ?? []) : [], searching: isFetching || settled !== query.trim() };
}

export default function NewWorkOrderPage() {
  const navigate = useNavigate();
  const { data: me } = useQuery(authQueries.me());
  const create = useCreateOrder();
  const lineSearch = useLineSearch();
  if (!may(me, 'workOrders.plan')) {
    return (
      <div className="max-w-2xl">
        <PageHeader title="New work order" />
        <Notice tone="refusal" title="Writing work orders is for planners and supervisors">{refusalFor('workOrders.plan', me?.roles ?? [])}</Notice>
      </div>
    );
  }
  return (
    <div className="max-w-3xl">
      <PageHeader title="New work order" subtitle="Scope, lines, window and cure conditions; joints and the isolation plan follow on the order’s page." />
      <div className="rounded-xl border border-ink/10 bg-paper-raised p-5 shadow-sm">
        <OrderForm
          lineSearch={lineSearch}
          submitLabel="Create the order"
          busy={create.isPending}
          error={create.error}
          onSubmit={async (body) => {
            const order = await create.mutateAsync(body);
            navigate(`/work-orders/${order.id}`);
          }}
          onCancel={() => navigate('/work-orders')}
        />
      </div>
    </div>
  );
}
