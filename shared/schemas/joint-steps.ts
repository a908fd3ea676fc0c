import { z } from 'zod';
import { fittingKindSchema } from './joint-tasks';

// A joint's steps on the shift tablet (DESIGN.md section 9), the holds that assembly creates, the
// photos of a joint, and the fitter's shift view. Each step records who and when; the server checks
// each value with the trade engine and refuses a step out of order.

export const JOINT_STEPS = ['prep', 'dry-fit', 'depth-marks', 'primer', 'cement', 'assembly', 'wipe'] as const;
export const jointStepSchema = z.enum(JOINT_STEPS);
export type JointStep = z.infer<typeof jointStepSchema>;
export const JOINT_STEP_LABELS: Record<JointStep, string> = {
  prep: 'Prepare the ends',
  'dry-fit': 'Dry fit',
  'depth-marks': 'Depth marks',
  primer: 'Primer',
  cement: 'Cement',
  assembly: 'Assemble and hold',
  wipe: 'Wipe the bead',
};
/** The steps that take photos (several each): the depth marks, and the finished joint. */
export const PHOTO_STEPS = ['depth-marks', 'wipe'] as const satisfies readonly JointStep[];
export type PhotoStep = (typeof PHOTO_STEPS)[number];

const yes = (what: string) => z.literal(true, { message: `confirm ${what}` });
const text = (max: number) => z.string().trim().min(1, 'must not be empty').max(max).regex(/^[^\0]*$/, 'must not contain a NUL character');
const finite = z.number({ message: 'must be a number' }).refine(Number.isFinite, 'must be a number');

export const lengthUnitSchema = z.enum(['in', 'mm']);
export const temperatureUnitSchema = z.enum(['F', 'C']);

export const prepValuesSchema = z.object({
  squareCut: yes('the cut is square'),
  deburred: yes('inside and outside are deburred'),
  chamfered: yes('the end is chamfered'),
  cleanDry: yes('the surfaces are clean and dry'),
});
export const dryFitValuesSchema = z.object({
  /** How far the dry pipe entered the socket. */
  insertion: finite.min(0, 'must be 0 or more').max(1000),
  unit: lengthUnitSchema,
});
export const depthMarksValuesSchema = z.object({
  insertionMark: yes('the insertion mark is on the pipe'),
  checkMark: yes('the check mark is on the pipe'),
});
export const primerValuesSchema = z.object({
  /** "ASTM F656"; "none" only where the material takes no primer (ABS). */
  standard: text(40),
  lot: text(60),
  softeningChecked: yes('the primer softened a scrap of the pipe'),
});
export const cementValuesSchema = z.object({
  standard: text(40),
  lot: text(60),
  /** The date stamped on the can, YYYY-MM-DD. */
  manufacturedOn: z.iso.date({ message: 'the date stamped on the can, as a date' }),
  ambientTemperature: finite.min(-60).max(160),
  temperatureUnit: temperatureUnitSchema,
  relativeHumidity: finite.min(0, 'must be 0–100 %').max(100, 'must be 0–100 %'),
});
export const assemblyValuesSchema = z.object({
  assembledWet: yes('the pipe went in while the cement was wet'),
  /** Whether a mechanical joining device bottomed the pipe (required where the size needs one). */
  joiningDeviceUsed: z.boolean(),
  /** How long the joint was held still after assembly, seconds (the countdown). */
  heldSeconds: z.number().int().min(0).max(3600),
});
export const wipeValuesSchema = z.object({ beadWiped: yes('the bead is wiped') });

/** One step as the tablet sends it: the step's name and its values. */
export const stepRecordSchema = z.discriminatedUnion('step', [
  z.object({ step: z.literal('prep'), values: prepValuesSchema }),
  z.object({ step: z.literal('dry-fit'), values: dryFitValuesSchema }),
  z.object({ step: z.literal('depth-marks'), values: depthMarksValuesSchema }),
  z.object({ step: z.literal('primer'), values: primerValuesSchema }),
  z.object({ step: z.literal('cement'), values: cementValuesSchema }),
  z.object({ step: z.literal('assembly'), values: assemblyValuesSchema }),
  z.object({ step: z.literal('wipe'), values: wipeValuesSchema }),
]);
export type StepRecord = z.infer<typeof stepRecordSchema>;

