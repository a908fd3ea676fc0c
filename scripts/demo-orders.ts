// The demo plant's work orders: a handful of invented orders on Marrowby Reach Works' lines, in
// different states, made through the product's own services as the demo people would make them
// (the planner Ines Varga, for the operations shift lead Maud Okafor). Windows fall in the coming
// days, counted from the moment of loading. Loaded once: scripts/seed-demo.ts runs it after the
// plant, an audit entry 'demo-orders-loaded' marks it done, and an order whose scope is already
// there is never made again (so a load cut short does not double the ones it made).

import { Op } from 'sequelize';
import { now } from '@server/clock';
import { config } from '@server/config';
import { AuditEntry } from '@server/db/models/audit-entry';
import { Line } from '@server/db/models/line';
import { Person } from '@server/db/models/person';
import { WorkOrder } from '@server/db/models/work-order';
import { JointTask } from '@server/db/models/joint-task';
import { sequelize } from '@server/db/sequelize';
import { recordStep } from '@server/services/joints/steps';
import { applyLocks } from '@server/services/lockout/locks';
import { verifyIsolation } from '@server/services/lockout/verification';
import { CEMENT_FOR_MATERIAL, crewAndTools, socketMarks } from '@shared/trade';
import type { StepRecord } from '@shared/schemas/joint-steps';
import { Hold } from '@server/db/models/joint-record';
import { liftDueHolds } from '@server/services/holds/lift';
import { lockoutBoard } from '@server/services/lockout/board';
import { removeLock } from '@server/services/lockout/locks';
import { recordPressureTest } from '@server/services/release/pressure-test';
import { releaseOrder } from '@server/services/release/release';
import { closeOrder } from '@server/services/record/completeness';
import { storePhoto } from '@server/services/joints/photos';
import sharp from 'sharp';
import { compute, loadFacts } from '@server/services/work-orders/order-facts';
import { recordAudit } from '@server/services/audit-service';
import { effectiveRoles } from '@server/services/people-service';
import { getIsolationPlan, setIsolationPlan } from '@server/services/work-orders/isolation-plan';
import { addJointTasks, setFitter } from '@server/services/work-orders/joint-tasks';
import { createOrder } from '@server/services/work-orders/order-service';
import { cancelOrder, submitPlan } from '@server/services/work-orders/plan-service';
import { isolationPlanBodySchema } from '@shared/schemas/isolation-plans';
import { jointTasksAddSchema, type FittingKind } from '@shared/schemas/joint-tasks';
import type { Me } from '@shared/schemas/roles';
import { workOrderCreateSchema, type Priority, type WorkOrderKind, type WorkOrderState } from '@shared/schemas/work-orders';
import { DEMO_ACCOUNTS } from './demo-accounts';

interface DemoOrder {
  line: string;
  kind: WorkOrderKind;
  priority: Priority;
  scope: string;
  /** The window: days from the day of loading, the hour it starts (UTC) and its length (with `fromLoad`, the hour counts from the loading hour); null: not booked yet. */
  window: { day: number; hour: number; hours: number; fromLoad?: boolean } | null;
  forecast: { lowF: number; highRh: number };
  joints: { fitting: FittingKind; count: number; reducingSize?: string }[];
  /** The username of the fitter the joints go to. */
  fitter?: 'fitter' | 'fitter2';
  /** Where the order is left. */
  state: Extract<WorkOrderState, 'draft' | 'planned' | 'isolated' | 'in-work' | 'curing' | 'testing' | 'ready' | 'released' | 'closed' | 'cancelled'>;
  lateReason?: string;
  cancelReason?: string;
}

