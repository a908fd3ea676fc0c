import { z } from 'zod';
import { ISOLATION_POSITIONS, isolationKindSchema, type IsolationKind } from './lines';

/** What an isolation plan holds: the register's points (valve, blind, disconnect), and drain and vent points. */
export const PLAN_POINT_KINDS = ['valve', 'blind', 'disconnect', 'drain', 'vent'] as const;
export const planPointKindSchema = z.enum(PLAN_POINT_KINDS);
export type PlanPointKind = z.infer<typeof planPointKindSchema>;

/** The position each kind must stand in while the section is worked on: the isolating one. */
export const REQUIRED_POSITION: Record<PlanPointKind, string> = {
  valve: 'closed',
  blind: 'installed',
  disconnect: 'disconnected',
  drain: 'open',
  vent: 'open',
};

/** The position a register point stands in when the line is in service (a new point joins the register with it). */
export const IN_SERVICE_POSITION: Record<IsolationKind, string> = { valve: 'open', blind: 'removed', disconnect: 'connected' };

const tag = z.string().trim().min(1, 'must not be empty').max(60).regex(/^[^\0]*$/, 'must not contain a NUL character');

/**
 * One entry of the plan as a planner sends it: a register point by id; or a point that is not in
 * the register yet (a valve, blind or disconnect: it joins the register); or a drain or vent point.
 */
export const isolationPlanEntryInputSchema = z.union([
  z.object({ isolationPointId: z.uuid({ message: 'not an isolation point id' }) }),
  z.object({
    lineId: z.uuid({ message: 'not a line id' }),
    tag,
    kind: isolationKindSchema,
    /** Its in-service position; default IN_SERVICE_POSITION. */
    normalPosition: z.string().trim().optional(),
    notes: z.string().trim().max(500).optional(),
  }).superRefine((p, ctx) => {
    if (p.normalPosition !== undefined && !ISOLATION_POSITIONS[p.kind].includes(p.normalPosition)) {
      ctx.addIssue({ code: 'custom', path: ['normalPosition'], message: `a ${p.kind} stands ${ISOLATION_POSITIONS[p.kind].join(' or ')}` });
    }
  }),
  z.object({ lineId: z.uuid({ message: 'not a line id' }), tag, kind: z.enum(['drain', 'vent']) }),
]);
export type IsolationPlanEntryInput = z.infer<typeof isolationPlanEntryInputSchema>;

/** PUT replaces the whole plan; the order of the entries is kept. */
export const isolationPlanBodySchema = z.object({
  entries: z.array(isolationPlanEntryInputSchema).max(200).superRefine((entries, ctx) => {
    const seen = new Set<string>();
    entries.forEach((e, i) => {
      const key = 'isolationPointId' in e ? e.isolationPointId : e.tag.toUpperCase();
      if (seen.has(key)) ctx.addIssue({ code: 'custom', path: [i], message: 'this point is already in the plan' });
      seen.add(key);
    });
  }),
});
export type IsolationPlanBody = z.infer<typeof isolationPlanBodySchema>;

export const isolationPlanEntrySchema = z.object({
  id: z.string(),
  /** The register's point; null for a drain or vent point. */
  isolationPointId: z.string().nullable(),
  lineId: z.string(),
  lineNumber: z.string(),
  tag: z.string(),
  kind: planPointKindSchema,
  requiredPosition: z.string(),
});
export type IsolationPlanEntryDto = z.infer<typeof isolationPlanEntrySchema>;

/** The plan as saved, and the register's points of the order's lines with the position each must be in (the pre-fill). */
export const isolationPlanResponseSchema = z.object({
  entries: z.array(isolationPlanEntrySchema),
  suggested: z.array(isolationPlanEntrySchema.omit({ id: true }).extend({ inPlan: z.boolean() })),
});
export type IsolationPlanResponse = z.infer<typeof isolationPlanResponseSchema>;
