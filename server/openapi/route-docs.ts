// Every route of the app, one entry each: what it does, who may call it, what it takes and what
// it answers, from the same zod schemas the route validates with. tests/api/openapi.test.ts fails
// when the router stack has a route this list lacks, or this list names a route that is gone.

import { z } from 'zod';
import type { Action } from '@shared/permissions';
import { isolationPlanBodySchema, isolationPlanResponseSchema } from '@shared/schemas/isolation-plans';
import { jointTaskFitterSchema, jointTaskIdParamsSchema, jointTaskSchema, jointTasksAddSchema } from '@shared/schemas/joint-tasks';
import {
  importIdParamsSchema, importListQuerySchema, importListResponseSchema, importRowsQuerySchema, importRowsResponseSchema, lineImportSchema,
} from '@shared/schemas/line-imports';
import { lineDetailSchema, lineExportQuerySchema, lineListQuerySchema, lineListResponseSchema, lineNumberParamsSchema } from '@shared/schemas/lines';
import { plantSettingsBodySchema, plantSettingsSchema } from '@shared/schemas/plant-settings';
import { fitterSchema, meSchema, personIdParamsSchema, personRolesBodySchema, personSchema } from '@shared/schemas/roles';
import { scheduleQuerySchema, scheduleResponseSchema, windowPlanSchema } from '@shared/schemas/work-order-plan';
import {
  workOrderCancelSchema, workOrderCreateSchema, workOrderIdParamsSchema, workOrderListQuerySchema, workOrderListResponseSchema, workOrderPlanSchema,
  workOrderSchema, workOrderUpdateSchema,
} from '@shared/schemas/work-orders';
import { jointSpecSchema } from '@shared/trade';
import { engineeringEntrySchema, holdIdParamsSchema, jointDetailSchema, photoIdParamsSchema, photoSchema, photoUploadFieldsSchema, redoSchema, shiftSchema, stepRecordSchema } from '@shared/schemas/joint-steps';
import { lineStatusBoardSchema, pressureTestBodySchema, pressureTestSchema, releaseBlockerSchema, releaseBodySchema, releaseQueueSchema } from '@shared/schemas/release';
import { handoverSchema, lockBoxCreateSchema, lockIdParamsSchema, lockRemovalSchema, locksApplySchema, lockoutSchema, verificationSchema } from '@shared/schemas/lockout';
import * as S from './route-schemas';

export type Method = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';

export interface RouteDoc {
  /** Method and path as Express has them, as in the role table: 'GET /api/work-orders/:id'. */
  route: `${Method} /${string}`;
  tag: string;
  summary: string;
  description?: string;
  /** The permission the route is guarded by (shared/permissions.ts), 'signed-in' for any session, or 'public'. */
  allow: Action | 'signed-in' | 'public';
  params?: z.ZodObject;
  query?: z.ZodObject;
  /** A JSON body, or a multipart form. */
  body?: z.ZodType | { multipart: z.ZodType };
  /** The main answer: its status, and its schema (JSON) or content type. */
  ok: { status: number; description: string; schema?: z.ZodType; contentType?: string; alsoStatus?: number };
  /** Refusals besides the ones every route of its kind has (400, 401, 403, 404 are added from the entry). */
  errors?: Partial<Record<number, string>>;
}

const id = workOrderIdParamsSchema;
const IDEMPOTENT = 'Send an `Idempotency-Key` header (8–200 letters, digits, `.:_-`): a replay with the same key and body answers the first result and records nothing twice.';
const REUSED = 'The Idempotency-Key was already used for a different write.';
const CONFLICT = { 409: 'The order is not in a state that allows this, or the edit was made over a newer version.' };

