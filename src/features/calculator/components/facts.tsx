import type { ReactNode } from 'react';
import { Notice } from '@/components/ui/notice';
import { SUPERVISOR_MAY_ENTER } from '@shared/trade';

export function Section({ title, children, id }: { title: ReactNode; children: ReactNode; id?: string }) {
  return (
    <section aria-labelledby={id} className="rounded-xl border border-ink/10 bg-paper-raised p-4 shadow-sm">
      <h2 id={id} className="mb-2 text-base font-semibold">{title}</h2>
      {children}
    </section>
  );
}

export function Facts({ children }: { children: ReactNode }) {
  return <dl className="divide-y divide-ink/10">{children}</dl>;
}

/** One line of the picture: the value in US units, metric beside it, a note under it. */
export function Fact({ term, value, metric, note }: { term: ReactNode; value: ReactNode; metric?: ReactNode; note?: ReactNode }) {
  return (
    <div className="grid grid-cols-[minmax(0,10rem)_1fr] gap-x-3 py-2">
      <dt className="pt-0.5 text-sm text-ink-soft">{term}</dt>
      <dd className="min-w-0">
        <span className="text-base font-semibold tabular-nums">{value}</span>
        {metric && <span className="ml-2 whitespace-nowrap text-sm text-ink-soft tabular-nums">{metric}</span>}
        {note && <p className="mt-0.5 text-sm text-ink-soft">{note}</p>}
      </dd>
    </div>
  );
}

/** The sources of a section, each named once (rules share some, such as the cement body table). */
export function Source({ of }: { of: readonly (string | null | undefined)[] }) {
  const parts = [...new Set(of.flatMap((s) => (s ? s.split('; ') : [])))];
  return parts.length ? <p className="mt-2 text-xs leading-snug text-ink-faint">Source: {parts.join('; ')}</p> : null;
}

/** What a person can do when a table has no answer; said once, plainly, under the reason. */
export function whoDecides(section: string, reason: string): string {
  if (section === 'Cure') return 'A supervisor can enter an engineering cure time with a written reason (coming with cure holds).';
  if (section === 'Test' && /refused: compressed air or gas/.test(reason)) return 'Test with water. No one can approve a test with air or gas in Linewright.';
  if (section === 'Test') return 'The planner changes the design pressure or the weakest component; the test is not lowered to fit.';
  if (section === 'Rating') return "The line's engineer decides: a pipe rated for the service, or a lower design pressure.";
  if (section === 'Cement') return 'Use the cement the pipe calls for.';
  return 'A supervisor decides, with a written reason.';
}

/** The engine's reason without its own supervisor sentence (whoDecides says it in our words). */
export const plainReason = (reason: string) => reason.replace(SUPERVISOR_MAY_ENTER, '').trim();

/** A cure or size beyond the tables has no published value; a gas test or a wrong cement is refused by rule. */
export function refusalTitle(section: string): string {
  return section === 'Cure' ? 'Outside the published tables' : section === 'Cement' ? 'Wrong cement for this joint' : 'Refused';
}

export function Refused({ section, reason }: { section: string; reason: string }) {
  return (
    <Notice tone="refusal" title={refusalTitle(section)}>
      <p>{plainReason(reason)}</p>
      <p className="mt-1 font-semibold">{whoDecides(section, reason)}</p>
    </Notice>
  );
}