export const DEMO_ORDERS: DemoOrder[] = [
  {
    line: '100-SA-001', kind: 'repair', priority: 'urgent', state: 'planned', fitter: 'fitter',
    scope: 'Weep at the coupling downstream of the dosing pump discharge valve. Cut out 18" of pipe, replace with two couplings and a union for the pump.',
    window: { day: 2, hour: 6, hours: 24 }, forecast: { lowF: 68, highRh: 45 },
    joints: [{ fitting: 'coupling', count: 2 }, { fitting: 'union', count: 1 }],
  },
  {
    line: '100-SA-001', kind: 'tie-in', priority: 'routine', state: 'draft',
    scope: 'Add a sample point: a tee with a 1/2" branch and a sample valve, near the day tank. Overlaps the coupling repair; move it or fold it into that order.',
    window: { day: 2, hour: 10, hours: 8 }, forecast: { lowF: 68, highRh: 45 },
    joints: [{ fitting: 'tee', count: 1, reducingSize: '1/2' }, { fitting: 'cap', count: 1 }],
  },
  {
    line: '300-FW-001', kind: 'tie-in', priority: 'soon', state: 'planned', fitter: 'fitter2',
    scope: 'Tie in a 2" bypass around the filtered-water flow meter: a reducing tee and two couplings on the 3" line.',
    window: { day: 3, hour: 7, hours: 6 }, forecast: { lowF: 45, highRh: 70 },
    joints: [{ fitting: 'tee', count: 1, reducingSize: '2' }, { fitting: 'coupling', count: 2 }],
    lateReason: 'Operations can give the filtered-water line for a six-hour slot only this week. The section stays isolated after the slot under the supervisor\'s watch and is tested on the evening round.',
  },
  {
    line: '200-NA-001', kind: 'replacement', priority: 'soon', state: 'draft',
    scope: 'Replace the heat-traced caustic run between the day tank and the dosing skid: four elbows and two couplings. Trace and insulation off first.',
    window: { day: 5, hour: 6, hours: 24 }, forecast: { lowF: 60, highRh: 55 },
    joints: [{ fitting: 'elbow-90', count: 4 }, { fitting: 'coupling', count: 2 }],
  },
  {
    line: '400-UPW-001', kind: 'repair', priority: 'routine', state: 'draft',
    scope: 'Cracked socket flange at the polishing filter outlet. Clean build: bagged fittings, no pipe dope. Window to be booked with operations.',
    window: null, forecast: { lowF: 70, highRh: 40 },
    joints: [{ fitting: 'socket-flange', count: 1 }, { fitting: 'coupling', count: 1 }],
  },
  {
    line: '300-CW-001', kind: 'repair', priority: 'soon', state: 'planned', fitter: 'fitter2',
    scope: 'Replace the reducing bushing at the cooling-water strainer drain and the elbow after it.',
    window: { day: 4, hour: 6, hours: 16 }, forecast: { lowF: 72, highRh: 50 },
    joints: [{ fitting: 'reducing-bushing', count: 1, reducingSize: '2' }, { fitting: 'elbow-90', count: 1 }],
  },
  {
    // Under way when the plant is loaded: the fitter's locks on, zero energy verified by operations,
    // the first joint prepared and dry-fitted; the shift view and the lock board show it at once.
    line: '100-HY-002', kind: 'repair', priority: 'urgent', state: 'in-work', fitter: 'fitter',
    scope: 'Weeping elbow on the hypochlorite transfer line at the pipe-rack riser: cut out the elbow and the coupling above it, make two new joints.',
    window: { day: 0, hour: -2, hours: 40, fromLoad: true }, forecast: { lowF: 64, highRh: 55 },
    joints: [{ fitting: 'elbow-90', count: 1 }, { fitting: 'coupling', count: 1 }],
  },
  {
    // Curing: every joint made this morning, the cure holds counting down on the order and the shift view.
    line: '400-RO-001', kind: 'repair', priority: 'soon', state: 'curing', fitter: 'fitter',
    scope: 'Replace the cracked coupling and the elbow after it on the RO permeate header at the skid outlet.',
    window: { day: 0, hour: -4, hours: 30, fromLoad: true }, forecast: { lowF: 66, highRh: 50 },
    joints: [{ fitting: 'coupling', count: 1 }, { fitting: 'elbow-90', count: 1 }],
  },
  {
    // Ready: made the day before, cured, locks off, the test passed; operations may release it.
    line: '300-CW-001', kind: 'repair', priority: 'soon', state: 'ready', fitter: 'fitter',
    scope: 'Replace the weeping coupling on the cooling-water supply at the tower basin outlet.',
    window: { day: 0, hour: -26, hours: 40, fromLoad: true }, forecast: { lowF: 68, highRh: 50 },
    joints: [{ fitting: 'coupling', count: 2 }],
  },
  {
    // Isolated: the fitter's locks on and zero energy verified an hour ago; no joint started yet.
    line: '200-BR-001', kind: 'repair', priority: 'soon', state: 'isolated', fitter: 'fitter',
    scope: 'Cut out the brine line tee that weeps at the dissolver overflow and make it up with a new tee.',
    window: { day: 0, hour: -1, hours: 30, fromLoad: true }, forecast: { lowF: 62, highRh: 60 },
    joints: [{ fitting: 'tee', count: 1 }],
  },
  {
    // Testing: every cure hold ran out twenty minutes ago; the test waits on the fitter's locks coming off.
    line: '300-FW-002', kind: 'repair', priority: 'soon', state: 'testing', fitter: 'fitter',
    scope: 'Replace the cracked elbow on the filtered-water line under the filter gallery walkway.',
    window: { day: 0, hour: -20, hours: 36, fromLoad: true }, forecast: { lowF: 60, highRh: 55 },
    joints: [{ fitting: 'elbow-90', count: 2 }],
  },
  {
    // Released by operations as the plant was loaded: the line is back in service; the planner has yet to close it.
    line: '400-ROC-001', kind: 'repair', priority: 'soon', state: 'released', fitter: 'fitter',
    scope: 'Replace the RO concentrate coupling that was struck by a forklift at the skid edge.',
    window: { day: 0, hour: -30, hours: 32, fromLoad: true }, forecast: { lowF: 66, highRh: 50 },
    joints: [{ fitting: 'coupling', count: 2 }],
  },
  {
    // Closed: made two days ago, every step, photo and the test recorded; released and closed as the plant was
    // loaded, so its record prints as a PDF.
    line: '300-FC-001', kind: 'repair', priority: 'urgent', state: 'closed', fitter: 'fitter',
    scope: 'Replace the ferric chloride dosing elbow that wept at the injection quill.',
    window: { day: 0, hour: -54, hours: 30, fromLoad: true }, forecast: { lowF: 64, highRh: 55 },
    joints: [{ fitting: 'elbow-90', count: 1 }],
  },
  {
    line: '500-AD-001', kind: 'repair', priority: 'soon', state: 'cancelled',
    scope: 'Drip reported on the acid drain line at the pit wall: replace the coupling there.',
    window: { day: 1, hour: 6, hours: 12 }, forecast: { lowF: 66, highRh: 60 },
    joints: [{ fitting: 'coupling', count: 1 }],
    cancelReason: 'The leak was at a flange gasket, not a solvent-cemented joint; passed to the mechanical crew.',
  },
];

