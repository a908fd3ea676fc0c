// Checking one register row and comparing it with the register. Pure: no database, no clock.
// Every problem names the column as the planner headed it and says what to do.

import {
  fToC, maxServiceTemperatureF, nominalSizeLabel, parseNominalSize, parsePipeMaterial, parsePressure, parseTemperature, unknownSizeReason,
} from '@shared/trade';
import { ISOLATION_KINDS, ISOLATION_POSITIONS, type IsolationKind, type PipeMaterial } from '@shared/schemas/lines';
import type { RegisterLine, RegisterPoint } from '@server/db/queries/line-imports';
import type { RawRow } from './data-rows';
import type { Columns, LineField, PointField, PressureUnit, TemperatureUnit } from './register-csv';

export interface Problem {
  column: string;
  message: string;
}

/** A checked lines row: the register's own line fields (as the preview reads them from the register). */
export type LineValues = RegisterLine;

/** A checked isolation-points row, in the register's own fields. */
export type PointValues = RegisterPoint;

export type Checked<V> = { ok: true; values: V } | { ok: false; problems: Problem[] };

/** Collects one row's problems; a problem names the column as the file heads it. */
class RowCheck<F extends string> {
  problems: Problem[] = [];
  constructor(private cells: RawRow<F>, readonly cols: Columns<F>) {}

  problem(field: F, message: string): null {
    this.problems.push({ column: this.cols.header[field] ?? field, message });
    return null;
  }
  text(field: F, what: string, max: number, required: boolean): string | null {
    const v = this.cells[field] ?? '';
    if (v === '') return required ? this.problem(field, `Missing value: every row needs ${what}.`) : null;
    if (v.length > max) return this.problem(field, `Too long: ${v.length} characters, at most ${max}.`);
    return v;
  }
  /** A required cell read by `reader` (at most 30 characters: codes and numbers). */
  read<T>(field: F, what: string, reader: (v: string) => Cell<T>): T | null {
    const v = this.text(field, what, 30, true);
    if (v === null) return null;
    const r = reader(v);
    return r.ok ? r.value : this.problem(field, r.message);
  }
  raw(field: F): string {
    return this.cells[field] ?? '';
  }
  /** What reading the row found: a stray quote, cells beyond the header, values without a column, unreadable characters. */
  shape(): void {
    const cells = this.cells;
    if (cells.__quote) this.problems.push({ column: cells.__quote.column, message: QUOTE_MESSAGES[cells.__quote.kind] });
    if (cells.__extra) {
      this.problems.push({ column: '(row)', message: `This row has ${cells.__extra} cell(s) more than the header; is there a comma in a value that needs quotes?` });
    }
    if (cells.__unnamed) {
      for (const v of cells.__unnamed) this.problems.push({ column: '(unnamed)', message: `"${v}" is in a column without a name; name the column or remove the value.` });
    }
    if (cells.__unreadable) for (const field of cells.__unreadable) this.problem(field, UNREADABLE);
  }
  /** A key (line number, tag) a spreadsheet would take for a formula is refused: it could never be exported safely. */
  key(field: F, v: string | null): string | null {
    return v !== null && FORMULA_LEAD.test(v) ? this.problem(field, `"${v}" begins with ${leadName(v)}, which a spreadsheet takes for the start of a formula; a line number or tag may not begin with =, +, -, @, a tab or a line break.`) : v;
  }
}

/** What a spreadsheet takes for the start of a formula (the export puts an apostrophe before these). */
const FORMULA_LEAD = /^[=+\-@\t\r\n]/;
const leadName = (v: string) => ({ '\t': 'a tab', '\r': 'a line break', '\n': 'a line break' })[v[0]!] ?? `"${v[0]}"`;

const QUOTE_MESSAGES = {
  unclosed:
    'A quote (") at the start of this cell is never closed on its row, so the rows below would run into this cell; the row is skipped and the rows below are read on their own. Close the quote (or remove it) and upload again.',
  'text-after': 'Text follows the quote (") that closes this cell. Put the whole cell in quotes and write each quote inside it twice (""), as a spreadsheet does.',
} as const;

const UNREADABLE =
  'This cell holds a character that could not be read (shown as "\uFFFD"): the file has a byte that stands for no character in its encoding. Retype the cell, or save the file as "CSV UTF-8", and upload again.';

