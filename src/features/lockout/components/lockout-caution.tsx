import { cautionsFor, DEFERENCE } from '@shared/trade';
import { Notice } from '@/components/ui/notice';

/** The trade engine's lockout cautions; the deference to local codes and the plant's procedures closes them once. */
export function LockoutCaution() {
  return (
    <Notice tone="caution" title="Before anyone works on the section">
      <ul className="mt-1 space-y-1.5">
        {cautionsFor('lockout').map((c) => (
          <li key={c.id}><span className="font-semibold">{c.title}.</span> {c.text.replace(DEFERENCE, '').trim()}</li>
        ))}
      </ul>
      <p className="mt-1.5 text-ink-soft">{DEFERENCE}</p>
    </Notice>
  );
}
