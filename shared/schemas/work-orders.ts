import { z } from 'zod';
import { holdSchema } from './joint-steps';
import { repeatedList } from './query';
import { isolationPlanEntrySchema } from './isolation-plans';
import { jointTaskSchema } from './joint-tasks';
import { lineSchema } from './lines';
import { materialsSchema, overlapSchema, testPressureSchema, windowPlanSchema } from './work-order-plan';

/**
 * A work order's states, in the order an order goes through them (DESIGN.md section 7), then
 * `cancelled`. The server's state module (server/services/work-orders/states.ts) knows every
 * allowed step between them; nothing sets a state directly.
 */
export const WORK_ORDER_STATES = ['draft', 'planned', 'isolated', 'in-work', 'curing', 'testing', 'ready', 'released', 'closed', 'cancelled'] as const;
/** States in which an order still stands between its lines and normal service. */
export const OPEN_WORK_ORDER_STATES = ['draft', 'planned', 'isolated', 'in-work', 'curing', 'testing', 'ready'] as const;
export const workOrderStateSchema = z.enum(WORK_ORDER_STATES);
export type WorkOrderState = z.infer<typeof workOrderStateSchema>;
export const WORK_ORDER_STATE_LABELS: Record<WorkOrderState, string> = {
  draft: 'Draft',
  planned: 'Planned',
  isolated: 'Isolated',
  'in-work': 'In work',
  curing: 'Curing',
  testing: 'Testing',
  ready: 'Ready for release',
  released: 'Released',
  closed: 'Closed',
  cancelled: 'Cancelled',
};

export const WORK_ORDER_KINDS = ['repair', 'tie-in', 'replacement'] as const;
export const workOrderKindSchema = z.enum(WORK_ORDER_KINDS);
export type WorkOrderKind = z.infer<typeof workOrderKindSchema>;
export const WORK_ORDER_KIND_LABELS: Record<WorkOrderKind, string> = { repair: 'Repair', 'tie-in': 'Tie-in', replacement: 'Replacement' };

/** Our own scale, least pressing first; the list sorts by this order. */
export const PRIORITIES = ['routine', 'soon', 'urgent', 'emergency'] as const;
export const prioritySchema = z.enum(PRIORITIES);
export type Priority = z.infer<typeof prioritySchema>;
export const PRIORITY_LABELS: Record<Priority, string> = {
  routine: 'Routine: at the next planned stop',
  soon: 'Soon: within the week',
  urgent: 'Urgent: within a day or two',
  emergency: 'Emergency: now',
};

const noNul = (s: z.ZodString) => s.regex(/^[^\0]*$/, 'must not contain a NUL character');
const text = (max: number) => noNul(z.string().trim().min(1, 'must not be empty').max(max));
const instant = z.iso.datetime({ offset: true, message: 'must be a date and time with its offset, e.g. 2026-12-07T06:00:00-06:00' });

/** The fields a planner writes; the readable number, the state and the version are the server's. */
const orderFields = {
  kind: workOrderKindSchema,
  priority: prioritySchema,
  scope: text(4000),
  requestedBy: text(200),
  lineIds: z.array(z.uuid({ message: 'not a line id' })).min(1, 'choose at least one line').max(50),
  /** The repair window booked with operations; both or neither. */
  windowStart: instant.nullable(),
  windowEnd: instant.nullable(),
  /** Cure conditions: the lowest temperature (°F) and highest relative humidity (%) forecast during the cure. */
  forecastLowF: z.number().min(-60).max(140).nullable(),
  forecastHighRh: z.number().min(0).max(100).nullable(),
  /** The planner's raised test pressure, psi; null: the trade engine's minimum. */
  testPressurePsi: z.number().positive().max(10_000).nullable(),
  /** The rating of the weakest component other than the pipe (a valve, a flange), psi; the pipe's own always counts. */
  componentRatingPsi: z.number().positive().max(10_000).nullable(),
};

const windowBothOrNeither = (b: { windowStart?: string | null; windowEnd?: string | null }, ctx: z.RefinementCtx) => {
  if (b.windowStart === undefined && b.windowEnd === undefined) return;
  if ((b.windowStart ?? null) === null !== ((b.windowEnd ?? null) === null)) {
    ctx.addIssue({ code: 'custom', path: [b.windowStart ? 'windowEnd' : 'windowStart'], message: 'give both the start and the end of the window, or neither' });
  } else if (b.windowStart && b.windowEnd && Date.parse(b.windowEnd) <= Date.parse(b.windowStart)) {
    ctx.addIssue({ code: 'custom', path: ['windowEnd'], message: 'the window must end after it starts' });
  }
};