export const ROUTE_DOCS: RouteDoc[] = [
  // the service and the document
  { route: 'GET /api/health', tag: 'service', allow: 'public', summary: 'Whether the server reaches its database', ok: { status: 200, description: 'PostgreSQL answers', schema: S.healthResponseSchema } },
  { route: 'GET /api/openapi.json', tag: 'service', allow: 'public', summary: 'This document', description: 'The API\'s description, built from the shared zod schemas. Public: it holds no data, only the shape of the API the client already carries.', ok: { status: 200, description: 'OpenAPI 3.1', schema: S.openApiDocumentSchema } },
  // signing in
  { route: 'GET /auth/login', tag: 'sign-in', allow: 'public', summary: 'Start a sign-in at the identity provider', query: S.signInQuerySchema, ok: { status: 302, description: 'Redirect to the identity provider' }, errors: { 429: 'Too many sign-in attempts from this address this minute.' } },
  { route: 'GET /auth/callback', tag: 'sign-in', allow: 'public', summary: 'The identity provider\'s return: completes the sign-in', query: S.callbackQuerySchema, ok: { status: 302, description: 'Signed in; redirect to where the sign-in started' }, errors: { 400: 'No sign-in under way, or the provider\'s answer does not match it.', 429: 'Too many sign-in attempts from this address this minute.' } },
  { route: 'POST /auth/logout', tag: 'sign-in', allow: 'public', summary: 'Sign out', description: 'Ends the session; signing out without one is harmless.', ok: { status: 200, description: 'Where to go next (the provider\'s sign-out page, or the app)', schema: S.signOutResponseSchema } },
  // people
  { route: 'GET /api/me', tag: 'people', allow: 'signed-in', summary: 'The signed-in person and their roles', ok: { status: 200, description: 'The person', schema: meSchema } },
  { route: 'GET /api/people', tag: 'people', allow: 'people.manage', summary: 'Everyone who has signed in, with their roles', ok: { status: 200, description: 'People by name', schema: z.array(personSchema) } },
  { route: 'GET /api/fitters', tag: 'people', allow: 'workOrders.plan', summary: 'Everyone who holds the fitter role, to give joint tasks to', ok: { status: 200, description: 'Fitters by name', schema: z.array(fitterSchema) } },
  { route: 'PUT /api/people/:id/roles', tag: 'people', allow: 'people.manage', summary: 'Set a person\'s roles (grants and withdrawals against the provider\'s)', params: personIdParamsSchema, body: personRolesBodySchema, ok: { status: 200, description: 'The person', schema: personSchema }, errors: { 409: 'An administrator cannot withdraw their own admin role.' } },
  // the line register
  { route: 'GET /api/lines', tag: 'lines', allow: 'lines.read', summary: 'A page of the line register, sorted and filtered', query: lineListQuerySchema, ok: { status: 200, description: 'The page, the total and the filter facets', schema: lineListResponseSchema } },
  { route: 'GET /api/lines/export.csv', tag: 'lines', allow: 'lines.read', summary: 'The register as CSV (the import\'s columns), sorted and filtered like the list', query: lineExportQuerySchema, ok: { status: 200, description: 'A CSV file; cells a spreadsheet would run are prefixed with \'', contentType: 'text/csv' } },
  { route: 'GET /api/lines/:lineNumber', tag: 'lines', allow: 'lines.read', summary: 'One line with its isolation points', params: lineNumberParamsSchema, ok: { status: 200, description: 'The line', schema: lineDetailSchema } },
  // importing the register
  { route: 'GET /api/line-imports', tag: 'line imports', allow: 'lines.import', summary: 'Past imports, newest first', query: importListQuerySchema, ok: { status: 200, description: 'A page of imports', schema: importListResponseSchema } },
  { route: 'POST /api/line-imports', tag: 'line imports', allow: 'lines.import', summary: 'Upload a register CSV file and preview every row', description: 'Files over IMPORT_INLINE_LIMIT rows preview in the worker (status `previewing`).', body: { multipart: S.uploadBodySchema }, ok: { status: 201, description: 'The import and its preview counts', schema: lineImportSchema } },
  { route: 'GET /api/line-imports/:id', tag: 'line imports', allow: 'lines.import', summary: 'One import: status, counts, progress', params: importIdParamsSchema, ok: { status: 200, description: 'The import', schema: lineImportSchema } },
  { route: 'GET /api/line-imports/:id/rows', tag: 'line imports', allow: 'lines.import', summary: 'A page of an import\'s previewed rows', params: importIdParamsSchema, query: importRowsQuerySchema, ok: { status: 200, description: 'The rows', schema: importRowsResponseSchema } },
  { route: 'POST /api/line-imports/:id/confirm', tag: 'line imports', allow: 'lines.import', summary: 'Write the new and changed rows to the register, in one transaction', params: importIdParamsSchema, ok: { status: 200, alsoStatus: 202, description: 'Applied (200), or applying in the worker (202)', schema: lineImportSchema }, errors: { 409: 'The import is not previewed, or was applied or cancelled.' } },
  { route: 'POST /api/line-imports/:id/cancellation', tag: 'line imports', allow: 'lines.import', summary: 'Cancel an import that is not applied', params: importIdParamsSchema, ok: { status: 200, description: 'The cancelled import', schema: lineImportSchema }, errors: { 409: 'The import was applied already.' } },
  // the trade engine and the plant's settings
  { route: 'POST /api/calc/joint', tag: 'calc', allow: 'calc.use', summary: 'Rating, set and cure times, test pressure and materials for one joint', body: jointSpecSchema, ok: { status: 200, description: 'The trade engine\'s picture of the joint; `ok: false` with `problems` when it refuses', schema: S.jointPictureSchema } },
  { route: 'GET /api/plant-settings', tag: 'plant settings', allow: 'plantSettings.read', summary: 'The plant\'s cure schedule, test cap, time zone and window-plan minutes', ok: { status: 200, description: 'The settings, with those still at their default named', schema: plantSettingsSchema } },
  { route: 'PUT /api/plant-settings', tag: 'plant settings', allow: 'plantSettings.edit', summary: 'Change the plant\'s settings', body: plantSettingsBodySchema, ok: { status: 200, description: 'The settings', schema: plantSettingsSchema }, errors: { 409: 'Saved over a newer version of the settings.' } },
  // work orders
  { route: 'GET /api/work-orders', tag: 'work orders', allow: 'workOrders.read', summary: 'A page of work orders, sorted and filtered', query: workOrderListQuerySchema, ok: { status: 200, description: 'The page and the total', schema: workOrderListResponseSchema } },
  { route: 'POST /api/work-orders', tag: 'work orders', allow: 'workOrders.plan', summary: 'Create a draft work order on one or more lines', body: workOrderCreateSchema, ok: { status: 201, description: 'The order', schema: workOrderSchema } },
  { route: 'GET /api/work-orders/:id', tag: 'work orders', allow: 'workOrders.read', summary: 'One order: lines, joint tasks, isolation plan, materials, test pressure, window plan, overlaps, history', params: id, ok: { status: 200, description: 'The order', schema: workOrderSchema } },
  { route: 'PATCH /api/work-orders/:id', tag: 'work orders', allow: 'workOrders.plan', summary: 'Edit a draft or planned order', params: id, body: workOrderUpdateSchema, ok: { status: 200, description: 'The order', schema: workOrderSchema }, errors: CONFLICT },
  { route: 'POST /api/work-orders/:id/plan', tag: 'work orders', allow: 'workOrders.plan', summary: 'Submit the plan: draft → planned', description: 'Needs a line, a joint task, an isolation plan and a window; a plan that does not fit its window needs `lateReason`, and operations and the requester are told by e-mail.', params: id, body: workOrderPlanSchema, ok: { status: 200, description: 'The planned order', schema: workOrderSchema }, errors: CONFLICT },
  { route: 'POST /api/work-orders/:id/cancellation', tag: 'work orders', allow: 'workOrders.plan', summary: 'Cancel a draft or planned order, with a reason', params: id, body: workOrderCancelSchema, ok: { status: 200, description: 'The cancelled order', schema: workOrderSchema }, errors: CONFLICT },
  { route: 'POST /api/work-orders/:id/joint-tasks', tag: 'work orders', allow: 'workOrders.plan', summary: 'Add joint tasks: `count` joints of one fitting on one of the order\'s lines', params: id, body: jointTasksAddSchema, ok: { status: 201, description: 'The new tasks (J1, J2 …)', schema: z.array(jointTaskSchema) }, errors: CONFLICT },
  { route: 'GET /api/work-orders/:id/isolation-plan', tag: 'work orders', allow: 'workOrders.read', summary: 'The isolation plan, and the register\'s points of the order\'s lines to pre-fill it', params: id, ok: { status: 200, description: 'The plan and the suggestions', schema: isolationPlanResponseSchema } },
  { route: 'PUT /api/work-orders/:id/isolation-plan', tag: 'work orders', allow: 'workOrders.plan', summary: 'Replace the isolation plan; a point not in the register joins it', params: id, body: isolationPlanBodySchema, ok: { status: 200, description: 'The plan', schema: isolationPlanResponseSchema }, errors: CONFLICT },
  { route: 'GET /api/work-orders/:id/window-plan', tag: 'work orders', allow: 'workOrders.read', summary: 'The computed chain (isolation, joints, cure, test, release) against the booked window', params: id, ok: { status: 200, description: 'The window plan', schema: windowPlanSchema } },
  { route: 'DELETE /api/joint-tasks/:id', tag: 'work orders', allow: 'workOrders.plan', summary: 'Remove a joint task (its number is not reused)', params: jointTaskIdParamsSchema, ok: { status: 204, description: 'Removed' }, errors: CONFLICT },
  { route: 'PUT /api/joint-tasks/:id/fitter', tag: 'work orders', allow: 'workOrders.plan', summary: 'Assign a joint task to a fitter, or take it back', params: jointTaskIdParamsSchema, body: jointTaskFitterSchema, ok: { status: 200, description: 'The task', schema: jointTaskSchema }, errors: { ...CONFLICT, 400: 'The person does not hold the fitter role, or a field is not valid.' } },
  { route: 'GET /api/schedule', tag: 'work orders', allow: 'workOrders.read', summary: 'Every order whose window falls in from–to (at most 62 days), with overlaps on a line or isolation point', query: scheduleQuerySchema, ok: { status: 200, description: 'The orders on the schedule', schema: scheduleResponseSchema } },
  // lockout (OSHA 29 CFR 1910.147) — every write carries an Idempotency-Key header
  { route: 'GET /api/work-orders/:id/lockout', tag: 'lockout', allow: 'workOrders.read', summary: 'The lock board: who is locked on where, right now, the lock box and the verification', params: id, ok: { status: 200, description: 'The board', schema: lockoutSchema } },
  { route: 'POST /api/work-orders/:id/locks', tag: 'lockout', allow: 'locks.apply', summary: 'Apply my own locks to points of the plan or to the lock box', description: IDEMPOTENT, params: id, body: locksApplySchema, ok: { status: 201, description: 'The board', schema: lockoutSchema }, errors: { 409: 'A lock number already on the order, a second lock of mine on one place, a key that sits in the box, or an order not open to locks.', 422: REUSED } },
  { route: 'POST /api/work-orders/:id/lock-box', tag: 'lockout', allow: 'locks.apply', summary: 'Set up the group lock box: the keys of the named points go in it; I hold primary responsibility', description: IDEMPOTENT, params: id, body: lockBoxCreateSchema, ok: { status: 201, description: 'The board', schema: lockoutSchema }, errors: { 409: 'The order already has a box, or is not open to locks.', 422: REUSED } },
  { route: 'POST /api/work-orders/:id/handovers', tag: 'lockout', allow: 'locks.handover', summary: 'Shift handover: my locks go on where the off-going person\'s are, before theirs come off', description: IDEMPOTENT, params: id, body: handoverSchema, ok: { status: 201, description: 'The board', schema: lockoutSchema }, errors: { 409: 'A lock number already on the order, or the off-going person has no lock there.', 422: REUSED } },
  { route: 'POST /api/work-orders/:id/verification', tag: 'lockout', allow: 'isolation.verify', summary: 'Record the verification of zero energy: positions found, method and reading; a planned order becomes isolated', description: IDEMPOTENT, params: id, body: verificationSchema, ok: { status: 201, description: 'The board', schema: lockoutSchema }, errors: { 409: 'A point without a lock, a point found out of its required position, or already verified.', 422: REUSED } },
  { route: 'POST /api/locks/:id/removal', tag: 'lockout', allow: 'locks.apply', summary: 'Remove a lock: by its owner, or by a supervisor recording the three steps of (e)(3) (the owner is mailed)', description: IDEMPOTENT, params: lockIdParamsSchema, body: lockRemovalSchema, ok: { status: 200, description: 'The board', schema: lockoutSchema }, errors: { 403: 'Someone else\'s lock, without the supervisor\'s permission.', 409: 'The last lock on a point or the box while work is open, someone else\'s lock without the (e)(3) record, or already removed.', 422: REUSED } },
  // the shift tablet
  { route: 'GET /api/shift', tag: 'shift', allow: 'workOrders.read', summary: 'My joint tasks on open orders, grouped by order and line, with what blocks each', ok: { status: 200, description: 'The shift', schema: shiftSchema } },
  { route: 'GET /api/joint-tasks/:id', tag: 'shift', allow: 'workOrders.read', summary: 'One joint: the engine\'s figures, the recorded steps, what blocks the next, holds, photos, cautions', params: jointTaskIdParamsSchema, ok: { status: 200, description: 'The joint', schema: jointDetailSchema } },
  { route: 'POST /api/joint-tasks/:id/steps', tag: 'shift', allow: 'joints.record', summary: 'Record the joint\'s next step, checked by the trade engine; assembly creates the set and cure holds', description: `${IDEMPOTENT} A dry fit outside 1/3–2/3 of the socket depth answers 409 \`dry_fit_outside\` and is kept as a retry.`, params: jointTaskIdParamsSchema, body: stepRecordSchema, ok: { status: 201, alsoStatus: 200, description: 'The joint (200 when the same step was already recorded the same way by me)', schema: jointDetailSchema }, errors: { 409: 'Isolation not verified, no lock of mine on, a step out of order, a step recorded differently by someone else (with what and by whom), a dry fit outside the window, or a value the engine refuses (expired cement, cement for another material, transition cement on pressure service, a primer that does not suit).', 422: REUSED } },
  { route: 'POST /api/joint-tasks/:id/redo', tag: 'shift', allow: 'joints.redo', summary: 'Cut the joint out for redo, with a reason: its holds are void and a new task replaces it', description: IDEMPOTENT, params: jointTaskIdParamsSchema, body: redoSchema, ok: { status: 201, description: 'The new task', schema: jointDetailSchema }, errors: { 409: 'Already redone, no step recorded, or the section is not isolated.', 422: REUSED } },
  { route: 'POST /api/joint-tasks/:id/photos', tag: 'shift', allow: 'joints.record', summary: 'Add a photo of the depth marks or the finished joint (JPEG, PNG or WebP by content; re-encoded without metadata)', description: IDEMPOTENT, params: jointTaskIdParamsSchema, body: { multipart: photoUploadFieldsSchema.extend({ photo: z.string().describe('the picture (binary)') }) }, ok: { status: 201, description: 'The photo', schema: photoSchema }, errors: { 409: 'The order is not being worked on.', 413: 'The picture is larger than 12 MB.', 415: 'Not a JPEG, PNG or WebP picture by its content.', 422: REUSED } },
  // the test and the release
  { route: 'GET /api/work-orders/:id/pressure-tests', tag: 'release', allow: 'workOrders.read', summary: 'The order\'s hydrostatic tests, oldest first', params: id, ok: { status: 200, description: 'The tests', schema: z.array(pressureTestSchema) } },
  { route: 'POST /api/work-orders/:id/pressure-tests', tag: 'release', allow: 'tests.witness', summary: 'Record the hydrostatic test as its witness: the (f)(1) sequence, readings, result; a pass makes the order ready, a failure cuts out the leaking joints', description: IDEMPOTENT, params: id, body: pressureTestBodySchema, ok: { status: 201, description: 'The test', schema: pressureTestSchema }, errors: { 409: 'Not testing, a cure hold still running, a lock still on, air or gas, a pressure outside minimum and cap, or a pass held too short or below the minimum.', 422: REUSED } },
  { route: 'GET /api/work-orders/:id/release-check', tag: 'release', allow: 'workOrders.read', summary: 'Whether the order\'s lines may go back into service now, with every reason they may not', params: id, ok: { status: 200, description: 'Ready, or the reasons', schema: z.object({ ready: z.boolean(), blockers: z.array(releaseBlockerSchema) }) } },
  { route: 'POST /api/work-orders/:id/release', tag: 'release', allow: 'lines.release', summary: 'Sign the release checklist: the lines go back into service, the lockout closes', description: 'One transaction holding the order\'s row lock: of two releases racing, exactly one succeeds.', params: id, body: releaseBodySchema, ok: { status: 201, description: 'The order released', schema: z.object({ id: z.string(), number: z.string(), state: z.string(), releasedAt: z.string().nullable() }) }, errors: { 409: 'Refused, with every reason in `details.reasons`: a lock on, a hold active by the clock, no passed test, or not ready.' } },
  { route: 'GET /api/release-queue', tag: 'release', allow: 'workOrders.read', summary: 'Orders whose lines are out, ready to release first, each with every reason it is blocked', ok: { status: 200, description: 'The queue', schema: releaseQueueSchema } },
  { route: 'POST /api/holds/:id/engineering', tag: 'release', allow: 'holds.engineeringEntry', summary: 'Enter an engineering set and cure time, with a reason, for a joint whose holds the published tables refused', description: IDEMPOTENT, params: holdIdParamsSchema, body: engineeringEntrySchema, ok: { status: 200, description: 'The joint, its holds running', schema: jointDetailSchema }, errors: { 409: 'The joint has no hold waiting for an engineering entry.', 422: REUSED } },
  { route: 'GET /api/work-orders/:id/record-gaps', tag: 'release', allow: 'workOrders.read', summary: 'What the order\'s record still lacks before it can be closed (steps, photos, a passed test)', params: id, ok: { status: 200, description: 'The gaps; empty when complete', schema: z.object({ gaps: z.array(z.string()) }) } },
  { route: 'POST /api/work-orders/:id/close', tag: 'release', allow: 'workOrders.close', summary: 'Close a released order whose record is complete', params: id, ok: { status: 200, description: 'The order', schema: workOrderSchema }, errors: { 409: 'Not released, or the record lacks steps, photos or a passed test (named in `details.gaps`).' } },
  { route: 'GET /api/work-orders/:id/record.pdf', tag: 'release', allow: 'workOrders.read', summary: 'The order\'s record as a PDF, a QR code on each joint\'s section', params: id, ok: { status: 200, description: 'The PDF', contentType: 'application/pdf' }, errors: { 409: 'The order is not released yet.' } },
  { route: 'GET /api/line-status', tag: 'release', allow: 'workOrders.read', summary: 'Every line out of service, the open orders holding it out with their reasons, and the latest hold end', ok: { status: 200, description: 'The board', schema: lineStatusBoardSchema } },
  { route: 'GET /api/photos/:id', tag: 'shift', allow: 'workOrders.read', summary: 'A joint photo', params: photoIdParamsSchema, ok: { status: 200, description: 'The picture', contentType: 'image/jpeg' } },
];
