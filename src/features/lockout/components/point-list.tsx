import type { LockoutDto } from '@shared/schemas/lockout';
import { formatDateTime } from '@/lib/format';
import type { LockoutPoint } from '@/features/lockout/board';
import { LockLine } from '@/features/lockout/components/lock-line';

const KIND_WORDS: Record<string, string> = { valve: 'Valve', blind: 'Blind', disconnect: 'Disconnect', drain: 'Drain', vent: 'Vent' };
type Powers = { mayRemoveAbsent: boolean; workOpen: boolean };

/** Where locks must be on (or are about to go on): a point without one is a danger there, and nowhere else. */
const LOCKS_NEEDED: readonly string[] = ['planned', 'isolated', 'in-work', 'curing'];

/** Marked in words and a sign, not by colour alone. */
function Protection({ point, boxLabel, state }: { point: LockoutPoint; boxLabel?: string; state: string }) {
  if (!point.protected && !LOCKS_NEEDED.includes(state)) {
    // the locks came off for the test ((f)(1)) or at the release: expected, not alarming
    return <span className="inline-flex items-center gap-1 rounded-full border border-ink/25 bg-paper-sunk px-2.5 py-0.5 text-sm font-medium text-ink"><span aria-hidden>○</span> {state === 'testing' ? 'No lock: off for the test' : 'No lock'}</span>;
  }
  if (!point.protected) {
    return <span className="inline-flex items-center gap-1 rounded-full border border-refuse/50 bg-refuse-light px-2.5 py-0.5 text-sm font-semibold text-refuse"><span aria-hidden>×</span> No lock: not protected</span>;
  }
  return (
    <span className="inline-flex items-center gap-1 rounded-full border border-tide/50 bg-tide-light px-2.5 py-0.5 text-sm font-medium text-ink">
      <span aria-hidden>✓</span> {point.lockBoxId ? `Key in lock box ${boxLabel ?? ''}`.trim() : 'Locked'}
    </span>
  );
}

/** Each isolation point: where, what it must be, and whose locks are on it now. */
export function PointList({ board, ...powers }: { board: LockoutDto } & Powers) {
  const boxLabel = board.lockBox?.label;
  return (
    <ul className="space-y-2" aria-label="Isolation points">
      {board.points.map((p) => (
        <li key={p.entryId} className={`rounded-lg border p-3 ${p.protected || !LOCKS_NEEDED.includes(board.state) ? 'border-ink/10 bg-paper' : 'border-refuse/50 border-l-4 bg-refuse-light/40'}`}>
          <div className="flex flex-wrap items-center justify-between gap-2">
            <p>
              <span className="font-semibold">{p.tag}</span>
              <span className="text-sm text-ink-soft"> · {KIND_WORDS[p.kind] ?? p.kind} on {p.lineNumber} · must be {p.requiredPosition}</span>
              {p.positionFound && <span className="text-sm text-ink-soft"> · found {p.positionFound}</span>}
            </p>
            <Protection point={p} boxLabel={boxLabel} state={board.state} />
          </div>
          {p.lockBoxId && p.locks.length === 0 && (
            <p className="mt-1 text-sm text-ink-soft">Its key is in the lock box; the locks on the box protect it.</p>
          )}
          {p.locks.length > 0 && (
            <ul className="mt-2 space-y-1.5" aria-label={`Locks on ${p.tag}`}>
              {p.locks.map((l) => <LockLine key={l.id} board={board} lock={l} {...powers} />)}
            </ul>
          )}
        </li>
      ))}
    </ul>
  );
}

/** The group lock box ((f)(3)): who holds primary responsibility, which keys are in it, whose locks are on it. */
export function LockBoxPanel({ board, ...powers }: { board: LockoutDto } & Powers) {
  const box = board.lockBox;
  if (!box) return null;
  const inBox = board.points.filter((p) => p.lockBoxId === box.id).map((p) => p.tag);
  return (
    <section aria-label={`Lock box ${box.label}`} className={`rounded-lg border p-3 ${box.locks.length ? 'border-ink/10 bg-paper' : 'border-refuse/50 border-l-4 bg-refuse-light/40'}`}>
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h3 className="font-semibold">Lock box {box.label}</h3>
        {box.locks.length === 0 && (
          <span className="inline-flex items-center gap-1 rounded-full border border-refuse/50 bg-refuse-light px-2.5 py-0.5 text-sm font-semibold text-refuse"><span aria-hidden>×</span> No lock on the box</span>
        )}
      </div>
      <p className="mt-1 text-sm text-ink-soft">
        Primary responsibility: {box.responsible.name} · set up {formatDateTime(box.createdAt)} · keys of {inBox.length ? inBox.join(', ') : 'no points'}
      </p>
      {box.locks.length > 0 && (
        <ul className="mt-2 space-y-1.5" aria-label={`Locks on lock box ${box.label}`}>
          {box.locks.map((l) => <LockLine key={l.id} board={board} lock={l} {...powers} />)}
        </ul>
      )}
    </section>
  );
}