export const workOrderCreateSchema = z
  .object({
    kind: orderFields.kind,
    priority: orderFields.priority,
    scope: orderFields.scope,
    requestedBy: orderFields.requestedBy,
    lineIds: orderFields.lineIds,
    windowStart: orderFields.windowStart.default(null),
    windowEnd: orderFields.windowEnd.default(null),
    forecastLowF: orderFields.forecastLowF.default(null),
    forecastHighRh: orderFields.forecastHighRh.default(null),
    testPressurePsi: orderFields.testPressurePsi.default(null),
    componentRatingPsi: orderFields.componentRatingPsi.default(null),
  })
  .superRefine(windowBothOrNeither);
export type WorkOrderCreate = z.infer<typeof workOrderCreateSchema>;

/** A change: any of the fields, and the version the form was opened at (a save over a newer one is refused). */
export const workOrderUpdateSchema = z
  .object({ ...orderFields, version: z.number().int().min(1) })
  .partial()
  .required({ version: true })
  // Either end may change alone; the server checks the window the change leaves.
  .superRefine((b, ctx) => (b.windowStart !== undefined && b.windowEnd !== undefined ? windowBothOrNeither(b, ctx) : undefined));
export type WorkOrderUpdate = z.infer<typeof workOrderUpdateSchema>;

/** Submitting the plan; a plan whose earliest release is after the window's end needs a written reason. */
export const workOrderPlanSchema = z.object({ lateReason: text(2000).optional() });
export const workOrderCancelSchema = z.object({ reason: text(2000) });
export const workOrderIdParamsSchema = z.object({ id: z.uuid({ message: 'not a work order id' }) });

export const WORK_ORDER_SORTS = ['number', 'priority', 'state', 'windowStart', 'createdAt', 'updatedAt'] as const;
export const workOrderListQuerySchema = z.object({
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(1).max(200).default(50),
  sort: z.enum(WORK_ORDER_SORTS).default('createdAt'),
  dir: z.enum(['asc', 'desc']).default('desc'),
  /** Part of an order number ("0042", "WO-2026"). */
  search: noNul(z.string().trim().max(40)).optional(),
  state: repeatedList(workOrderStateSchema),
  priority: repeatedList(prioritySchema),
  area: repeatedList(noNul(z.string().min(1).max(200))),
  /** Line numbers. */
  line: repeatedList(noNul(z.string().min(1).max(100))),
  /** Orders with a joint task assigned to this person. */
  fitter: z.uuid({ message: 'not a person id' }).optional(),
  /** Orders whose window overlaps from–to. */
  windowFrom: instant.optional(),
  windowTo: instant.optional(),
});
export type WorkOrderListQuery = z.infer<typeof workOrderListQuerySchema>;

export const workOrderRowSchema = z.object({
  id: z.string(),
  number: z.string(),
  kind: workOrderKindSchema,
  priority: prioritySchema,
  state: workOrderStateSchema,
  scope: z.string(),
  requestedBy: z.string(),
  lines: z.array(z.object({ id: z.string(), lineNumber: z.string(), area: z.string() })),
  windowStart: z.string().nullable(),
  windowEnd: z.string().nullable(),
  jointCount: z.number(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type WorkOrderRow = z.infer<typeof workOrderRowSchema>;
export const workOrderListResponseSchema = z.object({ rows: z.array(workOrderRowSchema), total: z.number(), page: z.number(), pageSize: z.number() });
export type WorkOrderListResponse = z.infer<typeof workOrderListResponseSchema>;

export const historyEntrySchema = z.object({
  at: z.string(),
  action: z.string(),
  actor: z.object({ id: z.string(), name: z.string() }).nullable(),
  before: z.unknown(),
  after: z.unknown(),
});

export const workOrderSchema = workOrderRowSchema.omit({ lines: true, jointCount: true }).extend({
  forecastLowF: z.number().nullable(),
  forecastHighRh: z.number().nullable(),
  testPressurePsi: z.number().nullable(),
  componentRatingPsi: z.number().nullable(),
  lateReason: z.string().nullable(),
  cancelReason: z.string().nullable(),
  plannedAt: z.string().nullable(),
  cancelledAt: z.string().nullable(),
  createdBy: z.object({ id: z.string(), name: z.string() }),
  version: z.number(),
  lines: z.array(lineSchema),
  jointTasks: z.array(jointTaskSchema),
  isolationPlan: z.array(isolationPlanEntrySchema),
  materials: materialsSchema,
  testPressure: testPressureSchema,
  windowPlan: windowPlanSchema,
  overlaps: z.array(overlapSchema),
  history: z.array(historyEntrySchema),
  /** The set and cure holds of the order's joints, as the database has them now. */
  holds: z.array(holdSchema),
});
export type WorkOrderDto = z.infer<typeof workOrderSchema>;
