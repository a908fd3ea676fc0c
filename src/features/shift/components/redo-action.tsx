import { useState } from 'react';
import { useNavigate } from 'react-router-dom';
import { redoSchema, type JointDetailDto } from '@shared/schemas/joint-steps';
import { newIdempotencyKey, useOnline } from '@/lib/offline-writes';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { useRedoJoint } from '../api';

/**
 * A joint that went wrong (cement dried before assembly, pipe not bottomed) is cut out: marked for
 * redo with a reason, and the fitter goes on to the new joint that replaces it.
 */
export function RedoAction({ detail }: { detail: JointDetailDto }) {
  const [open, setOpen] = useState(false);
  const [reason, setReason] = useState('');
  const [problem, setProblem] = useState<string>();
  const [key, setKey] = useState(newIdempotencyKey);
  const redo = useRedoJoint(detail.id);
  const online = useOnline();
  const navigate = useNavigate();

  if (!open) {
    return (
      <Button type="button" variant="secondary" size="lg" onClick={() => { setOpen(true); setKey(newIdempotencyKey()); }}>
        Mark {detail.label} for redo…
      </Button>
    );
  }
  const submit = (e: React.FormEvent) => {
    e.preventDefault();
    const parsed = redoSchema.safeParse({ reason });
    if (!parsed.success) return setProblem(parsed.error.issues[0]?.message ?? 'Say why it is cut out.');
    redo.mutate({ reason: parsed.data.reason, key }, { onSuccess: (next: JointDetailDto) => navigate(`/joints/${next.id}`) });
  };
  return (
    <form onSubmit={submit} className="space-y-3 rounded-xl border-2 border-refuse/40 bg-paper-raised p-4">
      <h2 className="text-lg font-semibold">Cut {detail.label} out and make it again</h2>
      <label className="block">
        <span className="mb-1 block font-medium text-ink-soft">Why it is cut out</span>
        <textarea
          value={reason}
          onChange={(e) => { setReason(e.target.value); setProblem(undefined); }}
          rows={3}
          maxLength={1000}
          placeholder="Cement dried before assembly; pipe not bottomed…"
          className="w-full rounded-lg border-2 border-ink/25 bg-paper-raised px-3 py-2 text-lg focus:border-tide"
        />
        {problem && <span className="mt-1 block text-sm font-medium text-refuse">{problem}</span>}
      </label>
      {!online && <Notice tone="caution">Marking for redo needs the network: the new joint comes from the server.</Notice>}
      {redo.isError && <Notice tone="refusal" title="Not marked for redo">{redo.error.message}</Notice>}
      <div className="flex flex-wrap gap-2">
        <Button type="submit" variant="danger" size="lg" disabled={!online || redo.isPending}>
          {redo.isPending ? 'Marking…' : `Mark ${detail.label} for redo`}
        </Button>
        <Button type="button" variant="secondary" size="lg" onClick={() => { setOpen(false); redo.reset(); }}>
          Keep the joint
        </Button>
      </div>
    </form>
  );
}
