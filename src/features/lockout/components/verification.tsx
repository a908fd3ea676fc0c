import { useState } from 'react';
import { verificationSchema, type LockoutDto } from '@shared/schemas/lockout';
import { formatDateTime } from '@/lib/format';
import { Button } from '@/components/ui/button';
import { Field, Input } from '@/components/ui/field';
import { positionDefaults, samePosition, unprotectedPoints } from '@/features/lockout/board';
import { lockoutWrites, useLockoutWrite } from '@/features/lockout/api';
import { FormProblems, TOUCH, WriteState, issuesOf, textarea } from '@/features/lockout/components/write-state';

/** Zero energy as verified ((d)(6)): who, when, how, what was read, and each point as found. */
export function VerificationRecord({ record }: { record: NonNullable<LockoutDto['verification']> }) {
  return (
    <div className="space-y-1 text-sm">
      <p>
        <span className="font-semibold">Verified by {record.verifiedBy.name}</span>
        <span className="text-ink-soft"> · {formatDateTime(record.verifiedAt)}</span>
      </p>
      <p><span className="text-ink-soft">How: </span>{record.method}</p>
      <p><span className="text-ink-soft">Reading: </span>{record.reading}</p>
      <p>
        <span className="text-ink-soft">Found: </span>
        {record.points.map((p) => `${p.tag} ${p.positionFound}`).join(' · ')}
      </p>
    </div>
  );
}

/**
 * Operations or a supervisor records that the section is dead: each point's position as found
 * (prefilled with the one it must be in), the method and the reading. Offered only once every point
 * is protected; the server decides.
 */
export function VerificationForm({ board }: { board: LockoutDto }) {
  const write = useLockoutWrite(board.workOrderId);
  const [found, setFound] = useState(() => positionDefaults(board));
  const [method, setMethod] = useState('');
  const [reading, setReading] = useState('');
  const [problems, setProblems] = useState<string[]>([]);
  const open = unprotectedPoints(board);
  const ready = open.length === 0;

  const submit = (ev: React.FormEvent) => {
    ev.preventDefault();
    const points = board.points.map((p) => ({ entryId: p.entryId, positionFound: found[p.entryId] ?? '' }));
    const parsed = verificationSchema.safeParse({ points, method, reading });
    setProblems(issuesOf(parsed));
    if (!parsed.success) return;
    write.send(lockoutWrites.verify(board.workOrderId, parsed.data, board.number));
  };

  return (
    <form onSubmit={submit} aria-label="Verify zero energy" className="space-y-3">
      {!ready && (
        <p className="text-sm text-ink-soft">
          Verification opens once every point carries a lock{board.lockBox ? ' or sits in the lock box with a lock on it' : ''}.
          {open.length > 0 && ` Not protected yet: ${open.map((p) => p.tag).join(', ')}.`}
        </p>
      )}
      <fieldset disabled={!ready} className="space-y-3">
        <legend className="sr-only">Each point as found</legend>
        <div className="grid gap-3 sm:grid-cols-2">
          {board.points.map((p) => (
            <Field
              key={p.entryId}
              label={`${p.tag} found (must be ${p.requiredPosition})`}
              error={found[p.entryId]?.trim() && !samePosition(found[p.entryId]!, p.requiredPosition) ? `Not ${p.requiredPosition}: the section is not isolated until it is.` : undefined}
            >
              <Input className={TOUCH} value={found[p.entryId] ?? ''} onChange={(e) => setFound((f) => ({ ...f, [p.entryId]: e.target.value }))} required maxLength={40} />
            </Field>
          ))}
        </div>
        <Field label="How the section was proven dead" hint="For example: opened the low-point drain and the vent at the pump, tried the start button.">
          <textarea className={textarea} rows={2} value={method} onChange={(e) => setMethod(e.target.value)} required maxLength={1000} />
        </Field>
        <Field label="What was read" hint="For example: 0 psi on PI-1004, no flow at the drain after 5 min.">
          <Input className={TOUCH} value={reading} onChange={(e) => setReading(e.target.value)} required maxLength={500} />
        </Field>
      </fieldset>
      <FormProblems problems={problems} />
      <WriteState error={write.error} queued={write.isQueued} refusedTitle="The verification was not recorded" />
      <div className="flex flex-wrap gap-2">
        <Button type="submit" size="lg" disabled={!ready || write.isPending || write.isQueued || !method.trim() || !reading.trim()}>
          {write.isPending ? 'Recording…' : 'Record zero energy verified'}
        </Button>
      </div>
    </form>
  );
}
