// Reading a register file: text, header, rows. Pure: no database, no clock.
// Two kinds of file share the upload; a `tag` column makes it an isolation-points file.
// Header names are matched case-insensitively, with spaces, brackets and ° folded, so
// "Design Pressure (psi)" reads as design_pressure_psi. Units live in the header.

import Papa from 'papaparse';
import { AppError } from '@server/errors';
import type { ImportKind } from '@shared/schemas/line-imports';

export type PressureUnit = 'psi' | 'bar' | 'kPa' | 'MPa';
export type TemperatureUnit = 'F' | 'C';

export type LineField =
  | 'lineNumber' | 'area' | 'service' | 'material' | 'schedule' | 'nominalSize'
  | 'designPressure' | 'designTemperature' | 'drawingRef' | 'notes';
export type PointField = 'tag' | 'lineNumber' | 'kind' | 'normalPosition' | 'notes';

interface HeaderSpec<F extends string> {
  field: F;
  unit?: PressureUnit | TemperatureUnit;
}

const LINE_HEADERS: Record<string, HeaderSpec<LineField>> = {
  line_number: { field: 'lineNumber' },
  area: { field: 'area' },
  service: { field: 'service' },
  material: { field: 'material' },
  schedule: { field: 'schedule' },
  nominal_size: { field: 'nominalSize' },
  nominal_size_in: { field: 'nominalSize' },
  design_pressure_psi: { field: 'designPressure', unit: 'psi' },
  design_pressure_psig: { field: 'designPressure', unit: 'psi' },
  design_pressure_bar: { field: 'designPressure', unit: 'bar' },
  design_pressure_barg: { field: 'designPressure', unit: 'bar' },
  design_pressure_kpa: { field: 'designPressure', unit: 'kPa' },
  design_pressure_mpa: { field: 'designPressure', unit: 'MPa' },
  design_temperature_f: { field: 'designTemperature', unit: 'F' },
  design_temperature_c: { field: 'designTemperature', unit: 'C' },
  drawing: { field: 'drawingRef' },
  drawing_ref: { field: 'drawingRef' },
  notes: { field: 'notes' },
};
const LINE_REQUIRED: LineField[] = ['lineNumber', 'area', 'service', 'material', 'schedule', 'nominalSize', 'designPressure', 'designTemperature'];

const POINT_HEADERS: Record<string, HeaderSpec<PointField>> = {
  tag: { field: 'tag' },
  line_number: { field: 'lineNumber' },
  kind: { field: 'kind' },
  normal_position: { field: 'normalPosition' },
  notes: { field: 'notes' },
};
const POINT_REQUIRED: PointField[] = ['tag', 'lineNumber', 'kind', 'normalPosition'];

/** How each field is headed in this file: the planner's own header text and the unit it names. */
export interface Columns<F extends string> {
  kind: ImportKind;
  header: Partial<Record<F, string>>;
  pressureUnit: PressureUnit;
  temperatureUnit: TemperatureUnit;
  /** Fields by position in the file; null for a column without a name (ignored). */
  byIndex: (F | null)[];
}
export type AnyColumns = Columns<LineField> | Columns<PointField>;

export const LINES_HEADER_HELP =
  'line_number, area, service, material, schedule, nominal_size, design_pressure_psi (or _bar, _kpa, _mpa), ' +
  'design_temperature_f (or _c), drawing, notes';
export const POINTS_HEADER_HELP = 'tag, line_number, kind, normal_position, notes';

export function normaliseHeader(raw: string): string {
  return raw
    .replace(/^\uFEFF/, '')
    .trim()
    .toLowerCase()
    .replace(/°/g, '')
    .replace(/[^a-z0-9]+/g, '_')
    .replace(/^_+|_+$/g, '');
}

/** Decodes an upload: UTF-8 (BOM dropped), or Windows-1252 when the bytes are not UTF-8. */
export function decodeCsv(buffer: Buffer): string {
  if (buffer.includes(0)) throw AppError.badRequest('This file is not a text CSV file (it holds binary data). Save it from the spreadsheet as "CSV".');
  let text: string;
  try {
    text = new TextDecoder('utf-8', { fatal: true }).decode(buffer);
  } catch {
    text = new TextDecoder('windows-1252').decode(buffer);
  }
  return text.replace(/^\uFEFF/, '');
}

