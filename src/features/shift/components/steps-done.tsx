import { JOINT_STEPS } from '@shared/schemas/joint-steps';

/** "3/7" with a bar of seven segments, one per step. */
export function StepsDone({ done }: { done: number }) {
  const total = JOINT_STEPS.length;
  return (
    <span className="flex shrink-0 flex-col items-end gap-1" aria-label={`${done} of ${total} steps recorded`} role="img">
      <span className="text-lg font-bold tabular-nums">
        {done}/{total}
      </span>
      <span className="flex gap-0.5" aria-hidden>
        {JOINT_STEPS.map((s, i) => (
          <span key={s} className={`h-2 w-3 rounded-sm ${i < done ? 'bg-tide' : 'bg-ink/15'}`} />
        ))}
      </span>
    </span>
  );
}
