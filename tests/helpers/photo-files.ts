/**
 * Files a homeowner might send, good and bad, made on the fly so no binary fixtures are committed.
 */
import { randomBytes } from 'node:crypto';
import sharp from 'sharp';

/**
 * A landscape camera frame (red top half, blue bottom half as stored) that the camera marks as
 * "rotate to view": EXIF Orientation 6, plus a GPS position and a camera make.
 * Source: EXIF 2.32 (CIPA DC-008), tag 0x0112 Orientation, value 6 = "the 0th row is the visual
 * right-hand side, the 0th column is the visual top", i.e. shown turned 90° clockwise.
 */
export async function sidewaysPhoneJpeg({ width = 3000, height = 2000 } = {}): Promise<Buffer> {
  const bottom = await sharp({ create: { width, height: height / 2, channels: 3, background: '#0000ff' } })
    .png()
    .toBuffer();
  const stored = await sharp({ create: { width, height, channels: 3, background: '#ff0000' } })
    .composite([{ input: bottom, top: height / 2, left: 0 }])
    .jpeg()
    .toBuffer();
  return sharp(stored)
    .withMetadata({ orientation: 6 })
    .withExifMerge({
      IFD0: { Make: 'LapwingTestCam' },
      // IFD3 is the GPS IFD in sharp's EXIF writer (libvips naming).
      IFD3: { GPSLatitudeRef: 'N', GPSLatitude: GPS_LATITUDE, GPSLongitudeRef: 'W', GPSLongitude: '97/1 44/1 0/1' },
    })
    .jpeg({ quality: 90 })
    .toBuffer();
}

const GPS_LATITUDE = '30/1 16/1 1234/100';

/** The seconds of GPS_LATITUDE as an EXIF RATIONAL (1234/100) in either byte order. */
export function containsOurGpsSeconds(exif: Buffer): boolean {
  // Source: EXIF 2.32, RATIONAL = two LONGs (numerator, denominator), byte order from the TIFF header.
  const little = Buffer.from([0xd2, 0x04, 0, 0, 0x64, 0, 0, 0]);
  const big = Buffer.from([0, 0, 0x04, 0xd2, 0, 0, 0, 0x64]);
  return exif.includes(little) || exif.includes(big);
}

/**
 * A realistic 12-megapixel camera JPEG: 4000 × 3000 of noise, which compresses like a photo's detail
 * (about 6 MB at quality 90). Random bytes squeezed into 90–166 rather than libvips' gaussian noise,
 * which took seconds to make and, with many test workers, pushed the test towards its timeout.
 */
export function twelveMegapixelJpeg(): Promise<Buffer> {
  const [width, height] = [4000, 3000];
  return sharp(randomBytes(width * height * 3), { raw: { width, height, channels: 3 } })
    .linear(0.3, 90)
    .jpeg({ quality: 90 })
    .toBuffer();
}

export function smallPng({ transparent = false } = {}): Promise<Buffer> {
  return sharp({ create: { width: 640, height: 480, channels: 4, background: { r: 40, g: 110, b: 80, alpha: transparent ? 0 : 1 } } })
    .png()
    .toBuffer();
}

export function smallWebp(): Promise<Buffer> {
  return sharp({ create: { width: 800, height: 600, channels: 3, background: '#e9d8b4' } })
    .webp()
    .toBuffer();
}

/** 8000 × 6000 = 48 megapixels of one colour: a PNG of a few hundred kilobytes. */
export function hugePixelPng(): Promise<Buffer> {
  return sharp({ create: { width: 8000, height: 6000, channels: 3, background: '#ffffff' } })
    .png({ compressionLevel: 9 })
    .toBuffer();
}

/** A JPEG cut off halfway through its image data. */
export async function truncatedJpeg(): Promise<Buffer> {
  const whole = await sharp({ create: { width: 1200, height: 900, channels: 3, background: '#808080', noise: { type: 'gaussian', mean: 128, sigma: 40 } } })
    .jpeg()
    .toBuffer();
  return whole.subarray(0, Math.floor(whole.length / 2));
}

/**
 * Program files with the leading bytes operating systems recognise them by.
 * Source: ELF specification (System V ABI), e_ident = 0x7F 'E' 'L' 'F';
 * Microsoft PE/COFF specification, MS-DOS stub starts with 'MZ' and holds the PE header offset at 0x3C.
 */
export function elfExecutable(): Buffer {
  const bytes = Buffer.alloc(4096);
  Buffer.from([0x7f, 0x45, 0x4c, 0x46, 0x02, 0x01, 0x01]).copy(bytes, 0);
  return bytes;
}

export function windowsExecutable(): Buffer {
  const bytes = Buffer.alloc(4096);
  bytes.write('MZ', 0, 'latin1');
  bytes.writeUInt32LE(0x80, 0x3c);
  bytes.write('PE\0\0', 0x80, 'latin1');
  bytes.write('This program cannot be run in DOS mode.', 0x4e, 'latin1');
  return bytes;
}

export const svgWithScript = Buffer.from(
  '<?xml version="1.0"?><svg xmlns="http://www.w3.org/2000/svg" width="100" height="100"><script>alert(document.domain)</script><rect width="100" height="100" fill="green"/></svg>',
);

export const htmlPage = Buffer.from('<!doctype html><html><body><script>alert(1)</script><p>wall</p></body></html>');

/** A file that starts like a JPEG and is 16 MiB long: over the 15 MB limit. */
export function sixteenMegabyteFile(): Buffer {
  const bytes = Buffer.alloc(16 * 1024 * 1024, 0x20);
  Buffer.from([0xff, 0xd8, 0xff, 0xe0]).copy(bytes, 0);
  return bytes;
}