/** The demo lines the orders are on. */
export const DEMO_ORDER_LINES = [...new Set(DEMO_ORDERS.map((o) => o.line))];

/** A demo account as a person of the plant, as its first sign-in through the local provider would make it. */
async function demoPerson(username: string): Promise<Me> {
  const account = DEMO_ACCOUNTS.find((a) => a.username === username)!;
  const [p] = await Person.findOrCreate({
    where: { issuer: config.oidc.issuer, subject: username },
    defaults: { issuer: config.oidc.issuer, subject: username, name: account.name, email: account.email, rolesFromIdp: [account.role], lastSignInAt: null },
  });
  return { id: p.id, name: p.name, email: p.email, roles: effectiveRoles(p) };
}

/** `day` days after the day of `from` (UTC), at `hour`. */
const at = (from: Date, day: number, hour: number) => new Date(Date.UTC(from.getUTCFullYear(), from.getUTCMonth(), from.getUTCDate() + day, hour)).toISOString();

/** A window's start (plus `hours`): on its day at its hour, or with `fromLoad`, `hour` hours from the loading hour. */
function windowAt(from: Date, w: NonNullable<DemoOrder['window']>, hours: number): string {
  if (!w.fromLoad) return at(from, w.day, w.hour + hours);
  const hour = 3_600_000;
  return new Date(Math.floor(from.getTime() / hour) * hour + (w.hour + hours) * hour).toISOString();
}

