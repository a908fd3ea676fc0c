import type { Caution } from '@shared/trade';

/** Each caution's text already ends by deferring to local codes, procedures and engineering judgement. */
export function CautionsSection({ cautions }: { cautions: readonly Caution[] }) {
  return (
    <section aria-labelledby="cautions" className="rounded-xl border border-hold/40 bg-hold-light p-4">
      <h2 id="cautions" className="mb-2 text-base font-semibold">Cautions</h2>
      <ul className="grid gap-3 md:grid-cols-2">
        {cautions.map((c) => (
          <li key={c.id} className="rounded-lg bg-paper-raised/70 p-3">
            <p className="font-semibold">{c.title}</p>
            <p className="mt-1 text-sm leading-relaxed">{c.text}</p>
          </li>
        ))}
      </ul>
    </section>
  );
}
