import type { ImportKind, ImportRowDto } from '@shared/schemas/line-imports';
import { OutcomeMark } from '@/features/line-imports/components/outcome-mark';

// The template's column names where a field's name differs from it.
const ALIASES: Record<string, string> = { drawingRef: 'drawing' };
/** The planner's own word for a field: the CSV column name (designPressurePsi → design_pressure_psi). */
export const columnName = (field: string) => ALIASES[field] ?? field.replace(/[A-Z]/g, (c) => `_${c.toLowerCase()}`);

const show = (v: unknown) => (v === null || v === undefined || v === '' ? '(blank)' : typeof v === 'object' ? JSON.stringify(v) : String(v));

// Fields in the order of the template; the database hands them back in its own order.
const ORDER = ['area', 'service', 'material', 'schedule', 'sdr', 'nominalSize', 'designPressurePsi', 'designTemperatureF', 'drawingRef', 'lineNumber', 'kind', 'normalPosition', 'notes'];
const rank = (k: string) => (ORDER.includes(k) ? ORDER.indexOf(k) : ORDER.length);
// nominalSizeIn repeats nominal_size in inches; the planner's file has only the size.
const HIDDEN = new Set(['nominalSizeIn']);

function Pairs({ data, skip }: { data: Record<string, unknown>; skip: string }) {
  const entries = Object.entries(data)
    .filter(([k, v]) => k !== skip && !HIDDEN.has(k) && v !== null && v !== undefined && v !== '')
    .sort(([a], [b]) => rank(a) - rank(b));
  return (
    <ul className="flex flex-wrap gap-x-4 gap-y-0.5">
      {entries.map(([k, v]) => (
        <li key={k}>
          <span className="text-ink-faint">{k === 'sdr' ? 'schedule' : columnName(k)}</span> {k === 'sdr' ? `SDR ${show(v)}` : show(v)}
        </li>
      ))}
    </ul>
  );
}

function Changes({ changes }: { changes: NonNullable<ImportRowDto['changes']> }) {
  return (
    <ul className="space-y-0.5">
      {Object.entries(changes).map(([k, c]) => (
        <li key={k}>
          <code className="rounded bg-paper-sunk px-1.5 py-0.5 font-sans text-[13px] font-semibold">{columnName(k)}</code> <span className="text-ink-soft line-through decoration-ink-faint/60">{show(c.from)}</span>{' '}
          <span aria-label="becomes">→</span> <span className="font-semibold">{show(c.to)}</span>
        </li>
      ))}
    </ul>
  );
}

function Problems({ problems }: { problems: NonNullable<ImportRowDto['problems']> }) {
  return (
    <ul className="space-y-0.5">
      {problems.map((p, i) => (
        <li key={i}>
          <code className="rounded bg-refuse/10 px-1.5 py-0.5 font-sans text-[13px] font-semibold text-refuse">{p.column}</code> <span>{p.message}</span>
        </li>
      ))}
    </ul>
  );
}

function What({ row, keyField }: { row: ImportRowDto; keyField: string }) {
  if (row.outcome === 'rejected') return <Problems problems={row.problems ?? []} />;
  if (row.outcome === 'changed' && row.changes) return <Changes changes={row.changes} />;
  if (row.outcome === 'unchanged') return <span className="text-ink-faint">Same as the register; left as it is</span>;
  return row.data ? <Pairs data={row.data} skip={keyField} /> : null;
}

/** Every row of the file as the import will treat it; rejected rows stand out with their reasons. */
export function ImportRowsTable({ rows, kind, written, dimmed }: { rows: ImportRowDto[]; kind: ImportKind; written?: boolean; dimmed?: boolean }) {
  const keyField = kind === 'lines' ? 'lineNumber' : 'tag';
  return (
    <div className="overflow-x-auto rounded-xl border border-ink/10 bg-paper-raised shadow-sm">
      <table className={`w-full text-left text-sm transition-opacity ${dimmed ? 'opacity-60' : ''}`}>
        <thead className="border-b border-ink/10 bg-paper-sunk/60 text-[13px] font-semibold text-ink-soft">
          <tr>
            <th scope="col" className="w-16 px-3 py-2.5 text-right">Row</th>
            <th scope="col" className="w-32 px-3 py-2.5">Outcome</th>
            <th scope="col" className="w-40 px-3 py-2.5">{kind === 'lines' ? 'Line number' : 'Tag'}</th>
            <th scope="col" className="px-3 py-2.5">{written ? 'What the import did' : 'What the import will do'}</th>
          </tr>
        </thead>
        <tbody>
          {rows.map((row) => (
            <tr key={row.rowNumber} className={`border-b border-ink/5 align-top last:border-0 ${row.outcome === 'rejected' ? 'bg-refuse-light/70' : ''}`}>
              <td className={`px-3 py-3 text-right tabular-nums text-ink-soft ${row.outcome === 'rejected' ? 'border-l-4 border-l-refuse' : 'border-l-4 border-l-transparent'}`}>{row.rowNumber}</td>
              <td className="px-3 py-3">
                <OutcomeMark outcome={row.outcome} />
              </td>
              <td className="whitespace-nowrap px-3 py-3 font-semibold">{row.key ?? <span className="font-normal text-ink-faint">(none)</span>}</td>
              <td className="px-3 py-3">
                <What row={row} keyField={keyField} />
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
