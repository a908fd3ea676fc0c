// Fills the speed bench's database THROUGH THE SERVICES: the demo plant (150 lines, 362 isolation
// points), `count` orders taken to `isolated` (locks on, zero energy verified: in the release queue,
// their lines locked out), and a register grown by plant-like lines in steps (the line import,
// preview then confirm, in-process). The demo orders (scripts/demo-orders.ts) are not used: that
// loader changes as the demo plant grows, and the bench must fill the same way before and after.
// Import only after the environment is set: server modules read it when loaded.

import { config } from '../server/config';
import { Line } from '../server/db/models/line';
import { Person } from '../server/db/models/person';
import { sequelize } from '../server/db/sequelize';
import { confirmImport, uploadImport } from '../server/services/line-imports/import-service';
import { applyLocks } from '../server/services/lockout/locks';
import { verifyIsolation } from '../server/services/lockout/verification';
import { effectiveRoles } from '../server/services/people-service';
import { getIsolationPlan, setIsolationPlan } from '../server/services/work-orders/isolation-plan';
import { addJointTasks, setFitter } from '../server/services/work-orders/joint-tasks';
import { createOrder } from '../server/services/work-orders/order-service';
import { submitPlan } from '../server/services/work-orders/plan-service';
import { isolationPlanBodySchema } from '../shared/schemas/isolation-plans';
import { jointTasksAddSchema } from '../shared/schemas/joint-tasks';
import { LINE_CSV_COLUMNS } from '../shared/schemas/register-columns';
import type { Me } from '../shared/schemas/roles';
import { workOrderCreateSchema } from '../shared/schemas/work-orders';
import { demoPlant, toCsv } from '../scripts/demo-plant';
import { prng } from '../scripts/lib/prng';

/** A person of the plant as a first sign-in would make it, with one role from the provider. */
export async function demoPerson(username: string, role: Me['roles'][number]): Promise<Me> {
  const [p] = await Person.findOrCreate({
    where: { issuer: config.oidc.issuer, subject: username },
    defaults: { issuer: config.oidc.issuer, subject: username, name: `Bench ${username}`, email: null, rolesFromIdp: [role], lastSignInAt: null },
  });
  return { id: p.id, name: p.name, email: p.email, roles: effectiveRoles(p) };
}

export async function importCsv(me: Me, filename: string, csv: string): Promise<void> {
  const preview = await uploadImport(me, { filename, buffer: Buffer.from(csv) }, { inline: true });
  if (preview.counts.rejected) throw new Error(`${filename}: ${preview.counts.rejected} rows rejected`);
  await confirmImport(me, preview.id, { inline: true });
}

/** The demo plant's lines and isolation points, through the line import. */
export async function loadPlant(me: Me): Promise<string> {
  const { lines, points } = demoPlant();
  await importCsv(me, 'demo-lines.csv', toCsv(lines));
  await importCsv(me, 'demo-points.csv', toCsv(points));
  return `${lines.length} lines, ${points.length} isolation points`;
}

// Plant-like services: line numbers "<area>-<code>-<5 digits>" (the demo's have 3), so a search
// for "HY" (hypochlorite) finds about one line in eight, as in the demo plant.
const SERVICES = [
  [100, '100 Acid dosing', 'SA', 'Sulphuric acid 93%', 'CPVC'], [100, '100 Acid dosing', 'HCL', 'Hydrochloric acid 33%', 'PVC'],
  [100, '100 Acid dosing', 'HY', 'Sodium hypochlorite 12.5%', 'PVC'], [200, '200 Caustic & brine', 'NA', 'Sodium hydroxide 50%', 'CPVC'],
  [200, '200 Caustic & brine', 'BR', 'Brine', 'PVC'], [200, '200 Caustic & brine', 'HY', 'Sodium hypochlorite 12.5%', 'CPVC'],
  [300, '300 Water treatment', 'RW', 'Raw water', 'PVC'], [300, '300 Water treatment', 'FW', 'Filtered water', 'PVC'],
  [300, '300 Water treatment', 'FC', 'Ferric chloride 40%', 'CPVC'], [300, '300 Water treatment', 'CW', 'Cooling water', 'ABS'],
  [400, '400 Ultrapure water', 'RO', 'RO permeate', 'PVC'], [400, '400 Ultrapure water', 'UPW', 'Ultrapure water supply', 'CPVC'],
  [400, '400 Ultrapure water', 'HUPW', 'Hot ultrapure water', 'CPVC'], [500, '500 Effluent', 'EF', 'Neutralised effluent', 'PVC'],
  [500, '500 Effluent', 'AD', 'Acid drain', 'CPVC'], [500, '500 Effluent', 'EV', 'Effluent tank vent', 'ABS'],
] as const;
const MAX_F = { PVC: 100, CPVC: 160, ABS: 140 } as const;

