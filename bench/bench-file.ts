// The bench's lines file: the same seeded rows on every run, so runs compare.

import { prng } from '../scripts/lib/prng';
import { LINE_CSV_COLUMNS } from '../shared/schemas/register-columns';

export const HEADER = LINE_CSV_COLUMNS.join(',');

/** `rows` valid lines; with `changedEvery` n, every n-th row's pressure is 5 psi higher than on the first run. */
export function benchFile(rows: number, changedEvery = 0): string {
  const rnd = prng(20261203);
  const pick = <T>(xs: readonly T[]) => xs[Math.floor(rnd() * xs.length)]!;
  const out = [HEADER];
  for (let i = 0; i < rows; i++) {
    const material = pick(['PVC', 'CPVC', 'ABS'] as const);
    const temp = Math.round(40 + rnd() * ({ PVC: 100, CPVC: 160, ABS: 140 }[material] - 40));
    const psi = Math.round(50 + rnd() * 250) + (changedEvery && i % changedEvery === 0 ? 5 : 0);
    out.push([`BENCH-${String(i).padStart(6, '0')}`, pick(['100 Acid dosing', '200 Caustic & brine', '300 Water treatment']), pick(['Sulphuric acid 93%', 'Brine', 'RO permeate']), material, pick(['40', '80', 'SDR 21']), pick(['1/2', '1-1/4', '2', '4', '8']), psi, temp, `MRW-P&ID-${100 + (i % 400)}-0${i % 9}`, i % 10 === 0 ? 'bench row' : ''].join(','));
  }
  return out.join('\n') + '\n';
}
