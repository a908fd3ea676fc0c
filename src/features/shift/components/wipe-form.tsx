import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { wipeValuesSchema } from '@shared/schemas/joint-steps';
import { BigCheck } from './big-check';
import { RecordButton, type StepFormProps } from './form-bits';
import { PhotoCapture } from './photo-capture';

type In = z.input<typeof wipeValuesSchema>;
type Out = z.output<typeof wipeValuesSchema>;

/** The bead wiped, and photos of the finished joint. */
export function WipeForm({ detail, disabled, onRecord }: StepFormProps) {
  const form = useForm<In, unknown, Out>({ resolver: zodResolver(wipeValuesSchema) });
  const [photos, setPhotos] = useState<Blob[]>([]);
  const [photoError, setPhotoError] = useState<string>();
  const hasRecorded = detail.photos.some((p) => p.step === 'wipe');
  const submit = form.handleSubmit((values) => {
    if (!photos.length && !hasRecorded) return setPhotoError('Take at least one photo of the finished joint.');
    onRecord({ step: 'wipe', values }, photos);
  });
  return (
    <form noValidate onSubmit={submit}>
      <fieldset disabled={disabled} className="space-y-3">
        <legend className="sr-only">Wipe the bead</legend>
        <BigCheck label="The bead is wiped" error={form.formState.errors.beadWiped?.message} {...form.register('beadWiped')} />
        <PhotoCapture label="Photo of the finished joint" photos={photos} onChange={(p) => { setPhotos(p); setPhotoError(undefined); }} error={photoError} />
        <RecordButton step="wipe" />
      </fieldset>
    </form>
  );
}
