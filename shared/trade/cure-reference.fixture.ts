// Test fixture: the set and cure tables copied as text from TRADE-REFERENCE §4, parsed here so a
// test compares the engine with the reference's own words. Used only by tests.

export function minutes(cell: string): number {
  const m = /^([\d.]+) (min|h|d)$/.exec(cell.trim());
  if (!m) throw new Error(`bad cell ${cell}`);
  return Number(m[1]) * { min: 1, h: 60, d: 1440 }[m[2] as 'min' | 'h' | 'd'];
}

function parse(text: string): { band: string; cells: number[] }[] {
  return text
    .trim()
    .split('\n')
    .map((line) => line.split('|').map((c) => c.trim()).filter(Boolean))
    .map(([band, ...cells]) => ({ band: band as string, cells: cells.map(minutes) }));
}

// Schedule A, average initial set, a manufacturer's installation manual [mfr]
// columns: 1/2"–1-1/4" | 1-1/2"–2" | 2-1/2"–8" | 10"–15" | 15"+
export const A_SET = parse(`
| 60–100 °F | 2 min | 5 min | 30 min | 2 h | 4 h |
| 40–60 °F | 5 min | 10 min | 2 h | 8 h | 16 h |
| 0–40 °F | 10 min | 15 min | 12 h | 24 h | 48 h |`);

// Schedule A, average joint cure [mfr]; columns as in the reference
export const A_CURE_COLUMNS = [
  { size: '1', psi: 100, label: '1/2"–1-1/4" ≤160 psi' },
  { size: '1-1/4', psi: 200, label: '1/2"–1-1/4" 160–370 psi' },
  { size: '1-1/2', psi: 100, label: '1-1/2"–2" ≤160' },
  { size: '2', psi: 200, label: '1-1/2"–2" 160–315' },
  { size: '4', psi: 100, label: '2-1/2"–8" ≤160' },
  { size: '6', psi: 200, label: '2-1/2"–8" 160–315' },
  { size: '12', psi: 50, label: '10"–15" ≤100' },
  { size: '18', psi: 50, label: '15"+ ≤100' },
];
export const A_CURE = parse(`
| 60–100 °F | 15 min | 6 h | 30 min | 12 h | 1.5 h | 24 h | 48 h | 72 h |
| 40–60 °F | 20 min | 12 h | 45 min | 24 h | 4 h | 48 h | 96 h | 6 d |
| 0–40 °F | 30 min | 48 h | 1 h | 96 h | 72 h | 8 d | 8 d | 14 d |`);

// Schedule B, a plastics piping technical manual [pub]
// set columns: 1/2"–1-1/4" | 1-1/2"–3" | 4"–8" | 10"–16"
export const B_SET_SIZES = ['1', '2', '6', '12'];
export const B_SET = parse(`
| 60–100 °F | 15 min | 30 min | 1 h | 2 h |
| 40–60 °F | 1 h | 2 h | 4 h | 8 h |
| 0–40 °F | 3 h | 6 h | 12 h | 24 h |`);

export const B_CURE_COLUMNS = [
  { size: '1', psi: 150, label: '1/2"–1-1/4" ≤180 psi' },
  { size: '1', psi: 250, label: '>180–370' },
  { size: '2', psi: 150, label: '1-1/2"–3" ≤180' },
  { size: '3', psi: 250, label: '>180–315' },
  { size: '4', psi: 150, label: '4"–8" ≤180' },
  { size: '8', psi: 250, label: '>180–315' },
  { size: '16', psi: 80, label: '10"–16" ≤100' },
];
export const B_CURE = parse(`
| 60–100 °F | 1 h | 6 h | 2 h | 12 h | 6 h | 24 h | 24 h |
| 40–60 °F | 2 h | 12 h | 4 h | 24 h | 12 h | 48 h | 48 h |
| 0–40 °F | 8 h | 48 h | 16 h | 96 h | 48 h | 8 d | 8 d |`);

/** A temperature well inside each band, in the reference's row order. */
export const BAND_TEMPERATURE: Record<string, number> = { '60–100 °F': 75, '40–60 °F': 50, '0–40 °F': 20 };
export const A_SET_SIZES = ['1/2', '1-1/2', '3', '12', '20'];
