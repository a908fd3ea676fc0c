import type { ImportKind, ImportRowDto } from '@shared/schemas/line-imports';
import { columnOf, REGISTER_COLUMNS, REGISTER_KEY_FIELD } from '@shared/schemas/register-columns';
import { OutcomeMark } from '@/features/line-imports/components/outcome-mark';

/**
 * The planner's own word for a field: its column in the register file (designPressurePsi →
 * design_pressure_psi, drawingRef → drawing); a field no column carries (sdr) in the same style.
 */
export const columnName = (kind: ImportKind, field: string) =>
  columnOf(kind, field)?.column ?? field.replace(/[A-Z]/g, (c) => `_${c.toLowerCase()}`);

const show = (v: unknown) => (v === null || v === undefined || v === '' ? '(blank)' : typeof v === 'object' ? JSON.stringify(v) : String(v));

// Fields in the order of the template, an SDR where the schedule is; the database hands them back in its own order.
const ORDER: Record<ImportKind, string[]> = {
  lines: REGISTER_COLUMNS.lines.flatMap((c): string[] => (c.field === 'schedule' ? ['schedule', 'sdr'] : [c.field])),
  'isolation-points': REGISTER_COLUMNS['isolation-points'].map((c) => c.field),
};
const rank = (kind: ImportKind, k: string) => (ORDER[kind].includes(k) ? ORDER[kind].indexOf(k) : ORDER[kind].length);
// nominalSizeIn repeats nominal_size in inches; the planner's file has only the size.
const HIDDEN = new Set(['nominalSizeIn']);

function Pairs({ data, kind }: { data: Record<string, unknown>; kind: ImportKind }) {
  const entries = Object.entries(data)
    .filter(([k, v]) => k !== REGISTER_KEY_FIELD[kind] && !HIDDEN.has(k) && v !== null && v !== undefined && v !== '')
    .sort(([a], [b]) => rank(kind, a) - rank(kind, b));
  return (
    <ul className="flex flex-wrap gap-x-4 gap-y-0.5">
      {entries.map(([k, v]) => (
        <li key={k}>
          <span className="text-ink-faint">{k === 'sdr' ? 'schedule' : columnName(kind, k)}</span> {k === 'sdr' ? `SDR ${show(v)}` : show(v)}
        </li>
      ))}
    </ul>
  );
}

function Changes({ changes, kind }: { changes: NonNullable<ImportRowDto['changes']>; kind: ImportKind }) {
  return (
    <ul className="space-y-0.5">
      {Object.entries(changes).map(([k, c]) => (
        <li key={k}>
          <code className="rounded bg-paper-sunk px-1.5 py-0.5 font-sans text-[13px] font-semibold">{columnName(kind, k)}</code> <span className="text-ink-soft line-through decoration-ink-faint/60">{show(c.from)}</span>{' '}
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

function What({ row, kind }: { row: ImportRowDto; kind: ImportKind }) {
  if (row.outcome === 'rejected') return <Problems problems={row.problems ?? []} />;
  if (row.outcome === 'changed' && row.changes) return <Changes changes={row.changes} kind={kind} />;
  if (row.outcome === 'unchanged') return <span className="text-ink-faint">Same as the register; left as it is</span>;
  return row.data ? <Pairs data={row.data} kind={kind} /> : null;
}

/** The heading of the key column: the key field's label, "Line number" or "Tag". */
const keyHeading = (kind: ImportKind) => {
  const label = columnOf(kind, REGISTER_KEY_FIELD[kind])?.label ?? '';
  return label.charAt(0).toUpperCase() + label.slice(1);
};

/** Every row of the file as the import will treat it; rejected rows stand out with their reasons. */
export function ImportRowsTable({ rows, kind, written, dimmed }: { rows: ImportRowDto[]; kind: ImportKind; written?: boolean; dimmed?: boolean }) {
  return (
    <div className="overflow-x-auto rounded-xl border border-ink/10 bg-paper-raised shadow-sm">
      <table className={`w-full text-left text-sm transition-opacity ${dimmed ? 'opacity-60' : ''}`}>
        <thead className="border-b border-ink/10 bg-paper-sunk/60 text-[13px] font-semibold text-ink-soft">
          <tr>
            <th scope="col" className="w-16 px-3 py-2.5 text-right">Row</th>
            <th scope="col" className="w-32 px-3 py-2.5">Outcome</th>
            <th scope="col" className="w-40 px-3 py-2.5">{keyHeading(kind)}</th>
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
                <What row={row} kind={kind} />
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
