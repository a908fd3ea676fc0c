import { z } from 'zod';
import { planPointKindSchema } from './isolation-plans';

// Lockout of a work order's section (OSHA 29 CFR 1910.147; DESIGN.md section 10): personal locks
// on isolation points or on the order's group lock box, the verification of zero energy, removal
// by the owner or by the (e)(3) procedure, and shift handover.

const text = (max: number) => z.string().trim().min(1, 'must not be empty').max(max).regex(/^[^\0]*$/, 'must not contain a NUL character');
/** The number stamped or engraved on the lock; each lock identifies its owner (1910.147(c)(5)). */
const lockNumber = text(40);

/** Where one lock goes: an isolation point of the plan, or the order's group lock box. */
export const lockTargetSchema = z.union([
  z.object({ entryId: z.uuid({ message: 'not an isolation plan entry id' }), lockNumber }),
  z.object({ lockBoxId: z.uuid({ message: 'not a lock box id' }), lockNumber }),
]);
export type LockTarget = z.infer<typeof lockTargetSchema>;

/** The person signed in applies their own locks, one per point or one on the box. */
export const locksApplySchema = z.object({
  locks: z.array(lockTargetSchema).min(1, 'name at least one point or the lock box').max(200),
});
export type LocksApply = z.infer<typeof locksApplySchema>;

/**
 * The group lock box ((f)(3)): the keys of the named points go in it, and the person who sets it up
 * holds primary responsibility for it. Each person then puts their own lock on the box.
 */
export const lockBoxCreateSchema = z.object({
  label: text(40),
  entryIds: z.array(z.uuid({ message: 'not an isolation plan entry id' })).min(1, 'put at least one point in the box').max(200),
});
export type LockBoxCreate = z.infer<typeof lockBoxCreateSchema>;

/**
 * Removing an absent person's lock (1910.147(e)(3)): a supervisor records each step. Without it,
 * only the person who applied a lock may remove it.
 */
export const absentRemovalSchema = z.object({
  /** The supervisor verified the person is not at the facility. */
  notAtFacility: z.literal(true, { message: 'confirm the person is not at the facility' }),
  /** How they tried to reach the person ("called mobile twice, texted, called home"). */
  contactAttempts: text(1000),
  /** When they tried. */
  contactAttemptedAt: z.iso.datetime({ offset: true, message: 'when the person was called, as a date and time' }),
  /** How the person will be told before they resume work. */
  informBeforeReturn: text(1000),
});
export type AbsentRemoval = z.infer<typeof absentRemovalSchema>;

export const lockRemovalSchema = z.object({ absent: absentRemovalSchema.optional() });
export type LockRemoval = z.infer<typeof lockRemovalSchema>;

/**
 * Shift handover ((f)(4)): the on-coming person (signed in) puts a lock of their own on every point
 * and box where the off-going person has one; the off-going person then removes their own. The
 * server refuses any removal that would leave a point or the box without a lock while work is open.
 */
export const handoverSchema = z.object({
  fromPersonId: z.uuid({ message: 'not a person id' }),
  /** For each of the off-going person's locks, the number of the on-coming person's lock that replaces it. */
  locks: z.array(z.object({ replacesLockId: z.uuid({ message: 'not a lock id' }), lockNumber })).min(1).max(200),
});
export type Handover = z.infer<typeof handoverSchema>;

/** Zero energy verified ((d)(6)): each point's position as found, and how the section was proven dead. */
export const verificationSchema = z.object({
  points: z.array(z.object({ entryId: z.uuid({ message: 'not an isolation plan entry id' }), positionFound: text(40) })).min(1).max(200),
  /** "Opened the low-point drain and the vent at the pump; gauge PI-1004 read." */
  method: text(1000),
  /** "0 psi on PI-1004, no flow at the drain after 5 min." */
  reading: text(500),
});
export type Verification = z.infer<typeof verificationSchema>;

export const lockIdParamsSchema = z.object({ id: z.uuid({ message: 'not a lock id' }) });

const personRef = z.object({ id: z.string(), name: z.string() });

export const lockSchema = z.object({
  id: z.string(),
  lockNumber: z.string(),
  person: personRef,
  entryId: z.string().nullable(),
  lockBoxId: z.string().nullable(),
  appliedAt: z.string(),
  /** The lock this one took over from at a shift handover. */
  handedOverFromLockId: z.string().nullable(),
  removedAt: z.string().nullable(),
  removedBy: personRef.nullable(),
  /** owner: removed by the person who applied it; absent: by a supervisor under (e)(3). */
  removal: z.enum(['owner', 'absent']).nullable(),
});
export type LockDto = z.infer<typeof lockSchema>;

export const lockoutPointSchema = z.object({
  entryId: z.string(),
  tag: z.string(),
  kind: planPointKindSchema,
  lineNumber: z.string(),
  requiredPosition: z.string(),
  /** Its key sits in this group lock box; null when it is locked point by point. */
  lockBoxId: z.string().nullable(),
  /** Personal locks on the point right now (empty for a point whose key is in the box). */
  locks: z.array(lockSchema),
  /** Whether it is protected right now: a personal lock on it, or it is in a box that carries one. */
  protected: z.boolean(),
  positionFound: z.string().nullable(),
});

export const lockBoxSchema = z.object({
  id: z.string(),
  label: z.string(),
  responsible: personRef,
  locks: z.array(lockSchema),
  createdAt: z.string(),
});

export const verificationRecordSchema = z.object({
  id: z.string(),
  verifiedBy: personRef,
  verifiedAt: z.string(),
  method: z.string(),
  reading: z.string(),
  points: z.array(z.object({ entryId: z.string(), tag: z.string(), positionFound: z.string() })),
});

/** The order's lock board: who is locked on where, right now, and the verification. */
export const lockoutSchema = z.object({
  workOrderId: z.string(),
  number: z.string(),
  state: z.string(),
  points: z.array(lockoutPointSchema),
  lockBox: lockBoxSchema.nullable(),
  verification: verificationRecordSchema.nullable(),
  /** Every point protected and zero energy verified. */
  isolated: z.boolean(),
  /** What is still missing before the section is isolated, as sentences; empty when isolated. */
  missing: z.array(z.string()),
  /** Locks removed, newest first (the audit has every event). */
  removedLocks: z.array(lockSchema),
  /** The lock numbers the signed-in person has on this order now. */
  myLocks: z.array(lockSchema),
});
export type LockoutDto = z.infer<typeof lockoutSchema>;
