import { useState } from 'react';
import { useQuery } from '@tanstack/react-query';
import { Link } from 'react-router-dom';
import { JOINT_STEPS } from '@shared/schemas/joint-steps';
import { NOMINAL_SIZES, parseNominalSize } from '@shared/trade';
import { FITTING_KINDS, FITTING_KIND_LABELS, REDUCING_FITTINGS, type FittingKind, type JointTaskDto } from '@shared/schemas/joint-tasks';
import type { LineDto } from '@shared/schemas/lines';
import { ApiRequestError } from '@/lib/api-client';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Field, Input, Select } from '@/components/ui/field';
import { Notice } from '@/components/ui/notice';
import { formatSize } from '@/lib/format';
import { useAddJoints, useRemoveJoint, useSetFitter, workOrderQueries } from '@/features/work-orders/api';

export function JointTasksCard({ orderId, lines, tasks, mayEdit }: { orderId: string; lines: LineDto[]; tasks: JointTaskDto[]; mayEdit: boolean }) {
  const remove = useRemoveJoint();
  const assign = useSetFitter();
  const fitters = useQuery({ ...workOrderQueries.fitters(), enabled: mayEdit });
  return (
    <Card title={`Joint tasks (${tasks.length})`}>
      {tasks.length === 0 ? (
        <p className="mb-3 text-sm text-ink-soft">No joints yet. Add the joints the repair needs, one row per fitting kind and size.</p>
      ) : (
        <div className="mb-3 overflow-x-auto">
          <table className="w-full text-left text-sm">
            <thead className="text-[13px] text-ink-soft">
              <tr className="border-b border-ink/10">
                <th scope="col" className="py-2 pr-3">Joint</th>
                <th scope="col" className="py-2 pr-3">Line</th>
                <th scope="col" className="py-2 pr-3">Fitting</th>
                <th scope="col" className="py-2 pr-3 text-right">Size</th>
                <th scope="col" className="py-2 pr-3">Fitter</th>
                {!mayEdit && <th scope="col" className="py-2 pr-3">Steps</th>}
                {mayEdit && <th scope="col" className="py-2"><span className="sr-only">Remove</span></th>}
              </tr>
            </thead>
            <tbody>
              {tasks.map((j) => (
                <tr key={j.id} className="border-b border-ink/5 last:border-0">
                  <td className="py-1 pr-3 font-semibold">{j.label}</td>
                  <td className="py-1 pr-3">{j.lineNumber}</td>
                  <td className="py-1 pr-3">{FITTING_KIND_LABELS[j.fittingKind]}</td>
                  <td className="py-1 pr-3 text-right tabular-nums">{formatSize(j.jointSize)}{j.reducingSize && <span className="text-ink-soft"> (on {formatSize(j.nominalSize)})</span>}</td>
                  <td className="py-1 pr-3">
                    {mayEdit && fitters.data ? (
                      <Select
                        aria-label={`Fitter for joint ${j.label}`}
                        value={j.fitter?.id ?? ''}
                        disabled={assign.isPending}
                        onChange={(e) => assign.mutate({ taskId: j.id, personId: e.target.value || null })}
                      >
                        <option value="">not assigned</option>
                        {fitters.data.map((f) => (
                          <option key={f.id} value={f.id}>{f.name}</option>
                        ))}
                      </Select>
                    ) : (
                      j.fitter?.name ?? <span className="text-ink-faint">not assigned</span>
                    )}
                  </td>
                  {!mayEdit && (
                    <td className="py-1 pr-3">
                      <Link to={`/joints/${j.id}`} className="inline-flex min-h-11 items-center font-medium text-tide hover:underline">
                        {j.redone ? 'cut out for redo' : `${j.stepsDone} of ${JOINT_STEPS.length}`}
                        <span className="sr-only"> — open joint {j.label}</span>
                      </Link>
                    </td>
                  )}
                  {mayEdit && (
                    <td className="py-1 text-right">
                      <Button variant="ghost" aria-label={`Remove joint ${j.label}`} disabled={remove.isPending} onClick={() => remove.mutate(j.id)}>Remove</Button>
                    </td>
                  )}
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
      {remove.error && <Notice tone="refusal" title="The joint was not removed">{remove.error.message}</Notice>}
      {assign.error && <Notice tone="refusal" title="The fitter was not assigned">{assign.error.message}</Notice>}
      {mayEdit && lines.length > 0 && <AddJoints orderId={orderId} lines={lines} />}
    </Card>
  );
}

function AddJoints({ orderId, lines }: { orderId: string; lines: LineDto[] }) {
  const add = useAddJoints(orderId);
  const [lineId, setLineId] = useState(lines[0]!.id);
  const [kind, setKind] = useState<FittingKind>('coupling');
  const [reducing, setReducing] = useState('');
  const [count, setCount] = useState('1');
  const line = lines.find((l) => l.id === lineId) ?? lines[0]!;
  const reduces = REDUCING_FITTINGS.includes(kind);
  const lineIn = parseNominalSize(line.nominalSize) ?? 0;
  const smaller = NOMINAL_SIZES.filter((s) => (parseNominalSize(s) ?? 0) < lineIn);
  const details = add.error instanceof ApiRequestError ? add.error.details : undefined;

  const submit = (e: React.FormEvent) => {
    e.preventDefault();
    add.mutate(
      { lineId: line.id, fittingKind: kind, count: Number(count) || 1, ...(reduces && reducing ? { reducingSize: reducing } : {}) },
      { onSuccess: () => (setCount('1'), setReducing('')) },
    );
  };
  return (
    <form onSubmit={submit} aria-label="Add joints" className="rounded-lg border border-ink/10 bg-paper p-3">
      <p className="mb-2 text-sm font-semibold">Add joints</p>
      <div className="grid grid-cols-2 gap-3 xl:grid-cols-[1.3fr_1.3fr_1fr_0.7fr_auto] xl:items-end">
        <Field label="Fitting kind" error={details?.fittingKind?.join(' ')}>
          <Select value={kind} onChange={(e) => setKind(e.target.value as FittingKind)}>
            {FITTING_KINDS.map((k) => <option key={k} value={k}>{FITTING_KIND_LABELS[k]}</option>)}
          </Select>
        </Field>
        <Field label="Line" error={details?.lineId?.join(' ')}>
          <Select value={line.id} onChange={(e) => setLineId(e.target.value)}>
            {lines.map((l) => <option key={l.id} value={l.id}>{l.lineNumber} ({formatSize(l.nominalSize)})</option>)}
          </Select>
        </Field>
        <Field label="Reducing size" error={details?.reducingSize?.join(' ')}>
          <Select value={reduces ? reducing : ''} disabled={!reduces} onChange={(e) => setReducing(e.target.value)}>
            <option value="">{reduces ? `none: ${formatSize(line.nominalSize)}` : `line size ${formatSize(line.nominalSize)}`}</option>
            {reduces && smaller.map((s) => <option key={s} value={s}>{formatSize(s)}</option>)}
          </Select>
        </Field>
        <Field label="Count" error={details?.count?.join(' ')}>
          <Input type="number" min={1} max={100} value={count} onChange={(e) => setCount(e.target.value)} />
        </Field>
        <Button type="submit" disabled={add.isPending} className="col-span-2 xl:col-span-1">{add.isPending ? 'Adding…' : 'Add'}</Button>
      </div>
      {add.error && !details && <div className="mt-2"><Notice tone="refusal" title="The joints were not added">{add.error.message}</Notice></div>}
    </form>
  );
}
