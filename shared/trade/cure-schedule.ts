// Set and cure time of a solvent-cemented joint from a published schedule (cure-tables.ts).
// Rules on top of the table [practice]:
// - temperature on a band edge takes the colder band (60 °F → 40–60, 40 °F → 0–40); 100 °F is
//   in 60–100; above 100 °F or below 0 °F there is no published value → refused;
// - pressure exactly on an edge between columns takes the higher column (160 psi → 160–370);
//   the top of the highest column is inclusive (370 psi is in 160–370); above it → refused;
// - size on a shared edge takes the larger band (15" → 15"+); a size between bands (3-1/2" in
//   schedule B) falls in the next larger band; a size above the table → refused;
// - relative humidity above 60% adds 50% to set and cure, rounded up to whole minutes;
// - nothing is extrapolated: a supervisor may enter an engineering time with a reason.

import {
  CURE_SCHEDULES, DEFAULT_CURE_SCHEDULE_ID, HUMID_ABOVE_PERCENT, HUMID_FACTOR, TEMPERATURE_BANDS,
  type CureScheduleTable, type PressureColumn, type SizeBand, type TemperatureBand,
} from './cure-tables';
import { parseNominalSize, unknownSizeReason } from './nominal-size';
import { parseTabledMaterial } from './pipe-materials';
import { isFiniteNumber, refuse, show, SUPERVISOR_MAY_ENTER, type Refusal } from './result';
import { SOURCES } from './sources';

export interface CureScheduleInput {
  material: string;
  nominalSize: string;
  /** The lowest temperature expected during set and cure, °F. */
  temperatureF: number;
  relativeHumidity: number;
  /** The first and highest pressure the joint will see: the test pressure if it will be tested. */
  pressurePsi: number;
  /** Cure schedule id from listCureSchedules(); default 'A'. */
  schedule?: string;
}

export interface CureScheduleResult {
  ok: true;
  setMinutes: number;
  cureMinutes: number;
  source: string;
  schedule: string;
  temperatureBand: string;
  sizeBand: string;
  pressureBand: string;
  humidityAdjusted: boolean;
}

export function listCureSchedules(): { id: string; name: string; source: string }[] {
  return CURE_SCHEDULES.map(({ id, name, source }) => ({ id, name, source }));
}

export function findCureSchedule(id: unknown): CureScheduleTable | null {
  if (id !== undefined && typeof id !== 'string') return null;
  const wanted = (id ?? DEFAULT_CURE_SCHEDULE_ID).trim().toUpperCase();
  return CURE_SCHEDULES.find((s) => s.id.toUpperCase() === wanted) ?? null;
}

export function temperatureBandFor(temperatureF: number): TemperatureBand | Refusal {
  const warmest = TEMPERATURE_BANDS[0];
  const coldest = TEMPERATURE_BANDS[TEMPERATURE_BANDS.length - 1];
  if (!warmest || !coldest) return refuse('No temperature bands.');
  if (!isFiniteNumber(temperatureF)) return refuse('Cure temperature must be a number (°F).');
  if (temperatureF > warmest.maxF || temperatureF < coldest.minF) {
    const side = temperatureF > warmest.maxF ? 'above the warmest' : 'below the coldest';
    return refuse(
      `Temperature ${temperatureF} °F is ${side} band of the schedule (${coldest.minF}–${warmest.maxF} °F): ` +
        `no published set or cure time. ${SUPERVISOR_MAY_ENTER}`,
    );
  }
  const band = TEMPERATURE_BANDS.find((b) => temperatureF > b.minF && temperatureF <= b.maxF) ?? coldest;
  return band;
}

export function sizeBandFor(table: CureScheduleTable, inches: number): SizeBand | Refusal {
  const band = table.sizeBands.find((b) => inches < b.maxIn || (inches === b.maxIn && b.maxInclusive));
  if (band) return band;
  const last = table.sizeBands[table.sizeBands.length - 1];
  return refuse(
    `Size ${inches}" is outside schedule ${table.id} (largest band ${last?.label ?? 'none'}): ` +
      `no published set or cure time. ${SUPERVISOR_MAY_ENTER}`,
  );
}

export function pressureColumnFor(
  table: CureScheduleTable,
  band: SizeBand,
  pressurePsi: number,
): PressureColumn | Refusal {
  if (!isFiniteNumber(pressurePsi) || pressurePsi < 0) return refuse('Pressure must be a number of psi, 0 or more.');
  const columns = table.cure.filter((c) => c.sizeBand === band.id);
  const last = columns[columns.length - 1];
  const column = columns.find((c) => pressurePsi < c.maxPsi || (c === last && pressurePsi === c.maxPsi));
  if (column) return column;
  return refuse(
    `Pressure ${pressurePsi} psi is above the highest column (${last?.maxPsi ?? 0} psi) for ${band.label} ` +
      `in schedule ${table.id}: no published cure time. ${SUPERVISOR_MAY_ENTER}`,
  );
}

function humid(minutes: number, relativeHumidity: number): number {
  return relativeHumidity > HUMID_ABOVE_PERCENT ? Math.ceil(minutes * HUMID_FACTOR) : minutes;
}

function checkInputs(input: CureScheduleInput): { table: CureScheduleTable; inches: number } | Refusal {
  if (!parseTabledMaterial(input.material)) {
    return refuse(`No published set or cure schedule here for "${show(input.material)}": PVC and CPVC only. ${SUPERVISOR_MAY_ENTER}`);
  }
  const table = findCureSchedule(input.schedule);
  if (!table) return refuse(`Unknown cure schedule "${show(input.schedule)}".`);
  const inches = parseNominalSize(input.nominalSize);
  if (inches === null) return refuse(unknownSizeReason(input.nominalSize));
  const rh = input.relativeHumidity;
  if (!isFiniteNumber(rh) || rh < 0 || rh > 100) return refuse('Relative humidity must be 0–100 %.');
  return { table, inches };
}

export function cureSchedule(input: CureScheduleInput): CureScheduleResult | Refusal {
  const checked = checkInputs(input);
  if ('ok' in checked) return checked;
  const { table, inches } = checked;
  const temp = temperatureBandFor(input.temperatureF);
  if ('ok' in temp) return temp;
  const size = sizeBandFor(table, inches);
  if ('ok' in size) return size;
  const column = pressureColumnFor(table, size, input.pressurePsi);
  if ('ok' in column) return column;
  const set = table.set[size.id]?.[temp.id];
  if (set === undefined) return refuse(`Schedule ${table.id} has no set time for ${size.label}.`);
  const humidityAdjusted = input.relativeHumidity > HUMID_ABOVE_PERCENT;
  return {
    ok: true,
    setMinutes: humid(set, input.relativeHumidity),
    cureMinutes: humid(column.minutes[temp.id], input.relativeHumidity),
    source: `${table.source}; ${SOURCES.bandEdges}${humidityAdjusted ? `; ${SOURCES.humidity}` : ''}`,
    schedule: table.id,
    temperatureBand: temp.label,
    sizeBand: size.label,
    pressureBand: column.label,
    humidityAdjusted,
  };
}
