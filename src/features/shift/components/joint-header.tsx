import { Link } from 'react-router-dom';
import { FITTING_KIND_LABELS } from '@shared/schemas/joint-tasks';
import type { JointDetailDto } from '@shared/schemas/joint-steps';
import { Notice } from '@/components/ui/notice';
import { formatDateTime, formatSize } from '@/lib/format';
import { orderStateWords } from '../state-words';

/** Which joint this is: its label, fitting, size and material, the order and line it belongs to. */
export function JointHeader({ detail }: { detail: JointDetailDto }) {
  const { line } = detail;
  return (
    <header className="space-y-3">
      <div className="flex flex-wrap items-end gap-x-5 gap-y-1">
        <h1 className="text-5xl font-bold tracking-tight">{detail.label}</h1>
        <p className="text-2xl font-semibold">
          {FITTING_KIND_LABELS[detail.fittingKind]} · {formatSize(detail.jointSize)} · {line.material}
          {line.schedule ? ` Sch ${line.schedule.replace(/^sch(edule)?\s*/i, '')}` : ''}
        </p>
      </div>
      <p className="flex flex-wrap items-center gap-x-2 text-lg">
        <Link to={`/work-orders/${detail.workOrder.id}`} className="inline-flex min-h-12 items-center font-semibold text-tide underline">
          {detail.workOrder.number}
        </Link>
        <span className="text-ink-soft">({orderStateWords(detail.workOrder.state)})</span>
        <span>· Line {line.lineNumber}</span>
        <span className="text-ink-soft">· {line.service}</span>
        {detail.fitter && <span className="text-ink-soft">· fitter {detail.fitter.name}</span>}
      </p>
      {detail.redo && (
        <Notice tone="refusal" title={`Cut out for redo by ${detail.redo.by.name}, ${formatDateTime(detail.redo.at)}`}>
          <p>{detail.redo.reason}</p>
          {detail.replacedByTaskId && (
            <Link to={`/joints/${detail.replacedByTaskId}`} className="inline-flex min-h-12 items-center font-semibold text-tide underline">
              Open the joint that replaces it
            </Link>
          )}
        </Notice>
      )}
      {detail.replacesTaskId && (
        <p>
          This joint replaces one cut out for redo.{' '}
          <Link to={`/joints/${detail.replacesTaskId}`} className="inline-flex min-h-12 items-center font-semibold text-tide underline">
            See the joint it replaces
          </Link>
        </p>
      )}
      {detail.engine.problems.length > 0 && (
        <Notice tone="caution" title="The engine’s figures for this joint">
          {detail.engine.problems.map((p) => <p key={p}>{p}</p>)}
        </Notice>
      )}
    </header>
  );
}
