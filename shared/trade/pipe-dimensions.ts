// ASTM D1785, Sch 40 and Sch 80 table [pub]: OD and minimum wall in inches, working pressure
// in psi for water at 73 °F, non-shock. ASTM F441 (CPVC) uses the same IPS sizes and
// 73 °F ratings [pub]. The printed ratings are looked up, not recomputed: the table is not a
// plain rounding of the ISO equation (3" Sch 80 computes 375 and prints 370).

import type { PipeSchedule } from './result';
import { nominalSizeLabel, parseNominalSize, type NominalSize } from './nominal-size';

export interface PipeRow {
  size: NominalSize;
  odIn: number;
  sch40WallIn: number;
  sch40Psi: number;
  sch80WallIn: number;
  sch80Psi: number;
}

type Cells = [NominalSize, number, number, number, number, number];

// NPS, OD, Sch 40 wall, Sch 40 WP, Sch 80 wall, Sch 80 WP — ASTM D1785 table [pub]
const CELLS: readonly Cells[] = [
  ['1/2', 0.84, 0.109, 600, 0.147, 850],
  ['3/4', 1.05, 0.113, 480, 0.154, 690],
  ['1', 1.315, 0.133, 450, 0.179, 630],
  ['1-1/4', 1.66, 0.14, 370, 0.191, 520],
  ['1-1/2', 1.9, 0.145, 330, 0.2, 470],
  ['2', 2.375, 0.154, 280, 0.218, 400],
  ['2-1/2', 2.875, 0.203, 300, 0.276, 420],
  ['3', 3.5, 0.216, 260, 0.3, 370],
  ['3-1/2', 4.0, 0.226, 240, 0.318, 350],
  ['4', 4.5, 0.237, 220, 0.337, 320],
  ['5', 5.563, 0.258, 190, 0.375, 290],
  ['6', 6.625, 0.28, 180, 0.432, 280],
  ['8', 8.625, 0.322, 160, 0.5, 250],
  ['10', 10.75, 0.365, 140, 0.593, 230],
  ['12', 12.75, 0.406, 130, 0.687, 230],
  ['14', 14.0, 0.437, 130, 0.75, 220],
  ['16', 16.0, 0.5, 130, 0.843, 220],
  ['18', 18.0, 0.562, 130, 0.937, 220],
  ['20', 20.0, 0.593, 120, 1.031, 220],
  ['24', 24.0, 0.687, 120, 1.218, 210],
];

export const IPS_PIPE_TABLE: readonly PipeRow[] = CELLS.map(
  ([size, odIn, sch40WallIn, sch40Psi, sch80WallIn, sch80Psi]) => ({
    size, odIn, sch40WallIn, sch40Psi, sch80WallIn, sch80Psi,
  }),
);

export function pipeRow(nominalSize: unknown): PipeRow | null {
  const inches = parseNominalSize(nominalSize);
  const label = inches === null ? null : nominalSizeLabel(inches);
  return IPS_PIPE_TABLE.find((row) => row.size === label) ?? null;
}

export function wallAndRating(row: PipeRow, schedule: PipeSchedule): { wallIn: number; psi: number } {
  return schedule === 40
    ? { wallIn: row.sch40WallIn, psi: row.sch40Psi }
    : { wallIn: row.sch80WallIn, psi: row.sch80Psi };
}
