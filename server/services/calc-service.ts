import { AppError } from '@server/errors';
import { currentPlantSettings } from '@server/services/plant-settings-service';
import { jointPicture, type JointPicture, type JointSpec } from '@shared/trade';

/**
 * The whole picture of one joint, from the same jointPicture() the client previews with.
 * The plant's settings decide the cure schedule and the test cap (its cement maker's table, its
 * procedure), so a caller cannot pick another; the answer's `spec` shows what was used.
 * Refusals from the tables are part of the answer (`ok: false`), not errors.
 */
export async function jointForPlant(spec: JointSpec): Promise<JointPicture> {
  const plant = await currentPlantSettings();
  const picture = jointPicture({ ...spec, cureScheduleId: plant.cureScheduleId, testCap: plant.testCap });
  // the route validated the body with the same schema, so this only guards against drift
  if (!('spec' in picture)) throw AppError.badRequest(picture.reason, { spec: picture.issues });
  return picture;
}
