import { z } from 'zod';

// The hydrostatic test, and operations' release of the line (DESIGN.md sections 7 and 10): what is
// recorded, and why a release is refused.

const text = (max: number) => z.string().trim().min(1, 'must not be empty').max(max).regex(/^[^\0]*$/, 'must not contain a NUL character');
const psi = z.number({ message: 'a pressure in psi' }).finite().min(0).max(10_000);
const instant = z.iso.datetime({ offset: true, message: 'a date and time' });

/**
 * A test as the witness records it, after it ran. The (f)(1) sequence comes first: tools and people
 * clear, the locks on the test boundary removed by their owners (the server checks none is on).
 * The rest is the record ASME B31.3 345.2.7 asks for.
 */
export const pressureTestBodySchema = z.object({
  toolsClear: z.literal(true, { message: 'confirm tools and materials are clear of the section' }),
  peopleClear: z.literal(true, { message: 'confirm people are clear of the section' }),
  /** Water; air or any gas is refused. */
  medium: text(40),
  testPressurePsi: psi,
  /** The gauge read: tag and range ("PI-T3, 0–300 psi, calibrated 2026-09"). */
  gauge: text(200),
  startedAt: instant,
  startReadingPsi: psi,
  endedAt: instant,
  endReadingPsi: psi,
  result: z.enum(['passed', 'failed']),
  /** On a failed test, the joints that leaked: each becomes a redo task. */
  leakingJointIds: z.array(z.uuid({ message: 'not a joint task id' })).max(200).default([]),
  /** How the piping tested is identified (B31.3 345.2.7): lines, from/to, drawing. */
  pipingIdentified: text(500),
  /** The examiner who certifies the record (B31.3 345.2.7). */
  examiner: text(200),
  notes: z.string().trim().max(2000).optional(),
}).superRefine((b, ctx) => {
  if (Date.parse(b.endedAt) <= Date.parse(b.startedAt)) ctx.addIssue({ code: 'custom', path: ['endedAt'], message: 'must be after the start' });
  if (b.result === 'failed' && b.leakingJointIds.length === 0) ctx.addIssue({ code: 'custom', path: ['leakingJointIds'], message: 'name the joints that leaked' });
  if (b.result === 'passed' && b.leakingJointIds.length > 0) ctx.addIssue({ code: 'custom', path: ['leakingJointIds'], message: 'a passed test has no leaking joints' });
});
export type PressureTestBody = z.infer<typeof pressureTestBodySchema>;

const personRef = z.object({ id: z.string(), name: z.string() });

export const pressureTestSchema = z.object({
  id: z.string(),
  workOrderId: z.string(),
  result: z.enum(['passed', 'failed']),
  medium: z.string(),
  testPressurePsi: z.number(),
  gauge: z.string(),
  startedAt: z.string(),
  startReadingPsi: z.number(),
  endedAt: z.string(),
  endReadingPsi: z.number(),
  holdMinutes: z.number(),
  leakingJoints: z.array(z.object({ id: z.string(), label: z.string() })),
  pipingIdentified: z.string(),
  examiner: z.string(),
  notes: z.string().nullable(),
  witness: personRef,
  recordedAt: z.string(),
});
export type PressureTestDto = z.infer<typeof pressureTestSchema>;

/** Operations' release checklist ((e)(1)–(2) and the refill). */
export const releaseBodySchema = z.object({
  areaInspected: z.literal(true, { message: 'confirm the area is inspected: tools and materials removed, equipment whole' }),
  peopleClear: z.literal(true, { message: 'confirm everyone is clear of the section' }),
  affectedTold: z.literal(true, { message: 'confirm the affected people are told the line returns to service' }),
  ventsDrainsSet: z.literal(true, { message: 'confirm vents and drains are set for service' }),
  slowRefill: z.literal(true, { message: 'confirm the line will be refilled slowly, venting air, watching the new joints' }),
  notes: z.string().trim().max(2000).optional(),
});
export type ReleaseBody = z.infer<typeof releaseBodySchema>;

/** One reason a release is refused, with what it is about. */
export const releaseBlockerSchema = z.object({
  kind: z.enum(['state', 'lock', 'hold', 'test']),
  message: z.string(),
  /** For a hold: when it ends by the clock (null while it waits for an engineering entry). */
  until: z.string().nullable(),
});
export type ReleaseBlocker = z.infer<typeof releaseBlockerSchema>;

export const releaseQueueRowSchema = z.object({
  id: z.string(),
  number: z.string(),
  state: z.string(),
  lines: z.array(z.string()),
  windowEnd: z.string().nullable(),
  /** The latest end of a running hold, by the clock. */
  latestHoldEnd: z.string().nullable(),
  ready: z.boolean(),
  blockers: z.array(releaseBlockerSchema),
});
export const releaseQueueSchema = z.object({ orders: z.array(releaseQueueRowSchema) });
export type ReleaseQueueDto = z.infer<typeof releaseQueueSchema>;

/** The line status board: every line out of service, why, and when it can come back. */
export const lineStatusBoardSchema = z.object({
  lines: z.array(z.object({
    id: z.string(),
    lineNumber: z.string(),
    area: z.string(),
    service: z.string(),
    status: z.enum(['out-of-service', 'locked-out']),
    /** The open orders holding it out, each with what still stands in the way. */
    orders: z.array(releaseQueueRowSchema),
    /** The latest hold end of those orders, by the clock; null when none runs. */
    earliestBack: z.string().nullable(),
  })),
});
export type LineStatusBoardDto = z.infer<typeof lineStatusBoardSchema>;
