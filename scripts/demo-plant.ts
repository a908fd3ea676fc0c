// The demo plant: an invented site, Marrowby Reach Works, with about 150 PVC/CPVC/ABS lines and
// their isolation points, as register CSV files. Deterministic: a seeded PRNG, the same plant on
// every machine. Design temperatures stay under each material's maximum service temperature.

import Papa from 'papaparse';
import { prng } from './lib/prng';

export const SITE = 'Marrowby Reach Works';

type Material = 'PVC' | 'CPVC' | 'ABS';

interface ServiceSpec {
  code: string;
  service: string;
  materials: Material[];
  sizes: string[];
  schedules: string[];
  psi: number[];
  tempF: [number, number];
  notes?: string[];
}

interface AreaSpec {
  no: number;
  name: string;
  lines: number;
  services: ServiceSpec[];
}

const SMALL = ['1/2', '3/4', '1', '1-1/4', '1-1/2', '2'];
const MID = ['2', '2-1/2', '3', '4', '6'];
const LARGE = ['4', '6', '8', '10', '12', '14', '16'];

const AREAS: AreaSpec[] = [
  { no: 100, name: '100 Acid dosing', lines: 30, services: [
    { code: 'SA', service: 'Sulphuric acid 93%', materials: ['CPVC'], sizes: SMALL, schedules: ['80'], psi: [100, 150], tempF: [60, 95], notes: ['Double containment', 'Spray shield at flanges'] },
    { code: 'HCL', service: 'Hydrochloric acid 33%', materials: ['PVC', 'CPVC'], sizes: SMALL, schedules: ['80'], psi: [100, 150], tempF: [60, 100] },
    { code: 'HY', service: 'Sodium hypochlorite 12.5%', materials: ['PVC', 'CPVC'], sizes: SMALL, schedules: ['80'], psi: [75, 100, 150], tempF: [55, 95], notes: ['Vented ball valves only', 'Keep out of sunlight'] },
  ] },
  { no: 200, name: '200 Caustic & brine', lines: 30, services: [
    { code: 'NA', service: 'Sodium hydroxide 50%', materials: ['CPVC'], sizes: SMALL, schedules: ['80'], psi: [100, 150], tempF: [80, 160], notes: ['Heat traced and insulated'] },
    { code: 'BR', service: 'Brine', materials: ['PVC', 'CPVC'], sizes: MID, schedules: ['40', '80'], psi: [75, 100], tempF: [60, 120] },
    { code: 'HY', service: 'Sodium hypochlorite 12.5%', materials: ['PVC'], sizes: SMALL, schedules: ['80'], psi: [75, 100], tempF: [55, 90] },
  ] },
  { no: 300, name: '300 Water treatment', lines: 35, services: [
    { code: 'RW', service: 'Raw water', materials: ['PVC'], sizes: LARGE, schedules: ['40', '80', 'SDR 21', 'SDR 26'], psi: [75, 100, 125], tempF: [40, 85] },
    { code: 'FW', service: 'Filtered water', materials: ['PVC'], sizes: MID, schedules: ['40', '80'], psi: [75, 100], tempF: [40, 85] },
    { code: 'FC', service: 'Ferric chloride 40%', materials: ['PVC', 'CPVC'], sizes: SMALL, schedules: ['80'], psi: [75, 100], tempF: [50, 95] },
    { code: 'BW', service: 'Filter backwash', materials: ['PVC'], sizes: LARGE, schedules: ['40', 'SDR 21'], psi: [50, 75], tempF: [40, 85] },
    { code: 'CW', service: 'Cooling water', materials: ['ABS', 'PVC'], sizes: MID, schedules: ['40'], psi: [50, 75], tempF: [60, 110] },
  ] },
  { no: 400, name: '400 Ultrapure water', lines: 30, services: [
    { code: 'RO', service: 'RO permeate', materials: ['PVC'], sizes: MID, schedules: ['80', 'SDR 21'], psi: [100, 150], tempF: [55, 85] },
    { code: 'ROC', service: 'RO concentrate', materials: ['PVC'], sizes: MID, schedules: ['80'], psi: [150, 200], tempF: [55, 85] },
    { code: 'UPW', service: 'Ultrapure water supply', materials: ['PVC', 'CPVC'], sizes: MID, schedules: ['80'], psi: [75, 100], tempF: [65, 85], notes: ['Clean build: bagged fittings, no pipe dope'] },
    { code: 'HUPW', service: 'Hot ultrapure water', materials: ['CPVC'], sizes: SMALL, schedules: ['80'], psi: [50, 75], tempF: [150, 176], notes: ['Expansion loops; check supports when hot'] },
  ] },
  { no: 500, name: '500 Effluent', lines: 25, services: [
    { code: 'EF', service: 'Neutralised effluent', materials: ['PVC', 'ABS'], sizes: LARGE, schedules: ['40', 'SDR 26'], psi: [25, 50], tempF: [50, 100] },
    { code: 'AD', service: 'Acid drain', materials: ['CPVC'], sizes: MID, schedules: ['80'], psi: [25, 50], tempF: [50, 140] },
    { code: 'EV', service: 'Effluent tank vent', materials: ['ABS'], sizes: MID, schedules: ['40'], psi: [5, 10], tempF: [40, 100] },
    { code: 'CWR', service: 'Cooling water return', materials: ['ABS'], sizes: MID, schedules: ['40'], psi: [50], tempF: [70, 140] },
  ] },
];


