import { useId } from 'react';
import { formatSize } from '@/lib/format';

export interface LineChoice {
  id: string;
  lineNumber: string;
  area: string;
  service: string;
  material: string;
  nominalSize: string;
}

/**
 * Lines picked by search: the page runs the register's search for `query` and hands back `options`.
 * Chosen lines show as removable chips; every row is a 44 px target.
 */
export function LinePicker({ chosen, options, query, onQuery, onChange, searching, error }: {
  chosen: LineChoice[];
  options: LineChoice[];
  query: string;
  onQuery: (q: string) => void;
  onChange: (next: LineChoice[]) => void;
  searching?: boolean;
  error?: string;
}) {
  const id = useId();
  const chosenIds = new Set(chosen.map((l) => l.id));
  const offered = options.filter((l) => !chosenIds.has(l.id));
  return (
    <fieldset className="space-y-2">
      <legend className="mb-1 text-sm font-medium text-ink-soft">Lines</legend>
      {chosen.length > 0 ? (
        <ul className="flex flex-wrap gap-2" aria-label="Chosen lines">
          {chosen.map((l) => (
            <li key={l.id}>
              <button type="button" onClick={() => onChange(chosen.filter((c) => c.id !== l.id))} className="inline-flex min-h-11 items-center gap-2 rounded-full border border-tide/50 bg-tide-light px-3 text-sm">
                <span className="font-semibold">{l.lineNumber}</span>
                <span className="text-ink-soft">{l.material} {formatSize(l.nominalSize)} · {l.service}</span>
                <span aria-hidden>×</span>
                <span className="sr-only">: take it off the order</span>
              </button>
            </li>
          ))}
        </ul>
      ) : (
        <p className="text-sm text-ink-soft">No line chosen yet.</p>
      )}
      <label htmlFor={id} className="block text-sm font-medium text-ink-soft">Find a line to add</label>
      <input
        id={id}
        type="search"
        value={query}
        onChange={(e) => onQuery(e.target.value)}
        placeholder="Part of a line number"
        aria-invalid={!!error}
        className="min-h-11 w-full rounded-lg border border-ink/25 bg-paper-raised px-3 py-2 text-base focus:border-tide"
      />
      {error && <p className="text-sm text-refuse">{error}</p>}
      {query.trim() && (
        <ul className="max-h-64 overflow-y-auto rounded-lg border border-ink/15 bg-paper-raised" aria-label="Matching lines" aria-busy={searching}>
          {offered.length === 0 && <li className="px-3 py-2 text-sm text-ink-soft">{searching ? 'Searching…' : 'No other line matches.'}</li>}
          {offered.map((l) => (
            <li key={l.id}>
              <button type="button" onClick={() => (onChange([...chosen, l]), onQuery(''))} className="flex min-h-11 w-full items-center gap-3 px-3 text-left text-sm hover:bg-paper-sunk">
                <span className="font-semibold">Add {l.lineNumber}</span>
                <span className="text-ink-soft">{l.area} · {l.material} {formatSize(l.nominalSize)} · {l.service}</span>
              </button>
            </li>
          ))}
        </ul>
      )}
    </fieldset>
  );
}