/** A supervisor's engineering cure time for a hold the engine refused, with a written reason. */
export const engineeringEntrySchema = z.object({
  setMinutes: z.number().int().min(1).max(60 * 24 * 30),
  cureMinutes: z.number().int().min(1).max(60 * 24 * 60),
  reason: text(2000),
}).refine((b) => b.cureMinutes >= b.setMinutes, { path: ['cureMinutes'], message: 'the cure lasts at least as long as the set' });
export type EngineeringEntry = z.infer<typeof engineeringEntrySchema>;
export const holdIdParamsSchema = z.object({ id: z.uuid({ message: 'not a hold id' }) });

export const redoSchema = z.object({ reason: text(1000) });
export type Redo = z.infer<typeof redoSchema>;

export const photoUploadFieldsSchema = z.object({ step: z.enum(PHOTO_STEPS) });
export const photoIdParamsSchema = z.object({ id: z.uuid({ message: 'not a photo id' }) });

const personRef = z.object({ id: z.string(), name: z.string() });

export const recordedStepSchema = z.object({
  step: jointStepSchema,
  values: z.record(z.string(), z.unknown()),
  recordedBy: personRef,
  recordedAt: z.string(),
});
export type RecordedStepDto = z.infer<typeof recordedStepSchema>;

export const HOLD_KINDS = ['set', 'cure'] as const;
export const HOLD_STATUSES = ['running', 'awaiting-engineering', 'ended', 'void'] as const;
export const holdSchema = z.object({
  id: z.string(),
  kind: z.enum(HOLD_KINDS),
  jointTaskId: z.string().nullable(),
  status: z.enum(HOLD_STATUSES),
  startsAt: z.string(),
  /** Null while it waits for a supervisor's engineering cure time. */
  endsAt: z.string().nullable(),
  temperatureF: z.number(),
  relativeHumidity: z.number(),
  pressurePsi: z.number(),
  schedule: z.string().nullable(),
  /** "40–60 °F · 1-1/2"–3" · 160–370 psi", or the engine's refusal while awaiting engineering. */
  basis: z.string(),
  source: z.string().nullable(),
  voidReason: z.string().nullable(),
  /** Set where a supervisor entered the cure time because the engine refused: every record says so. */
  engineering: z.object({ by: z.object({ id: z.string(), name: z.string() }), reason: z.string(), minutes: z.number() }).nullable(),
});
export type HoldDto = z.infer<typeof holdSchema>;

export const photoSchema = z.object({
  id: z.string(),
  step: z.enum(PHOTO_STEPS),
  url: z.string(),
  width: z.number(),
  height: z.number(),
  takenBy: personRef,
  takenAt: z.string(),
});
export type PhotoDto = z.infer<typeof photoSchema>;

/** What stops the next step now, in words ("isolation not verified", "the set hold runs until 14:20"). */
export const blockerSchema = z.object({
  kind: z.enum(['isolation', 'my-lock', 'previous-step', 'hold', 'redone', 'order-state']),
  message: z.string(),
  /** For a hold: when it ends. */
  until: z.string().nullable(),
});
export type BlockerDto = z.infer<typeof blockerSchema>;

export const cautionDtoSchema = z.object({ id: z.string(), title: z.string(), text: z.string() });

