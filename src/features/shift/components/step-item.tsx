import { Link } from 'react-router-dom';
import { JOINT_STEP_LABELS, PHOTO_STEPS, type JointDetailDto, type JointStep, type PhotoStep, type RecordedStepDto, type StepRecord } from '@shared/schemas/joint-steps';
import type { TabletWrite } from '@/lib/offline-writes';
import { formatDateTime } from '@/lib/format';
import { LocalThumb, PhotoThumbs } from './photo-thumbs';
import { StepCautions } from './step-cautions';
import { StepForm } from './step-form';
import { stepValuesText } from './step-values';

export type StepView =
  | { kind: 'recorded'; record: RecordedStepDto }
  | { kind: 'waiting'; values: Record<string, unknown>; online: boolean }
  | { kind: 'current' }
  | { kind: 'locked'; reason: string; orderId?: string | null };

const RAIL: Record<StepView['kind'], string> = {
  recorded: 'bg-tide text-white',
  waiting: 'bg-hold text-white',
  current: 'bg-ink text-paper ring-4 ring-tide/40',
  locked: 'bg-paper-sunk text-ink-soft border border-ink/20',
};
const MARK: Record<StepView['kind'], string | null> = { recorded: '✓', waiting: '…', current: null, locked: null };
const isPhotoStep = (s: JointStep): s is PhotoStep => (PHOTO_STEPS as readonly JointStep[]).includes(s);

/** One step of the stepper; the current one holds its form. */
export function StepItem({ index, step, view, detail, waitingPhotos, form }: {
  index: number;
  step: JointStep;
  view: StepView;
  detail: JointDetailDto;
  waitingPhotos: TabletWrite[];
  form: { onRecord: (rec: StepRecord, photos?: Blob[]) => void; cementTemperatureF: number | null };
}) {
  const photos = isPhotoStep(step) ? detail.photos.filter((p) => p.step === step) : [];
  const status =
    view.kind === 'recorded' ? 'recorded' : view.kind === 'waiting' ? (view.online ? 'sending' : 'waiting to send') : view.kind === 'current' ? 'to record now' : 'locked';
  return (
    <li
      aria-current={view.kind === 'current' ? 'step' : undefined}
      className={`flex gap-4 rounded-xl border p-4 ${view.kind === 'current' ? 'border-tide bg-paper-raised shadow-sm' : 'border-ink/10 bg-paper-raised/70'}`}
    >
      <span aria-hidden className={`grid h-12 w-12 shrink-0 place-items-center rounded-full text-xl font-bold ${RAIL[view.kind]}`}>
        {MARK[view.kind] ?? index + 1}
      </span>
      <div className="min-w-0 flex-1 space-y-2">
        <h3 className="flex flex-wrap items-baseline gap-x-3 text-xl font-semibold">
          {JOINT_STEP_LABELS[step]}{' '}
          <span className={`text-base font-medium ${view.kind === 'waiting' ? 'text-hold' : 'text-ink-soft'}`}>· {status}</span>
        </h3>
        {view.kind === 'recorded' && (
          <>
            <p className="text-lg">{stepValuesText(step, view.record.values)}</p>
            <p className="text-sm text-ink-soft">
              {view.record.recordedBy.name}, {formatDateTime(view.record.recordedAt)}
            </p>
          </>
        )}
        {view.kind === 'waiting' && (
          <>
            <p className="text-lg">{stepValuesText(step, view.values)}</p>
            <p className="font-medium text-hold">{view.online ? 'Sending to the server…' : 'Kept on this tablet; sent when the network is back.'}</p>
          </>
        )}
        {view.kind === 'locked' && (
          <p className="text-ink-soft">
            {view.reason}
            {view.orderId && (
              <>
                {' '}
                <Link to={`/work-orders/${view.orderId}`} className="inline-flex min-h-12 items-center font-semibold text-tide underline">Open the order’s locks</Link>
              </>
            )}
          </p>
        )}
        {(photos.length > 0 || waitingPhotos.length > 0) && (
          <div className="flex flex-wrap items-start gap-2">
            <PhotoThumbs photos={photos} />
            {waitingPhotos.map((w) => (
              <div key={w.idempotencyKey} className="text-center text-xs font-medium text-hold">
                <LocalThumb blob={(w.body as { photo: Blob }).photo} alt={`${w.label}, waiting to send`} />
                waiting
              </div>
            ))}
          </div>
        )}
        {view.kind === 'current' && <StepCautions cautions={detail.cautions[step] ?? []} />}
        {view.kind === 'locked' && detail.nextStep !== null && (detail.cautions[step] ?? []).length > 0 && (
          <details className="rounded-lg border border-hold/40 bg-hold-light/60">
            <summary className="flex min-h-12 cursor-pointer items-center px-3 font-medium">Cautions for this step ({detail.cautions[step].length})</summary>
            <div className="px-1 pb-1">
              <StepCautions cautions={detail.cautions[step]} />
            </div>
          </details>
        )}
        {view.kind === 'current' && <StepForm step={step} detail={detail} disabled={false} onRecord={form.onRecord} cementTemperatureF={form.cementTemperatureF} />}
      </div>
    </li>
  );
}