export interface DemoLine {
  line_number: string;
  area: string;
  service: string;
  material: Material;
  schedule: string;
  nominal_size: string;
  design_pressure_psi: string;
  design_temperature_f: string;
  drawing: string;
  notes: string;
}

export interface DemoPoint {
  tag: string;
  line_number: string;
  kind: 'valve' | 'blind' | 'disconnect';
  normal_position: string;
  notes: string;
}

const POINT_NOTES = ['At the pump suction', 'At the pump discharge', 'At the tank outlet', 'Upstream of the flow meter', 'At the header tie-in', ''];

/** The whole plant, the same every time. */
export function demoPlant(): { lines: DemoLine[]; points: DemoPoint[] } {
  const rnd = prng(0x5eed_0f_4d);
  const pick = <T>(xs: readonly T[]): T => xs[Math.floor(rnd() * xs.length)]!;
  const lines: DemoLine[] = [];
  const points: DemoPoint[] = [];
  const seq = new Map<string, number>();
  let tagNo = 0;
  for (const area of AREAS) {
    for (let i = 0; i < area.lines; i++) {
      const s = area.services[i % area.services.length]!;
      const n = (seq.get(`${area.no}-${s.code}`) ?? 0) + 1;
      seq.set(`${area.no}-${s.code}`, n);
      const lineNumber = `${area.no}-${s.code}-${String(n).padStart(3, '0')}`;
      const [lo, hi] = s.tempF;
      lines.push({
        line_number: lineNumber, area: area.name, service: s.service, material: pick(s.materials), schedule: pick(s.schedules),
        nominal_size: pick(s.sizes), design_pressure_psi: String(pick(s.psi)), design_temperature_f: String(Math.round(lo + rnd() * (hi - lo))),
        drawing: `MRW-P&ID-${area.no + 1 + Math.floor(i / 8)}-0${1 + (i % 4)}`, notes: s.notes && rnd() < 0.3 ? pick(s.notes) : '',
      });
      const count = 1 + Math.floor(rnd() * 4);
      for (let k = 0; k < count; k++) points.push(demoPoint(area.no, ++tagNo, lineNumber, pick, rnd()));
    }
  }
  return { lines, points };
}

function demoPoint(areaNo: number, tagNo: number, lineNumber: string, pick: <T>(xs: readonly T[]) => T, roll: number): DemoPoint {
  const id = String(tagNo).padStart(4, '0');
  if (roll < 0.7) return { tag: `HV-${areaNo / 100}${id}`, line_number: lineNumber, kind: 'valve', normal_position: roll < 0.6 ? 'open' : 'closed', notes: pick(POINT_NOTES) };
  if (roll < 0.88) return { tag: `SB-${areaNo / 100}${id}`, line_number: lineNumber, kind: 'blind', normal_position: roll < 0.84 ? 'removed' : 'installed', notes: pick(POINT_NOTES) };
  return { tag: `SP-${areaNo / 100}${id}`, line_number: lineNumber, kind: 'disconnect', normal_position: 'connected', notes: 'Removable spool' };
}

export function toCsv(rows: object[]): string {
  return Papa.unparse(rows, { delimiter: ',', newline: '\n', escapeFormulae: true }) + '\n';
}

/**
 * docs/sample-lines.csv and docs/sample-isolation-points.csv: against a fresh demo plant a
 * planner sees unchanged, changed and new rows, and no rejected ones.
 */
