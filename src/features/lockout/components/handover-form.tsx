import { useState } from 'react';
import { handoverSchema, type LockoutDto } from '@shared/schemas/lockout';
import { Button } from '@/components/ui/button';
import { Field, Input, Select } from '@/components/ui/field';
import { Notice } from '@/components/ui/notice';
import { lockHolders, locksOn, placeOf, repeatedNumbers, toHandover } from '@/features/lockout/board';
import { lockoutWrites, useLockoutWrite } from '@/features/lockout/api';
import { FormProblems, TOUCH, WriteState, issuesOf } from '@/features/lockout/components/write-state';

/**
 * Shift change without a gap ((f)(4)): the on-coming person (signed in) puts a lock of their own beside
 * each of the off-going person's; only then does the off-going person take theirs off.
 */
export function HandoverForm({ board, meId, onClose }: { board: LockoutDto; meId: string; onClose: () => void }) {
  const write = useLockoutWrite(board.workOrderId);
  const holders = lockHolders(board, meId);
  const [fromId, setFromId] = useState(holders.length === 1 ? holders[0]!.person.id : '');
  const [numbers, setNumbers] = useState<Record<string, string>>({});
  const [problems, setProblems] = useState<string[]>([]);
  const [doneFor, setDoneFor] = useState<string | null>(null);
  const from = holders.find((h) => h.person.id === fromId);

  if (doneFor) {
    return (
      <div className="space-y-2">
        <Notice tone="success" title="Your locks are on">
          Now {doneFor} takes their own locks off with “Remove my lock”, signed in as themselves.
        </Notice>
        <Button variant="secondary" size="lg" onClick={onClose}>Close</Button>
      </div>
    );
  }
  if (!holders.length) {
    return (
      <div className="space-y-2 rounded-lg border border-ink/15 bg-paper p-3">
        <p className="text-sm">Nobody else has a lock on this order, so there is nothing to take over. Apply your own locks instead.</p>
        <Button variant="secondary" size="lg" onClick={onClose}>Close</Button>
      </div>
    );
  }

  const submit = (ev: React.FormEvent) => {
    ev.preventDefault();
    if (!from) return setProblems(['Pick the person going off shift.']);
    const body = toHandover(from.person.id, from.locks, numbers);
    const twice = repeatedNumbers(body.locks.map((l) => l.lockNumber), locksOn(board).map((l) => l.lockNumber));
    const parsed = handoverSchema.safeParse(body);
    const found = [...issuesOf(parsed), ...twice.map((n) => `Lock ${n} is named twice or is already on ${board.number}: one lock hangs in one place.`)];
    setProblems(found);
    if (found.length || !parsed.success) return;
    write.send(lockoutWrites.handOver(board.workOrderId, parsed.data, board.number), () => setDoneFor(from.person.name));
  };

  return (
    <form onSubmit={submit} aria-label="Take over at shift change" className="space-y-3 rounded-lg border border-ink/15 bg-paper p-3">
      <p className="text-sm">
        You put one of your own locks beside each lock of the person going off shift. The server keeps their locks on until yours are recorded.
      </p>
      <Field label="Who is going off shift">
        <Select className={TOUCH} value={fromId} onChange={(e) => (setFromId(e.target.value), setNumbers({}))} required>
          <option value="">Pick a person with locks on…</option>
          {holders.map((h) => (
            <option key={h.person.id} value={h.person.id}>{h.person.name} ({h.locks.length === 1 ? '1 lock' : `${h.locks.length} locks`})</option>
          ))}
        </Select>
      </Field>
      {from && (
        <div className="grid gap-3 sm:grid-cols-2">
          {from.locks.map((l) => (
            <Field key={l.id} label={`Your lock on ${placeOf(board, l)}, beside ${from.person.name}’s lock ${l.lockNumber}`}>
              <Input className={TOUCH} autoComplete="off" value={numbers[l.id] ?? ''} onChange={(e) => setNumbers((n) => ({ ...n, [l.id]: e.target.value }))} required />
            </Field>
          ))}
        </div>
      )}
      <FormProblems problems={problems} />
      <WriteState error={write.error} queued={write.isQueued} refusedTitle="The handover was not recorded" />
      <div className="flex flex-wrap gap-2">
        <Button type="submit" size="lg" disabled={!from || write.isPending || write.isQueued}>
          {write.isPending ? 'Recording…' : 'Record my locks for the handover'}
        </Button>
        <Button type="button" variant="secondary" size="lg" onClick={onClose}>{write.isQueued ? 'Close' : 'Cancel'}</Button>
      </div>
    </form>
  );
}
