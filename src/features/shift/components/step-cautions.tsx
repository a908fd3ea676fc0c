import { DEFERENCE } from '@shared/trade';

/**
 * A step's cautions, compact: each title and its words, and the sentence that defers to local codes
 * and procedures once at the end (the API's caution texts each end with it).
 */
export function StepCautions({ cautions, title }: { cautions: readonly { id: string; title: string; text: string }[]; title?: string }) {
  if (!cautions.length) return null;
  const deferring = cautions.some((c) => c.text.trim().endsWith(DEFERENCE));
  return (
    <div role="note" aria-label={title ?? 'Cautions'} className="rounded-lg border border-hold/40 bg-hold-light px-3 py-2 text-sm">
      {title && <p className="mb-1 font-semibold">{title}</p>}
      <ul className="space-y-1">
        {cautions.map((c) => (
          <li key={c.id}>
            <span className="font-semibold">{c.title}.</span> {c.text.replace(DEFERENCE, '').trim()}
          </li>
        ))}
      </ul>
      {deferring && <p className="mt-1 font-medium">{DEFERENCE}</p>}
    </div>
  );
}
