import type { LockoutDto } from '@shared/schemas/lockout';
import { formatDateTime } from '@/lib/format';
import { placeOf } from '@/features/lockout/board';

/** Locks that came off, newest first, one line each; the order's record has every event. */
export function RemovedLocks({ board }: { board: LockoutDto }) {
  const locks = board.removedLocks;
  if (!locks.length) return null;
  return (
    <details className="rounded-lg border border-ink/10 px-3 text-sm">
      <summary className="flex min-h-12 cursor-pointer items-center font-medium text-ink-soft">Removed locks ({locks.length})</summary>
      <ol className="space-y-1 pb-3">
        {locks.map((l) => (
          <li key={l.id} className="border-l-2 border-ink/15 pl-2">
            <span className="font-medium">{l.person.name}</span> · lock {l.lockNumber} · {placeOf(board, l)}
            <span className="text-ink-soft">
              {' '}· on {formatDateTime(l.appliedAt)}
              {l.removedAt && `, off ${formatDateTime(l.removedAt)}`}
              {l.removal === 'absent' ? ` by ${l.removedBy?.name ?? 'a supervisor'}, absent-person procedure` : l.removal === 'owner' ? ' by its owner' : ''}
            </span>
          </li>
        ))}
      </ol>
    </details>
  );
}