/** Register rows `from` … `from + count - 1` of the bench plant: the same rows on every run. */
export function plantLinesCsv(from: number, count: number): string {
  const rnd = prng(20261211 + from);
  const pick = <T>(xs: readonly T[]) => xs[Math.floor(rnd() * xs.length)]!;
  const out = [LINE_CSV_COLUMNS.join(',')];
  for (let i = from; i < from + count; i++) {
    const [no, area, code, service, material] = SERVICES[i % SERVICES.length]!;
    const n = String(Math.floor(i / SERVICES.length)).padStart(5, '0');
    const temp = Math.round(40 + rnd() * (MAX_F[material] - 40));
    out.push([`${no}-${code}-${n}`, area, service, material, pick(['40', '80'] as const), pick(['1/2', '1', '1-1/2', '2', '3', '4', '6', '8']),
      Math.round(50 + rnd() * 250), temp, `MRW-P&ID-${no + 1 + (i % 9)}-0${i % 7}`, i % 10 === 0 ? 'bench row' : ''].join(','));
  }
  return out.join('\n') + '\n';
}

/** Orders planned, locked and verified (state `isolated`) on the demo plant's lines, one each, spread over the areas. */
export async function isolatedOrders(count: number, people: { planner: Me; operations: Me; fitter: Me }): Promise<number> {
  const demo = (await Line.findAll({ order: [['lineNumber', 'ASC']] })).filter((l) => /^\d{3}-[A-Z]+-\d{3}$/.test(l.lineNumber));
  const step = Math.max(1, Math.floor(demo.length / count));
  const lines = [...demo.filter((_, i) => i % step === 0), ...demo.filter((_, i) => i % step !== 0)];
  const { planner, operations, fitter } = people;
  const hour = 3_600_000;
  const start = Math.floor(Date.now() / hour) * hour - 2 * hour;
  let made = 0;
  for (const line of lines) {
    if (made === count) break;
    const order = await createOrder(planner, workOrderCreateSchema.parse({
      kind: 'repair', priority: 'soon', scope: `Bench: replace two couplings on ${line.lineNumber}.`, requestedBy: operations.name, lineIds: [line.id],
      windowStart: new Date(start).toISOString(), windowEnd: new Date(start + 36 * hour).toISOString(), forecastLowF: 66, forecastHighRh: 50,
    }));
    const tasks = await addJointTasks(planner, order.id, jointTasksAddSchema.parse({ lineId: line.id, fittingKind: 'coupling', count: 2 }));
    for (const t of tasks) await setFitter(planner, t.id, fitter.id);
    const { suggested } = await getIsolationPlan(order.id);
    const code = line.lineNumber.replace(/-/g, '');
    await setIsolationPlan(planner, order.id, isolationPlanBodySchema.parse({
      entries: [...suggested.map((p) => ({ isolationPointId: p.isolationPointId })), { lineId: line.id, tag: `DR-${code}-B`, kind: 'drain' }, { lineId: line.id, tag: `VT-${code}-B`, kind: 'vent' }],
    }));
    // A line whose test pressure the trade rules refuse cannot be planned: its order stays a draft, the next line is taken.
    if (!(await submitPlan(planner, order.id, {}).then(() => true, () => false))) continue;
    const { entries } = await getIsolationPlan(order.id);
    await sequelize.transaction((t) => applyLocks(fitter, order.id, { locks: entries.map((e, i) => ({ entryId: e.id, lockNumber: `BL-${code}-${i + 1}` })) }, t));
    await sequelize.transaction((t) => verifyIsolation(operations, order.id, {
      points: entries.map((e) => ({ entryId: e.id, positionFound: e.requiredPosition })),
      method: 'Closed and locked the valves, opened the drain and the vent, watched the gauge five minutes.', reading: '0 psi on the gauge.',
    }, t));
    made++;
  }
  return made;
}
