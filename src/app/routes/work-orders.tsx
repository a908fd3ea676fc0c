import { useMemo } from 'react';
import { useQuery } from '@tanstack/react-query';
import { useSearchParams, type LoaderFunctionArgs } from 'react-router-dom';
import { queryClient } from '@/lib/query-client';
import { authQueries } from '@/lib/auth';
import { may } from '@shared/permissions';
import { workOrderQueries } from '@/features/work-orders/api';
import { filtersFromSearch, filtersToSearch, hasActiveFilters, type WorkOrderFilters } from '@/features/work-orders/filters';
import { WorkOrdersTable } from '@/features/work-orders/components/work-orders-table';
import { WorkOrderFilterBar } from '@/features/work-orders/components/work-order-filters';
import { StateLegend } from '@/features/work-orders/components/state-mark';
import { lineQueries } from '@/features/lines/api';
import { filtersFromSearch as lineFiltersFromSearch } from '@/features/lines/filters';
import { Button, ButtonLink } from '@/components/ui/button';
import { PageHeader } from '@/components/ui/card';
import { Notice } from '@/components/ui/notice';
import { Pager } from '@/components/ui/pager';
import { revalidateOnOtherPagesOnly } from '@/lib/loaders';

export async function loader({ request }: LoaderFunctionArgs) {
  await queryClient.ensureQueryData(workOrderQueries.list(filtersFromSearch(new URL(request.url).searchParams)));
  return null;
}

export const shouldRevalidate = revalidateOnOtherPagesOnly;

const PAGE_SIZES = [25, 50, 100];
/** The register's areas, for the area filter: one line is enough to bring the facets. */
const AREA_FACETS = lineFiltersFromSearch(new URLSearchParams('pageSize=1'));

export default function WorkOrdersPage() {
  const [params, setParams] = useSearchParams();
  const filters = useMemo(() => filtersFromSearch(params), [params]);
  const { data, error, isPlaceholderData, isFetching } = useQuery(workOrderQueries.list(filters));
  const { data: lines } = useQuery(lineQueries.list(AREA_FACETS));
  const { data: me } = useQuery(authQueries.me());
  const mayPlan = may(me, 'workOrders.plan');
  const isFitter = !!me?.roles.includes('fitter');

  const update = (patch: Partial<WorkOrderFilters>, replace = false) => setParams(filtersToSearch({ ...filters, ...patch, page: patch.page ?? 1 }), { replace });
  const onSort = (sort: WorkOrderFilters['sort']) => update({ sort, dir: filters.sort === sort && filters.dir === 'asc' ? 'desc' : 'asc' });
  const filtered = hasActiveFilters(filters);

  return (
    <>
      <PageHeader
        title="Work orders"
        subtitle={data ? `${data.total} ${data.total === 1 ? 'order' : 'orders'}${filtered ? (data.total === 1 ? ' matches' : ' match') : ' in the plant'}` : 'Repairs, tie-ins and replacements'}
        actions={
          <>
            <ButtonLink to="/schedule" variant="secondary">Schedule</ButtonLink>
            {mayPlan && <ButtonLink to="/work-orders/new">New work order</ButtonLink>}
          </>
        }
      />
      <WorkOrderFilterBar filters={filters} areas={lines?.facets.areas ?? []} myId={isFitter ? me?.id : undefined} onChange={update} />
      <div className="mb-3">
        <StateLegend />
      </div>
      {error && !data && (
        <Notice tone="refusal" title="The work orders could not be loaded">
          {error.message}
        </Notice>
      )}
      {data && data.total === 0 && (
        <div className="rounded-xl border border-dashed border-ink/25 bg-paper-raised px-6 py-12 text-center">
          <p className="font-semibold">{filtered ? 'No order matches these filters' : 'No work orders yet'}</p>
          {filtered ? (
            <Button variant="ghost" className="mt-2" onClick={() => setParams(new URLSearchParams())}>Clear the filters</Button>
          ) : (
            <p className="mt-1 text-ink-soft">{mayPlan ? 'Start one from a line that needs a repair or a tie-in.' : 'A planner writes the orders; they will be listed here.'}</p>
          )}
          {!filtered && mayPlan && <ButtonLink to="/work-orders/new" className="mt-4">New work order</ButtonLink>}
        </div>
      )}
      {data && data.total > 0 && data.rows.length === 0 && (
        <Notice title="This page is past the end of the list">
          <Button variant="ghost" onClick={() => update({ page: 1 })}>Go to the first page</Button>
        </Notice>
      )}
      {data && data.rows.length > 0 && (
        <>
          <WorkOrdersTable rows={data.rows} filters={filters} onSort={onSort} dimmed={isPlaceholderData} />
          <div className="mt-3 flex flex-wrap items-center justify-between gap-3">
            <Pager page={filters.page} pageSize={filters.pageSize} total={data.total} onPage={(page) => (update({ page }), window.scrollTo({ top: 0 }))} busy={isFetching} />
            <label className="flex items-center gap-2 text-sm text-ink-soft">
              Rows per page
              <select value={filters.pageSize} onChange={(e) => update({ pageSize: Number(e.target.value) })} className="min-h-11 rounded-lg border border-ink/25 bg-paper-raised px-2">
                {PAGE_SIZES.map((n) => (
                  <option key={n}>{n}</option>
                ))}
              </select>
            </label>
          </div>
        </>
      )}
    </>
  );
}
