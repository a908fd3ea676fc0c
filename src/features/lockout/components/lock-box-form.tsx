import { useState } from 'react';
import { lockBoxCreateSchema, type LockoutDto } from '@shared/schemas/lockout';
import { Button } from '@/components/ui/button';
import { Field, Input } from '@/components/ui/field';
import { lockoutWrites, useLockoutWrite } from '@/features/lockout/api';
import { FormProblems, TOUCH, WriteState, issuesOf } from '@/features/lockout/components/write-state';

/**
 * A group lockout ((f)(3)): the keys of the chosen points go into one box, and whoever sets it up holds
 * primary responsibility for it. Everyone then puts their own lock on the box.
 */
export function LockBoxForm({ board, onClose }: { board: LockoutDto; onClose: () => void }) {
  const write = useLockoutWrite(board.workOrderId);
  const [label, setLabel] = useState('');
  const [picked, setPicked] = useState(() => new Set(board.points.map((p) => p.entryId)));
  const [problems, setProblems] = useState<string[]>([]);
  const lockedAlready = board.points.filter((p) => picked.has(p.entryId) && p.locks.length > 0).map((p) => p.tag);
  const toggle = (id: string) => setPicked((s) => { const n = new Set(s); if (n.has(id)) n.delete(id); else n.add(id); return n; });

  const submit = (ev: React.FormEvent) => {
    ev.preventDefault();
    const parsed = lockBoxCreateSchema.safeParse({ label, entryIds: board.points.filter((p) => picked.has(p.entryId)).map((p) => p.entryId) });
    setProblems(issuesOf(parsed));
    if (!parsed.success) return;
    write.send(lockoutWrites.setUpLockBox(board.workOrderId, parsed.data, board.number), onClose);
  };

  return (
    <form onSubmit={submit} aria-label="Set up a group lock box" className="space-y-3 rounded-lg border border-ink/15 bg-paper p-3">
      <p className="text-sm">
        The keys of the chosen points go into the box. You hold primary responsibility for it; each person then puts a
        personal lock on the box for as long as they work on the section, and takes it off when they stop.
      </p>
      <Field label="The box’s label or number">
        <Input className={TOUCH} autoComplete="off" value={label} onChange={(e) => setLabel(e.target.value)} required maxLength={40} />
      </Field>
      <fieldset>
        <legend className="mb-1 text-sm font-semibold">Points whose keys go into the box</legend>
        {board.points.map((p) => (
          <label key={p.entryId} className={`flex ${TOUCH} items-center gap-3 rounded-md px-2 text-sm hover:bg-paper-sunk`}>
            <input type="checkbox" className="h-6 w-6 shrink-0 accent-tide" checked={picked.has(p.entryId)} onChange={() => toggle(p.entryId)} />
            <span className="font-semibold">{p.tag}</span>
            <span className="text-ink-soft">on {p.lineNumber}, {p.requiredPosition}</span>
          </label>
        ))}
      </fieldset>
      {lockedAlready.length > 0 && (
        <p className="text-sm text-ink-soft">
          {lockedAlready.join(', ')} already {lockedAlready.length === 1 ? 'carries' : 'carry'} personal locks. Once a key is in the box, only the locks on the box count for that point.
        </p>
      )}
      <FormProblems problems={problems} />
      <WriteState error={write.error} queued={write.isQueued} refusedTitle="The lock box was not set up" />
      <div className="flex flex-wrap gap-2">
        <Button type="submit" size="lg" disabled={write.isPending || write.isQueued || !label.trim() || picked.size === 0}>
          {write.isPending ? 'Recording…' : 'Set up the lock box'}
        </Button>
        <Button type="button" variant="secondary" size="lg" onClick={onClose}>{write.isQueued ? 'Close' : 'Cancel'}</Button>
      </div>
    </form>
  );
}
