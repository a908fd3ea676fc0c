import type { JointDetailDto, JointStep } from '@shared/schemas/joint-steps';
import { AssemblyForm } from './assembly-form';
import { CementForm } from './cement-form';
import { DepthMarksForm } from './depth-marks-form';
import { DryFitForm } from './dry-fit-form';
import type { StepFormProps } from './form-bits';
import { PrepForm } from './prep-form';
import { PrimerForm } from './primer-form';
import { WipeForm } from './wipe-form';

/** The form of one step; the assembly's hold needs the temperature recorded with the cement. */
export function StepForm({ step, cementTemperatureF, ...props }: StepFormProps & { step: JointStep; cementTemperatureF: number | null; detail: JointDetailDto }) {
  switch (step) {
    case 'prep':
      return <PrepForm {...props} />;
    case 'dry-fit':
      return <DryFitForm {...props} />;
    case 'depth-marks':
      return <DepthMarksForm {...props} />;
    case 'primer':
      return <PrimerForm {...props} />;
    case 'cement':
      return <CementForm {...props} />;
    case 'assembly':
      return <AssemblyForm {...props} cementTemperatureF={cementTemperatureF} />;
    case 'wipe':
      return <WipeForm {...props} />;
  }
}
