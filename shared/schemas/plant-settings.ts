import { z } from 'zod';
import { listCureSchedules, TEST_CAPS, type TestCap } from '@shared/trade';

/** How the hydrostatic test is capped by the weakest component: the trade's list (shared/trade/test-pressure.ts). */
export { TEST_CAPS, type TestCap };

export const TEST_CAP_LABELS: Record<TestCap, string> = {
  rating: "At the lowest component's rating (the stricter)",
  'one-and-a-half-rating': "At 1.5 × the lowest component's rating",
};

const scheduleIds = () => listCureSchedules().map((s) => s.id);

/** What an administrator sends to change the plant's settings. */
export const plantSettingsBodySchema = z.object({
  cureScheduleId: z
    .string()
    .refine((id) => scheduleIds().includes(id), { message: `Not a published cure schedule (choose ${scheduleIds().join(' or ')})` }),
  testCap: z.enum(TEST_CAPS),
  /** The version the form was opened at (PlantSettings.version); a save over a newer one is refused. */
  version: z.number().int().min(0),
});
export type PlantSettingsBody = z.infer<typeof plantSettingsBodySchema>;

export const plantSettingsSchema = plantSettingsBodySchema.extend({
  schedule: z.object({ id: z.string(), name: z.string(), source: z.string() }),
  updatedAt: z.string().nullable(),
  updatedBy: z.object({ id: z.string(), name: z.string() }).nullable(),
});
export type PlantSettings = z.infer<typeof plantSettingsSchema>;
