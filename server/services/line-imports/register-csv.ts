// Reading a register file: text, header, rows. Pure: no database, no clock.
// Two kinds of file share the upload; a `tag` column makes it an isolation-points file.
// Header names are matched case-insensitively, with spaces, brackets and ° folded, so
// "Design Pressure (psi)" reads as design_pressure_psi. Units live in the header. Which columns
// there are, and their other names and units, is shared/schemas/register-columns.ts.

import { AppError } from '@server/errors';
import type { ImportKind } from '@shared/schemas/line-imports';
import {
  columnList, REGISTER_COLUMNS, REGISTER_KEY_FIELD, type LineField, type PointField, type PressureUnit, type RegisterColumn,
  type TemperatureUnit,
} from '@shared/schemas/register-columns';
import { countFilledLines, csvRecords, isBlank, type CsvRecord } from './csv-text';

export type { LineField, PointField, PressureUnit, TemperatureUnit };

interface HeaderSpec<F extends string> {
  column: RegisterColumn<F>;
  unit?: PressureUnit | TemperatureUnit;
}

/** Every header name the importer accepts, from the shared column table: names, aliases, other units. */
function acceptedHeaders<F extends string>(columns: readonly RegisterColumn<F>[]): ReadonlyMap<string, HeaderSpec<F>> {
  const known = new Map<string, HeaderSpec<F>>();
  for (const column of columns) {
    for (const name of [column.column, ...(column.aliases ?? [])]) known.set(name, { column, unit: column.unit });
    for (const alt of column.alternatives ?? []) {
      for (const name of [alt.column, ...(alt.aliases ?? [])]) known.set(name, { column, unit: alt.unit });
    }
  }
  return known;
}

const LINE_HEADERS = acceptedHeaders(REGISTER_COLUMNS.lines);
const POINT_HEADERS = acceptedHeaders(REGISTER_COLUMNS['isolation-points']);
const POINTS_MARK = REGISTER_COLUMNS['isolation-points'].find((c) => c.field === REGISTER_KEY_FIELD['isolation-points'])!.column;

/** How each field is headed in this file: the planner's own header text and the unit it names. */
export interface Columns<F extends string> {
  kind: ImportKind;
  header: Partial<Record<F, string>>;
  pressureUnit: PressureUnit;
  temperatureUnit: TemperatureUnit;
  /** Fields by position in the file; null for a column without a name (ignored). */
  byIndex: (F | null)[];
  /** The header's row number, and where the first record after it starts in the text. */
  headerRow: number;
  dataStart: number;
}
export type AnyColumns = Columns<LineField> | Columns<PointField>;

export function normaliseHeader(raw: string): string {
  return raw
    .replace(/^\uFEFF/, '')
    .trim()
    .toLowerCase()
    .replace(/°/g, '')
    .replace(/[^a-z0-9]+/g, '_')
    .replace(/^_+|_+$/g, '');
}

function refuseHeader(message: string): never {
  throw AppError.badRequest(message, { file: [message] });
}

/** Reads the header row (the first row that is not blank), decides the kind of file and maps each column; refuses the whole file when it cannot. */
export function readColumns(text: string): AnyColumns {
  let header: CsvRecord | null = null;
  for (const record of csvRecords(text)) {
    if (!isBlank(record.cells)) {
      header = record;
      break;
    }
  }
  if (!header) refuseHeader(`The file is empty. The first row must name the columns: ${columnList('lines')}.`);
  if (header.quote) {
    refuseHeader(`The header (row ${header.row}) has a quote (") that is not closed where its column name ends; correct the column names and upload again.`);
  }
  const first = header.cells;
  const names = first.map(normaliseHeader);
  const kind: ImportKind = names.includes(POINTS_MARK) ? 'isolation-points' : 'lines';
  const at = { headerRow: header.row, dataStart: header.next };
  return kind === 'lines'
    ? mapColumns<LineField>(kind, first, names, LINE_HEADERS, REGISTER_COLUMNS.lines, at)
    : mapColumns<PointField>(kind, first, names, POINT_HEADERS, REGISTER_COLUMNS['isolation-points'], at);
}

function mapColumns<F extends string>(
  kind: ImportKind, raw: string[], names: string[], known: ReadonlyMap<string, HeaderSpec<F>>, columns: readonly RegisterColumn<F>[],
  at: { headerRow: number; dataStart: number },
): Columns<F> {
  const what = kind === 'lines' ? 'A lines file' : 'An isolation-points file';
  const help = columnList(kind);
  const cols: Columns<F> = { kind, header: {}, pressureUnit: 'psi', temperatureUnit: 'F', byIndex: [], ...at };
  names.forEach((name, i) => {
    const spec = known.get(name);
    const shown = (raw[i] ?? '').replace(/^\uFEFF/, '').trim();
    if (name === '') return void cols.byIndex.push(null);
    if (!spec) refuseHeader(`The column "${shown}" is not one Linewright knows. ${what} has the columns ${help}. Rename or remove it and upload again.`);
    const { field } = spec.column;
    const earlier = cols.header[field];
    if (earlier) refuseHeader(`The columns "${earlier}" and "${shown}" both give the ${nameInMessage(spec.column)}; keep one of them.`);
    cols.header[field] = shown;
    if (field === 'designPressurePsi') cols.pressureUnit = spec.unit as PressureUnit;
    if (field === 'designTemperatureF') cols.temperatureUnit = spec.unit as TemperatureUnit;
    cols.byIndex.push(field);
  });
  const missing = columns.filter((c) => c.required && !cols.header[c.field]);
  if (missing.length) {
    const list = missing.map(suggestion).join(', ');
    refuseHeader(`${what} needs the column${missing.length > 1 ? 's' : ''} ${list}; the file does not have ${missing.length > 1 ? 'them' : 'it'}. Columns: ${help}.`);
  }
  return cols;
}

/**
 * What the two-columns-for-one-field message calls the field: its label for a column read in a
 * unit ("the design pressure"); otherwise, as this message always has, the field's own name.
 */
function nameInMessage(column: RegisterColumn): string {
  return column.unit ? column.label : column.field;
}

/** A missing column as the message suggests it: "design_pressure_psi (or design_pressure_bar, design_pressure_kpa)". */
function suggestion(column: RegisterColumn): string {
  const others = (column.alternatives ?? []).filter((a) => a.suggested !== false).map((a) => a.column);
  return others.length ? `${column.column} (or ${others.join(', ')})` : column.column;
}

/** At least as many as the file's data rows (lines with something in them, less the header), to decide between inline and the queue. */
export function estimateRows(text: string): number {
  return Math.max(0, countFilledLines(text) - 1);
}

/** True when the file has at least one data row after the header. */
export function hasDataRows(text: string, cols: AnyColumns): boolean {
  for (const record of csvRecords(text, cols.dataStart, cols.headerRow + 1)) if (!isBlank(record.cells)) return true;
  return false;
}
