import { workOrderListQuerySchema, type WorkOrderListQuery } from '@shared/schemas/work-orders';

/** The work-order list's view: paging, one sort, filters and an order-number search, as the API reads it. */
export type WorkOrderFilters = WorkOrderListQuery;
export type WorkOrderListKey = 'state' | 'priority' | 'area' | 'line';
export const LIST_KEYS: readonly WorkOrderListKey[] = ['state', 'priority', 'area', 'line'];
const SINGLE_KEYS = ['search', 'fitter', 'windowFrom', 'windowTo'] as const;

const shape = workOrderListQuerySchema.shape;
const DEFAULTS = workOrderListQuerySchema.parse({});

/** Reads the view from the address bar field by field: one bad value falls back to its default. */
export function filtersFromSearch(params: URLSearchParams): WorkOrderFilters {
  const read = <K extends keyof typeof shape>(key: K) => {
    const raw = (LIST_KEYS as readonly string[]).includes(key) ? params.getAll(key) : (params.get(key) ?? undefined);
    const parsed = shape[key].safeParse(raw);
    return (parsed.success ? parsed.data : DEFAULTS[key]) as WorkOrderFilters[K];
  };
  return {
    page: read('page'),
    pageSize: read('pageSize'),
    sort: read('sort'),
    dir: read('dir'),
    search: read('search') || undefined,
    state: read('state'),
    priority: read('priority'),
    area: read('area'),
    line: read('line'),
    fitter: read('fitter'),
    windowFrom: read('windowFrom'),
    windowTo: read('windowTo'),
  };
}

/** Writes the view back, leaving defaults out so links stay short. */
export function filtersToSearch(f: WorkOrderFilters): URLSearchParams {
  const q = new URLSearchParams();
  for (const key of SINGLE_KEYS) if (f[key]) q.set(key, f[key]);
  for (const key of LIST_KEYS) for (const value of f[key] ?? []) q.append(key, value);
  if (f.sort !== DEFAULTS.sort) q.set('sort', f.sort);
  if (f.dir !== DEFAULTS.dir) q.set('dir', f.dir);
  if (f.page !== DEFAULTS.page) q.set('page', String(f.page));
  if (f.pageSize !== DEFAULTS.pageSize) q.set('pageSize', String(f.pageSize));
  return q;
}

export const hasActiveFilters = (f: WorkOrderFilters) =>
  SINGLE_KEYS.some((k) => !!f[k]) || LIST_KEYS.some((k) => (f[k]?.length ?? 0) > 0);

export const NO_FILTERS: Partial<WorkOrderFilters> = { search: undefined, state: undefined, priority: undefined, area: undefined, line: undefined, fitter: undefined, windowFrom: undefined, windowTo: undefined };
