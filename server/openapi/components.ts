// The named schemas of the OpenAPI document: each shared zod schema a route validates with or
// answers with, under the name it has in `components.schemas`. A schema left out of these lists is
// written inline where it is used; one listed here is a `$ref`, inside other schemas too.

import { z } from 'zod';
import { apiErrorSchema } from '@shared/schemas/errors';
import { isolationPlanBodySchema, isolationPlanEntrySchema, isolationPlanResponseSchema } from '@shared/schemas/isolation-plans';
import { jointTaskFitterSchema, jointTaskSchema, jointTasksAddSchema } from '@shared/schemas/joint-tasks';
import { importListResponseSchema, importRowSchema, importRowsResponseSchema, lineImportSchema } from '@shared/schemas/line-imports';
import { isolationPointSchema, lineDetailSchema, lineListResponseSchema, lineSchema } from '@shared/schemas/lines';
import { plantSettingsBodySchema, plantSettingsSchema } from '@shared/schemas/plant-settings';
import { meSchema, personRolesBodySchema, personSchema } from '@shared/schemas/roles';
import { materialsSchema, overlapSchema, scheduleResponseSchema, testPressureSchema, windowPlanSchema } from '@shared/schemas/work-order-plan';
import {
  historyEntrySchema, workOrderCancelSchema, workOrderCreateSchema, workOrderListResponseSchema, workOrderPlanSchema, workOrderRowSchema, workOrderSchema,
  workOrderUpdateSchema,
} from '@shared/schemas/work-orders';
import { jointSpecSchema } from '@shared/trade';
import { engineeringEntrySchema, holdSchema, temperatureLogSchema, jointDetailSchema, photoSchema, redoSchema, shiftSchema, stepRecordSchema } from '@shared/schemas/joint-steps';
import { pressureTestBodySchema, pressureTestSchema, releaseBlockerSchema, releaseBodySchema, releaseQueueSchema } from '@shared/schemas/release';
import { handoverSchema, lockBoxCreateSchema, lockoutSchema, lockRemovalSchema, lockSchema, locksApplySchema, verificationSchema } from '@shared/schemas/lockout';

/** Request bodies, described as the client sends them (zod's input: defaults may be left out). */
export const REQUEST_SCHEMAS: Record<string, z.ZodType> = {
  PersonRolesBody: personRolesBodySchema,
  JointSpec: jointSpecSchema,
  PlantSettingsBody: plantSettingsBodySchema,
  WorkOrderCreate: workOrderCreateSchema,
  WorkOrderUpdate: workOrderUpdateSchema,
  WorkOrderPlan: workOrderPlanSchema,
  WorkOrderCancel: workOrderCancelSchema,
  JointTasksAdd: jointTasksAddSchema,
  JointTaskFitter: jointTaskFitterSchema,
  IsolationPlanBody: isolationPlanBodySchema,
  LocksApply: locksApplySchema,
  LockBoxCreate: lockBoxCreateSchema,
  LockRemoval: lockRemovalSchema,
  Handover: handoverSchema,
  Verification: verificationSchema,
  StepRecord: stepRecordSchema,
  Redo: redoSchema,
  PressureTestBody: pressureTestBodySchema,
  EngineeringEntry: engineeringEntrySchema,
  ReleaseBody: releaseBodySchema,
};

/** Answers, described as the server sends them (zod's output). */
export const RESPONSE_SCHEMAS: Record<string, z.ZodType> = {
  ApiError: apiErrorSchema,
  Me: meSchema,
  Person: personSchema,
  Line: lineSchema,
  IsolationPoint: isolationPointSchema,
  LineDetail: lineDetailSchema,
  LineList: lineListResponseSchema,
  LineImport: lineImportSchema,
  LineImportList: importListResponseSchema,
  ImportRow: importRowSchema,
  ImportRows: importRowsResponseSchema,
  PlantSettings: plantSettingsSchema,
  WorkOrderRow: workOrderRowSchema,
  WorkOrderList: workOrderListResponseSchema,
  WorkOrder: workOrderSchema,
  HistoryEntry: historyEntrySchema,
  JointTask: jointTaskSchema,
  IsolationPlanEntry: isolationPlanEntrySchema,
  IsolationPlan: isolationPlanResponseSchema,
  Materials: materialsSchema,
  TestPressure: testPressureSchema,
  WindowPlan: windowPlanSchema,
  Overlap: overlapSchema,
  Schedule: scheduleResponseSchema,
  Lock: lockSchema,
  Lockout: lockoutSchema,
  Hold: holdSchema,
  Photo: photoSchema,
  JointDetail: jointDetailSchema,
  Shift: shiftSchema,
  PressureTest: pressureTestSchema,
  TemperatureLog: temperatureLogSchema,
  ReleaseBlocker: releaseBlockerSchema,
  ReleaseQueue: releaseQueueSchema,
};