const round1 = (v: number) => Math.round(v * 10) / 10;
const fmt = (v: number) => String(round1(v));

/** What one cell says: a value, or why it cannot be read. Pure in the cell's text. */
type Cell<T> = { ok: true; value: T } | { ok: false; message: string };
const fail = (message: string): Cell<never> => ({ ok: false, message });

/**
 * Register files repeat the same few materials, sizes and ratings on every row, so each
 * column's reader remembers what it made of a text (per file; bounded).
 */
function remembered<T>(read: (v: string) => Cell<T>): (v: string) => Cell<T> {
  const seen = new Map<string, Cell<T>>();
  return (v) => {
    let r = seen.get(v);
    if (!r) {
      r = read(v);
      if (seen.size < 5000) seen.set(v, r);
    }
    return r;
  };
}

function readMaterial(v: string): Cell<PipeMaterial> {
  const m = parsePipeMaterial(v);
  return m ? { ok: true, value: m } : fail(`"${v}" is not a material the register takes (PVC, CPVC or ABS).`);
}

function readSchedule(v: string): Cell<{ schedule: string | null; sdr: number | null }> {
  const sch = /^(?:sch(?:edule)?\.?\s*)?(40|80)$/i.exec(v);
  if (sch) return { ok: true, value: { schedule: sch[1]!, sdr: null } };
  const sdr = /^(?:sdr|dr)\s*-?\s*(\d+(?:\.\d+)?)$/i.exec(v);
  if (sdr) return Number(sdr[1]) > 2 ? { ok: true, value: { schedule: null, sdr: Number(sdr[1]) } } : fail(`SDR ${sdr[1]} is not possible; an SDR is greater than 2.`);
  return fail(`"${v}" is not a schedule the register takes: write 40, 80, "Sch 40", "Sch 80" or an SDR such as "SDR 21".`);
}

function readSize(v: string): Cell<{ nominalSize: string; nominalSizeIn: number }> {
  const inches = parseNominalSize(v);
  const label = inches === null ? null : nominalSizeLabel(inches);
  return inches !== null && label ? { ok: true, value: { nominalSize: label, nominalSizeIn: inches } } : fail(unknownSizeReason(v));
}

