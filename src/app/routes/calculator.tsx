import { useMemo } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { useSuspenseQuery } from '@tanstack/react-query';
import { PageHeader } from '@/components/ui/card';
import { Notice } from '@/components/ui/notice';
import { queryClient } from '@/lib/query-client';
import { plantSettingsQueries, useRefetchPlantSettings } from '@/features/plant-settings/api';
import { calculatorFormSchema, DEFAULT_VALUES, type CalculatorValues } from '@/features/calculator/form';
import { metricPressure, psi } from '@/lib/format';
import { previewJoint, stableJson } from '@/features/calculator/preview';
import { useServerCheck } from '@/features/calculator/use-server-check';
import { CalculatorForm } from '@/features/calculator/components/calculator-form';
import { CautionsSection } from '@/features/calculator/components/cautions-section';
import { CureSection } from '@/features/calculator/components/cure-section';
import { HandlingSection } from '@/features/calculator/components/handling-section';
import { MaterialsSection } from '@/features/calculator/components/materials-section';
import { PlantLine } from '@/features/calculator/components/plant-line';
import { PressureSection } from '@/features/calculator/components/pressure-section';
import { ServerMark, ServerNotice } from '@/features/calculator/components/server-mark';
import { SocketSection } from '@/features/calculator/components/socket-section';
import { Verdict } from '@/features/calculator/components/verdict';

export async function loader() {
  await queryClient.ensureQueryData(plantSettingsQueries.current());
  return null;
}

export default function CalculatorPage() {
  const { data: plant } = useSuspenseQuery(plantSettingsQueries.current());
  const form = useForm<CalculatorValues>({ resolver: zodResolver(calculatorFormSchema), defaultValues: DEFAULT_VALUES, mode: 'onChange' });
  const values = { ...DEFAULT_VALUES, ...useWatch({ control: form.control }) } as CalculatorValues;
  const key = stableJson(values);
  // eslint-disable-next-line react-hooks/exhaustive-deps -- keyed by the values' content, not identity
  const preview = useMemo(() => previewJoint(values, plant), [key, plant.cureScheduleId, plant.testCap]);
  const check = useServerCheck(preview.ok ? preview.spec : null, useRefetchPlantSettings());
  const picture = check.state === 'disagrees' ? check.server : preview.ok ? preview.picture : null;
  const test = picture?.test;
  const testHint = picture && test?.ok && picture.spec.testPressurePsi === undefined
    ? `Optional. Blank: 1.5 × design = ${psi(test.testPsi)} (${metricPressure(test.testPsi, values.pressureUnit)}).`
    : 'Optional. Blank: 1.5 × design pressure.';

  return (
    <div>
      <PageHeader title="Joint calculator" subtitle="Set and cure, test pressure, marks and materials for one solvent-cemented joint." />
      <PlantLine plant={plant} />
      <div className="grid gap-4 lg:grid-cols-[minmax(0,25rem)_minmax(0,1fr)] xl:grid-cols-[minmax(0,27rem)_minmax(0,1fr)]">
        {/* From tablet width the form keeps its place and scrolls by itself, so the verdict stays in view. */}
        <div className="rounded-xl border border-ink/10 bg-paper-raised p-4 shadow-sm lg:sticky lg:top-18 lg:max-h-[calc(100vh-5.5rem)] lg:self-start lg:overflow-y-auto">
          <CalculatorForm form={form} testHint={testHint} />
        </div>
        <div className="@container min-w-0 space-y-4">
          <ServerNotice check={check} />
          {picture ? (
            <>
              <Verdict picture={picture} unit={values.pressureUnit} mark={<ServerMark check={check} />} />
              <div className="grid gap-4 @3xl:grid-cols-2">
                <CureSection picture={picture} unit={values.pressureUnit} />
                <PressureSection picture={picture} unit={values.pressureUnit} />
                <SocketSection picture={picture} dryFit={preview.ok ? preview.dryFit : null} />
                <MaterialsSection picture={picture} />
                <HandlingSection picture={picture} />
              </div>
              <CautionsSection cautions={picture.cautions} />
            </>
          ) : (
            <Notice title="Fill in the joint">
              <p>Nothing to show until every value reads: {Object.values(preview.ok ? {} : preview.errors).join(' ')}</p>
            </Notice>
          )}
        </div>
      </div>
    </div>
  );
}
