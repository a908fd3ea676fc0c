import Papa from 'papaparse';
import { sequelize } from '@server/db/sequelize';
import { fetchLineExport, openLineExportCursor, type LineAttributes } from '@server/db/queries/lines';
import type { LineExportQuery } from '@shared/schemas/lines';
import { LINE_CSV_COLUMNS } from '@shared/schemas/register-columns';

/** The columns the line importer reads, in its order (the shared column table): an export re-imports unchanged. */
export const LINE_IMPORT_COLUMNS = LINE_CSV_COLUMNS;

export const EXPORT_BATCH = 5000;

/**
 * A text cell starting with one of these is taken for a formula by spreadsheets; papaparse
 * then writes it quoted with a leading apostrophe ('=HYPERLINK(…) stays text). Papaparse's own
 * `escapeFormulae: true` is /^[=+\-@\t\r].*$/, which lacks LF and, since `.` stops at a line
 * break, misses "=1+1\nx" altogether; NUL is added as STACK.md asks. Numbers are never escaped
 * (papaparse skips number cells), so a design temperature of -20 leaves as -20; the pressure
 * check keeps design pressures ≥ 0. A text cell such as a note "-see drawing" does gain the
 * apostrophe: that is the price of not running it.
 */
export const FORMULA_LEAD = /^[=+\-@\t\r\n\0]/;

const UNPARSE = { delimiter: ',', newline: '\r\n', escapeFormulae: FORMULA_LEAD, header: false } as const;

/** The register's schedule column as the importer reads it: "40", "80" or "SDR 21". */
function scheduleCell(row: LineAttributes): string {
  if (row.schedule) return row.schedule;
  return row.sdr === null ? '' : `SDR ${row.sdr}`;
}

function toCells(row: LineAttributes, withStatus: boolean): (string | number)[] {
  const cells: (string | number)[] = [
    row.lineNumber, row.area, row.service, row.material, scheduleCell(row), row.nominalSize,
    row.designPressurePsi, row.designTemperatureF, row.drawingRef ?? '', row.notes ?? '',
  ];
  return withStatus ? [...cells, row.status] : cells;
}

export function exportFilename(now: Date): string {
  return `line-register-${now.toISOString().slice(0, 10)}.csv`;
}

/**
 * The register as CSV text in pieces: the header, then one piece per 5,000 lines read from a
 * server-side cursor, so 100,000 lines never sit in memory at once and all come from one
 * snapshot. Stopping early (the download was cancelled) closes the cursor's transaction.
 */
export async function* lineRegisterCsv(q: LineExportQuery): AsyncGenerator<string> {
  const fields = q.withStatus ? [...LINE_IMPORT_COLUMNS, 'status'] : [...LINE_IMPORT_COLUMNS];
  const transaction = await sequelize.transaction();
  try {
    await openLineExportCursor(q, transaction);
    yield Papa.unparse([fields], UNPARSE) + '\r\n';
    for (;;) {
      const rows = await fetchLineExport(EXPORT_BATCH, transaction);
      if (rows.length === 0) break;
      yield Papa.unparse(rows.map((r) => toCells(r, q.withStatus)), UNPARSE) + '\r\n';
    }
  } finally {
    await transaction.rollback(); // read only: nothing to keep, and it closes the cursor
  }
}
