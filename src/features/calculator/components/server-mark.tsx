import { Notice } from '@/components/ui/notice';
import type { ServerCheck } from '../use-server-check';

const SECTION_LABEL: Record<string, string> = {
  rating: 'rating', ratingAtTest: 'rating at test temperature', test: 'pressure test', cure: 'set and cure', spec: 'specification used',
  curePressurePsi: 'cure pressure', curePressureBasis: 'cure pressure basis', socket: 'socket marks', chamfer: 'chamfer', cement: 'cement',
  body: 'cement body', quantities: 'quantities', applicator: 'applicator', crew: 'crew', hold: 'assembly hold', cautions: 'cautions',
  ok: 'verdict', problems: 'problems', notes: 'notes',
};

/** The small mark beside the verdict: has the server, the authority, given the same answer? */
export function ServerMark({ check }: { check: ServerCheck }) {
  const base = 'inline-flex min-h-8 items-center gap-1.5 rounded-full px-3 text-sm font-semibold';
  if (check.state === 'agrees') return <span className={`${base} bg-tide-light text-tide-dark`} role="status">✓ Checked by the server</span>;
  if (check.state === 'checking') return <span className={`${base} bg-paper-sunk text-ink-soft`} role="status">Checking with the server…</span>;
  if (check.state === 'disagrees') return <span className={`${base} bg-refuse text-white`} role="status">Server differs</span>;
  if (check.state === 'error') return <span className={`${base} bg-hold-light text-hold`} role="status">Not checked by the server</span>;
  return null;
}

export function ServerNotice({ check }: { check: ServerCheck }) {
  if (check.state === 'disagrees') {
    return (
      <Notice tone="refusal" title="The server's answer differs from this page's preview">
        <p>
          The server is the authority, so its answer is shown below. Differing: {check.sections.map((s) => SECTION_LABEL[s] ?? s).join(', ')}.
          Reload the page; if it stays, tell the plant's Linewright administrator.
        </p>
      </Notice>
    );
  }
  if (check.state === 'error') {
    return (
      <Notice tone="caution" title="Not checked by the server">
        <p>{check.message} The preview uses the same rules; the server's answer is the one that counts.</p>
      </Notice>
    );
  }
  return null;
}
