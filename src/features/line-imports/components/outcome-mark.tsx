import type { RowOutcome } from '@shared/schemas/line-imports';

export const OUTCOME_LABELS: Record<RowOutcome, string> = { new: 'New', changed: 'Changed', unchanged: 'Unchanged', rejected: 'Rejected' };

// A glyph per outcome, so the preview reads without colour: plus, arrow, equals, cross.
const GLYPHS: Record<RowOutcome, { d: string; className: string }> = {
  new: { d: 'M7 3v8M3 7h8', className: 'bg-tide text-white' },
  changed: { d: 'M3 7h7M7.5 4.5 10 7l-2.5 2.5', className: 'bg-ink-soft text-white' },
  unchanged: { d: 'M3.5 5.5h7M3.5 8.5h7', className: 'bg-paper-sunk text-ink-faint' },
  rejected: { d: 'M4 4l6 6M10 4l-6 6', className: 'bg-refuse text-white' },
};

export function OutcomeGlyph({ outcome }: { outcome: RowOutcome }) {
  const g = GLYPHS[outcome];
  return (
    <span aria-hidden className={`grid h-5 w-5 shrink-0 place-items-center rounded ${g.className}`}>
      <svg width="14" height="14" viewBox="0 0 14 14">
        <path d={g.d} fill="none" stroke="currentColor" strokeWidth="1.8" strokeLinecap="round" strokeLinejoin="round" />
      </svg>
    </span>
  );
}

export function OutcomeMark({ outcome }: { outcome: RowOutcome }) {
  return (
    <span className={`inline-flex items-center gap-1.5 whitespace-nowrap text-sm ${outcome === 'rejected' ? 'font-semibold text-refuse' : outcome === 'unchanged' ? 'text-ink-soft' : 'font-medium'}`}>
      <OutcomeGlyph outcome={outcome} />
      {OUTCOME_LABELS[outcome]}
    </span>
  );
}
