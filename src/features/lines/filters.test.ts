import { describe, expect, it } from 'vitest';
import { toSearch } from '@/lib/api-client';
import { exportFilters, filtersFromSearch, filtersToSearch } from '@/features/lines/filters';

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
