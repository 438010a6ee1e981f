/**
 * Shrinks a photo in the browser before upload: a 12-megapixel phone photo of several megabytes
 * becomes a JPEG of a few hundred kilobytes, which matters on a slow mobile uplink. Drawing it
 * anew also leaves its EXIF (including the GPS position) behind on the phone.
 */
import { PHOTO_LONG_EDGE_PX } from '~/lib/shared/photo-schemas';
import { fitLongEdge } from './fit-long-edge';

/** JPEG quality for the shrunk copy: visually clean for wall photos (common practice, no source). */
const JPEG_QUALITY = 0.85;

/** The shrunk JPEG, or null when this browser cannot decode the file (the caller decides what next). */
export async function shrinkPhoto(file: Blob): Promise<Blob | null> {
  let bitmap: ImageBitmap;
  try {
    // 'from-image' applies the EXIF orientation, so the copy is upright without its EXIF.
    bitmap = await createImageBitmap(file, { imageOrientation: 'from-image' });
  } catch {
    return null;
  }
  try {
    const { width, height } = fitLongEdge(bitmap.width, bitmap.height, PHOTO_LONG_EDGE_PX);
    if (typeof OffscreenCanvas !== 'undefined') {
      const canvas = new OffscreenCanvas(width, height);
      const context = canvas.getContext('2d');
      if (!context) return null;
      draw(context, bitmap, width, height);
      return await canvas.convertToBlob({ type: 'image/jpeg', quality: JPEG_QUALITY });
    }
    const canvas = document.createElement('canvas');
    canvas.width = width;
    canvas.height = height;
    const context = canvas.getContext('2d');
    if (!context) return null;
    draw(context, bitmap, width, height);
    return await new Promise<Blob | null>((resolve) => canvas.toBlob(resolve, 'image/jpeg', JPEG_QUALITY));
  } catch {
    return null;
  } finally {
    bitmap.close();
  }
}

function draw(context: OffscreenCanvasRenderingContext2D | CanvasRenderingContext2D, bitmap: ImageBitmap, width: number, height: number) {
  // JPEG has no transparency; white reads better than black behind a transparent PNG.
  context.fillStyle = '#ffffff';
  context.fillRect(0, 0, width, height);
  context.imageSmoothingQuality = 'high';
  context.drawImage(bitmap, 0, 0, width, height);
}