async function makeOrder(spec: DemoOrder, line: Line, people: { planner: Me; requester: Me; fitters: Record<string, Me> }, from: Date): Promise<WorkOrder> {
  const { planner } = people;
  const order = await createOrder(planner, workOrderCreateSchema.parse({
    kind: spec.kind, priority: spec.priority, scope: spec.scope, requestedBy: people.requester.name, lineIds: [line.id],
    windowStart: spec.window ? windowAt(from, spec.window, 0) : null,
    windowEnd: spec.window ? windowAt(from, spec.window, spec.window.hours) : null,
    forecastLowF: spec.forecast.lowF, forecastHighRh: spec.forecast.highRh,
  }));
  for (const j of spec.joints) {
    const tasks = await addJointTasks(planner, order.id, jointTasksAddSchema.parse({ lineId: line.id, fittingKind: j.fitting, count: j.count, reducingSize: j.reducingSize }));
    const fitter = spec.fitter && people.fitters[spec.fitter];
    // A demo fitter whose role an administrator withdrew keeps no tasks: the order is still made.
    if (fitter?.roles.includes('fitter')) for (const t of tasks) await setFitter(planner, t.id, fitter.id);
  }
  const { suggested } = await getIsolationPlan(order.id);
  const code = line.lineNumber.replace(/-/g, '');
  await setIsolationPlan(planner, order.id, isolationPlanBodySchema.parse({
    entries: [
      ...suggested.map((p) => ({ isolationPointId: p.isolationPointId })),
      { lineId: line.id, tag: `DR-${code}-${order.number.slice(-4)}`, kind: 'drain' },
      { lineId: line.id, tag: `VT-${code}-${order.number.slice(-4)}`, kind: 'vent' },
    ],
  }));
  if (spec.state !== 'draft') await submitPlan(planner, order.id, spec.lateReason ? { lateReason: spec.lateReason } : {});
  if (spec.state === 'cancelled') await cancelOrder(planner, order.id, spec.cancelReason!);
  if (WORKED.includes(spec.state as Worked)) await workThrough(order.id, line, people, spec.state as Worked, from);
  return (await WorkOrder.findByPk(order.id))!;
}

const WORKED = ['isolated', 'in-work', 'curing', 'testing', 'ready', 'released', 'closed'] as const;
type Worked = (typeof WORKED)[number];
/** How long before loading the cure holds of an order left in this state ran out. */
const CURED_AGO_MIN: Partial<Record<Worked, number>> = { testing: 20, ready: 60, released: 150, closed: 48 * 60 };

/** A picture for a demo joint's photo: a pipe in its socket with the insertion and check marks drawn (no real photo). */
async function demoPhoto(label: string): Promise<Buffer> {
  const svg = `<svg xmlns="http://www.w3.org/2000/svg" width="640" height="480"><rect width="640" height="480" fill="#8b9aa6"/>` +
    `<rect x="40" y="190" width="380" height="100" fill="#d9dcd6"/><rect x="400" y="170" width="200" height="140" fill="#c6ccc3"/>` +
    `<rect x="300" y="186" width="6" height="108" fill="#22313f"/><rect x="350" y="186" width="6" height="108" fill="#22313f"/>` +
    `<text x="40" y="420" font-family="sans-serif" font-size="28" fill="#101820">${label}</text></svg>`;
  return sharp(Buffer.from(svg)).jpeg({ quality: 80 }).toBuffer();
}

/**
 * The fitter locks every point and operations verifies zero energy; an order left isolated stops
 * there. For an order in work, the first joint is prepared and dry-fitted; for one curing, every
 * joint is made (its holds running). Further on, the joints were made before loading: their holds
 * are moved back to have run out (CURED_AGO_MIN) and lifted as the sweep would — an order left
 * testing keeps its locks on. For ready and beyond the fitter takes the locks off and operations
 * records a passed test; a released order was signed back to service by operations; a closed one
 * also has its photos and was closed by the planner.
 */
