import { z } from 'zod';

// Pieces every list query shares.

/** PostgreSQL refuses a NUL in text ("invalid byte sequence"): refused here, it is a 400, not a 500. */
export const noNul = (s: z.ZodString) => s.regex(/^[^\0]*$/, 'must not contain a NUL character');

/**
 * A filter of several values, each sent as its own repeated parameter (`?area=A&area=B`): Express's
 * query parser gives one string or an array of strings. Values are never split, so an area may hold
 * a comma. Empty values are dropped, and no value at all is no filter.
 */
export const repeatedList = <T extends z.ZodType>(item: T) =>
  z.preprocess((v) => {
    const list = typeof v === 'string' ? [v] : v;
    if (!Array.isArray(list)) return list;
    const values = list.filter((x) => x !== '');
    return values.length ? values : undefined;
  }, z.array(item).optional());
