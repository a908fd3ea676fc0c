// The set and cure holds that assembly creates (DESIGN.md section 9): computed on the server by the
// trade engine at the lower of the recorded and the forecast temperature, the higher humidity, and
// the order's test pressure. A refusal from the engine leaves both holds awaiting a supervisor's
// engineering cure time, with the engine's reason written on them.

import type { Transaction } from 'sequelize';
import { Hold } from '@server/db/models/joint-record';
import type { JointTask } from '@server/db/models/joint-task';
import type { Line } from '@server/db/models/line';
import type { WorkOrder } from '@server/db/models/work-order';
import { scheduleLifts } from '@server/services/holds/lift';
import { compute, loadFacts } from '@server/services/work-orders/order-facts';
import { cureSchedule } from '@shared/trade';

const MINUTE = 60_000;

export interface CureConditions {
  temperatureF: number;
  relativeHumidity: number;
  pressurePsi: number | null;
  /** Why there is no pressure to count the cure against, when there is none. */
  pressureProblem: string | null;
}

/** The conditions the cure is counted at: the colder and the more humid of recorded and forecast, against the test pressure. */
export async function cureConditions(order: WorkOrder, recorded: { temperatureF: number; relativeHumidity: number }, t: Transaction): Promise<CureConditions> {
  const facts = await loadFacts(order.id, t);
  const { testPressure } = compute(facts);
  const temperatureF = Math.min(recorded.temperatureF, order.forecastLowF ?? recorded.temperatureF);
  const relativeHumidity = Math.max(recorded.relativeHumidity, order.forecastHighRh ?? recorded.relativeHumidity);
  if (!testPressure.required) return { temperatureF, relativeHumidity, pressurePsi: testPressure.highestDesign?.psi ?? 0, pressureProblem: null };
  if (testPressure.testPsi === null) return { temperatureF, relativeHumidity, pressurePsi: null, pressureProblem: `the order's test pressure cannot be worked out (${testPressure.problems.join(' ')})` };
  return { temperatureF, relativeHumidity, pressurePsi: testPressure.testPsi, pressureProblem: null };
}

export async function createJointHolds(
  input: { order: WorkOrder; task: JointTask; line: Line; jointSize: string; at: Date; conditions: CureConditions; cureScheduleId: string },
  t: Transaction,
): Promise<Hold[]> {
  const { order, task, line, at, conditions: c } = input;
  const result = c.pressurePsi === null
    ? null
    : cureSchedule({ material: line.material, nominalSize: input.jointSize, temperatureF: c.temperatureF, relativeHumidity: c.relativeHumidity, pressurePsi: c.pressurePsi, schedule: input.cureScheduleId });
  const common = { workOrderId: order.id, jointTaskId: task.id, startsAt: at, temperatureF: c.temperatureF, relativeHumidity: c.relativeHumidity, pressurePsi: c.pressurePsi ?? 0 };
  if (!result || !result.ok) {
    const reason = result && !result.ok ? result.reason : `No cure time: ${c.pressureProblem}.`;
    return Hold.bulkCreate(
      (['set', 'cure'] as const).map((kind) => ({ ...common, kind, status: 'awaiting-engineering' as const, endsAt: null, schedule: input.cureScheduleId, basis: reason, source: null })),
      { transaction: t },
    );
  }
  const basis = `${result.temperatureBand} · ${result.sizeBand} · ${result.pressureBand}${result.humidityAdjusted ? ' · +50% for humidity above 60%' : ''}`;
  const hold = (kind: 'set' | 'cure', minutes: number) => ({
    ...common, kind, status: 'running' as const, endsAt: new Date(at.getTime() + minutes * MINUTE), schedule: result.schedule, basis, source: result.source,
  });
  const made = await Hold.bulkCreate([hold('set', result.setMinutes), hold('cure', result.cureMinutes)], { transaction: t });
  scheduleLifts(made, t);
  return made;
}
