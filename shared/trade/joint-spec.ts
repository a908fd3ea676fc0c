// The whole specification of one joint, as the API validates it and the client preview sends it.
// jointPicture() (joint-picture.ts) turns it into everything the trade rules say about it.

import { z } from 'zod';
import { parseNominalSize } from './nominal-size';
import { PIPE_MATERIALS } from './pipe-materials';
import { TEST_CAPS } from './test-pressure';
import { BELOW_ABSOLUTE_ZERO, isBelowAbsoluteZero } from './units';

/** A temperature in °F, refused below absolute zero by the same rule the importer uses (units.ts). */
export const temperatureFSchema = z.number().refine((f) => !isBelowAbsoluteZero(f), { message: BELOW_ABSOLUTE_ZERO });

export const jointSpecSchema = z.object({
  material: z.enum(PIPE_MATERIALS),
  schedule: z.union([z.literal(40), z.literal(80)]),
  nominalSize: z.string().refine((s) => parseNominalSize(s) !== null, { message: 'Not a listed nominal pipe size' }),
  designPressurePsi: z.number().nonnegative(),
  /** Service temperature: the pipe is rated at this. */
  designTemperatureF: temperatureFSchema,
  /** The lowest temperature expected during set and cure. */
  cureTemperatureF: temperatureFSchema,
  relativeHumidity: z.number().min(0).max(100),
  /** Omit to derive 1.5 × design. */
  testPressurePsi: z.number().positive().optional(),
  /** Temperature of the test water; the pipe's rating at it caps the test. Default: the design temperature. */
  testTemperatureF: temperatureFSchema.optional(),
  testMedium: z.string().default('water'),
  /** Rating of the weakest other component (valve, flange …); the pipe's own rating always counts too. */
  lowestComponentRatingPsi: z.number().positive().optional(),
  cementStandard: z.string().optional(),
  cementBody: z.enum(['regular', 'medium', 'heavy']).optional(),
  pressureService: z.boolean().default(true),
  cureScheduleId: z.string().optional(),
  testCap: z.enum(TEST_CAPS).default('rating'),
  chemicalService: z.boolean().default(true),
});

/** What a caller sends (defaults may be left out). */
export type JointSpecInput = z.input<typeof jointSpecSchema>;
/** What the rules work on (defaults filled in). */
export type JointSpec = z.output<typeof jointSpecSchema>;