export function sampleFiles(): { lines: string; points: string } {
  const { lines, points } = demoPlant();
  const byNumber = new Map(lines.map((l) => [l.line_number, l]));
  const same = ['100-SA-001', '100-HY-002', '200-NA-001', '300-RW-001', '300-CW-002', '400-RO-001', '400-UPW-003', '500-EF-001'].map((n) => byNumber.get(n)!);
  const changed: DemoLine[] = [
    { ...byNumber.get('100-HCL-003')!, design_pressure_psi: '100', notes: 'Re-rated after the 2026 survey' },
    { ...byNumber.get('200-BR-002')!, nominal_size: '4', drawing: 'MRW-P&ID-201-04' },
    { ...byNumber.get('400-HUPW-002')!, design_temperature_f: '170', notes: 'Expansion loops; check supports when hot' },
    { ...byNumber.get('500-AD-001')!, material: 'CPVC', schedule: '80', notes: 'Replaced like for like, spool 3' },
  ];
  const added: DemoLine[] = [
    { line_number: '100-SA-011', area: '100 Acid dosing', service: 'Sulphuric acid 93%', material: 'CPVC', schedule: '80', nominal_size: '1', design_pressure_psi: '150', design_temperature_f: '80', drawing: 'MRW-P&ID-104-02', notes: 'New dosing skid, pump P-104C' },
    { line_number: '100-HY-011', area: '100 Acid dosing', service: 'Sodium hypochlorite 12.5%', material: 'PVC', schedule: '80', nominal_size: '3/4', design_pressure_psi: '100', design_temperature_f: '75', drawing: 'MRW-P&ID-104-03', notes: 'Vented ball valves only' },
    { line_number: '200-NA-011', area: '200 Caustic & brine', service: 'Sodium hydroxide 50%', material: 'CPVC', schedule: '80', nominal_size: '1-1/2', design_pressure_psi: '150', design_temperature_f: '140', drawing: 'MRW-P&ID-204-01', notes: 'Heat traced and insulated' },
    { line_number: '300-FC-008', area: '300 Water treatment', service: 'Ferric chloride 40%', material: 'PVC', schedule: '80', nominal_size: '1', design_pressure_psi: '100', design_temperature_f: '70', drawing: 'MRW-P&ID-305-01', notes: '' },
    { line_number: '300-RW-008', area: '300 Water treatment', service: 'Raw water', material: 'PVC', schedule: 'SDR 21', nominal_size: '16', design_pressure_psi: '100', design_temperature_f: '60', drawing: 'MRW-P&ID-305-02', notes: 'Intake header extension' },
    { line_number: '400-RO-009', area: '400 Ultrapure water', service: 'RO permeate', material: 'PVC', schedule: '80', nominal_size: '2-1/2', design_pressure_psi: '150', design_temperature_f: '77', drawing: 'MRW-P&ID-405-01', notes: '' },
    { line_number: '500-CWR-008', area: '500 Effluent', service: 'Cooling water return', material: 'ABS', schedule: '40', nominal_size: '6', design_pressure_psi: '50', design_temperature_f: '120', drawing: 'MRW-P&ID-504-02', notes: '' },
    { line_number: '500-EV-008', area: '500 Effluent', service: 'Effluent tank vent', material: 'ABS', schedule: '40', nominal_size: '3', design_pressure_psi: '5', design_temperature_f: '90', drawing: 'MRW-P&ID-504-03', notes: 'Goes to the scrubber' },
  ];
  const pointsOn = (n: string) => points.filter((p) => p.line_number === n);
  const samplePoints: DemoPoint[] = [
    ...pointsOn('100-SA-001'),
    ...pointsOn('300-RW-001').map((p) => (p.kind === 'valve' && p.normal_position === 'open' ? { ...p, normal_position: 'closed', notes: 'Closed while the intake screen is rebuilt' } : p)),
    { tag: 'HV-10901', line_number: '100-HY-002', kind: 'valve', normal_position: 'open', notes: 'New vented ball valve at the day tank' },
    { tag: 'SB-20901', line_number: '200-NA-001', kind: 'blind', normal_position: 'removed', notes: 'Spectacle blind at the caustic tank outlet' },
    { tag: 'SP-40901', line_number: '400-RO-001', kind: 'disconnect', normal_position: 'connected', notes: 'Removable spool at the RO skid' },
  ];
  return { lines: toCsv([...same, ...changed, ...added]), points: toCsv(samplePoints) };
}
