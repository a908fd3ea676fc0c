import type { ImportKind } from '@shared/schemas/line-imports';
import { ISOLATION_KINDS, ISOLATION_POSITIONS, PIPE_MATERIALS } from '@shared/schemas/lines';

const positions = ISOLATION_KINDS.map((k) => `${k}: ${ISOLATION_POSITIONS[k].join('/')}`).join(' · ');

export interface TemplateColumn {
  name: string;
  what: string;
  required: boolean;
}

// The importer's column names (server/services/register-csv.ts reads them; units live in the header).
export const TEMPLATE_COLUMNS: Record<ImportKind, TemplateColumn[]> = {
  lines: [
    { name: 'line_number', what: 'The line’s unique tag. A number already in the register updates that line.', required: true },
    { name: 'area', what: 'Plant area or unit', required: true },
    { name: 'service', what: 'The fluid it carries, e.g. “Sodium hypochlorite 12%”', required: true },
    { name: 'material', what: PIPE_MATERIALS.join(', '), required: true },
    { name: 'schedule', what: '40, 80 or an SDR such as “SDR 21”', required: true },
    { name: 'nominal_size', what: 'Nominal size in inches: 1/2, 1-1/4, 2, 24 …', required: true },
    { name: 'design_pressure_psi', what: 'Design pressure in psi; for another unit head the column design_pressure_bar, _kpa or _mpa', required: true },
    { name: 'design_temperature_f', what: 'Design temperature in °F; for °C head it design_temperature_c', required: true },
    { name: 'drawing', what: 'Drawing reference', required: false },
    { name: 'notes', what: 'Anything else worth knowing', required: false },
  ],
  'isolation-points': [
    { name: 'tag', what: 'The valve, blind or disconnect’s unique tag', required: true },
    { name: 'line_number', what: 'The line it isolates; the line must be in the register', required: true },
    { name: 'kind', what: ISOLATION_KINDS.join(', '), required: true },
    { name: 'normal_position', what: positions, required: true },
    { name: 'notes', what: 'Anything else worth knowing', required: false },
  ],
};

export const TEMPLATE_FILENAMES: Record<ImportKind, string> = { lines: 'lines-template.csv', 'isolation-points': 'isolation-points-template.csv' };

/** A header-only CSV, built in the browser, as a link a planner can download and fill in. */
export const templateHref = (kind: ImportKind) =>
  `data:text/csv;charset=utf-8,${encodeURIComponent(TEMPLATE_COLUMNS[kind].map((c) => c.name).join(',') + '\r\n')}`;
