// The register files' columns: one table for each kind of file. The importer maps headers and
// checks required columns with it (server/services/line-imports/register-csv.ts), the export
// writes its header from it, and the import page's template, format documentation and preview
// headings read it. A column changed here changes in all of them; README's CSV section says the same.

import type { ImportKind } from './line-imports';
import { ISOLATION_KINDS, ISOLATION_POSITIONS, PIPE_MATERIALS } from './lines';

export type PressureUnit = 'psi' | 'bar' | 'kPa' | 'MPa';
export type TemperatureUnit = 'F' | 'C';

/** The same field headed in another unit; the importer converts it to the column's own unit. */
export interface UnitAlternative {
  column: string;
  unit: PressureUnit | TemperatureUnit;
  /** Other names for this unit's column, accepted and never advertised (design_pressure_barg). */
  aliases?: readonly string[];
  /** false: accepted and in the column list, but not suggested when the column is missing. */
  suggested?: boolean;
}

export interface RegisterColumn<F extends string = string> {
  /** The field of a line or isolation point the column fills, as the API and the preview name it. */
  field: F;
  /** The column's name as written in the file, the export and the template. */
  column: string;
  required: boolean;
  /** Other names accepted for the column, never advertised (nominal_size_in, drawing_ref). */
  aliases?: readonly string[];
  /** The unit of `column`; the value is stored in it. */
  unit?: PressureUnit | TemperatureUnit;
  alternatives?: readonly UnitAlternative[];
  /** A short human name: "the design pressure" in a message, "Line number" as a heading. */
  label: string;
  /** What the import page's documentation says of the column. */
  help: string;
}

const positions = ISOLATION_KINDS.map((k) => `${k}: ${ISOLATION_POSITIONS[k].join('/')}`).join(' · ');
const ANYTHING_ELSE = 'Anything else worth knowing';

/** A lines file's columns, in the order the template and the export write them. */
export const LINE_COLUMNS = [
  { field: 'lineNumber', column: 'line_number', required: true, label: 'line number', help: 'The line’s unique tag. A number already in the register updates that line.' },
  { field: 'area', column: 'area', required: true, label: 'area', help: 'Plant area or unit' },
  { field: 'service', column: 'service', required: true, label: 'service', help: 'The fluid it carries, e.g. “Sodium hypochlorite 12%”' },
  { field: 'material', column: 'material', required: true, label: 'material', help: PIPE_MATERIALS.join(', ') },
  { field: 'schedule', column: 'schedule', required: true, label: 'schedule', help: '40, 80 or an SDR such as “SDR 21”' },
  {
    field: 'nominalSize', column: 'nominal_size', required: true, aliases: ['nominal_size_in'], label: 'nominal size',
    help: 'Nominal size in inches: 1/2, 1-1/4, 2, 24 …',
  },
  {
    field: 'designPressurePsi', column: 'design_pressure_psi', required: true, unit: 'psi', aliases: ['design_pressure_psig'],
    alternatives: [
      { column: 'design_pressure_bar', unit: 'bar', aliases: ['design_pressure_barg'] },
      { column: 'design_pressure_kpa', unit: 'kPa' },
      { column: 'design_pressure_mpa', unit: 'MPa', suggested: false },
    ],
    label: 'design pressure',
    help: 'Design pressure in psi; for another unit head the column design_pressure_bar, _kpa or _mpa',
  },
  {
    field: 'designTemperatureF', column: 'design_temperature_f', required: true, unit: 'F',
    alternatives: [{ column: 'design_temperature_c', unit: 'C' }],
    label: 'design temperature',
    help: 'Design temperature in °F; for °C head it design_temperature_c',
  },
  { field: 'drawingRef', column: 'drawing', required: false, aliases: ['drawing_ref'], label: 'drawing', help: 'Drawing reference' },
  { field: 'notes', column: 'notes', required: false, label: 'notes', help: ANYTHING_ELSE },
] as const satisfies readonly RegisterColumn[];

/** An isolation-points file's columns; its `tag` column is what marks a file as one. */
export const ISOLATION_POINT_COLUMNS = [
  { field: 'tag', column: 'tag', required: true, label: 'tag', help: 'The valve, blind or disconnect’s unique tag' },
  { field: 'lineNumber', column: 'line_number', required: true, label: 'line number', help: 'The line it isolates; the line must be in the register' },
  { field: 'kind', column: 'kind', required: true, label: 'kind', help: ISOLATION_KINDS.join(', ') },
  { field: 'normalPosition', column: 'normal_position', required: true, label: 'normal position', help: positions },
  { field: 'notes', column: 'notes', required: false, label: 'notes', help: ANYTHING_ELSE },
] as const satisfies readonly RegisterColumn[];

export type LineField = (typeof LINE_COLUMNS)[number]['field'];
export type PointField = (typeof ISOLATION_POINT_COLUMNS)[number]['field'];

export const REGISTER_COLUMNS: { lines: readonly RegisterColumn<LineField>[]; 'isolation-points': readonly RegisterColumn<PointField>[] } = {
  lines: LINE_COLUMNS,
  'isolation-points': ISOLATION_POINT_COLUMNS,
};

/** The field a row is known by: re-importing updates lines by line number and points by tag. */
export const REGISTER_KEY_FIELD = { lines: 'lineNumber', 'isolation-points': 'tag' } as const satisfies {
  lines: LineField;
  'isolation-points': PointField;
};

/** The header row the template and the export write (and the tests' files use). */
export const LINE_CSV_COLUMNS: readonly string[] = LINE_COLUMNS.map((c) => c.column);
export const ISOLATION_POINT_CSV_COLUMNS: readonly string[] = ISOLATION_POINT_COLUMNS.map((c) => c.column);

/** The column a field is written in; undefined for a field no file carries. */
export function columnOf(kind: ImportKind, field: string): RegisterColumn | undefined {
  return (REGISTER_COLUMNS[kind] as readonly RegisterColumn[]).find((c) => c.field === field);
}

/** The columns as a message lists them: "…, design_pressure_psi (or _bar, _kpa, _mpa), …". */
export function columnList(kind: ImportKind): string {
  return REGISTER_COLUMNS[kind]
    .map((c) => (c.alternatives ? `${c.column} (or ${c.alternatives.map((a) => a.column.slice(a.column.lastIndexOf('_'))).join(', ')})` : c.column))
    .join(', ');
}
