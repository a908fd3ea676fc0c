import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { depthMarksValuesSchema } from '@shared/schemas/joint-steps';
import { lengthText } from '../units';
import { BigCheck } from './big-check';
import { RecordButton, type StepFormProps } from './form-bits';
import { PhotoCapture } from './photo-capture';

type In = z.input<typeof depthMarksValuesSchema>;
type Out = z.output<typeof depthMarksValuesSchema>;

function Mark({ name, inches }: { name: string; inches: number | null }) {
  return (
    <div className="rounded-xl border-2 border-ink/15 bg-paper-sunk p-4">
      <p className="font-medium text-ink-soft">{name}, from the pipe end</p>
      {inches === null ? (
        <p className="text-xl text-ink-soft">not computed for this joint</p>
      ) : (
        <>
          <p className="text-5xl font-bold tabular-nums tracking-tight">{lengthText(inches, 'in')}</p>
          <p className="text-xl tabular-nums text-ink-soft">{lengthText(inches, 'mm')}</p>
        </>
      )}
    </div>
  );
}

/** The two marks, computed and shown large; the fitter confirms each and photographs them. */
export function DepthMarksForm({ detail, disabled, onRecord }: StepFormProps) {
  const form = useForm<In, unknown, Out>({ resolver: zodResolver(depthMarksValuesSchema) });
  const [photos, setPhotos] = useState<Blob[]>([]);
  const [photoError, setPhotoError] = useState<string>();
  const hasRecorded = detail.photos.some((p) => p.step === 'depth-marks');
  const e = form.formState.errors;
  const submit = form.handleSubmit((values) => {
    if (!photos.length && !hasRecorded) return setPhotoError('Take at least one photo of the marks.');
    onRecord({ step: 'depth-marks', values }, photos);
  });
  return (
    <form noValidate onSubmit={submit}>
      <fieldset disabled={disabled} className="space-y-3">
        <legend className="sr-only">Depth marks</legend>
        <div className="grid gap-3 sm:grid-cols-2">
          <Mark name="Insertion mark" inches={detail.engine.insertionMarkIn} />
          <Mark name="Check mark" inches={detail.engine.checkMarkIn} />
        </div>
        <BigCheck label="The insertion mark is on the pipe" error={e.insertionMark?.message} {...form.register('insertionMark')} />
        <BigCheck label="The check mark is on the pipe" error={e.checkMark?.message} {...form.register('checkMark')} />
        <PhotoCapture label="Photo of the marks" photos={photos} onChange={(p) => { setPhotos(p); setPhotoError(undefined); }} error={photoError} />
        <RecordButton step="depth-marks" />
      </fieldset>
    </form>
  );
}
