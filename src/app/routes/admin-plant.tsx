import { useSuspenseQuery } from '@tanstack/react-query';
import { Card, PageHeader } from '@/components/ui/card';
import { Notice } from '@/components/ui/notice';
import { queryClient } from '@/lib/query-client';
import { useMe } from '@/lib/auth';
import { formatDateTime } from '@/lib/format';
import { may, whoMay } from '@shared/permissions';
import { plantSettingsQueries } from '@/features/plant-settings/api';
import { PlantSettingsForm } from '@/features/plant-settings/components/plant-settings-form';

export async function loader() {
  await queryClient.ensureQueryData(plantSettingsQueries.current());
  return null;
}

export default function AdminPlantPage() {
  const me = useMe();
  const { data: settings } = useSuspenseQuery(plantSettingsQueries.current());
  const canChange = may(me, 'plantSettings.edit');
  return (
    <div className="max-w-3xl">
      <PageHeader title="Plant settings" subtitle="Choices the trade rules leave to the plant. The joint calculator and the server both use them." />
      {!canChange && (
        <div className="mb-4">
          <Notice title="Read only">Only {whoMay('plantSettings.edit')} may change the plant settings.</Notice>
        </div>
      )}
      <Card>
        <PlantSettingsForm settings={settings} canChange={canChange} />
        <p className="mt-4 text-sm text-ink-soft">
          {settings.updatedBy && settings.updatedAt
            ? `Last changed by ${settings.updatedBy.name}, ${formatDateTime(settings.updatedAt)}.`
            : 'Not changed yet: Linewright\u2019s defaults (schedule A, cap at the lowest component\u2019s rating).'}
        </p>
      </Card>
    </div>
  );
}
