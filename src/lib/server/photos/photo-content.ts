/**
 * What we do to the bytes of an uploaded photo: tell its type by content, decode it under a pixel
 * cap, turn it upright, shrink it, and re-encode it as a fresh JPEG with no metadata at all.
 * Re-encoding is the point: nothing the homeowner's file carried (GPS position, camera serial,
 * hidden payloads after the image data) survives into what staff see.
 */
import sharp from 'sharp';
import { fileTypeFromBuffer } from 'file-type';
import { ACCEPTED_PHOTO_TYPES, PHOTO_LONG_EDGE_PX, PHOTO_MESSAGES } from '~/lib/shared/photo-schemas';

/**
 * Largest decoded image we accept. A small, highly compressible file can decode to gigabytes of
 * pixels; sharp's own default cap is 268 MP. 40 MP is above any phone camera in common use
 * (common practice, no source; docs/sources.md §14).
 */
export const MAX_INPUT_PIXELS = 40_000_000;

/** Long edge of the thumbnail staff and the homeowner see in lists. */
export const THUMBNAIL_LONG_EDGE_PX = 400;

export type PhotoType = (typeof ACCEPTED_PHOTO_TYPES)[number];

export type CleanPhoto = { image: Buffer; thumbnail: Buffer; width: number; height: number };

/** A photo we will not keep; `message` is written for the homeowner. */
export class PhotoRefused extends Error {}

export const REFUSALS = {
  notAPhoto: PHOTO_MESSAGES.notAPhoto,
  tooBig: PHOTO_MESSAGES.tooBig,
  tooManyPixels: 'This photo has more pixels than we can handle (over 40 megapixels). Please send a smaller copy.',
  damaged: "This photo looks damaged and can't be opened. Please try another one.",
  empty: 'This file is empty.',
} as const;

/**
 * The file's type as its first bytes say, or null when it is not one of the accepted formats.
 * The name and the declared Content-Type are never consulted.
 */
export async function sniffPhotoType(bytes: Uint8Array): Promise<PhotoType | null> {
  const found = await fileTypeFromBuffer(bytes);
  const mime = found?.mime;
  return (ACCEPTED_PHOTO_TYPES as readonly string[]).includes(mime ?? '') ? (mime as PhotoType) : null;
}

/** Checks and rewrites a photo. Throws PhotoRefused with a plain message for anything unusable. */
export async function cleanPhoto(bytes: Buffer): Promise<CleanPhoto> {
  if (bytes.length === 0) throw new PhotoRefused(REFUSALS.empty);
  const type = await sniffPhotoType(bytes);
  if (!type) throw new PhotoRefused(REFUSALS.notAPhoto);

  // failOn 'error' refuses corrupt and truncated data but tolerates the harmless warnings
  // some phone encoders produce. limitInputPixels is a second guard behind the explicit check.
  const decode = () => sharp(bytes, { failOn: 'error', limitInputPixels: MAX_INPUT_PIXELS });

  let header: sharp.Metadata;
  try {
    header = await decode().metadata();
  } catch (error) {
    throw refusalFor(error);
  }
  // sharp decodes by content as well; a file that sniffs as one format and decodes as another is refused.
  if (`image/${header.format}` !== type) throw new PhotoRefused(REFUSALS.notAPhoto);
  if (!header.width || !header.height) throw new PhotoRefused(REFUSALS.damaged);
  if (header.width * header.height > MAX_INPUT_PIXELS) throw new PhotoRefused(REFUSALS.tooManyPixels);

  try {
    const { data: image, info } = await decode()
      .rotate() // upright by the EXIF orientation; the tag itself goes with the rest of the metadata
      .resize({ width: PHOTO_LONG_EDGE_PX, height: PHOTO_LONG_EDGE_PX, fit: 'inside', withoutEnlargement: true })
      .flatten({ background: '#ffffff' }) // transparent PNG/WebP areas become white, not black
      .jpeg({ quality: 82 })
      // No withMetadata()/keepExif(): sharp writes no EXIF, XMP, IPTC or ICC by default.
      .toBuffer({ resolveWithObject: true });
    const thumbnail = await sharp(image)
      .resize({ width: THUMBNAIL_LONG_EDGE_PX, height: THUMBNAIL_LONG_EDGE_PX, fit: 'inside', withoutEnlargement: true })
      .jpeg({ quality: 75 })
      .toBuffer();
    return { image, thumbnail, width: info.width, height: info.height };
  } catch (error) {
    throw refusalFor(error);
  }
}

/** sharp reports an over-large image as "Input image exceeds pixel limit"; anything else is damage. */
function refusalFor(error: unknown): PhotoRefused {
  if (error instanceof Error && /pixel limit/i.test(error.message)) return new PhotoRefused(REFUSALS.tooManyPixels);
  return new PhotoRefused(REFUSALS.damaged);
}
