import { randomUUID } from 'node:crypto';
import { LineImport } from '@server/db/models/line-import';
import { ISOLATION_POINT_CSV_COLUMNS, LINE_CSV_COLUMNS } from '@shared/schemas/register-columns';

/** A prefix no other test shares, so each test's line numbers and tags are its own. */
export const testPrefix = (what: string) => `${what}-${randomUUID().slice(0, 8).toUpperCase()}`;

export const LINE_HEADER: string[] = [...LINE_CSV_COLUMNS];
export const POINT_HEADER: string[] = [...ISOLATION_POINT_CSV_COLUMNS];

export type CsvRow = Record<string, string>;

/** A believable, valid lines row; `over` changes or blanks any cell. */
export function lineRow(lineNumber: string, over: CsvRow = {}): CsvRow {
  return {
    line_number: lineNumber, area: '100 Acid dosing', service: 'Sulphuric acid 93%', material: 'PVC', schedule: '80',
    nominal_size: '1-1/2', design_pressure_psi: '150', design_temperature_f: '100', drawing: 'MRW-P&ID-104-02', notes: '', ...over,
  };
}

const cell = (v: string) => (/[",\n]/.test(v) ? `"${v.replace(/"/g, '""')}"` : v);

export function toCsv(rows: CsvRow[], header: string[] = LINE_HEADER): string {
  return [header.join(','), ...rows.map((r) => header.map((h) => cell(r[h] ?? '')).join(','))].join('\n') + '\n';
}

/** The import as the database has it, source and all. */
export const importRow = (id: string) => LineImport.unscoped().findByPk(id);

export async function waitFor<T>(what: string, read: () => Promise<T>, done: (v: T) => boolean, ms = 20_000): Promise<T> {
  const until = Date.now() + ms;
  for (;;) {
    const v = await read();
    if (done(v)) return v;
    if (Date.now() > until) throw new Error(`timed out waiting for ${what}: ${JSON.stringify(v)}`);
    await new Promise((r) => setTimeout(r, 25));
  }
}