const notANumber = (reason: string, unit: string) => (/^"/.test(reason) ? `${reason.replace(/\.$/, '')}: give a number of ${unit}.` : reason);

const pressureReader = (unit: PressureUnit) => (v: string): Cell<number> => {
  const r = parsePressure(v, unit);
  if (!r.ok) return fail(notANumber(r.reason, unit));
  if (r.unit !== unit) return fail(`"${v}" is in ${r.unit}, but this column is in ${unit}. Give the value in ${unit} (or, if the whole column is in ${r.unit}, head it design_pressure_${r.unit.toLowerCase()}).`);
  return { ok: true, value: round1(r.psi) };
};

const temperatureReader = (unit: TemperatureUnit) => (v: string): Cell<{ f: number; said: string }> => {
  const r = parseTemperature(v, unit);
  if (!r.ok) return fail(notANumber(r.reason, `°${unit}`));
  if (r.unit !== `°${unit}`) return fail(`"${v}" is in ${r.unit}, but this column is in °${unit}. Give the value in °${unit} (or, if the whole column is in ${r.unit}, head it design_temperature_${r.unit.slice(1).toLowerCase()}).`);
  const f = round1(r.temperatureF);
  return { ok: true, value: { f, said: unit === 'C' ? `${fmt(r.value)} °C (${fmt(f)} °F)` : `${fmt(f)} °F` } };
};

function aboveLimit(material: PipeMaterial, t: { f: number; said: string }): string | null {
  const max = maxServiceTemperatureF(material);
  return t.f > max ? `${t.said} is above ${material}'s maximum service temperature of ${max} °F (${fmt(fToC(max))} °C); check the temperature or the material.` : null;
}

/** Builds the checker for one lines file; every problem in a row is reported, not only the first. */
export function lineRowChecker(cols: Columns<LineField>): (cells: RawRow<LineField>) => Checked<LineValues> {
  const material = remembered(readMaterial);
  const schedule = remembered(readSchedule);
  const size = remembered(readSize);
  const pressure = remembered(pressureReader(cols.pressureUnit));
  const temperature = remembered(temperatureReader(cols.temperatureUnit));
  return (cells) => {
    const check = new RowCheck(cells, cols);
    check.shape();
    const lineNumber = check.key('lineNumber', check.text('lineNumber', 'a line number', 100, true));
    const area = check.text('area', 'an area', 200, true);
    const service = check.text('service', 'a service', 200, true);
    const mat = check.read('material', 'a material', material);
    const sch = check.read('schedule', 'a schedule or SDR', schedule);
    const sz = check.read('nominalSize', 'a nominal size', size);
    const psi = check.read('designPressurePsi', 'a design pressure', pressure);
    const temp = check.read('designTemperatureF', 'a design temperature', temperature);
    const tooHot = mat && temp ? aboveLimit(mat, temp) : null;
    if (tooHot) check.problem('designTemperatureF', tooHot);
    const drawingRef = check.text('drawingRef', 'a drawing', 200, false);
    const notes = check.text('notes', 'notes', 2000, false);
    if (check.problems.length) return { ok: false, problems: check.problems };
    return {
      ok: true,
      values: {
        lineNumber: lineNumber!, area: area!, service: service!, material: mat!, schedule: sch!.schedule, sdr: sch!.sdr,
        nominalSize: sz!.nominalSize, nominalSizeIn: sz!.nominalSizeIn, designPressurePsi: psi!, designTemperatureF: temp!.f, drawingRef, notes,
      },
    };
  };
}

/** Checks one isolation-points row; whether its line is in the register is the preview's question. */
export function checkPointRow(cells: RawRow<PointField>, cols: Columns<PointField>): Checked<PointValues> {
  const check = new RowCheck(cells, cols);
  check.shape();
  const tag = check.key('tag', check.text('tag', 'a tag', 100, true));
  const lineNumber = check.key('lineNumber', check.text('lineNumber', 'a line number', 100, true));
  const kindText = check.text('kind', 'a kind (valve, blind or disconnect)', 20, true)?.toLowerCase() ?? null;
  const kind = kindText === null ? null : (ISOLATION_KINDS as readonly string[]).includes(kindText) ? (kindText as IsolationKind) : check.problem('kind', `"${check.raw('kind')}" is not a kind of isolation point (valve, blind or disconnect).`);
  const position = check.text('normalPosition', 'a normal position', 30, true)?.toLowerCase() ?? null;
  if (kind && position !== null && !ISOLATION_POSITIONS[kind].includes(position)) {
    check.problem('normalPosition', `A ${kind} stands ${ISOLATION_POSITIONS[kind].join(' or ')}; "${check.raw('normalPosition')}" is not one of them.`);
  }
  const notes = check.text('notes', 'notes', 2000, false);
  if (check.problems.length) return { ok: false, problems: check.problems };
  return { ok: true, values: { tag: tag!, lineNumber: lineNumber!, kind: kind!, normalPosition: position!, notes } };
}

export type Changes = Record<string, { from: unknown; to: unknown }>;

const same = (a: unknown, b: unknown) =>
  typeof a === 'number' && typeof b === 'number' ? Math.abs(a - b) < 0.005 : (a ?? null) === (b ?? null);

/** The fields that differ; `fields` are the ones the file carries (an absent optional column changes nothing). */
export function diffValues<V extends object>(existing: V, incoming: V, fields: readonly (keyof V & string)[]): Changes {
  const changes: Changes = {};
  for (const f of fields) {
    if (!same(existing[f], incoming[f])) changes[f] = { from: existing[f] ?? null, to: incoming[f] ?? null };
  }
  return changes;
}

/** Fields of a line compared in a preview; drawing and notes only when the file has their columns. */
export function lineDiffFields(cols: Columns<LineField>): (keyof LineValues & string)[] {
  const fields: (keyof LineValues & string)[] = ['area', 'service', 'material', 'schedule', 'sdr', 'nominalSize', 'designPressurePsi', 'designTemperatureF'];
  if (cols.header.drawingRef) fields.push('drawingRef');
  if (cols.header.notes) fields.push('notes');
  return fields;
}

export function pointDiffFields(cols: Columns<PointField>): (keyof PointValues & string)[] {
  return cols.header.notes ? ['lineNumber', 'kind', 'normalPosition', 'notes'] : ['lineNumber', 'kind', 'normalPosition'];
}
