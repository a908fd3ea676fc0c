import type { Transaction } from 'sequelize';
import { Op } from 'sequelize';
import { JointTask } from '@server/db/models/joint-task';
import { PressureTest } from '@server/db/models/release';
import { namesOf } from '@server/services/lockout/board';
import { jointLabel } from '@server/services/work-orders/order-facts';
import type { PressureTestDto } from '@shared/schemas/release';

async function toDtos(tests: PressureTest[], t?: Transaction): Promise<PressureTestDto[]> {
  const names = await namesOf(tests.map((x) => x.witnessId), t);
  const jointIds = [...new Set(tests.flatMap((x) => x.leakingJointIds))];
  const joints = new Map((await JointTask.findAll({ where: { id: { [Op.in]: jointIds } }, attributes: ['id', 'number'], transaction: t })).map((j) => [j.id, jointLabel(j.number)]));
  return tests.map((x) => ({
    id: x.id, workOrderId: x.workOrderId, result: x.result, medium: x.medium, testPressurePsi: x.testPressurePsi, gauge: x.gauge,
    startedAt: x.startedAt.toISOString(), startReadingPsi: x.startReadingPsi, endedAt: x.endedAt.toISOString(), endReadingPsi: x.endReadingPsi,
    holdMinutes: Math.floor((x.endedAt.getTime() - x.startedAt.getTime()) / 60_000),
    leakingJoints: x.leakingJointIds.map((id) => ({ id, label: joints.get(id) ?? '?' })),
    pipingIdentified: x.pipingIdentified, examiner: x.examiner, notes: x.notes, witness: { id: x.witnessId, name: names.get(x.witnessId) ?? '' }, recordedAt: x.recordedAt.toISOString(),
  }));
}

export async function pressureTestDto(id: string, t?: Transaction): Promise<PressureTestDto> {
  const [dto] = await toDtos([(await PressureTest.findByPk(id, { transaction: t }))!], t);
  return dto!;
}

export async function listPressureTests(orderId: string): Promise<PressureTestDto[]> {
  return toDtos(await PressureTest.findAll({ where: { workOrderId: orderId }, order: [['recordedAt', 'ASC']] }));
}
