import { Link } from 'react-router-dom';
import { FITTING_KIND_LABELS } from '@shared/schemas/joint-tasks';
import { JOINT_STEP_LABELS, type BlockerDto, type ShiftDto } from '@shared/schemas/joint-steps';
import { formatSize } from '@/lib/format';
import { BlockerList } from './blockers';
import { HoldLine } from './hold-list';
import { StepsDone } from './steps-done';

export const ORDER_WIDE: readonly BlockerDto['kind'][] = ['isolation', 'my-lock'];
type ShiftJoint = ShiftDto['orders'][number]['lines'][number]['joints'][number];

/** One joint of the shift: the whole row opens it. */
export function ShiftJointRow({ joint }: { joint: ShiftJoint }) {
  const next = joint.nextStep ? `Next: ${JOINT_STEP_LABELS[joint.nextStep]}` : joint.redone ? 'Cut out for redo' : 'Every step recorded';
  const holds = joint.holds.filter((h) => h.status === 'running' || h.status === 'awaiting-engineering');
  // Isolation and my lock are the order's, said once above its joints.
  const blockers = joint.blockers.filter((b) => b.kind !== 'hold' && !ORDER_WIDE.includes(b.kind));
  return (
    <li>
      <Link
        to={`/joints/${joint.id}`}
        className={`block min-h-16 rounded-lg border-2 px-4 py-3 hover:border-tide hover:bg-tide-light/30 ${joint.redone ? 'border-ink/10 bg-paper-sunk' : 'border-ink/15 bg-paper-raised'}`}
      >
        <div className="flex items-center gap-4">
          <span className="w-16 shrink-0 text-3xl font-bold tracking-tight">{joint.label}</span>
          <div className="min-w-0 flex-1">
            <span className="block text-lg font-semibold">
              {FITTING_KIND_LABELS[joint.fittingKind]} · {formatSize(joint.jointSize)}
            </span>
            <span className={`block ${joint.nextStep ? 'font-medium text-ink' : 'text-ink-soft'}`}>{next}</span>
          </div>
          <StepsDone done={joint.stepsDone} />
          <span aria-hidden className="text-2xl text-ink-faint">›</span>
        </div>
        {(blockers.length > 0 || holds.length > 0) && (
          <div className="mt-2 space-y-1 border-t border-ink/10 pt-2">
            <BlockerList blockers={blockers} orderId={null} compact />
            {holds.map((h) => (
              <HoldLine key={h.id} hold={h} />
            ))}
          </div>
        )}
      </Link>
    </li>
  );
}
