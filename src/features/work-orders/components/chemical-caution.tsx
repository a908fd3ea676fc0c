import { cautionsFor, DEFERENCE, needsChemicalCaution } from '@shared/trade';
import { Notice } from '@/components/ui/notice';

/** The chemical-service caution for an order whose lines carry something other than plain water or air. */
export function ChemicalCaution({ services }: { services: string[] }) {
  const chemical = [...new Set(services.filter(needsChemicalCaution))];
  if (!chemical.length) return null;
  return (
    <Notice tone="caution" title={`Chemical service: ${chemical.join(', ')}`}>
      <ul className="mt-1 space-y-1.5">
        {cautionsFor('chemical-service').map((c) => (
          <li key={c.id}><span className="font-semibold">{c.title}.</span> {c.text.replace(DEFERENCE, '').trim()}</li>
        ))}
      </ul>
      <p className="mt-1.5 text-ink-soft">{DEFERENCE}</p>
    </Notice>
  );
}
