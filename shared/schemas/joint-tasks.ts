import { z } from 'zod';
import { parseNominalSize } from '@shared/trade';

/** The fittings a joint task is made on (DESIGN.md section 3). */
export const FITTING_KINDS = ['coupling', 'tee', 'elbow-90', 'elbow-45', 'socket-flange', 'union', 'reducing-bushing', 'cap'] as const;
export const fittingKindSchema = z.enum(FITTING_KINDS);
export type FittingKind = z.infer<typeof fittingKindSchema>;
export const FITTING_KIND_LABELS: Record<FittingKind, string> = {
  coupling: 'Coupling',
  tee: 'Tee',
  'elbow-90': 'Elbow 90°',
  'elbow-45': 'Elbow 45°',
  'socket-flange': 'Socket flange',
  union: 'Union',
  'reducing-bushing': 'Reducing bushing',
  cap: 'Cap',
};
/** Only these fittings have a smaller outlet, so only their joints may be made at a reducing size. */
export const REDUCING_FITTINGS: readonly FittingKind[] = ['tee', 'reducing-bushing'];

const size = z.string().trim().refine((s) => parseNominalSize(s) !== null, { message: 'not a listed nominal pipe size' });

/**
 * Adds `count` joints of one fitting kind on one of the order's lines. Each joint is made at the
 * line's size, or, for a tee's branch or a bushing's smaller end, at `reducingSize`.
 */
export const jointTasksAddSchema = z
  .object({
    lineId: z.uuid({ message: 'not a line id' }),
    fittingKind: fittingKindSchema,
    count: z.number().int().min(1).max(100).default(1),
    reducingSize: size.optional(),
  })
  .superRefine((b, ctx) => {
    if (b.reducingSize !== undefined && !REDUCING_FITTINGS.includes(b.fittingKind)) {
      ctx.addIssue({ code: 'custom', path: ['reducingSize'], message: 'only a tee or a reducing bushing has a reducing size' });
    }
  });
export type JointTasksAdd = z.infer<typeof jointTasksAddSchema>;

/** Who makes the joint: a person holding the fitter role, or null to take the task back. */
export const jointTaskFitterSchema = z.object({ personId: z.uuid({ message: 'not a person id' }).nullable() });
export const jointTaskIdParamsSchema = z.object({ id: z.uuid({ message: 'not a joint task id' }) });

export const jointTaskSchema = z.object({
  id: z.string(),
  /** "J3": short, unique within its order, never reused. */
  label: z.string(),
  number: z.number(),
  lineId: z.string(),
  lineNumber: z.string(),
  fittingKind: fittingKindSchema,
  nominalSize: z.string(),
  reducingSize: z.string().nullable(),
  /** The size the joint is made at: the reducing size where there is one, else the line's. */
  jointSize: z.string(),
  fitter: z.object({ id: z.string(), name: z.string() }).nullable(),
  replacesTaskId: z.string().nullable(),
  /** How many of the joint's seven steps are recorded. */
  stepsDone: z.number(),
  /** Cut out for redo: a later task replaces it. */
  redone: z.boolean(),
});
export type JointTaskDto = z.infer<typeof jointTaskSchema>;
