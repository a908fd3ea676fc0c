import { describe, expect, it } from 'vitest';
import { applicatorSize, assemblyHoldSeconds, crewAndTools } from './joint-handling';
import { cementQuantities, containersFor, JOINTS_PER_QUART, jointsPerQuart } from './materials';
import { cementShelfLife } from './shelf-life';

// Copied from TRADE-REFERENCE §5, average joints per quart, a plastics piping technical manual [pub]
const REFERENCE = '1/2" 300 · 3/4" 200 · 1" 125 · 1-1/2" 90 · 2" 60 · 3" 40 · 4" 30 · 6" 10 · 8" 5 · 10" 2–3 · 12" 1–2 · 15" 3/4 · 18" 1/2';
const ROWS = REFERENCE.split(' · ').map((cell) => {
  const [size, printed] = cell.split('" ') as [string, string];
  return { size, printed };
});

describe('cement and primer quantities', () => {
  it('a plastics piping technical manual: the engine holds every joints-per-quart row as printed', () => {
    expect(JOINTS_PER_QUART.map((r) => r.printed)).toEqual(ROWS.map((r) => r.printed));
  });

  it.each(ROWS.filter((r) => r.size !== '15'))('a plastics piping technical manual: $size" gives $printed joints per quart (ranges take the lower)', ({ size, printed }) => {
    const [num, den = '1'] = (printed.split('–')[0] as string).split('/');
    const lower = Number(num) / Number(den);
    expect(jointsPerQuart(size)).toMatchObject({ ok: true, jointsPerQuart: lower });
  });

  it('common practice (conservative): a size not listed takes the next larger listed size', () => {
    expect(jointsPerQuart('1-1/4')).toMatchObject({ jointsPerQuart: 90 });
    expect(jointsPerQuart('2-1/2')).toMatchObject({ jointsPerQuart: 40 });
    expect(jointsPerQuart('3-1/2')).toMatchObject({ jointsPerQuart: 30 });
    expect(jointsPerQuart('5')).toMatchObject({ jointsPerQuart: 10 });
    expect(jointsPerQuart('14')).toMatchObject({ jointsPerQuart: 0.75 });
    expect(jointsPerQuart('16')).toMatchObject({ jointsPerQuart: 0.5 });
  });

  it('above 18" there is no published value: refused, not extrapolated', () => {
    expect(jointsPerQuart('20').ok).toBe(false);
    expect(cementQuantities([{ nominalSize: '24', count: 1 }]).ok).toBe(false);
  });

  it('cement quarts from the table, primer about half as much, rounded up to containers', () => {
    const r = cementQuantities([{ nominalSize: '6', count: 25 }, { nominalSize: '2', count: 30 }]);
    expect(r).toMatchObject({
      ok: true, cementQuarts: 3, primerQuarts: 1.5, body: 'medium',
      cementContainers: [{ container: 'quart', count: 3 }],
      primerContainers: [{ container: 'quart', count: 1 }, { container: 'pint', count: 1 }],
    });
  });

  it('containers: the least volume in whole pints, fewest containers for it', () => {
    expect(containersFor(0)).toEqual([]);
    expect(containersFor(0.01)).toEqual([{ container: 'pint', count: 1 }]);
    expect(containersFor(5.2)).toEqual([{ container: 'gallon', count: 1 }, { container: 'quart', count: 1 }, { container: 'pint', count: 1 }]);
    expect(containersFor(8)).toEqual([{ container: 'gallon', count: 2 }]);
  });

  it('bad counts and sizes are refused', () => {
    expect(cementQuantities([{ nominalSize: '2', count: -1 }]).ok).toBe(false);
    expect(cementQuantities([{ nominalSize: '2', count: 1.5 }]).ok).toBe(false);
    expect(cementQuantities([{ nominalSize: 'big', count: 1 }]).ok).toBe(false);
  });
});

describe('applicator, crew and hold (common practice)', () => {
  it('common practice: applicator about half the OD; dauber small, swab, then swab or roller', () => {
    expect(applicatorSize('2')).toMatchObject({ ok: true, widthIn: 1.19, kind: 'dauber' });
    expect(applicatorSize('4')).toMatchObject({ ok: true, widthIn: 2.25, kind: 'swab' });
    expect(applicatorSize('12')).toMatchObject({ ok: true, kind: 'swab-or-roller' });
    expect(applicatorSize('13').ok).toBe(false);
  });

  it('common practice: a mechanical joining device and a crew from 6"', () => {
    expect(crewAndTools('4')).toMatchObject({ ok: true, crew: 1, mechanicalJoiningDevice: false });
    expect(crewAndTools('6')).toMatchObject({ ok: true, crew: 2, mechanicalJoiningDevice: true });
    expect(crewAndTools('24')).toMatchObject({ ok: true, crew: 3, mechanicalJoiningDevice: true });
  });

  it('common practice: hold at least 30 s, longer in the cold', () => {
    expect(assemblyHoldSeconds(75)).toMatchObject({ ok: true, seconds: 30 });
    expect(assemblyHoldSeconds(60)).toMatchObject({ ok: true, seconds: 60 });
    expect(assemblyHoldSeconds(40)).toMatchObject({ ok: true, seconds: 120 });
    expect(assemblyHoldSeconds(Number.NaN).ok).toBe(false);
  });
});

describe("cement shelf life, a manufacturer's installation manual: about two years", () => {
  it('expires two years after the stamped date and counts the days left', () => {
    const r = cementShelfLife({ manufacturedOn: new Date('2024-03-01T00:00:00Z'), now: new Date('2026-02-20T00:00:00Z') });
    expect(r).toMatchObject({ ok: true, expired: false, daysLeft: 9, expiresAt: new Date('2026-03-01T00:00:00Z') });
  });

  it('is expired on and after the two-year date', () => {
    expect(cementShelfLife({ manufacturedOn: '2023-06-01T00:00:00Z', now: Date.parse('2025-06-01T00:00:00Z') })).toMatchObject({ ok: true, expired: true, daysLeft: 0 });
  });

  it('a 29 February stamp expires on 28 February, the earlier date', () => {
    const r = cementShelfLife({ manufacturedOn: '2024-02-29T00:00:00Z', now: Date.parse('2024-06-01T00:00:00Z') });
    expect(r.ok && r.expiresAt.toISOString()).toBe('2026-02-28T00:00:00.000Z');
  });

  it('a bad or future date is refused', () => {
    expect(cementShelfLife({ manufacturedOn: 'soon', now: 0 }).ok).toBe(false);
    expect(cementShelfLife({ manufacturedOn: '2030-01-01', now: Date.parse('2025-01-01') }).ok).toBe(false);
  });
});
