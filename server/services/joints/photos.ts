// Joint photos: checked by content (file-type), never by the name or the type the browser claims;
// turned upright and re-encoded as JPEG by sharp, which keeps no metadata (no location, no camera);
// stored in PostgreSQL and served by id only.

import type { Transaction } from 'sequelize';
import { fileTypeFromBuffer } from 'file-type';
import sharp from 'sharp';
import { Photo } from '@server/db/models/joint-record';
import { AppError } from '@server/errors';
import { findOrder } from '@server/services/work-orders/order-facts';
import { stateWords } from '@server/services/work-orders/states';
import type { PhotoDto, PhotoStep } from '@shared/schemas/joint-steps';
import type { Me } from '@shared/schemas/roles';
import { findTask, photoDto } from './joint-view';

export const PHOTO_TYPES = ['image/jpeg', 'image/png', 'image/webp'] as const;
/** The longest side a stored photo keeps; the tablet already resizes to this. */
const MAX_SIDE = 2048;

/** The upload's real type by its bytes, or a 415 naming what it is. */
async function imageOrRefuse(buffer: Buffer): Promise<void> {
  const type = await fileTypeFromBuffer(buffer);
  if (!type || !(PHOTO_TYPES as readonly string[]).includes(type.mime)) {
    const what = type ? `a ${type.ext.toUpperCase()} file` : 'not an image';
    throw new AppError(415, 'not_an_image', `That file is ${what} by its content; a joint photo must be a JPEG, PNG or WebP picture.`);
  }
}

export async function reencode(buffer: Buffer): Promise<{ data: Buffer; width: number; height: number }> {
  try {
    const { data, info } = await sharp(buffer, { failOn: 'error' })
      .rotate() // upright by the camera's orientation tag, before the tag is dropped
      .resize({ width: MAX_SIDE, height: MAX_SIDE, fit: 'inside', withoutEnlargement: true })
      .jpeg({ quality: 85, mozjpeg: true })
      .toBuffer({ resolveWithObject: true });
    return { data, width: info.width, height: info.height };
  } catch {
    throw AppError.badRequest('The picture could not be read; it may be cut short. Take it again.');
  }
}

export async function storePhoto(me: Me, taskId: string, step: PhotoStep, buffer: Buffer, t: Transaction): Promise<PhotoDto> {
  const task = await findTask(taskId, t);
  const order = await findOrder(task.workOrderId, t);
  if (['draft', 'planned', 'closed', 'cancelled'].includes(order.state)) {
    throw AppError.conflict(`${order.number} is ${stateWords(order.state)}; joint photos are taken while its joints are made.`);
  }
  await imageOrRefuse(buffer);
  const { data, width, height } = await reencode(buffer);
  const photo = await Photo.create({ jointTaskId: task.id, step, content: data, mediaType: 'image/jpeg', width, height, bytes: data.length, takenById: me.id }, { transaction: t });
  return photoDto(photo, new Map([[me.id, me.name]]));
}

export async function readPhoto(id: string): Promise<Photo> {
  const photo = await Photo.findByPk(id);
  if (!photo) throw AppError.notFound('There is no such photo.');
  return photo;
}
