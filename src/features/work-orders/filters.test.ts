import { describe, expect, it } from 'vitest';
import { filtersFromSearch, filtersToSearch } from '@/features/work-orders/filters';

describe('the work-order list view in the address bar', () => {
  it('a view written to the address bar reads back the same', () => {
    const params = new URLSearchParams('state=draft&state=planned&line=SA-001&search=0042&sort=windowStart&dir=asc&page=2&windowFrom=2027-03-01T06:00:00.000Z');
    const f = filtersFromSearch(params);
    expect(f).toMatchObject({ state: ['draft', 'planned'], line: ['SA-001'], search: '0042', sort: 'windowStart', dir: 'asc', page: 2 });
    expect(filtersFromSearch(filtersToSearch(f))).toEqual(f);
  });

  it('a bad value falls back to its default and leaves the rest', () => {
    const f = filtersFromSearch(new URLSearchParams('state=nonsense&sort=colour&priority=urgent'));
    expect(f).toMatchObject({ state: undefined, sort: 'createdAt', priority: ['urgent'] });
  });
});
