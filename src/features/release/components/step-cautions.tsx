import { cautionsFor, DEFERENCE } from '@shared/trade';
import { Notice } from '@/components/ui/notice';

/** The trade's cautions for the test or the release, with the deference to local codes said once at the end. */
export function StepCautions({ step, title }: { step: 'pressure-test' | 'release'; title: string }) {
  const cautions = cautionsFor(step);
  if (!cautions.length) return null;
  return (
    <Notice tone="caution" title={title}>
      <ul className="mt-1 space-y-1.5">
        {cautions.map((c) => (
          <li key={c.id}><span className="font-semibold">{c.title}.</span> {c.text.replace(DEFERENCE, '').trim()}</li>
        ))}
      </ul>
      <p className="mt-1.5 text-ink-soft">{DEFERENCE}</p>
    </Notice>
  );
}
