import type { ComponentProps, ReactNode } from 'react';
import { JOINT_STEP_LABELS, type JointDetailDto, type JointStep, type StepRecord } from '@shared/schemas/joint-steps';
import { buttonClass } from '@/components/ui/button';

/** What every step's form gets: the joint, whether it may be filled in now, and where its record goes. */
export interface StepFormProps {
  detail: JointDetailDto;
  disabled: boolean;
  /** Queues the step (and its photos first) as tablet writes. */
  onRecord: (record: StepRecord, photos?: Blob[]) => void;
}

export function RecordButton({ step, disabled, children }: { step: JointStep; disabled?: boolean; children?: ReactNode }) {
  return (
    <button type="submit" disabled={disabled} className={buttonClass('primary', { size: 'wide', className: 'mt-2' })}>
      {children ?? `Record: ${JOINT_STEP_LABELS[step].toLowerCase()}`}
    </button>
  );
}

/** A large text or number field with its label and the form's error under it. */
export function BigField({ label, hint, error, className = '', ...input }: ComponentProps<'input'> & { label: ReactNode; hint?: ReactNode; error?: string }) {
  return (
    <label className="block">
      <span className="mb-1 block font-medium text-ink-soft">{label}</span>
      <input {...input} className={`min-h-12 w-full rounded-lg border-2 border-ink/25 bg-paper-raised px-3 py-2 text-xl focus:border-tide ${className}`} />
      {hint && !error && <span className="mt-1 block text-sm text-ink-soft">{hint}</span>}
      {error && <span className="mt-1 block text-sm font-medium text-refuse">{error}</span>}
    </label>
  );
}
