import type { LineListQuery } from '@shared/schemas/lines';
import { toSearch } from '@/lib/api-client';
import { LINE_LIST_QUERY as Q, LINE_SORTS, LINE_STATUSES, PIPE_MATERIALS, SORT_DIRECTIONS } from '@shared/schemas/line-values';

// The register's first screen reads its view from the address bar before anything else, so this
// file stays free of zod (its download and start-up were a third of the first screen's script): it
// applies the API's rules (lineListQuerySchema in shared/schemas/lines.ts, built from the same
// values) by hand, and filters.test.ts checks it against that schema.

/** The register's view: paging, one sort, filters and a line-number search, as the API reads it. */
export type LineFilters = LineListQuery;
export type LineFilterKey = 'area' | 'material' | 'size' | 'status';
export const FILTER_KEYS: readonly LineFilterKey[] = ['area', 'material', 'size', 'status'];

const DEFAULTS = { page: Q.page, pageSize: Q.pageSize, sort: Q.sort, dir: Q.dir } as const satisfies Partial<LineFilters>;

/** A whole number in [1, max] as z.coerce.number().int() reads it: Number(raw), a safe integer (so not '', NaN or Infinity). */
function wholeNumber(raw: string | null, max: number): number | undefined {
  if (raw === null) return undefined;
  const n = Number(raw);
  return Number.isSafeInteger(n) && n >= 1 && n <= max ? n : undefined;
}

const oneOf = <T extends string>(list: readonly T[], raw: string | null): T | undefined =>
  raw !== null && (list as readonly string[]).includes(raw) ? (raw as T) : undefined;

const noNul = (s: string) => !s.includes('\0');

/** A repeated parameter: empty values dropped, none left is no filter, and one bad value drops the filter. */
function list<T extends string>(values: string[], valid: (v: string) => boolean): T[] | undefined {
  const kept = values.filter((v) => v !== '');
  return kept.length > 0 && kept.every(valid) ? (kept as T[]) : undefined;
}
const text = (max: number) => (v: string) => v.length <= max && noNul(v);

function search(raw: string | null): string | undefined {
  const trimmed = raw?.trim();
  return trimmed && trimmed.length <= Q.maxSearch && noNul(trimmed) ? trimmed : undefined;
}

/**
 * Reads the view from the address bar by the API's rules, field by field, so one bad value (an old
 * link, a hand edit) falls back to its default instead of breaking the page.
 */
export function filtersFromSearch(params: URLSearchParams): LineFilters {
  return {
    page: wholeNumber(params.get('page'), Number.MAX_SAFE_INTEGER) ?? DEFAULTS.page,
    pageSize: wholeNumber(params.get('pageSize'), Q.maxPageSize) ?? DEFAULTS.pageSize,
    sort: oneOf(LINE_SORTS, params.get('sort')) ?? DEFAULTS.sort,
    dir: oneOf(SORT_DIRECTIONS, params.get('dir')) ?? DEFAULTS.dir,
    search: search(params.get('search')),
    area: list(params.getAll('area'), text(Q.maxArea)),
    material: list(params.getAll('material'), (v) => oneOf(PIPE_MATERIALS, v) !== undefined),
    size: list(params.getAll('size'), text(Q.maxSize)),
    status: list(params.getAll('status'), (v) => oneOf(LINE_STATUSES, v) !== undefined),
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

/** The register's address in the API for a view (the list query's and the first screen's early fetch). */
export const lineListPath = (f: LineFilters) => `/api/lines${toSearch(f)}`;

/** The filters without paging: what the CSV export should contain. */
export function exportFilters(f: LineFilters): Partial<LineFilters> {
  const { page: _page, pageSize: _pageSize, ...rest } = f;
  return rest;
}
