import { useEffect, useRef, useState } from 'react';
import { useDebouncedValue } from '@/lib/use-debounced-value';
import { CheckMenu, type CheckOption } from '@/components/ui/check-menu';
import type { LineListResponse } from '@shared/schemas/lines';
import { LINE_STATUSES, LINE_STATUS_LABELS, PIPE_MATERIALS } from '@shared/schemas/line-values';
import { FILTER_KEYS, hasActiveFilters, type LineFilterKey, type LineFilters } from '@/features/lines/filters';
import { formatSize } from '@/lib/format';

const LABELS: Record<LineFilterKey, string> = { area: 'Area', material: 'Material', size: 'Size', status: 'Status' };

function optionsFor(key: LineFilterKey, facets: LineListResponse['facets'] | undefined): CheckOption[] {
  if (key === 'material') return PIPE_MATERIALS.map((m) => ({ value: m, label: m }));
  if (key === 'status') return LINE_STATUSES.map((s) => ({ value: s, label: LINE_STATUS_LABELS[s] }));
  if (key === 'area') return (facets?.areas ?? []).map((a) => ({ value: a, label: a }));
  return (facets?.sizes ?? []).map((s) => ({ value: s, label: formatSize(s) }));
}

export function LineFilterBar({ filters, facets, onChange }: { filters: LineFilters; facets?: LineListResponse['facets']; onChange: (patch: Partial<LineFilters>, replace?: boolean) => void }) {
  const [search, setSearch] = useState(filters.search ?? '');
  // Waits until typing pauses before the search reaches the address bar (and the server).
  const settled = useDebouncedValue(search.trim(), 300);
  // The last search this box and the address bar agreed on; keeps the two from echoing each other.
  const agreed = useRef(filters.search ?? '');
  useEffect(() => {
    if (settled === agreed.current) return;
    agreed.current = settled;
    onChange({ search: settled || undefined }, true);
    // eslint-disable-next-line react-hooks/exhaustive-deps -- only a settled change of the text should push
  }, [settled]);
  useEffect(() => {
    // Back/forward or "Clear all" changed the address bar: follow it.
    const fromUrl = filters.search ?? '';
    if (fromUrl === agreed.current) return;
    agreed.current = fromUrl;
    setSearch(fromUrl);
  }, [filters.search]);

  const chips = FILTER_KEYS.flatMap((key) => (filters[key] ?? []).map((value) => ({ key, value, label: optionsFor(key, facets).find((o) => o.value === value)?.label ?? value })));

  return (
    <div className="mb-4 space-y-3">
      <div className="flex flex-wrap items-end gap-2">
        <label className="min-w-64 flex-1 sm:max-w-sm">
          <span className="mb-1 block text-sm font-medium text-ink-soft">Find a line number</span>
          <input
            type="search"
            value={search}
            onChange={(e) => setSearch(e.target.value)}
            placeholder="Part of a line number, e.g. SA-00"
            className="min-h-11 w-full rounded-lg border border-ink/25 bg-paper-raised px-3 py-2 text-base focus:border-tide"
          />
        </label>
        {FILTER_KEYS.map((key) => (
          <CheckMenu key={key} label={LABELS[key]} options={optionsFor(key, facets)} selected={filters[key] ?? []} onChange={(next) => onChange({ [key]: next.length ? next : undefined })} />
        ))}
      </div>
      {hasActiveFilters(filters) && (
        <div className="flex flex-wrap items-center gap-2 text-sm">
          <span className="text-ink-soft">Showing only:</span>
          {filters.search && <Chip label={`line number contains “${filters.search}”`} onRemove={() => onChange({ search: undefined })} />}
          {chips.map((c) => (
            <Chip key={`${c.key}:${c.value}`} label={`${LABELS[c.key]}: ${c.label}`} onRemove={() => onChange({ [c.key]: (filters[c.key] ?? []).filter((v) => v !== c.value) })} />
          ))}
          <button
            type="button"
            className="min-h-11 rounded-lg px-3 font-medium text-tide underline-offset-2 hover:underline"
            onClick={() => onChange({ search: undefined, area: undefined, material: undefined, size: undefined, status: undefined })}
          >
            Clear all
          </button>
        </div>
      )}
    </div>
  );
}

function Chip({ label, onRemove }: { label: string; onRemove: () => void }) {
  return (
    <button type="button" onClick={onRemove} aria-label={`Remove filter ${label}`} className="inline-flex min-h-11 items-center gap-2 rounded-full border border-ink/15 bg-paper-raised px-3 hover:bg-paper-sunk">
      {label}
      <span aria-hidden className="text-ink-faint">×</span>
    </button>
  );
}
