import { ROW_OUTCOMES, type ImportCounts, type RowOutcome } from '@shared/schemas/line-imports';
import { OUTCOME_LABELS, OutcomeGlyph } from '@/features/line-imports/components/outcome-mark';

/** Counts per outcome that double as the preview's filter; "All rows" shows everything. */
export function OutcomeTabs({ counts, total, active, onChange }: { counts: ImportCounts; total: number; active?: RowOutcome; onChange: (o?: RowOutcome) => void }) {
  const tab = (selected: boolean) =>
    `flex min-h-11 items-center gap-2 rounded-lg border px-3 py-1.5 text-sm ${selected ? 'border-ink bg-ink text-paper' : 'border-ink/15 bg-paper-raised hover:bg-paper-sunk'} disabled:cursor-not-allowed disabled:opacity-45`;
  return (
    <div role="toolbar" aria-label="Show rows" className="flex flex-wrap gap-2">
      <button type="button" aria-pressed={!active} className={tab(!active)} onClick={() => onChange(undefined)}>
        All rows <span className="font-semibold tabular-nums">{total}</span>
      </button>
      {ROW_OUTCOMES.map((o) => (
        <button key={o} type="button" aria-pressed={active === o} className={tab(active === o)} onClick={() => onChange(o)} disabled={counts[o] === 0 && active !== o}>
          <OutcomeGlyph outcome={o} />
          {OUTCOME_LABELS[o]} <span className="font-semibold tabular-nums">{counts[o]}</span>
        </button>
      ))}
    </div>
  );
}
