import { useState } from 'react';
import { locksApplySchema, type LockoutDto } from '@shared/schemas/lockout';
import { Button } from '@/components/ui/button';
import { Field, Input } from '@/components/ui/field';
import { locksOn, repeatedNumbers, targetsNeedingMyLock, toLocksApply } from '@/features/lockout/board';
import { lockoutWrites, useLockoutWrite } from '@/features/lockout/api';
import { FormProblems, TOUCH, WriteState, issuesOf } from '@/features/lockout/components/write-state';

/** The signed-in person's own locks: one number for each point not yet carrying theirs, or one on the box. */
export function ApplyLocksForm({ board, onClose }: { board: LockoutDto; onClose: () => void }) {
  const write = useLockoutWrite(board.workOrderId);
  const rows = targetsNeedingMyLock(board);
  const [numbers, setNumbers] = useState<Record<string, string>>({});
  const [problems, setProblems] = useState<string[]>([]);

  if (!rows.length) {
    return (
      <div className="space-y-2 rounded-lg border border-ink/15 bg-paper p-3">
        <p className="text-sm">You have a lock on every point{board.lockBox ? ' and on the lock box' : ''} of this order.</p>
        <Button variant="secondary" size="lg" onClick={onClose}>Close</Button>
      </div>
    );
  }

  const submit = (ev: React.FormEvent) => {
    ev.preventDefault();
    const body = toLocksApply(rows, numbers);
    const twice = repeatedNumbers(body.locks.map((l) => l.lockNumber), locksOn(board).map((l) => l.lockNumber));
    const parsed = locksApplySchema.safeParse(body);
    const found = [...issuesOf(parsed), ...twice.map((n) => `Lock ${n} is named twice or is already on ${board.number}: one lock hangs in one place.`)];
    setProblems(found);
    if (found.length || !parsed.success) return;
    write.send(lockoutWrites.applyLocks(board.workOrderId, parsed.data, board.number), onClose);
  };

  return (
    <form onSubmit={submit} aria-label="Apply my locks" className="space-y-3 rounded-lg border border-ink/15 bg-paper p-3">
      <p className="text-sm">
        Type the number on each lock as you put it on. Everyone working on the section puts their own lock on every point
        {board.lockBox ? ', or on the lock box for the points whose keys are in it' : ''}. Leave a field empty for a point you have not locked yet.
      </p>
      <div className="grid gap-3 sm:grid-cols-2">
        {rows.map((r) => (
          <Field key={r.key} label={`Your lock number on ${r.label}`}>
            <Input
              className={TOUCH}
              autoComplete="off"
              value={numbers[r.key] ?? ''}
              onChange={(e) => setNumbers((n) => ({ ...n, [r.key]: e.target.value }))}
            />
          </Field>
        ))}
      </div>
      <FormProblems problems={problems} />
      <WriteState error={write.error} queued={write.isQueued} refusedTitle="Your locks were not recorded" />
      <div className="flex flex-wrap gap-2">
        <Button type="submit" size="lg" disabled={write.isPending || write.isQueued || !Object.values(numbers).some((n) => n.trim())}>
          {write.isPending ? 'Recording…' : 'Record my locks'}
        </Button>
        <Button type="button" variant="secondary" size="lg" onClick={onClose}>{write.isQueued ? 'Close' : 'Cancel'}</Button>
      </div>
    </form>
  );
}
