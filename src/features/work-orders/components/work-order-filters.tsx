import { useEffect, useRef, useState } from 'react';
import { useDebouncedValue } from '@/lib/use-debounced-value';
import { CheckMenu, type CheckOption } from '@/components/ui/check-menu';
import { PRIORITIES, PRIORITY_LABELS, WORK_ORDER_STATES, WORK_ORDER_STATE_LABELS } from '@shared/schemas/work-orders';
import { hasActiveFilters, NO_FILTERS, type WorkOrderFilters } from '@/features/work-orders/filters';
import { formatDate } from '@/lib/format';
import { dayInputToIso, isoToDayInput } from '@/features/work-orders/local-time';

type Change = (patch: Partial<WorkOrderFilters>, replace?: boolean) => void;
const STATE_OPTIONS: CheckOption[] = WORK_ORDER_STATES.map((s) => ({ value: s, label: WORK_ORDER_STATE_LABELS[s] }));
const PRIORITY_OPTIONS: CheckOption[] = PRIORITIES.map((p) => ({ value: p, label: PRIORITY_LABELS[p] }));
const input = 'min-h-11 w-full rounded-lg border border-ink/25 bg-paper-raised px-3 py-2 text-base focus:border-tide';

/** A text box whose settled value goes to the address bar, and which follows the address bar back. */
function useSettledText(fromUrl: string, push: (value: string) => void) {
  const [text, setText] = useState(fromUrl);
  const settled = useDebouncedValue(text.trim(), 300);
  const agreed = useRef(fromUrl);
  useEffect(() => {
    if (settled === agreed.current) return;
    agreed.current = settled;
    push(settled);
    // eslint-disable-next-line react-hooks/exhaustive-deps -- only a settled change of the text should push
  }, [settled]);
  useEffect(() => {
    if (fromUrl === agreed.current) return;
    agreed.current = fromUrl;
    setText(fromUrl);
  }, [fromUrl]);
  return [text, setText] as const;
}

export function WorkOrderFilterBar({ filters, areas, myId, onChange }: { filters: WorkOrderFilters; areas: string[]; myId?: string; onChange: Change }) {
  const [search, setSearch] = useSettledText(filters.search ?? '', (v) => onChange({ search: v || undefined }, true));
  const [line, setLine] = useSettledText(filters.line?.[0] ?? '', (v) => onChange({ line: v ? [v] : undefined }, true));
  const chips = [
    ...(filters.search ? [{ label: `number contains “${filters.search}”`, patch: { search: undefined } }] : []),
    ...(filters.state ?? []).map((s) => ({ label: `State: ${WORK_ORDER_STATE_LABELS[s]}`, patch: { state: filters.state!.filter((v) => v !== s) } })),
    ...(filters.priority ?? []).map((p) => ({ label: `Priority: ${PRIORITY_LABELS[p].split(':')[0]}`, patch: { priority: filters.priority!.filter((v) => v !== p) } })),
    ...(filters.area ?? []).map((a) => ({ label: `Area: ${a}`, patch: { area: filters.area!.filter((v) => v !== a) } })),
    ...(filters.line ?? []).map((l) => ({ label: `Line: ${l}`, patch: { line: filters.line!.filter((v) => v !== l) } })),
    ...(filters.windowFrom ? [{ label: `Window from ${formatDate(filters.windowFrom)}`, patch: { windowFrom: undefined } }] : []),
    ...(filters.windowTo ? [{ label: `Window to ${formatDate(filters.windowTo)}`, patch: { windowTo: undefined } }] : []),
    ...(filters.fitter ? [{ label: filters.fitter === myId ? 'Assigned to me' : 'Assigned to one fitter', patch: { fitter: undefined } }] : []),
  ];

  return (
    <div className="mb-4 space-y-3">
      <div className="flex flex-wrap items-end gap-2">
        <label className="w-44">
          <span className="mb-1 block text-sm font-medium text-ink-soft">Find an order number</span>
          <input type="search" value={search} onChange={(e) => setSearch(e.target.value)} placeholder="e.g. 0042" className={input} />
        </label>
        <label className="w-36">
          <span className="mb-1 block text-sm font-medium text-ink-soft">Line number</span>
          <input type="search" value={line} onChange={(e) => setLine(e.target.value)} placeholder="exact line" className={input} />
        </label>
        <label className="w-40">
          <span className="mb-1 block text-sm font-medium text-ink-soft">Window from</span>
          <input type="date" value={isoToDayInput(filters.windowFrom)} onChange={(e) => onChange({ windowFrom: dayInputToIso(e.target.value) })} className={input} />
        </label>
        <label className="w-40">
          <span className="mb-1 block text-sm font-medium text-ink-soft">Window to</span>
          <input type="date" value={isoToDayInput(filters.windowTo, true)} onChange={(e) => onChange({ windowTo: dayInputToIso(e.target.value, true) })} className={input} />
        </label>
        <CheckMenu label="State" options={STATE_OPTIONS} selected={filters.state ?? []} onChange={(next) => onChange({ state: next.length ? (next as WorkOrderFilters['state']) : undefined })} />
        <CheckMenu label="Priority" options={PRIORITY_OPTIONS} selected={filters.priority ?? []} onChange={(next) => onChange({ priority: next.length ? (next as WorkOrderFilters['priority']) : undefined })} />
        <CheckMenu label="Area" options={areas.map((a) => ({ value: a, label: a }))} selected={filters.area ?? []} onChange={(next) => onChange({ area: next.length ? next : undefined })} />
        {myId && (
          <label className="flex min-h-11 items-center gap-2 rounded-lg border border-ink/20 bg-paper-raised px-3 text-sm font-medium">
            <input type="checkbox" className="h-5 w-5 accent-tide" checked={filters.fitter === myId} onChange={(e) => onChange({ fitter: e.target.checked ? myId : undefined })} />
            Joints assigned to me
          </label>
        )}
      </div>
      {hasActiveFilters(filters) && (
        <div className="flex flex-wrap items-center gap-2 text-sm">
          <span className="text-ink-soft">Showing only:</span>
          {chips.map((c) => (
            <button key={c.label} type="button" onClick={() => onChange(c.patch)} aria-label={`Remove filter ${c.label}`} className="inline-flex min-h-11 items-center gap-2 rounded-full border border-ink/15 bg-paper-raised px-3 hover:bg-paper-sunk">
              {c.label}
              <span aria-hidden className="text-ink-faint">×</span>
            </button>
          ))}
          <button type="button" className="min-h-11 rounded-lg px-3 font-medium text-tide underline-offset-2 hover:underline" onClick={() => onChange(NO_FILTERS)}>
            Clear all
          </button>
        </div>
      )}
    </div>
  );
}