function refuseHeader(message: string): never {
  throw AppError.badRequest(message, { file: [message] });
}

/** Reads the header row, decides the kind of file and maps each column; refuses the whole file when it cannot. */
export function readColumns(text: string): AnyColumns {
  const first = Papa.parse<string[]>(text, { delimiter: ',', preview: 1, skipEmptyLines: 'greedy' }).data[0] ?? [];
  const names = first.map(normaliseHeader);
  if (names.every((n) => n === '')) refuseHeader(`The file is empty. The first row must name the columns: ${LINES_HEADER_HELP}.`);
  const kind: ImportKind = names.includes('tag') ? 'isolation-points' : 'lines';
  return kind === 'lines'
    ? mapColumns<LineField>(kind, first, names, LINE_HEADERS, LINE_REQUIRED, LINES_HEADER_HELP)
    : mapColumns<PointField>(kind, first, names, POINT_HEADERS, POINT_REQUIRED, POINTS_HEADER_HELP);
}

function mapColumns<F extends string>(
  kind: ImportKind, raw: string[], names: string[], known: Record<string, HeaderSpec<F>>, required: F[], help: string,
): Columns<F> {
  const what = kind === 'lines' ? 'A lines file' : 'An isolation-points file';
  const cols: Columns<F> = { kind, header: {}, pressureUnit: 'psi', temperatureUnit: 'F', byIndex: [] };
  names.forEach((name, i) => {
    const spec = known[name];
    const shown = (raw[i] ?? '').replace(/^\uFEFF/, '').trim();
    if (name === '') return void cols.byIndex.push(null);
    if (!spec) refuseHeader(`The column "${shown}" is not one Linewright knows. ${what} has the columns ${help}. Rename or remove it and upload again.`);
    const earlier = cols.header[spec.field];
    if (earlier) refuseHeader(`The columns "${earlier}" and "${shown}" both give the ${describeField(spec.field)}; keep one of them.`);
    cols.header[spec.field] = shown;
    if (spec.field === 'designPressure') cols.pressureUnit = spec.unit as PressureUnit;
    if (spec.field === 'designTemperature') cols.temperatureUnit = spec.unit as TemperatureUnit;
    cols.byIndex.push(spec.field);
  });
  const missing = required.filter((f) => !cols.header[f]);
  if (missing.length) {
    const list = missing.map((f) => headerExample(f)).join(', ');
    refuseHeader(`${what} needs the column${missing.length > 1 ? 's' : ''} ${list}; the file does not have ${missing.length > 1 ? 'them' : 'it'}. Columns: ${help}.`);
  }
  return cols;
}

function describeField(field: string): string {
  return field === 'designPressure' ? 'design pressure' : field === 'designTemperature' ? 'design temperature' : field;
}

function headerExample(field: string): string {
  if (field === 'designPressure') return 'design_pressure_psi (or design_pressure_bar, design_pressure_kpa)';
  if (field === 'designTemperature') return 'design_temperature_f (or design_temperature_c)';
  return field.replace(/[A-Z]/g, (c) => `_${c.toLowerCase()}`);
}

export type RawRow<F extends string> = Partial<Record<F, string>> & { __parsed_extra?: string[] };

/** The data rows, keyed by field; row numbers count the header as row 1 (blank lines are skipped). */
export function readRows<F extends string>(text: string, cols: Columns<F>): { rowNumber: number; cells: RawRow<F> }[] {
  const parsed = Papa.parse<RawRow<F>>(text, {
    delimiter: ',',
    header: true,
    skipEmptyLines: 'greedy',
    transformHeader: (_h, i) => cols.byIndex[i] ?? `__unnamed_${i}`,
    transform: (v) => v.trim(),
  });
  return parsed.data.map((cells, i) => ({ rowNumber: i + 2, cells }));
}

/** Counts rows cheaply (an upper bound: line breaks), to decide between inline and the queue. */
export function estimateRows(text: string): number {
  let n = 0;
  for (let i = text.indexOf('\n'); i !== -1; i = text.indexOf('\n', i + 1)) n++;
  return text.endsWith('\n') ? n - 1 : n;
}

/** True when the file has at least one data row after the header. */
export function hasDataRows(text: string): boolean {
  return Papa.parse(text, { delimiter: ',', preview: 2, skipEmptyLines: 'greedy' }).data.length > 1;
}
