import { describe, expect, it } from 'vitest';
import { cementBody, cementCheck, normaliseStandard } from './cement';

const check = (pipeMaterial: string, cementStandard: string, pressureService = true, nominalSize = '2') =>
  cementCheck({ pipeMaterial, cementStandard, nominalSize, pressureService });

describe('cement must match the pipe', () => {
  it.each([
    ['PVC', 'ASTM D2564'],
    ['CPVC', 'ASTM F493'],
    ['ABS', 'ASTM D2235'],
  ])('ASTM: %s pipe takes %s cement', (material, std) => {
    expect(check(material, std)).toMatchObject({ ok: true, problems: [], requiredStandard: std });
  });

  it("standard strings are accepted as written: 'D2564', 'astm d 2564-12'", () => {
    expect(normaliseStandard('D2564')).toBe('D2564');
    expect(normaliseStandard('astm d 2564-12')).toBe('D2564');
    expect(normaliseStandard('ASTM F-493')).toBe('F493');
    expect(check('PVC', 'D2564').ok).toBe(true);
  });

  it('a cement standard for another material is refused, naming the right one', () => {
    const r = check('CPVC', 'ASTM D2564');
    expect(r.ok).toBe(false);
    expect(r.problems.join(' ')).toMatch(/D2564 is the cement for PVC, not CPVC pipe; use ASTM F493/);
    expect(check('PVC', 'F493').ok).toBe(false);
  });

  it('ASTM D3138: transition cement on pressure service is refused', () => {
    const r = check('PVC', 'ASTM D3138', true);
    expect(r.ok).toBe(false);
    expect(r.problems.join(' ')).toMatch(/non-pressure service only/);
  });

  it('ASTM D3138: transition cement on non-pressure ABS-to-PVC is accepted, never on CPVC', () => {
    expect(check('PVC', 'ASTM D3138', false).ok).toBe(true);
    expect(check('ABS', 'ASTM D3138', false).ok).toBe(true);
    expect(check('CPVC', 'ASTM D3138', false).ok).toBe(false);
  });

  it('ASTM F656 is a primer, not a cement; unknown numbers and materials are problems', () => {
    expect(check('PVC', 'ASTM F656').problems.join(' ')).toMatch(/primer, not a cement/);
    expect(check('PVC', 'glue').ok).toBe(false);
    expect(check('PE', 'ASTM D2564').ok).toBe(false);
  });

  it("a manufacturer's installation manual: cement body by size, regular ≤2\", medium ≤6\", heavy beyond", () => {
    expect(cementBody('2')).toMatchObject({ ok: true, body: 'regular' });
    expect(cementBody('2-1/2')).toMatchObject({ ok: true, body: 'medium' });
    expect(cementBody('6')).toMatchObject({ ok: true, body: 'medium' });
    expect(cementBody('8')).toMatchObject({ ok: true, body: 'heavy' });
    expect(cementBody('7').ok).toBe(false);
  });

  it('a cement body too thin for the size is a problem', () => {
    const r = cementCheck({ pipeMaterial: 'PVC', cementStandard: 'D2564', nominalSize: '8', pressureService: true, cementBody: 'medium' });
    expect(r.ok).toBe(false);
    expect(cementCheck({ pipeMaterial: 'PVC', cementStandard: 'D2564', nominalSize: '1', pressureService: true, cementBody: 'heavy' }).ok).toBe(true);
  });
});