async function workThrough(orderId: string, line: Line, people: { planner: Me; requester: Me; fitters: Record<string, Me> }, until: Worked, from: Date) {
  const fitter = people.fitters.fitter!;
  const { entries } = await getIsolationPlan(orderId);
  const prefix = line.lineNumber.replace(/\D/g, '').slice(0, 3);
  await sequelize.transaction((t) => applyLocks(fitter, orderId, { locks: entries.map((e, i) => ({ entryId: e.id, lockNumber: `TL-${prefix}-${String(i + 1).padStart(2, '0')}` })) }, t));
  await sequelize.transaction((t) => verifyIsolation(people.requester, orderId, {
    points: entries.map((e) => ({ entryId: e.id, positionFound: e.requiredPosition })),
    method: 'Closed and locked the valves, opened the drain and the vent, watched the gauge five minutes.',
    reading: '0 psi on the gauge; drain dry after the first litre.',
  }, t));
  const joints = await JointTask.findAll({ where: { workOrderId: orderId }, order: [['number', 'ASC']] });
  if (until === 'isolated' || !joints.length || !fitter.roles.includes('fitter')) return;
  const depth = socketMarks({ nominalSize: line.nominalSize, schedule: Number(line.schedule) === 80 ? 80 : 40 });
  const material = line.material as keyof typeof CEMENT_FOR_MATERIAL;
  const steps: StepRecord[] = [
    { step: 'prep', values: { squareCut: true, deburred: true, chamfered: true, cleanDry: true } },
    { step: 'dry-fit', values: { insertion: depth.ok ? Math.round(depth.socketDepthIn * 0.5 * 100) / 100 : 0.5, unit: 'in' } },
    { step: 'depth-marks', values: { insertionMark: true, checkMark: true } },
    { step: 'primer', values: { standard: material === 'ABS' ? 'none' : 'ASTM F656', lot: 'P-26-0412', softeningChecked: true } },
    { step: 'cement', values: { standard: `ASTM ${CEMENT_FOR_MATERIAL[material]}`, lot: 'C-26-0388', manufacturedOn: new Date(from.getTime() - 120 * 86_400_000).toISOString().slice(0, 10), ambientTemperature: 68, temperatureUnit: 'F', relativeHumidity: 50 } },
    { step: 'assembly', values: { assembledWet: true, joiningDeviceUsed: crewAndTools(line.nominalSize).ok && (crewAndTools(line.nominalSize) as { mechanicalJoiningDevice: boolean }).mechanicalJoiningDevice, heldSeconds: 120 } },
    { step: 'wipe', values: { beadWiped: true } },
  ];
  const record = (jointId: string, step: StepRecord) => sequelize.transaction((t) => recordStep(fitter, jointId, step, t));
  if (until === 'in-work') {
    for (const step of steps.slice(0, 2)) await record(joints[0]!.id, step);
    return;
  }
  for (const j of joints) for (const step of steps) await record(j.id, step);
  if (until === 'curing') return;
  const order = (await WorkOrder.findByPk(orderId))!;
  if (until === 'closed') {
    for (const j of joints) for (const step of ['depth-marks', 'wipe'] as const) {
      const picture = await demoPhoto(`${order.number} J${j.number} ${step === 'wipe' ? 'finished joint' : 'depth marks'} (demo picture)`);
      await sequelize.transaction((t) => storePhoto(fitter, j.id, step, picture, t));
    }
  }
  // Made before loading: every hold moved back so the last ran out CURED_AGO_MIN ago, then lifted as the sweep would.
  const curedAt = from.getTime() - CURED_AGO_MIN[until]! * 60_000;
  const running = await Hold.findAll({ where: { workOrderId: orderId, status: 'running' } });
  const back = Math.max(...running.map((h) => h.endsAt!.getTime())) - curedAt;
  for (const h of running) await h.update({ startsAt: new Date(h.startsAt.getTime() - back), endsAt: new Date(h.endsAt!.getTime() - back) });
  await liftDueHolds();
  const locksOffAt = now();
  if (until !== 'testing') {
    const board = await lockoutBoard(orderId, fitter.id);
    for (const l of board.myLocks) await sequelize.transaction((t) => removeLock(fitter, l.id, {}, t));
  }
  const testAt = now();
  if (until !== 'testing') {
    const testPsi = compute(await loadFacts(orderId)).testPressure.testPsi ?? 0;
    await sequelize.transaction((t) => recordPressureTest(people.requester, orderId, {
      toolsClear: true, peopleClear: true, medium: 'water', testPressurePsi: testPsi, gauge: 'PI-T2, 0–400 psi, calibrated 2026-10',
      startedAt: new Date(curedAt + 20 * 60_000).toISOString(), startReadingPsi: testPsi, endedAt: new Date(curedAt + 40 * 60_000).toISOString(), endReadingPsi: testPsi,
      result: 'passed', leakingJointIds: [], pipingIdentified: `${line.lineNumber}, the repaired run between its isolation points (${order.number})`, examiner: 'Rafe Adeyemi, plant inspector',
    }, t));
  }
  if (until === 'released' || until === 'closed') {
    await releaseOrder(people.requester, orderId, {
      areaInspected: true, peopleClear: true, affectedTold: true, ventsDrainsSet: true, slowRefill: true,
      notes: 'Refilled over twenty minutes from the header drain valve, vented at the high point; no weep at the new joints after an hour at pressure.',
    });
  }
  if (until === 'closed') await closeOrder(people.planner, orderId);
  // The record reads in the order it happened: the work before the cure, the locks off ten minutes after it, the test and release after that.
  await backdate(orderId, [
    { until: locksOffAt, by: back },
    { until: testAt, by: locksOffAt.getTime() - (curedAt + 10 * 60_000) },
    { until: null, by: testAt.getTime() - (curedAt + 45 * 60_000) },
  ]);
}

