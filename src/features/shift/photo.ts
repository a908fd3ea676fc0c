// A joint photo is made upright and at most 2048 px on its long side in the browser, as JPEG, before
// it is queued: a phone's HEIC or a 12-megapixel JPEG never travels, and the server re-encodes anyway.

export const PHOTO_MAX_EDGE = 2048;

/** The size that fits within `max` on the long side, keeping the aspect; never enlarged. */
export function fitWithin(width: number, height: number, max = PHOTO_MAX_EDGE): { width: number; height: number } {
  const scale = Math.min(1, max / Math.max(width, height));
  return { width: Math.max(1, Math.round(width * scale)), height: Math.max(1, Math.round(height * scale)) };
}

function draw(ctx: OffscreenCanvasRenderingContext2D | CanvasRenderingContext2D, bitmap: ImageBitmap, width: number, height: number) {
  ctx.fillStyle = '#ffffff'; // a transparent PNG becomes white, not black, as JPEG
  ctx.fillRect(0, 0, width, height);
  ctx.drawImage(bitmap, 0, 0, width, height);
}

/** The camera's file, upright (its EXIF orientation applied), scaled down, as a JPEG Blob. */
export async function prepareJointPhoto(file: Blob): Promise<Blob> {
  const bitmap = await createImageBitmap(file, { imageOrientation: 'from-image' });
  try {
    const { width, height } = fitWithin(bitmap.width, bitmap.height);
    if (typeof OffscreenCanvas !== 'undefined') {
      const canvas = new OffscreenCanvas(width, height);
      draw(canvas.getContext('2d')!, bitmap, width, height);
      return await canvas.convertToBlob({ type: 'image/jpeg', quality: 0.85 });
    }
    const canvas = document.createElement('canvas');
    canvas.width = width;
    canvas.height = height;
    draw(canvas.getContext('2d')!, bitmap, width, height);
    return await new Promise<Blob>((resolve, reject) =>
      canvas.toBlob((b) => (b ? resolve(b) : reject(new Error('The photo could not be converted.'))), 'image/jpeg', 0.85),
    );
  } finally {
    bitmap.close();
  }
}
