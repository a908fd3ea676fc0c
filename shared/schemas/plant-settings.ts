import { z } from 'zod';
import { listCureSchedules, TEST_CAPS, type TestCap } from '@shared/trade';

/** How the hydrostatic test is capped by the weakest component: the trade's list (shared/trade/test-pressure.ts). */
export { TEST_CAPS, type TestCap };

export const TEST_CAP_LABELS: Record<TestCap, string> = {
  rating: "At the lowest component's rating (the stricter)",
  'one-and-a-half-rating': "At 1.5 × the lowest component's rating",
};

const scheduleIds = () => listCureSchedules().map((s) => s.id);

/** Whether `tz` is a time zone this runtime knows ("America/Chicago", "UTC"). */
export function isTimeZone(tz: string): boolean {
  try {
    new Intl.DateTimeFormat('en', { timeZone: tz });
    return tz.trim() !== '';
  } catch {
    return false;
  }
}
/** The plant's time zone until an administrator sets it. */
export const DEFAULT_TIME_ZONE = 'UTC';

const minutes = z.number().int().min(0).max(24 * 60);
/** Minutes to make one joint up to `upToIn` inches (cut, prep, dry fit, prime, cement, assemble, hold). */
export const jointMinutesBandSchema = z.object({ upToIn: z.number().positive().max(24), minutes: minutes.min(1) });

/** The minutes the window plan counts (DESIGN.md section 8); each key an administrator leaves out is its default. */
export const windowPlanSettingsSchema = z.object({
  isolationPerOrderMinutes: minutes,
  isolationPerPointMinutes: minutes,
  jointMinutesBySize: z
    .array(jointMinutesBandSchema)
    .min(1)
    .max(20)
    .refine((bands) => bands.every((b, i) => i === 0 || b.upToIn > bands[i - 1]!.upToIn), { message: 'list the size bands from small to large' })
    .refine((bands) => (bands[bands.length - 1]?.upToIn ?? 0) >= 24, { message: 'the last size band must reach 24"' }),
  fillAndVentMinutes: minutes,
  releaseMinutes: minutes,
});
export type WindowPlanSettings = z.infer<typeof windowPlanSettingsSchema>;
export const WINDOW_PLAN_KEYS = Object.keys(windowPlanSettingsSchema.shape) as (keyof WindowPlanSettings)[];

/**
 * DEFAULTS, not from a published source: our own estimates [practice] for a two-person crew with
 * the fittings at hand, so a new plant sees a window plan at once. They are marked as defaults
 * wherever they are used until an administrator sets the plant's own.
 */
export const WINDOW_PLAN_DEFAULTS: WindowPlanSettings = {
  isolationPerOrderMinutes: 30, // permit, shutdown of the section, drain started
  isolationPerPointMinutes: 10, // operate, lock and tag one point
  jointMinutesBySize: [
    { upToIn: 1.25, minutes: 15 },
    { upToIn: 2, minutes: 20 },
    { upToIn: 4, minutes: 30 },
    { upToIn: 8, minutes: 45 },
    { upToIn: 12, minutes: 75 },
    { upToIn: 24, minutes: 120 },
  ],
  fillAndVentMinutes: 30, // fill the section slowly, vent the air at the high points
  releaseMinutes: 45, // walk-down inspection, vents and drains closed, slow refill
};

/** The window-plan minutes in force: the administrator's where set, else the defaults; and which are defaults. */
export function effectiveWindowPlan(set: Partial<WindowPlanSettings> | null | undefined): { values: WindowPlanSettings; defaults: (keyof WindowPlanSettings)[] } {
  const values = { ...WINDOW_PLAN_DEFAULTS };
  const defaults: (keyof WindowPlanSettings)[] = [];
  for (const key of WINDOW_PLAN_KEYS) {
    if (set?.[key] === undefined) defaults.push(key);
    else Object.assign(values, { [key]: set[key] });
  }
  return { values, defaults };
}

/**
 * DEFAULT, not from a published source [practice]: an hour after an order's last cure hold ends,
 * a lock still on (its test waits on it; often someone who went home) is worth a supervisor's call.
 */
export const DEFAULT_LOCK_LEFT_ON_MINUTES = 60;
export const lockLeftOnMinutesSchema = z.number().int().min(5, 'at least 5 minutes').max(24 * 60, 'at most 24 hours (1,440 minutes)');

/** What an administrator sends to change the plant's settings. */
export const plantSettingsBodySchema = z.object({
  cureScheduleId: z
    .string()
    .refine((id) => scheduleIds().includes(id), { message: `Not a published cure schedule (choose ${scheduleIds().join(' or ')})` }),
  testCap: z.enum(TEST_CAPS),
  /** The version the form was opened at (PlantSettings.version); a save over a newer one is refused. */
  version: z.number().int().min(0),
  /** The plant's time zone (IANA name); left out: unchanged; null: back to the default. */
  timeZone: z.string().trim().refine(isTimeZone, { message: 'not a time zone name (e.g. America/Chicago)' }).nullable().optional(),
  /** The window plan's minutes as the plant sets them (keys left out are the defaults); left out: unchanged. */
  windowPlan: windowPlanSettingsSchema.partial().optional(),
  /** Minutes a lock may stay on after the order's cure holds have all ended before a supervisor is told; null: back to the default. */
  lockLeftOnMinutes: lockLeftOnMinutesSchema.nullable().optional(),
});
export type PlantSettingsBody = z.infer<typeof plantSettingsBodySchema>;

export const plantSettingsSchema = plantSettingsBodySchema.extend({
  schedule: z.object({ id: z.string(), name: z.string(), source: z.string() }),
  updatedAt: z.string().nullable(),
  updatedBy: z.object({ id: z.string(), name: z.string() }).nullable(),
  timeZone: z.string(),
  windowPlan: windowPlanSettingsSchema,
  lockLeftOnMinutes: lockLeftOnMinutesSchema,
  /** The settings still at their shipped default ('timeZone', 'windowPlan.releaseMinutes' …), marked as such on every screen. */
  atDefault: z.array(z.string()),
});
export type PlantSettings = z.infer<typeof plantSettingsSchema>;
