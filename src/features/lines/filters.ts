import { lineListQuerySchema, type LineListQuery } from '@shared/schemas/lines';

/** The register's view: paging, one sort, filters and a line-number search, as the API reads it. */
export type LineFilters = LineListQuery;
export type LineFilterKey = 'area' | 'material' | 'size' | 'status';
export const FILTER_KEYS: readonly LineFilterKey[] = ['area', 'material', 'size', 'status'];

const shape = lineListQuerySchema.shape;
const DEFAULTS = lineListQuerySchema.parse({});

/**
 * Reads the view from the address bar with the API's own schema, field by field, so one bad
 * value (an old link, a hand edit) falls back to its default instead of breaking the page.
 */
export function filtersFromSearch(params: URLSearchParams): LineFilters {
  const read = <K extends keyof typeof shape>(key: K) => {
    // The list filters come as repeated parameters (`?area=A&area=B`), the rest once.
    const raw = (FILTER_KEYS as readonly string[]).includes(key) ? params.getAll(key) : (params.get(key) ?? undefined);
    const parsed = shape[key].safeParse(raw);
    return (parsed.success ? parsed.data : DEFAULTS[key]) as LineFilters[K];
  };
  return {
    page: read('page'),
    pageSize: read('pageSize'),
    sort: read('sort'),
    dir: read('dir'),
    search: read('search') || undefined,
    area: read('area'),
    material: read('material'),
    size: read('size'),
    status: read('status'),
  };
}

/** Writes the view back to search params, leaving defaults out so links stay short. */
export function filtersToSearch(f: LineFilters): URLSearchParams {
  const q = new URLSearchParams();
  if (f.search) q.set('search', f.search);
  for (const key of FILTER_KEYS) for (const value of f[key] ?? []) q.append(key, value);
  if (f.sort !== DEFAULTS.sort) q.set('sort', f.sort);
  if (f.dir !== DEFAULTS.dir) q.set('dir', f.dir);
  if (f.page !== DEFAULTS.page) q.set('page', String(f.page));
  if (f.pageSize !== DEFAULTS.pageSize) q.set('pageSize', String(f.pageSize));
  return q;
}

export const hasActiveFilters = (f: LineFilters) => !!f.search || FILTER_KEYS.some((k) => (f[k]?.length ?? 0) > 0);

/** The filters without paging: what the CSV export should contain. */
export function exportFilters(f: LineFilters): Partial<LineFilters> {
  const { page: _page, pageSize: _pageSize, ...rest } = f;
  return rest;
}