/** Everything the tablet shows for one joint: the task, the engine's figures, the steps, holds, photos. */
export const jointDetailSchema = z.object({
  id: z.string(),
  label: z.string(),
  workOrder: z.object({ id: z.string(), number: z.string(), state: z.string() }),
  line: z.object({ id: z.string(), lineNumber: z.string(), service: z.string(), material: z.string(), schedule: z.string().nullable(), designPressurePsi: z.number() }),
  fittingKind: fittingKindSchema,
  jointSize: z.string(),
  fitter: personRef.nullable(),
  replacesTaskId: z.string().nullable(),
  replacedByTaskId: z.string().nullable(),
  redo: z.object({ reason: z.string(), by: personRef, at: z.string() }).nullable(),
  /** The engine's figures for this joint; a field is null where the engine refused, with the reason in `problems`. */
  engine: z.object({
    socketDepthIn: z.number().nullable(),
    dryFitMinIn: z.number().nullable(),
    dryFitMaxIn: z.number().nullable(),
    insertionMarkIn: z.number().nullable(),
    checkMarkIn: z.number().nullable(),
    cementStandard: z.string(),
    primerStandard: z.string().nullable(),
    cementBody: z.string().nullable(),
    joiningDevice: z.boolean(),
    crewText: z.string().nullable(),
    chamferText: z.string().nullable(),
    /** The hold after assembly at the forecast low; the assembly step uses the recorded temperature. */
    assemblyHoldSeconds: z.number(),
    pressureService: z.boolean(),
    problems: z.array(z.string()),
  }),
  steps: z.array(recordedStepSchema),
  /** The next step to record, or null when the joint is finished (or redone). */
  nextStep: jointStepSchema.nullable(),
  blockers: z.array(blockerSchema),
  holds: z.array(holdSchema),
  photos: z.array(photoSchema),
  /** Dry fits the server refused (the fitter re-cut or took another fitting). */
  dryFitRetries: z.array(z.object({ insertionIn: z.number(), message: z.string(), at: z.string(), by: personRef })),
  cautions: z.record(jointStepSchema, z.array(cautionDtoSchema)),
});
export type JointDetailDto = z.infer<typeof jointDetailSchema>;

/** One row of the shift view. */
export const shiftJointSchema = z.object({
  id: z.string(),
  label: z.string(),
  fittingKind: fittingKindSchema,
  jointSize: z.string(),
  stepsDone: z.number(),
  nextStep: jointStepSchema.nullable(),
  blockers: z.array(blockerSchema),
  holds: z.array(holdSchema),
  redone: z.boolean(),
});

/** The fitter's shift: their joint tasks, grouped by order and line, with what blocks each. */
export const shiftSchema = z.object({
  person: personRef,
  orders: z.array(z.object({
    id: z.string(),
    number: z.string(),
    state: z.string(),
    windowStart: z.string().nullable(),
    windowEnd: z.string().nullable(),
    isolated: z.boolean(),
    /** Whether the signed-in person has a lock on the order (on a point or the box) now. */
    myLockOn: z.boolean(),
    chemicalService: z.boolean(),
    lines: z.array(z.object({
      id: z.string(),
      lineNumber: z.string(),
      service: z.string(),
      material: z.string(),
      joints: z.array(shiftJointSchema),
    })),
  })),
});
export type ShiftDto = z.infer<typeof shiftSchema>;

/** A temperature log as read, and what it does (or did) to each running hold of the order. */
export const temperatureLogSchema = z.object({
  id: z.string(),
  workOrderId: z.string(),
  fileName: z.string(),
  uploadedBy: personRef,
  uploadedAt: z.string(),
  unit: z.enum(['F', 'C']).nullable(),
  readings: z.array(z.object({ at: z.string(), temperatureF: z.number(), relativeHumidity: z.number().optional() })),
  problems: z.array(z.string()),
  status: z.enum(['previewed', 'applied']),
  appliedAt: z.string().nullable(),
  /** For a previewed log: each running hold's end now and by the log (never earlier); empty once applied. */
  holds: z.array(z.object({
    holdId: z.string(),
    joint: z.string(),
    kind: z.enum(HOLD_KINDS),
    endsAt: z.string(),
    newEndsAt: z.string().nullable(),
    lengthenedMinutes: z.number(),
    /** Where the log falls outside the published tables: the hold then waits for an engineering entry. */
    refusal: z.string().nullable(),
  })),
});
export type TemperatureLogDto = z.infer<typeof temperatureLogSchema>;
export const temperatureLogIdParamsSchema = z.object({ id: z.uuid({ message: 'not a temperature log id' }) });
