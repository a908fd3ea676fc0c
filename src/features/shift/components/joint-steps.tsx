import { useQueryClient } from '@tanstack/react-query';
import { Link } from 'react-router-dom';
import { JOINT_STEP_LABELS, JOINT_STEPS, type JointDetailDto, type JointStep, type StepRecord } from '@shared/schemas/joint-steps';
import { dismissWrite, tabletWrite, useOnline, useTabletWrite, useWaitingWrites, useWritesTo, type TabletWrite } from '@/lib/offline-writes';
import { FailedWriteList } from '@/components/ui/write-list';
import { jointTaskQueries } from '../api';
import { toFahrenheit } from '../units';
import { stopsWork } from './blockers';
import { StepItem, type StepView } from './step-item';

const stepOf = (w: TabletWrite) => (w.body as StepRecord).step;

/** The temperature the cement went on at (°F): recorded, or in the cement step still waiting on this tablet. */
function cementTemperature(detail: JointDetailDto, waiting: TabletWrite[]): number | null {
  const recorded = detail.steps.find((s) => s.step === 'cement')?.values.temperatureF;
  if (typeof recorded === 'number') return recorded;
  const queued = waiting.find((w) => stepOf(w) === 'cement')?.body as Extract<StepRecord, { step: 'cement' }> | undefined;
  return queued ? toFahrenheit(queued.values.ambientTemperature, queued.values.temperatureUnit) : null;
}

/**
 * The seven steps, top to bottom: recorded ones with their values, who and when; ones waiting on
 * this tablet; the next one's form; the rest locked with the reason. A step waiting to send counts
 * as done here, so a fitter offline goes on with the joint; the server takes them in order.
 */
export function JointSteps({ detail, mayRecord }: { detail: JointDetailDto; mayRecord: boolean }) {
  const queryClient = useQueryClient();
  const stepsPath = `/api/joint-tasks/${detail.id}/steps`;
  const photosPath = `/api/joint-tasks/${detail.id}/photos`;
  const stepWrites = useWritesTo(stepsPath);
  const photoWrites = useWritesTo(photosPath);
  const online = useOnline();
  const anyWaiting = useWaitingWrites().count > 0;
  const write = useTabletWrite({
    onSuccess: (data, w) => {
      if (w.path.endsWith('/steps') && data && typeof data === 'object' && 'steps' in data) {
        const answer = data as JointDetailDto;
        queryClient.setQueryData(jointTaskQueries.detail(answer.id).queryKey, answer);
      }
    },
  });

  const recorded = new Map(detail.steps.map((s) => [s.step, s]));
  const waiting = new Map(stepWrites.waiting.map((w) => [stepOf(w), w]));
  const current = detail.nextStep === null ? null : (JOINT_STEPS.find((s) => !recorded.has(s) && !waiting.has(s)) ?? null);
  const stops = stopsWork(detail.blockers);
  // Online with nothing queued, the server's blockers are current: the form stays shut. Offline (or
  // behind queued lock writes) they may be stale, so the fitter may go on; the server decides.
  const lockedBy = !mayRecord ? 'Joint steps are recorded by the pipefitter on the joint.' : stops.length && online && !anyWaiting ? stops[0].message : null;

  function record(rec: StepRecord, photos: Blob[] = []) {
    const base = `${detail.label} · ${JOINT_STEP_LABELS[rec.step]}`;
    for (const f of stepWrites.failed) if (stepOf(f.write) === rec.step) dismissWrite(f.id);
    photos.forEach((photo, i) => write.mutate(tabletWrite(photosPath, { photo, step: rec.step }, `${base}: photo ${i + 1} of ${photos.length} (${detail.workOrder.number})`, 'photo')));
    write.mutate(tabletWrite(stepsPath, rec, `${base} (${detail.workOrder.number})`));
  }

  const viewOf = (step: JointStep, i: number): StepView => {
    const done = recorded.get(step);
    if (done) return { kind: 'recorded', record: done };
    const queued = waiting.get(step);
    if (queued) return { kind: 'waiting', values: (queued.body as StepRecord).values, online };
    if (detail.nextStep === null) return { kind: 'locked', reason: detail.redo ? 'Cut out for redo.' : 'Not recorded.' };
    if (step === current) return lockedBy ? { kind: 'locked', reason: lockedBy, orderId: stops.length ? detail.workOrder.id : null } : { kind: 'current' };
    return { kind: 'locked', reason: `Record ${JOINT_STEP_LABELS[JOINT_STEPS[i - 1]].toLowerCase()} first.` };
  };

  return (
    <section aria-labelledby="steps" className="space-y-3">
      <h2 id="steps" className="text-xl font-semibold">Steps</h2>
      <FailedWriteList failed={[...stepWrites.failed, ...photoWrites.failed]} />
      {stops.length > 0 && mayRecord && !lockedBy && current && (
        <p className="rounded-lg border border-hold/40 bg-hold-light p-3 font-medium">
          As this tablet last saw it, the order stops work ({stops[0].message}). The server checks again when it receives the step.{' '}
          <Link to={`/work-orders/${detail.workOrder.id}`} className="inline-flex min-h-12 items-center text-tide underline">Open the order’s locks</Link>
        </p>
      )}
      <ol className="space-y-2">
        {JOINT_STEPS.map((step, i) => (
          <StepItem
            key={step}
            index={i}
            step={step}
            view={viewOf(step, i)}
            detail={detail}
            waitingPhotos={photoWrites.waiting.filter((w) => (w.body as { step: string }).step === step)}
            form={{ onRecord: record, cementTemperatureF: cementTemperature(detail, stepWrites.waiting) }}
          />
        ))}
      </ol>
    </section>
  );
}
