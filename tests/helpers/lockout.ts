import { randomUUID } from 'node:crypto';
import sharp from 'sharp';
import type { Line } from '@server/db/models/line';
import type { LockoutDto } from '@shared/schemas/lockout';
import type { Browserless } from './browserless';
import { makeIsolationPoint, makeLines, uniquePrefix } from './line-rows';
import { plannableOrder } from './work-orders';

let lockSeq = 0;
/** A lock number no other lock in the run carries. */
export const lockNo = (who = 'L') => `${who}-${process.pid}-${++lockSeq}`;

export interface LockoutUsers {
  planner: Browserless;
  fitter: Browserless;
  operations: Browserless;
}

/**
 * A planned order on a new line with one valve in the register (plus the drain the helper adds):
 * `joints` couplings, all given to the demo fitter.
 */
export async function plannedOrder(u: LockoutUsers, opts: { word?: string; joints?: number; line?: Record<string, unknown>; over?: Record<string, unknown> } = {}) {
  const p = uniquePrefix(opts.word ?? 'LOTO');
  const lines: Line[] = await makeLines(p, [opts.line ?? {}]);
  await makeIsolationPoint(lines[0]!, `${p}-HV-1`);
  const order = await plannableOrder(u.planner, lines, { joints: opts.joints ?? 1, over: opts.over });
  const fitterId = (await u.fitter.get('/api/me')).body.id as string;
  for (const j of order.jointTasks as { id: string }[]) {
    const res = await u.planner.put(`/api/joint-tasks/${j.id}/fitter`, { personId: fitterId });
    if (res.status !== 200) throw new Error(`fitter not assigned: ${JSON.stringify(res.body)}`);
  }
  const planned = await u.planner.post(`/api/work-orders/${order.id}/plan`, { lateReason: 'Test order: the window is not the point here.' });
  if (planned.status !== 200) throw new Error(`not planned: ${JSON.stringify(planned.body)}`);
  return { lines, order: planned.body, jointIds: (order.jointTasks as { id: string }[]).map((j) => j.id) };
}

export const board = async (b: Browserless, orderId: string): Promise<LockoutDto> => (await b.get(`/api/work-orders/${orderId}/lockout`)).body;

/** `who` puts a lock of their own on every point of the plan. */
export async function lockEveryPoint(who: Browserless, orderId: string) {
  const b = await board(who, orderId);
  const res = await who.tablet(`/api/work-orders/${orderId}/locks`, { locks: b.points.map((pt) => ({ entryId: pt.entryId, lockNumber: lockNo() })) });
  if (res.status !== 201) throw new Error(`locks not applied: ${JSON.stringify(res.body)}`);
  return res.body as LockoutDto;
}

/** The verification body with every point found in its required position. */
export const verificationOf = (b: LockoutDto) => ({
  points: b.points.map((pt) => ({ entryId: pt.entryId, positionFound: pt.requiredPosition })),
  method: 'Opened the low-point drain and the vent; watched the gauge for five minutes.',
  reading: '0 psi on the gauge, no flow at the drain.',
});

/** A planned order, locked on every point by the fitter and verified by operations: isolated. */
export async function isolatedOrder(u: LockoutUsers, opts: Parameters<typeof plannedOrder>[1] = {}) {
  const planned = await plannedOrder(u, opts);
  const locked = await lockEveryPoint(u.fitter, planned.order.id);
  const verified = await u.operations.tablet(`/api/work-orders/${planned.order.id}/verification`, verificationOf(locked));
  if (verified.status !== 201) throw new Error(`not verified: ${JSON.stringify(verified.body)}`);
  return { ...planned, board: verified.body as LockoutDto };
}

/** Good values for each step of a joint at 70 °F and 50 % RH, PVC on pressure service. */
export const GOOD_STEPS = {
  prep: { squareCut: true, deburred: true, chamfered: true, cleanDry: true },
  'dry-fit': { insertion: 0.75, unit: 'in' }, // 2" Sch 80: socket 1.500 in, window 0.500–1.000 in (ASTM D2467 via the engine)
  'depth-marks': { insertionMark: true, checkMark: true },
  primer: { standard: 'ASTM F656', lot: 'P-2291', softeningChecked: true },
  // made six months before the test runs, so the can is always in date
  cement: { standard: 'ASTM D2564', lot: 'C-7710', manufacturedOn: new Date(Date.now() - 182 * 86_400_000).toISOString().slice(0, 10), ambientTemperature: 70, temperatureUnit: 'F', relativeHumidity: 50 },
  assembly: { assembledWet: true, joiningDeviceUsed: false, heldSeconds: 30 },
  wipe: { beadWiped: true },
} as const;
export type StepName = keyof typeof GOOD_STEPS;

export const recordStep = (fitter: Browserless, jointId: string, step: StepName, values: unknown = GOOD_STEPS[step], key?: string) =>
  fitter.tablet(`/api/joint-tasks/${jointId}/steps`, { step, values }, key);

/** Records every step of the joint up to and including `last`, failing loudly on a refusal. */
export async function recordStepsThrough(fitter: Browserless, jointId: string, last: StepName) {
  for (const step of Object.keys(GOOD_STEPS) as StepName[]) {
    const res = await recordStep(fitter, jointId, step);
    if (res.status !== 201) throw new Error(`${step} refused: ${res.status} ${JSON.stringify(res.body)}`);
    if (step === last) return res.body;
  }
  throw new Error(`no step ${last}`);
}

/** A plain picture as a camera would send it (JPEG), `width` × `height`. */
export const jpegPicture = (width = 640, height = 480) =>
  sharp({ create: { width, height, channels: 3, background: { r: 180, g: 90, b: 30 } } }).jpeg().toBuffer();

/** Uploads a photo of `step` for the joint, as the tablet does (multipart, with an Idempotency-Key). */
export async function uploadPhoto(who: Browserless, jointId: string, step: 'depth-marks' | 'wipe', content: Buffer, filename = 'joint.jpg') {
  const form = new FormData();
  form.append('step', step);
  form.append('photo', new Blob([new Uint8Array(content)]), filename);
  const res = await who.raw(`/api/joint-tasks/${jointId}/photos`, { method: 'POST', body: form, headers: { 'Idempotency-Key': randomUUID() } });
  const text = await res.text();
  return { status: res.status, body: text && res.headers.get('content-type')?.includes('json') ? JSON.parse(text) : text };
}
