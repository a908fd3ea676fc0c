import { useState } from 'react';
import { useQuery } from '@tanstack/react-query';
import { may } from '@shared/permissions';
import type { LockoutDto } from '@shared/schemas/lockout';
import type { Me } from '@shared/schemas/roles';
import { authQueries } from '@/lib/auth';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Notice } from '@/components/ui/notice';
import { lockoutQueries } from '@/features/lockout/api';
import { locksMayGoOn, locksOn, mayBeVerified, sectionOpen } from '@/features/lockout/board';
import { ApplyLocksForm } from '@/features/lockout/components/apply-locks-form';
import { HandoverForm } from '@/features/lockout/components/handover-form';
import { LockBoxForm } from '@/features/lockout/components/lock-box-form';
import { LockoutCaution } from '@/features/lockout/components/lockout-caution';
import { LockBoxPanel, PointList } from '@/features/lockout/components/point-list';
import { RemovedLocks } from '@/features/lockout/components/removed-locks';
import { VerificationForm, VerificationRecord } from '@/features/lockout/components/verification';

type Open = null | 'apply' | 'box' | 'handover';

/** The order's lock board: who is locked on where, right now, the verification, and the lock events a person may record. */
export function LockBoardCard({ orderId }: { orderId: string }) {
  const { data: me } = useQuery(authQueries.me());
  const { data: board, error, isPending } = useQuery(lockoutQueries.board(orderId));
  if (error) {
    return (
      <Card title="Lockout">
        <Notice tone="refusal" title="The lock board could not be loaded">{error.message} The isolation points and their locks in the field are what count; ask the supervisor.</Notice>
      </Card>
    );
  }
  if (isPending) return <Card title="Lockout"><p className="text-sm text-ink-soft">Loading the lock board…</p></Card>;
  return <Board board={board} me={me ?? null} />;
}

function Board({ board, me }: { board: LockoutDto; me: Me | null }) {
  const [open, setOpen] = useState<Open>(null);
  const lockable = locksMayGoOn(board.state);
  const mayApply = lockable && may(me, 'locks.apply');
  const mayHandOver = lockable && may(me, 'locks.handover');
  const powers = { mayRemoveAbsent: may(me, 'locks.removeAbsent'), workOpen: sectionOpen(board.state) };
  const toggle = (o: Open) => setOpen((x) => (x === o ? null : o));
  const close = () => setOpen(null);

  return (
    <Card title="Lockout">
      <div className="space-y-4">
        <Status board={board} lockable={lockable} />
        {lockable && <LockoutCaution />}
        {(mayApply || mayHandOver) && board.points.length > 0 && (
          <div className="space-y-3">
            <div className="flex flex-wrap gap-2">
              {mayApply && <Button size="lg" aria-expanded={open === 'apply'} onClick={() => toggle('apply')}>Apply my locks</Button>}
              {mayApply && !board.lockBox && <Button variant="secondary" size="lg" aria-expanded={open === 'box'} onClick={() => toggle('box')}>Set up a group lock box</Button>}
              {mayHandOver && <Button variant="secondary" size="lg" aria-expanded={open === 'handover'} onClick={() => toggle('handover')}>Take over at shift change</Button>}
            </div>
            {open === 'apply' && <ApplyLocksForm board={board} onClose={close} />}
            {open === 'box' && !board.lockBox && <LockBoxForm board={board} onClose={close} />}
            {open === 'handover' && me && <HandoverForm board={board} meId={me.id} onClose={close} />}
          </div>
        )}
        {board.points.length === 0 ? (
          <p className="text-sm text-ink-soft">The order has no isolation points; the isolation plan names them.</p>
        ) : (
          <>
            <LockBoxPanel board={board} {...powers} />
            <PointList board={board} {...powers} />
          </>
        )}
        <Verification board={board} mayVerify={may(me, 'isolation.verify') && mayBeVerified(board)} />
        <RemovedLocks board={board} />
      </div>
    </Card>
  );
}

/** Isolated, or what is still missing, in the server's sentences. */
function Status({ board, lockable }: { board: LockoutDto; lockable: boolean }) {
  const on = locksOn(board).length;
  const count = on === 1 ? '1 lock is on' : `${on} locks are on`;
  if (board.isolated) return <Notice tone="success" title="Isolated">Every point is protected and zero energy is verified; {count}.</Notice>;
  if (!lockable) return <Notice tone="info" title={on ? `${count} still` : 'Every lock is off'} />;
  return (
    <Notice tone="caution" title="Not isolated: nobody works on the section until it is">
      {board.missing.length > 0 ? <ul className="mt-1 list-disc pl-5">{board.missing.map((m) => <li key={m}>{m}</li>)}</ul> : <p>Locks and the verification are still to come.</p>}
    </Notice>
  );
}

/** The record of zero energy, or the form to make it (operations or a supervisor, when the server would take it). */
function Verification({ board, mayVerify }: { board: LockoutDto; mayVerify: boolean }) {
  const record = board.verification;
  return (
    <section aria-labelledby="lockout-verification" className="space-y-2 border-t border-ink/10 pt-3">
      <h3 id="lockout-verification" className="font-semibold">Zero energy verification</h3>
      {record ? <VerificationRecord record={record} /> : <p className="text-sm text-ink-soft">Not verified.</p>}
      {mayVerify && board.points.length > 0 && <VerificationForm board={board} />}
    </section>
  );
}
