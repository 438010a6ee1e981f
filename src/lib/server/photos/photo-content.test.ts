import { describe, expect, test } from 'vitest';
import sharp from 'sharp';
import { cleanPhoto, MAX_INPUT_PIXELS, PhotoRefused, REFUSALS, sniffPhotoType } from './photo-content';

const ascii = (text: string) => Buffer.from(text, 'latin1');
const padded = (head: Buffer, length = 512) => Buffer.concat([head, Buffer.alloc(Math.max(0, length - head.length))]);
const solid = (width: number, height: number) => sharp({ create: { width, height, channels: 3, background: '#2f6b4f' } });

describe('sniffPhotoType: the type comes from the leading bytes', () => {
  test('JPEG, PNG and WebP files are recognised by their signatures', async () => {
    const jpeg = await solid(20, 10).jpeg().toBuffer();
    const png = await solid(20, 10).png().toBuffer();
    const webp = await solid(20, 10).webp().toBuffer();
    // Source: ITU-T T.81 (JPEG), SOI marker FF D8 followed by another marker FF.
    expect([...jpeg.subarray(0, 3)]).toEqual([0xff, 0xd8, 0xff]);
    // Source: PNG specification (W3C / RFC 2083) section 5.2, signature 89 50 4E 47 0D 0A 1A 0A.
    expect([...png.subarray(0, 8)]).toEqual([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
    // Source: RFC 9649 (WebP), RIFF header: "RIFF", 4-byte size, "WEBP".
    expect(webp.subarray(0, 4).toString('latin1')).toBe('RIFF');
    expect(webp.subarray(8, 12).toString('latin1')).toBe('WEBP');

    expect(await sniffPhotoType(jpeg)).toBe('image/jpeg');
    expect(await sniffPhotoType(png)).toBe('image/png');
    expect(await sniffPhotoType(webp)).toBe('image/webp');
  });

  test('programs, documents, markup and other image formats are not photos we take', async () => {
    const refused = {
      // Source: System V ABI, ELF e_ident: 7F 45 4C 46.
      elf: padded(Buffer.from([0x7f, 0x45, 0x4c, 0x46, 0x02, 0x01, 0x01])),
      // Source: Microsoft PE/COFF specification, MS-DOS header "MZ" with the PE offset at 0x3C.
      exe: (() => {
        const bytes = padded(ascii('MZ'), 1024);
        bytes.writeUInt32LE(0x80, 0x3c);
        ascii('PE\0\0').copy(bytes, 0x80);
        return bytes;
      })(),
      // Source: ISO 32000-1 section 7.5.2, a PDF file begins with "%PDF-".
      pdf: padded(ascii('%PDF-1.7\n')),
      // Source: GIF89a specification, header "GIF89a".
      gif: await solid(4, 4).gif().toBuffer(),
      svg: ascii('<svg xmlns="http://www.w3.org/2000/svg"><script>alert(1)</script></svg>'),
      html: ascii('<!doctype html><script>alert(1)</script>'),
      text: ascii('just some words, no image here'),
      // Source: ISO/IEC 23008-12 (HEIF), ftyp box with brand "heic" at offset 8.
      heic: padded(Buffer.concat([Buffer.from([0, 0, 0, 0x18]), ascii('ftypheic'), Buffer.alloc(4), ascii('mif1heic')])),
    };
    for (const [name, bytes] of Object.entries(refused)) {
      expect({ name, type: await sniffPhotoType(bytes) }).toEqual({ name, type: null });
    }
  });
});

describe('cleanPhoto', () => {
  test('keeps no EXIF, shrinks to a 2,000 px long edge and makes a 400 px thumbnail', async () => {
    const input = await solid(2400, 1200)
      .withExif({ IFD0: { Make: 'SomeCamera', Copyright: 'someone' } })
      .jpeg()
      .toBuffer();
    expect((await sharp(input).metadata()).exif).toBeDefined();
    const clean = await cleanPhoto(input);
    expect(clean).toMatchObject({ width: 2000, height: 1000 });
    const image = await sharp(clean.image).metadata();
    expect(image.exif).toBeUndefined();
    expect(image.icc).toBeUndefined();
    expect(await sharp(clean.thumbnail).metadata()).toMatchObject({ width: 400, height: 200, format: 'jpeg' });
  });

  test('a small photo is not enlarged', async () => {
    const clean = await cleanPhoto(await solid(300, 200).png().toBuffer());
    expect(clean).toMatchObject({ width: 300, height: 200 });
  });

  test('refusals carry the plain message for the homeowner', async () => {
    const refusal = async (bytes: Buffer) => {
      try {
        await cleanPhoto(bytes);
      } catch (error) {
        expect(error).toBeInstanceOf(PhotoRefused);
        return (error as Error).message;
      }
      throw new Error('expected a refusal');
    };
    expect(await refusal(Buffer.alloc(0))).toBe(REFUSALS.empty);
    expect(await refusal(ascii('<svg/>'))).toBe(REFUSALS.notAPhoto);
    // A JPEG signature with nothing decodable behind it.
    expect(await refusal(padded(Buffer.from([0xff, 0xd8, 0xff, 0xe0]), 2048))).toBe(REFUSALS.damaged);
    // One pixel over the cap, in a PNG that is tiny on disk.
    const width = 8000;
    const overCap = await solid(width, Math.floor(MAX_INPUT_PIXELS / width) + 1)
      .png()
      .toBuffer();
    expect(await refusal(overCap)).toBe(REFUSALS.tooManyPixels);
  });
});
