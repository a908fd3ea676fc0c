import { useState } from 'react';
import type { LockDto, LockoutDto } from '@shared/schemas/lockout';
import { formatDateTime } from '@/lib/format';
import { Button } from '@/components/ui/button';
import { handedOverFrom, isMine, placeOf } from '@/features/lockout/board';
import { lockoutWrites, useLockoutWrite } from '@/features/lockout/api';
import { AbsentRemovalDialog } from '@/features/lockout/components/absent-removal-dialog';
import { WriteState } from '@/features/lockout/components/write-state';

/** One lock on a point or on the box: whose, which number, since when; the owner may take it off. */
export function LockLine({ board, lock, mayRemoveAbsent, workOpen }: { board: LockoutDto; lock: LockDto; mayRemoveAbsent: boolean; workOpen: boolean }) {
  const mine = isMine(board, lock);
  const from = handedOverFrom(board, lock);
  return (
    <li className="rounded-lg border border-ink/10 bg-paper-raised p-2">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <p className="text-sm">
          <span className="font-semibold">{lock.person.name}{mine && ' (you)'}</span>
          <span> · lock {lock.lockNumber}</span>
          <span className="text-ink-soft"> · on since {formatDateTime(lock.appliedAt)}</span>
          {from && <span className="text-ink-soft"> · took over from {from.person.name}’s lock {from.lockNumber}</span>}
        </p>
        {!mine && mayRemoveAbsent && <AbsentRemovalDialog board={board} lock={lock} />}
      </div>
      {mine && <RemoveMyLock board={board} lock={lock} workOpen={workOpen} />}
    </li>
  );
}

/** Two taps, so a glove brushing the screen does not take a lock off. */
function RemoveMyLock({ board, lock, workOpen }: { board: LockoutDto; lock: LockDto; workOpen: boolean }) {
  const [asking, setAsking] = useState(false);
  const write = useLockoutWrite(board.workOrderId);
  const where = placeOf(board, lock);
  const remove = () => write.send(lockoutWrites.removeLock(lock.id, {}, `${board.number}: lock ${lock.lockNumber} off ${where}`), () => setAsking(false));
  return (
    <div className="mt-2 space-y-2">
      {!asking ? (
        <Button variant="secondary" size="lg" onClick={() => (write.reset(), setAsking(true))}>
          Remove my lock {lock.lockNumber}
        </Button>
      ) : (
        <div className="space-y-2 rounded-lg border border-refuse/30 bg-refuse-light/40 p-2">
          <p className="text-sm">
            Take lock {lock.lockNumber} off {where}? Tools and people clear first.
            {workOpen && ' While work is open, a removal that would leave a point or the box without a lock is refused.'}
          </p>
          <div className="flex flex-wrap gap-2">
            <Button variant="danger" size="lg" disabled={write.isPending || write.isQueued} onClick={remove}>
              {write.isPending ? 'Removing…' : `Yes, remove lock ${lock.lockNumber}`}
            </Button>
            <Button variant="secondary" size="lg" onClick={() => setAsking(false)}>Keep it on</Button>
          </div>
        </div>
      )}
      <WriteState error={write.error} queued={write.isQueued} refusedTitle={`Lock ${lock.lockNumber} was not removed`} />
    </div>
  );
}
