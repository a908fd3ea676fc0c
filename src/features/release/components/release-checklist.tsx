import { useState, type FormEvent } from 'react';
import { releaseBodySchema, type ReleaseBody } from '@shared/schemas/release';
import { ApiRequestError } from '@/lib/api-client';
import { Button } from '@/components/ui/button';
import { Field } from '@/components/ui/field';
import { Notice } from '@/components/ui/notice';
import { useReleaseOrder, type ReleaseResultDto } from '@/features/release/api';
import { CheckRow } from '@/features/release/components/check-row';

type Check = Exclude<keyof ReleaseBody, 'notes'>;

/** The checklist operations signs ((e)(1)–(2) and the refill), in the order it is done. */
export const RELEASE_CHECKS: readonly { key: Check; words: string }[] = [
  { key: 'areaInspected', words: 'The area is inspected: tools and materials removed, the equipment whole.' },
  { key: 'peopleClear', words: 'Everyone is clear of the section.' },
  { key: 'affectedTold', words: 'The affected people are told the line goes back into service.' },
  { key: 'ventsDrainsSet', words: 'Vents and drains are set for service.' },
  { key: 'slowRefill', words: 'The line will be refilled slowly, venting the air, watching the new joints.' },
];

const NONE_TICKED: Record<Check, boolean> = { areaInspected: false, peopleClear: false, affectedTold: false, ventsDrainsSet: false, slowRefill: false };
const textarea = 'min-h-12 w-full rounded-lg border border-ink/25 bg-paper-raised px-3 py-2 text-base focus:border-tide';

/** Every reason the server gave for refusing the release (409), or its one sentence. */
function Refusal({ error }: { error: Error }) {
  const reasons = error instanceof ApiRequestError ? error.details?.reasons ?? [] : [];
  return (
    <Notice tone="refusal" title="The line was not released">
      {reasons.length ? <ul className="list-disc pl-5">{reasons.map((r) => <li key={r}>{r}</li>)}</ul> : <p>{error.message}</p>}
    </Notice>
  );
}

/**
 * Operations' release: five ticks and optional notes. The button waits for the server's own check
 * (`ready`); the release itself is decided again on the server, in one transaction.
 */
export function ReleaseChecklist({ orderId, ready, lineCount, onReleased }: { orderId: string; ready: boolean; lineCount: number; onReleased: (r: ReleaseResultDto) => void }) {
  const release = useReleaseOrder(orderId);
  const [ticks, setTicks] = useState(NONE_TICKED);
  const [notes, setNotes] = useState('');
  const [problems, setProblems] = useState<Partial<Record<Check, string>>>({});

  const submit = (ev: FormEvent) => {
    ev.preventDefault();
    const parsed = releaseBodySchema.safeParse({ ...ticks, notes: notes.trim() ? notes : undefined });
    if (!parsed.success) {
      setProblems(Object.fromEntries(parsed.error.issues.map((i) => [String(i.path[0]), i.message])));
      return;
    }
    setProblems({});
    release.mutate(parsed.data, { onSuccess: onReleased });
  };

  return (
    <form onSubmit={submit} aria-label="Release checklist" className="space-y-3" noValidate>
      <fieldset className="space-y-2">
        <legend className="mb-1 text-sm font-semibold">Before the line goes back into service</legend>
        {RELEASE_CHECKS.map((c) => (
          <CheckRow key={c.key} checked={ticks[c.key]} onChange={(v) => setTicks((t) => ({ ...t, [c.key]: v }))} error={problems[c.key]}>{c.words}</CheckRow>
        ))}
      </fieldset>
      <Field label="Notes (optional)">
        <textarea className={textarea} rows={2} value={notes} onChange={(e) => setNotes(e.target.value)} maxLength={2000} />
      </Field>
      {release.error && <Refusal error={release.error} />}
      <Button type="submit" size="lg" disabled={!ready || release.isPending}>
        {release.isPending ? 'Releasing…' : lineCount === 1 ? 'Release the line' : 'Release the lines'}
      </Button>
      {!ready && <p className="text-sm text-ink-soft">The release opens once nothing above stands in the way.</p>}
    </form>
  );
}
