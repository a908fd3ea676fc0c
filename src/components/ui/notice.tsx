import type { ReactNode } from 'react';

type Tone = 'info' | 'caution' | 'refusal' | 'success';
const TONES: Record<Tone, string> = {
  info: 'border-ink/15 bg-paper-sunk text-ink',
  caution: 'border-hold/40 bg-hold-light text-ink',
  refusal: 'border-refuse/40 bg-refuse-light text-ink',
  success: 'border-tide/40 bg-tide-light text-ink',
};
const MARKS: Record<Tone, string> = { info: 'i', caution: '!', refusal: '×', success: '✓' };

export function Notice({ tone = 'info', title, children }: { tone?: Tone; title?: ReactNode; children?: ReactNode }) {
  return (
    <div role={tone === 'refusal' ? 'alert' : 'note'} className={`flex gap-3 rounded-lg border p-3 ${TONES[tone]}`}>
      <span aria-hidden className="mt-0.5 grid h-6 w-6 shrink-0 place-items-center rounded-full bg-ink/80 text-xs font-bold text-paper">
        {MARKS[tone]}
      </span>
      <div className="min-w-0 text-sm">
        {title && <p className="font-semibold">{title}</p>}
        {children}
      </div>
    </div>
  );
}
