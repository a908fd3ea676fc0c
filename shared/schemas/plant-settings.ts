import { z } from 'zod';
import { listCureSchedules, type TestCap as TradeTestCap } from '@shared/trade';

/** How the hydrostatic test is capped by the weakest component (shared/trade/test-pressure.ts). */
export const TEST_CAPS = ['rating', 'one-and-a-half-rating'] as const satisfies readonly TradeTestCap[];
export type TestCap = (typeof TEST_CAPS)[number];

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
});
export type PlantSettingsBody = z.infer<typeof plantSettingsBodySchema>;

export const plantSettingsSchema = plantSettingsBodySchema.extend({
  schedule: z.object({ id: z.string(), name: z.string(), source: z.string() }),
  updatedAt: z.string().nullable(),
  updatedBy: z.object({ id: z.string(), name: z.string() }).nullable(),
});
export type PlantSettings = z.infer<typeof plantSettingsSchema>;