/**
 * Moves every moment the services wrote for a demo order made "before loading" back in time:
 * a moment before `until` of the first phase by its `by` milliseconds, and so on (the last phase's
 * `until` is null). The holds keep the ends already given them; the sweep ended them at those ends.
 * The audit log is append-only and keeps the moments the loader wrote each entry.
 */
async function backdate(orderId: string, phases: { until: Date | null; by: number }[]): Promise<void> {
  const shift = (col: string) => `${col} - (case ${phases.map((p, i) => (p.until ? `when ${col} < :until${i} then interval '1 millisecond' * :by${i}` : `else interval '1 millisecond' * :by${i}`)).join(' ')} end)`;
  const set = (cols: string[]) => cols.map((c) => `${c} = ${shift(c)}`).join(', ');
  const tasks = 'select id from joint_tasks where work_order_id = :orderId';
  const statements = [
    `update work_orders set ${set(['created_at', 'planned_at', 'updated_at'])}, released_at = ${shift('released_at')} where id = :orderId`,
    `update joint_tasks set ${set(['created_at', 'updated_at'])} where work_order_id = :orderId`,
    `update isolation_plan_entries set ${set(['created_at'])} where work_order_id = :orderId`,
    `update locks set ${set(['applied_at'])}, removed_at = ${shift('removed_at')} where work_order_id = :orderId`,
    `update isolation_verifications set ${set(['verified_at'])}, superseded_at = ${shift('superseded_at')} where work_order_id = :orderId`,
    `update joint_steps set ${set(['recorded_at'])} where joint_task_id in (${tasks})`,
    `update photos set ${set(['created_at'])} where joint_task_id in (${tasks})`,
    `update holds set ${set(['created_at'])}, ended_at = ends_at where work_order_id = :orderId and status = 'ended'`,
    `update pressure_tests set ${set(['recorded_at'])} where work_order_id = :orderId`,
    `update releases set ${set(['released_at'])} where work_order_id = :orderId`,
  ];
  const replacements = Object.fromEntries([['orderId', orderId], ...phases.flatMap((p, i) => [[`until${i}`, p.until], [`by${i}`, p.by]])]);
  await sequelize.transaction(async (transaction) => {
    for (const sql of statements) await sequelize.query(sql, { replacements, transaction });
  });
}

export interface DemoOrdersResult {
  loaded: boolean;
  message: string;
  orders: { id: string; number: string; state: WorkOrderState; scope: string }[];
}

/**
 * Makes the demo orders unless they were made before. Refuses nothing the plant has: when a demo
 * line is gone from the register (a plant that replaced it with its own), it says so and makes none.
 */
export async function loadDemoOrders(opts: { from?: Date } = {}): Promise<DemoOrdersResult> {
  const existing = () => WorkOrder.findAll({ where: { scope: { [Op.in]: DEMO_ORDERS.map((o) => o.scope) } }, order: [['number', 'ASC']] });
  const summary = (orders: WorkOrder[]) => orders.map((o) => ({ id: o.id, number: o.number, state: o.state, scope: o.scope }));
  if (await AuditEntry.findOne({ where: { action: 'demo-orders-loaded' } })) {
    return { loaded: false, message: 'the demo work orders were loaded before; they are left as they are.', orders: summary(await existing()) };
  }
  const lines = await Line.findAll({ where: { lineNumber: { [Op.in]: DEMO_ORDER_LINES } } });
  const missing = DEMO_ORDER_LINES.filter((n) => !lines.some((l) => l.lineNumber === n));
  if (missing.length) return { loaded: false, message: `no demo work orders: the register lacks the demo lines ${missing.join(', ')}.`, orders: [] };

  const people = {
    planner: await demoPerson('planner'),
    requester: await demoPerson('operations'),
    fitters: { fitter: await demoPerson('fitter'), fitter2: await demoPerson('fitter2') },
  };
  const made = new Set((await existing()).map((o) => o.scope));
  const from = opts.from ?? now();
  for (const spec of DEMO_ORDERS) {
    if (made.has(spec.scope)) continue;
    await makeOrder(spec, lines.find((l) => l.lineNumber === spec.line)!, people, from);
  }
  const orders = summary(await existing());
  await recordAudit({ actorId: people.planner.id, action: 'demo-orders-loaded', entity: 'demo-plant', entityId: 'work-orders', after: { orders: orders.map((o) => o.number) } });
  return { loaded: true, message: `${orders.length} demo work orders: ${orders.map((o) => `${o.number} ${o.state}`).join(', ')}.`, orders };
}
