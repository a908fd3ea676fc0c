import { useMemo } from 'react';
import { useQuery } from '@tanstack/react-query';
import { Link, useSearchParams, type LoaderFunctionArgs } from 'react-router-dom';
import { queryClient } from '@/lib/query-client';
import { workOrderQueries } from '@/features/work-orders/api';
import { ScheduleChart } from '@/features/work-orders/components/schedule-chart';
import { StateLegend } from '@/features/work-orders/components/state-mark';
import { addDays, dayKey, weekStart } from '@/features/work-orders/local-time';
import { lineQueries } from '@/features/lines/api';
import { filtersFromSearch as lineFiltersFromSearch } from '@/features/lines/filters';
import { Button } from '@/components/ui/button';
import { PageHeader } from '@/components/ui/card';
import { Select } from '@/components/ui/field';
import { Notice } from '@/components/ui/notice';
import { revalidateOnOtherPagesOnly } from '@/lib/loaders';

/** The week in the address bar (`?week=2027-03-01`, any day of it; this week without it) and an area. */
function viewOf(params: URLSearchParams) {
  const raw = params.get('week');
  const parsed = raw && /^\d{4}-\d{2}-\d{2}$/.test(raw) ? new Date(`${raw}T00:00`) : new Date();
  const start = weekStart(Number.isNaN(parsed.getTime()) ? new Date() : parsed);
  const area = params.get('area') || undefined;
  return { start, query: { from: start.toISOString(), to: addDays(start, 7).toISOString(), ...(area ? { area } : {}) }, area };
}

export async function loader({ request }: LoaderFunctionArgs) {
  await queryClient.ensureQueryData(workOrderQueries.schedule(viewOf(new URL(request.url).searchParams).query));
  return null;
}
export const shouldRevalidate = revalidateOnOtherPagesOnly;

/** "WO-2026-0008 on point HV-1 and line SA-001": one phrase per other order. */
function overlapWords(overlaps: { number: string; on: string; what: string }[]): string {
  const by = new Map<string, string[]>();
  for (const x of overlaps) by.set(x.number, [...(by.get(x.number) ?? []), `${x.on === 'line' ? 'line' : 'point'} ${x.what}`]);
  return [...by].map(([n, on]) => `${n} on ${on.join(' and ')}`).join('; ');
}

const AREA_FACETS = lineFiltersFromSearch(new URLSearchParams('pageSize=1'));
const RANGE = new Intl.DateTimeFormat('en-US', { month: 'short', day: 'numeric', year: 'numeric' });

export default function SchedulePage() {
  const [params, setParams] = useSearchParams();
  const view = useMemo(() => viewOf(params), [params]);
  const { data, error, isPlaceholderData } = useQuery(workOrderQueries.schedule(view.query));
  const { data: lines } = useQuery(lineQueries.list(AREA_FACETS));
  const go = (patch: { week?: string; area?: string }) => {
    const next = new URLSearchParams(params);
    for (const [k, v] of Object.entries(patch)) if (v) next.set(k, v); else next.delete(k);
    setParams(next);
  };
  const overlapping = data?.orders.filter((o) => o.overlaps.length) ?? [];

  return (
    <>
      <PageHeader
        title="Schedule"
        subtitle={`Repair windows, week of ${RANGE.format(view.start)}`}
        actions={
          <>
            <Button variant="secondary" onClick={() => go({ week: dayKey(addDays(view.start, -7)) })}>← Previous week</Button>
            <Button variant="secondary" onClick={() => go({ week: undefined })}>This week</Button>
            <Button variant="secondary" onClick={() => go({ week: dayKey(addDays(view.start, 7)) })}>Next week →</Button>
          </>
        }
      />
      <div className="mb-4 flex flex-wrap items-end gap-3">
        <label className="w-48">
          <span className="mb-1 block text-sm font-medium text-ink-soft">Week of</span>
          <input type="date" value={dayKey(view.start)} onChange={(e) => go({ week: e.target.value || undefined })} className="min-h-11 w-full rounded-lg border border-ink/25 bg-paper-raised px-3 py-2 text-base" />
        </label>
        <label className="w-64">
          <span className="mb-1 block text-sm font-medium text-ink-soft">Area</span>
          <Select value={view.area ?? ''} onChange={(e) => go({ area: e.target.value || undefined })}>
            <option value="">Every area</option>
            {(lines?.facets.areas ?? []).map((a) => <option key={a} value={a}>{a}</option>)}
          </Select>
        </label>
      </div>
      {error && !data && <Notice tone="refusal" title="The schedule could not be loaded">{error.message}</Notice>}
      {overlapping.length > 0 && (
        <div className="mb-3">
          <Notice tone="caution" title="Windows that overlap on the same line or isolation point">
            <ul>
              {overlapping.map((o) => (
                <li key={o.id}>
                  <Link to={`/work-orders/${o.id}`} className="font-semibold text-tide underline">{o.number}</Link> overlaps{' '}
                  {overlapWords(o.overlaps)}
                </li>
              ))}
            </ul>
          </Notice>
        </div>
      )}
      {data && <div className={isPlaceholderData ? 'opacity-60' : ''}><ScheduleChart schedule={data} weekStart={view.start} /></div>}
      <div className="mt-3"><StateLegend open /></div>
      <p className="mt-2 text-xs text-ink-faint">Times in your time zone ({Intl.DateTimeFormat().resolvedOptions().timeZone}). A bar marked “!” with a brick outline shares its line or an isolation point with another order in the same hours.</p>
    </>
  );
}
