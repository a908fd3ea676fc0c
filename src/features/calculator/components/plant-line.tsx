import { ButtonLink } from '@/components/ui/button';
import type { PlantSettings } from '@shared/schemas/plant-settings';
import { TEST_CAP_LABELS } from '@shared/schemas/plant-settings';

/** The plant's choices, read-only here: the calculator and the server both use them. */
export function PlantLine({ plant }: { plant: PlantSettings }) {
  return (
    <div className="mb-4 flex flex-wrap items-center gap-x-4 gap-y-2 rounded-lg border border-ink/10 bg-paper-sunk px-3 py-2 text-sm">
      <p className="min-w-0 flex-1 leading-relaxed">
        <span className="font-semibold">Plant cure schedule: {plant.cureScheduleId}</span>{' '}
        <span className="text-ink-soft">({plant.schedule.name}; source: {plant.schedule.source})</span>
        {' · '}
        <span className="font-semibold">Test cap:</span> <span className="text-ink-soft">{TEST_CAP_LABELS[plant.testCap].toLowerCase()}</span>
        {' — change in plant settings'}
      </p>
      <ButtonLink to="/admin/plant" variant="secondary">
        Plant settings
      </ButtonLink>
    </div>
  );
}
