import { useEffect, useId, useRef, useState } from 'react';
import { absentRemovalSchema, type LockDto, type LockoutDto } from '@shared/schemas/lockout';
import { Button } from '@/components/ui/button';
import { Field, Input } from '@/components/ui/field';
import { localInputToIso, placeOf, toLocalInput } from '@/features/lockout/board';
import { lockoutWrites, useLockoutWrite } from '@/features/lockout/api';
import { FormProblems, TOUCH, WriteState, issuesOf, textarea } from '@/features/lockout/components/write-state';

/**
 * A supervisor removes the lock of someone who is not there (1910.147(e)(3)): the three steps of the
 * documented procedure, each recorded with the removal. A modal, so nothing else is tapped halfway.
 */
export function AbsentRemovalDialog({ board, lock }: { board: LockoutDto; lock: LockDto }) {
  const [open, setOpen] = useState(false);
  const ref = useRef<HTMLDialogElement>(null);
  const titleId = useId();
  useEffect(() => {
    if (open && !ref.current?.open) ref.current?.showModal();
  }, [open]);
  return (
    <>
      <Button variant="secondary" size="lg" onClick={() => setOpen(true)} aria-haspopup="dialog">
        Remove absent person’s lock
      </Button>
      <dialog
        ref={ref}
        aria-labelledby={titleId}
        onClose={() => setOpen(false)}
        className="m-auto max-h-[calc(100dvh-2rem)] w-[calc(100%-2rem)] max-w-xl overflow-y-auto rounded-xl bg-paper-raised p-4 text-ink shadow-lg backdrop:bg-ink/50"
      >
        {open && <AbsentRemovalForm board={board} lock={lock} titleId={titleId} onClose={() => ref.current?.close()} />}
      </dialog>
    </>
  );
}

function AbsentRemovalForm({ board, lock, titleId, onClose }: { board: LockoutDto; lock: LockDto; titleId: string; onClose: () => void }) {
  const write = useLockoutWrite(board.workOrderId);
  const [notAtFacility, setNotAtFacility] = useState(false);
  const [contactAttempts, setContactAttempts] = useState('');
  const [calledAt, setCalledAt] = useState(() => toLocalInput(new Date()));
  const [informBeforeReturn, setInformBeforeReturn] = useState('');
  const [problems, setProblems] = useState<string[]>([]);
  const name = lock.person.name;
  const where = placeOf(board, lock);

  const submit = (ev: React.FormEvent) => {
    ev.preventDefault();
    const parsed = absentRemovalSchema.safeParse({ notAtFacility, contactAttempts, contactAttemptedAt: localInputToIso(calledAt) ?? '', informBeforeReturn });
    setProblems(issuesOf(parsed));
    if (!parsed.success) return;
    write.send(lockoutWrites.removeLock(lock.id, { absent: parsed.data }, `${board.number}: ${name}’s lock ${lock.lockNumber} off ${where} (absent)`), onClose);
  };

  return (
    <form onSubmit={submit} className="space-y-4">
      <div>
        <h2 id={titleId} className="text-lg font-semibold">Remove {name}’s lock {lock.lockNumber} from {where}</h2>
        <p className="mt-1 text-sm text-ink-soft">
          Only the person who put a lock on takes it off. When they are not here, a supervisor may, after recording each step
          below (OSHA 29 CFR 1910.147(e)(3)). The removal and these answers go into the order’s record.
        </p>
      </div>
      <fieldset className="space-y-2">
        <legend className="text-sm font-semibold">1. {name} is not at the facility</legend>
        <label className={`flex ${TOUCH} items-center gap-3 rounded-md px-2 text-sm hover:bg-paper-sunk`}>
          <input type="checkbox" className="h-6 w-6 shrink-0 accent-tide" checked={notAtFacility} onChange={(e) => setNotAtFacility(e.target.checked)} />
          I have verified that {name} is not at the facility.
        </label>
      </fieldset>
      <fieldset className="space-y-2">
        <legend className="text-sm font-semibold">2. Every reasonable effort to reach {name}</legend>
        <Field label="How you tried to reach them" hint="For example: called mobile twice, texted, called home, asked the shift lead.">
          <textarea className={textarea} rows={3} value={contactAttempts} onChange={(e) => setContactAttempts(e.target.value)} required />
        </Field>
        <Field label="When you tried">
          <Input type="datetime-local" className={TOUCH} value={calledAt} onChange={(e) => setCalledAt(e.target.value)} required />
        </Field>
      </fieldset>
      <fieldset className="space-y-2">
        <legend className="text-sm font-semibold">3. {name} knows before returning to work</legend>
        <Field label={`How ${name} will be told, before resuming work, that the lock was removed`} hint="For example: a supervisor meets them at the gate at the start of their next shift.">
          <textarea className={textarea} rows={2} value={informBeforeReturn} onChange={(e) => setInformBeforeReturn(e.target.value)} required />
        </Field>
      </fieldset>
      <FormProblems problems={problems} />
      <WriteState error={write.error} queued={write.isQueued} refusedTitle="The lock was not removed" />
      <div className="flex flex-wrap gap-2">
        <Button type="submit" variant="danger" size="lg" disabled={write.isPending || write.isQueued || !notAtFacility}>
          {write.isPending ? 'Removing…' : `Remove ${name}’s lock ${lock.lockNumber}`}
        </Button>
        <Button type="button" variant="secondary" size="lg" onClick={onClose}>{write.isQueued ? 'Close' : 'Cancel'}</Button>
      </div>
    </form>
  );
}
