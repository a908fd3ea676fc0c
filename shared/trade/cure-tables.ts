// Set and cure schedules for two-step (primer + cement) PVC and CPVC joints, kept as data.
// Published schedules disagree; each is kept with its source and a plant chooses one.
// Times are minutes. Band edges are resolved in cure-schedule.ts (the longer time wins).

import { SOURCES } from './sources';

export type TemperatureBandId = '60-100' | '40-60' | '0-40';

export interface TemperatureBand {
  id: TemperatureBandId;
  label: string;
  minF: number;
  maxF: number;
}

/** Warm to cold. A temperature on an edge belongs to the colder band (the longer time). */
export const TEMPERATURE_BANDS: readonly TemperatureBand[] = [
  { id: '60-100', label: '60–100 °F', minF: 60, maxF: 100 },
  { id: '40-60', label: '40–60 °F', minF: 40, maxF: 60 },
  { id: '0-40', label: '0–40 °F', minF: 0, maxF: 40 },
];

export type ByTemperature = Readonly<Record<TemperatureBandId, number>>;

export interface SizeBand {
  id: string;
  label: string;
  /** Largest size in the band, inches. */
  maxIn: number;
  /** False where the next band starts at the same size (15"), so the edge goes to the larger band. */
  maxInclusive: boolean;
}

export interface PressureColumn {
  sizeBand: string;
  label: string;
  /** Highest pressure of the column, psi. Exactly on an edge between columns takes the next column. */
  maxPsi: number;
  minutes: ByTemperature;
}

export interface CureScheduleTable {
  id: string;
  name: string;
  source: string;
  sizeBands: readonly SizeBand[];
  set: Readonly<Record<string, ByTemperature>>;
  /** Columns of one size band in rising pressure. */
  cure: readonly PressureColumn[];
}

const H = 60;
const D = 24 * H;
const t = (warm: number, mild: number, cold: number): ByTemperature => ({ '60-100': warm, '40-60': mild, '0-40': cold });

// Schedule A, average initial set and average joint cure — a manufacturer's installation manual [mfr].
// The 160–315 psi upper limit for 1-1/2"–8" is the more common printing; one printing gives
// 160–370 for all three small bands [mfr/memory]. We keep 315: it refuses more, never less.
// "15"+" is taken as up to 24", the largest IPS size.
const SCHEDULE_A: CureScheduleTable = {
  id: 'A',
  name: 'Schedule A: average set and cure (most widely reprinted)',
  source: SOURCES.cureA,
  sizeBands: [
    { id: '1/2-1-1/4', label: '1/2"–1-1/4"', maxIn: 1.25, maxInclusive: true },
    { id: '1-1/2-2', label: '1-1/2"–2"', maxIn: 2, maxInclusive: true },
    { id: '2-1/2-8', label: '2-1/2"–8"', maxIn: 8, maxInclusive: true },
    { id: '10-15', label: '10"–15"', maxIn: 15, maxInclusive: false },
    { id: '15+', label: '15"+', maxIn: 24, maxInclusive: true },
  ],
  set: {
    '1/2-1-1/4': t(2, 5, 10),
    '1-1/2-2': t(5, 10, 15),
    '2-1/2-8': t(30, 2 * H, 12 * H),
    '10-15': t(2 * H, 8 * H, 24 * H),
    '15+': t(4 * H, 16 * H, 48 * H),
  },
  cure: [
    { sizeBand: '1/2-1-1/4', label: '≤160 psi', maxPsi: 160, minutes: t(15, 20, 30) },
    { sizeBand: '1/2-1-1/4', label: '160–370 psi', maxPsi: 370, minutes: t(6 * H, 12 * H, 48 * H) },
    { sizeBand: '1-1/2-2', label: '≤160 psi', maxPsi: 160, minutes: t(30, 45, 1 * H) },
    { sizeBand: '1-1/2-2', label: '160–315 psi', maxPsi: 315, minutes: t(12 * H, 24 * H, 96 * H) },
    { sizeBand: '2-1/2-8', label: '≤160 psi', maxPsi: 160, minutes: t(1.5 * H, 4 * H, 72 * H) },
    { sizeBand: '2-1/2-8', label: '160–315 psi', maxPsi: 315, minutes: t(24 * H, 48 * H, 8 * D) },
    { sizeBand: '10-15', label: '≤100 psi', maxPsi: 100, minutes: t(48 * H, 96 * H, 8 * D) },
    { sizeBand: '15+', label: '≤100 psi', maxPsi: 100, minutes: t(72 * H, 6 * D, 14 * D) },
  ],
};

// Schedule B — a plastics piping technical manual [pub]; cure at RH 60% or less, 50% more above.
// Its columns print "≤180" and ">180"; the trade's edge rule [practice] puts exactly 180 psi
// in the higher column, which is the longer time.
const SCHEDULE_B: CureScheduleTable = {
  id: 'B',
  name: "Schedule B: a handbook's set and cure",
  source: SOURCES.cureB,
  sizeBands: [
    { id: '1/2-1-1/4', label: '1/2"–1-1/4"', maxIn: 1.25, maxInclusive: true },
    { id: '1-1/2-3', label: '1-1/2"–3"', maxIn: 3, maxInclusive: true },
    { id: '4-8', label: '4"–8"', maxIn: 8, maxInclusive: true },
    { id: '10-16', label: '10"–16"', maxIn: 16, maxInclusive: true },
  ],
  set: {
    '1/2-1-1/4': t(15, 1 * H, 3 * H),
    '1-1/2-3': t(30, 2 * H, 6 * H),
    '4-8': t(1 * H, 4 * H, 12 * H),
    '10-16': t(2 * H, 8 * H, 24 * H),
  },
  cure: [
    { sizeBand: '1/2-1-1/4', label: '≤180 psi', maxPsi: 180, minutes: t(1 * H, 2 * H, 8 * H) },
    { sizeBand: '1/2-1-1/4', label: '>180–370 psi', maxPsi: 370, minutes: t(6 * H, 12 * H, 48 * H) },
    { sizeBand: '1-1/2-3', label: '≤180 psi', maxPsi: 180, minutes: t(2 * H, 4 * H, 16 * H) },
    { sizeBand: '1-1/2-3', label: '>180–315 psi', maxPsi: 315, minutes: t(12 * H, 24 * H, 96 * H) },
    { sizeBand: '4-8', label: '≤180 psi', maxPsi: 180, minutes: t(6 * H, 12 * H, 48 * H) },
    { sizeBand: '4-8', label: '>180–315 psi', maxPsi: 315, minutes: t(24 * H, 48 * H, 8 * D) },
    { sizeBand: '10-16', label: '≤100 psi', maxPsi: 100, minutes: t(24 * H, 48 * H, 8 * D) },
  ],
};

export const CURE_SCHEDULES: readonly CureScheduleTable[] = [SCHEDULE_A, SCHEDULE_B];

export const DEFAULT_CURE_SCHEDULE_ID = 'A';

/** Relative humidity above this adds HUMID_FACTOR to set and cure [mfr]. */
export const HUMID_ABOVE_PERCENT = 60;
export const HUMID_FACTOR = 1.5;
