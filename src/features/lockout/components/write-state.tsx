import { ApiRequestError } from '@/lib/api-client';
import { Notice } from '@/components/ui/notice';

/** Touch size for a gloved hand on the shift tablet (48 px) on fields and checkbox rows; buttons take `size="lg"`. */
export const TOUCH = 'min-h-12';
export const textarea = `${TOUCH} w-full rounded-lg border border-ink/25 bg-paper-raised px-3 py-2 text-base focus:border-tide`;

/**
 * What became of a lock event: refused (the server's sentence, and each field's words when it sent
 * them), or kept on this tablet until the network is back.
 */
export function WriteState({ error, queued, refusedTitle }: { error: Error | null; queued: boolean; refusedTitle: string }) {
  if (queued) {
    return (
      <Notice tone="caution" title="Saved on this tablet, not yet sent">
        It goes to the server, in order, as soon as the network is back. Until then the board does not show it, and nobody else sees it.
      </Notice>
    );
  }
  if (!error) return null;
  const details = error instanceof ApiRequestError ? error.details : undefined;
  const lines = details ? [...new Set(Object.values(details).flat())] : [];
  return (
    <Notice tone="refusal" title={refusedTitle}>
      <p>{error.message}</p>
      {lines.length > 0 && <ul className="mt-1 list-disc pl-5">{lines.map((m) => <li key={m}>{m}</li>)}</ul>}
    </Notice>
  );
}

/** The first words of each problem a shared schema found in a form's body, for a form that refuses before sending. */
export function issuesOf(result: { success: true } | { success: false; error: { issues: { message: string }[] } }): string[] {
  return result.success ? [] : [...new Set(result.error.issues.map((i) => i.message))];
}

export function FormProblems({ problems }: { problems: string[] }) {
  if (!problems.length) return null;
  return (
    <Notice tone="refusal" title="Check the form">
      <ul className="list-disc pl-5">{problems.map((p) => <li key={p}>{p}</li>)}</ul>
    </Notice>
  );
}
