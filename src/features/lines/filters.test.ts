import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { toSearch } from '@/lib/api-client';
import { exportFilters, filtersFromSearch, filtersToSearch, type LineFilters } from '@/features/lines/filters';
import { lineListQuerySchema } from '@shared/schemas/lines';

const NORTH = 'Tank farm, north';
const CAUSTIC = '200 Caustic';

describe('the register view in the address bar', () => {
  it('keeps each selected value as its own parameter, so an area with a comma stays one area', () => {
    const f = { ...filtersFromSearch(new URLSearchParams()), area: [NORTH, CAUSTIC], material: ['CPVC' as const] };
    const q = filtersToSearch(f);
    expect(q.getAll('area')).toEqual([NORTH, CAUSTIC]);
    expect(q.toString()).toBe('area=Tank+farm%2C+north&area=200+Caustic&material=CPVC');
    expect(filtersFromSearch(q)).toEqual(f);
  });

  it('reads one value, repeated values, and no value of a list filter', () => {
    expect(filtersFromSearch(new URLSearchParams(`area=${encodeURIComponent(NORTH)}`)).area).toEqual([NORTH]);
    expect(filtersFromSearch(new URLSearchParams('status=locked-out&status=in-service')).status).toEqual(['locked-out', 'in-service']);
    expect(filtersFromSearch(new URLSearchParams()).area).toBeUndefined();
    expect(filtersFromSearch(new URLSearchParams('material=STEEL&material=PVC')).material).toBeUndefined(); // a bad value: back to the default
  });
});

describe('the API request and export link', () => {
  it('send each value of a list as a repeated parameter and leave empty ones out', () => {
    const f = { ...filtersFromSearch(new URLSearchParams()), area: [NORTH, CAUSTIC], size: [] };
    expect(toSearch(exportFilters(f))).toBe('?sort=lineNumber&dir=asc&area=Tank+farm%2C+north&area=200+Caustic');
    expect(toSearch({ page: 2, outcome: undefined, search: '' })).toBe('?page=2');
    expect(toSearch({})).toBe('');
  });
});

describe('the address bar is read by the API’s own rules (without zod on the first screen)', () => {
  /** What the page read with the API's schema, field by field, before it dropped zod. */
  function bySchema(params: URLSearchParams): LineFilters {
    const shape = lineListQuerySchema.shape;
    const defaults = lineListQuerySchema.parse({});
    const lists = ['area', 'material', 'size', 'status'];
    const read = <K extends keyof typeof shape>(key: K) => {
      const raw = lists.includes(key) ? params.getAll(key) : (params.get(key) ?? undefined);
      const parsed = shape[key].safeParse(raw);
      return (parsed.success ? parsed.data : defaults[key]) as LineFilters[K];
    };
    return {
      page: read('page'), pageSize: read('pageSize'), sort: read('sort'), dir: read('dir'), search: read('search') || undefined,
      area: read('area'), material: read('material'), size: read('size'), status: read('status'),
    };
  }

  const value = fc.oneof(
    fc.constantFrom('', ' ', '0', '1', '2', '-1', '1.5', '200', '201', '50', ' 7 ', '1e2', '0x10', 'Infinity', 'NaN', '9007199254740993', 'abc'),
    fc.constantFrom('lineNumber', 'area', 'updatedAt', 'LINENUMBER', 'asc', 'desc', 'up', 'PVC', 'CPVC', 'ABS', 'STEEL', 'in-service', 'locked-out', 'retired'),
    fc.string({ maxLength: 4 }).map((s) => s + '\0'),
    fc.string({ minLength: 45, maxLength: 60 }),
    fc.string({ minLength: 95, maxLength: 110 }).map((s) => ` ${s} `),
    fc.string({ minLength: 190, maxLength: 210 }),
    fc.string({ maxLength: 12 }),
  );
  const key = fc.constantFrom('page', 'pageSize', 'sort', 'dir', 'search', 'area', 'material', 'size', 'status', 'other');

  it('gives what the schema gives for any address, odd values included', () => {
    fc.assert(
      fc.property(fc.array(fc.tuple(key, value), { maxLength: 12 }), (pairs) => {
        const params = new URLSearchParams(pairs);
        expect(filtersFromSearch(params)).toEqual(bySchema(params));
      }),
      { numRuns: 3000 },
    );
  });
});
