import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { NOMINAL_SIZES, nominalSizeLabel, parseNominalSize } from './nominal-size';

describe('nominal sizes as the trade writes them', () => {
  it.each([
    ['1/2', 0.5], ['3/4', 0.75], ['1', 1], ['1-1/4', 1.25], ['1-1/2', 1.5], ['2-1/2', 2.5], ['3-1/2', 3.5], ['24', 24],
  ])('"%s" is %d in', (s, v) => {
    expect(parseNominalSize(s)).toBe(v);
  });

  it('tolerates a unit mark, a space instead of the dash, or a decimal', () => {
    expect(parseNominalSize('2"')).toBe(2);
    expect(parseNominalSize('1 1/4')).toBe(1.25);
    expect(parseNominalSize('1-1/2 in')).toBe(1.5);
    expect(parseNominalSize('2.5')).toBe(2.5);
    expect(parseNominalSize(6)).toBe(6);
  });

  it('unknown sizes are null, never thrown', () => {
    for (const s of ['7', '15', '1/0', '', 'big', '-2', null, undefined, {}]) expect(parseNominalSize(s)).toBeNull();
  });

  it('every listed size round-trips through its label', () => {
    for (const s of NOMINAL_SIZES) expect(nominalSizeLabel(parseNominalSize(s) ?? -1)).toBe(s);
  });

  it('property: any string parses to a listed size or to null', () => {
    const listed = new Set(NOMINAL_SIZES.map((s) => parseNominalSize(s)));
    fc.assert(fc.property(fc.string(), (s) => {
      const v = parseNominalSize(s);
      expect(v === null || listed.has(v)).toBe(true);
    }));
  });
});
