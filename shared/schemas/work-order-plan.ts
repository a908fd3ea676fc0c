// What the server computes for a work order from the trade engine and the plant settings: the
// materials, the test pressure, the window plan (DESIGN.md section 8), and overlaps with other orders.
// Every figure carries its source; a refusal of the engine is returned as such, never guessed.

import { z } from 'zod';

const containers = z.array(z.object({ container: z.enum(['gallon', 'quart', 'pint']), count: z.number() }));

export const materialsSchema = z.object({
  /** False when the engine refuses: `problems` says why (a cement that does not suit a line's material …). */
  ok: z.boolean(),
  problems: z.array(z.string()),
  material: z.string().nullable(),
  cement: z.object({ standard: z.string(), body: z.enum(['regular', 'medium', 'heavy']).nullable(), primer: z.string().nullable() }).nullable(),
  /** Quantities for the order's joints, rounded up to containers. */
  quantities: z
    .object({ cementQuarts: z.number(), primerQuarts: z.number(), cementContainers: containers, primerContainers: containers })
    .nullable(),
  applicators: z.array(z.object({ size: z.string(), widthIn: z.number(), kind: z.string(), note: z.string().nullable() })),
  /** For the largest joint. */
  crew: z.object({ size: z.string(), crew: z.number(), mechanicalJoiningDevice: z.boolean(), text: z.string() }).nullable(),
  sources: z.array(z.string()),
});
export type MaterialsDto = z.infer<typeof materialsSchema>;

export const testPressureSchema = z.object({
  ok: z.boolean(),
  /** No line of the order is on pressure service (design 0 psi): no hydrostatic test. */
  required: z.boolean(),
  /** 1.5 × the highest design pressure, whole psi up. */
  minimumPsi: z.number().nullable(),
  /** The weakest component's rating (or 1.5 × it, by plant setting). */
  capPsi: z.number().nullable(),
  /** What the test will be: the planner's raised value, or the minimum. */
  testPsi: z.number().nullable(),
  raised: z.boolean(),
  highestDesign: z.object({ lineNumber: z.string(), psi: z.number() }).nullable(),
  weakest: z.object({ what: z.string(), psi: z.number() }).nullable(),
  holdMinutes: z.number().nullable(),
  problems: z.array(z.string()),
  source: z.string().nullable(),
});
export type TestPressureDto = z.infer<typeof testPressureSchema>;

export const WINDOW_STEPS = ['isolation', 'joints', 'cure', 'test', 'release'] as const;
export const windowStepSchema = z.enum(WINDOW_STEPS);
export type WindowStep = z.infer<typeof windowStepSchema>;

export const windowPlanStepSchema = z.object({
  step: windowStepSchema,
  label: z.string(),
  /** Null when the step cannot be computed (see `refusals` and `missing`). */
  minutes: z.number().nullable(),
  start: z.string().nullable(),
  end: z.string().nullable(),
  source: z.string(),
});

export const windowPlanRefusalSchema = z.object({
  step: windowStepSchema,
  reason: z.string(),
  /** Who may settle it: a supervisor's engineering cure time, or the planner's own input. */
  whoMayDecide: z.enum(['supervisor', 'planner']),
});

export const windowPlanSchema = z.object({
  timeZone: z.string(),
  window: z.object({ start: z.string(), end: z.string() }).nullable(),
  steps: z.array(windowPlanStepSchema),
  earliestRelease: z.string().nullable(),
  /** Null when it cannot be said (no window, or a step that cannot be computed). */
  fits: z.boolean().nullable(),
  late: z
    .object({
      step: windowStepSchema,
      stepLabel: z.string(),
      neededWindowEnd: z.string(),
      lateByMinutes: z.number(),
      /** The cure if the area is kept in the next warmer band (a heated enclosure); null when it is already the warmest. */
      warmer: z
        .object({ band: z.string(), keepAboveF: z.number(), cureMinutes: z.number(), earliestRelease: z.string(), fits: z.boolean() })
        .nullable(),
    })
    .nullable(),
  refusals: z.array(windowPlanRefusalSchema),
  /** What the planner has not given yet ("no repair window is booked"). */
  missing: z.array(z.string()),
});
export type WindowPlanDto = z.infer<typeof windowPlanSchema>;

/** Another order whose window overlaps this one's on the same line or isolation point. */
export const overlapSchema = z.object({
  orderId: z.string(),
  number: z.string(),
  state: z.string(),
  on: z.enum(['line', 'isolation-point']),
  /** The line number or the point's tag they share. */
  what: z.string(),
});
export type OverlapDto = z.infer<typeof overlapSchema>;

const instant = z.iso.datetime({ offset: true, message: 'must be a date and time with its offset' });
const MAX_SCHEDULE_DAYS = 62;

export const scheduleQuerySchema = z
  .object({ from: instant, to: instant, area: z.string().min(1).max(200).regex(/^[^\0]*$/).optional() })
  .superRefine((q, ctx) => {
    const days = (Date.parse(q.to) - Date.parse(q.from)) / 86_400_000;
    if (days <= 0) ctx.addIssue({ code: 'custom', path: ['to'], message: 'must be after from' });
    else if (days > MAX_SCHEDULE_DAYS) ctx.addIssue({ code: 'custom', path: ['to'], message: `the schedule shows at most ${MAX_SCHEDULE_DAYS} days at once` });
  });
export type ScheduleQuery = z.infer<typeof scheduleQuerySchema>;

export const scheduleResponseSchema = z.object({
  from: z.string(),
  to: z.string(),
  orders: z.array(
    z.object({
      id: z.string(),
      number: z.string(),
      state: z.string(),
      priority: z.string(),
      kind: z.string(),
      windowStart: z.string(),
      windowEnd: z.string(),
      lines: z.array(z.object({ id: z.string(), lineNumber: z.string(), area: z.string() })),
      overlaps: z.array(overlapSchema),
    }),
  ),
});
export type ScheduleResponse = z.infer<typeof scheduleResponseSchema>;
