import zlib from 'node:zlib';
import sharp from 'sharp';
import { beforeEach, describe, expect, it, vi } from 'vitest';
import { inspectImage, makeThumbnail, reencodeImage } from './images';
import { prepareBackground, STORED_BACKGROUND_SIDE_PX } from './site-backgrounds';

// Every call into sharp from the module under test is counted, so a test can prove a refused file
// never reached the decoder (vi.mock is hoisted above the imports). Fixtures are built with sharp too,
// so the count is reset just before the calls under test.
const decoder = vi.hoisted(() => ({ calls: 0 }));
vi.mock('sharp', async (importOriginal) => {
  const actual = (await importOriginal<{ default: typeof import('sharp') }>()).default;
  const counted = (...args: Parameters<typeof actual>) => {
    decoder.calls += 1;
    return actual(...args);
  };
  return { default: Object.assign(counted, actual) };
});


const photoLimits = { field: 'photo', maxBytes: 10 * 1024 * 1024, maxSidePx: 16384, maxPixels: 40_000_000 };
const be32 = (n: number) => Buffer.from([(n >>> 24) & 255, (n >>> 16) & 255, (n >>> 8) & 255, n & 255]);

function pngChunk(type: string, data: Buffer): Buffer {
  const body = Buffer.concat([Buffer.from(type, 'latin1'), data]);
  return Buffer.concat([be32(data.length), body, be32(zlib.crc32(body))]);
}

/** A PNG signature and IHDR chunk only (W3C PNG 3rd ed. §5.2, §11.2.1): it claims a size, holds no pixels. */
const pngHeader = (width: number, height: number) =>
  Buffer.concat([
    Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
    pngChunk('IHDR', Buffer.concat([be32(width), be32(height), Buffer.from([8, 2, 0, 0, 0])])),
  ]);

const solid = (width: number, height: number, colour = '#6a8f3c') =>
  sharp({ create: { width, height, channels: 3, background: colour } });

/** A 20 × 10 picture, left half red and right half blue, so a turn can be checked by where the colours land. */
function halves(): Buffer {
  const raw = Buffer.alloc(20 * 10 * 3);
  for (let y = 0; y < 10; y++) {
    for (let x = 0; x < 20; x++) raw.set(x < 10 ? [255, 0, 0] : [0, 0, 255], (y * 20 + x) * 3);
  }
  return raw;
}

async function pixel(bytes: Buffer, x: number, y: number): Promise<number[]> {
  const { data, info } = await sharp(bytes).raw().toBuffer({ resolveWithObject: true });
  const at = (y * info.width + x) * info.channels;
  return [data[at], data[at + 1], data[at + 2]];
}

/** The tag numbers in IFD0 of a raw EXIF block as sharp returns it ("Exif\0\0" then a TIFF header and IFDs; layout from memory). */
function ifd0Tags(exif: Buffer): number[] {
  const tiff = 6;
  const le = exif.toString('latin1', tiff, tiff + 2) === 'II';
  const r16 = (i: number) => (le ? exif.readUInt16LE(i) : exif.readUInt16BE(i));
  const r32 = (i: number) => (le ? exif.readUInt32LE(i) : exif.readUInt32BE(i));
  const ifd = tiff + r32(tiff + 4);
  return Array.from({ length: r16(ifd) }, (_, k) => r16(ifd + 2 + k * 12));
}
const GPS_IFD_POINTER = 0x8825; // TIFF/EXIF tag that points at the GPS directory

/** A camera-like JPEG: EXIF with a maker, a GPS position, and an XMP packet. */
const cameraJpeg = () =>
  solid(64, 48)
    .jpeg()
    .withExif({
      IFD0: { Make: 'TestCam', Model: 'Field 1' },
      IFD3: { GPSLatitudeRef: 'N', GPSLatitude: '51/1 30/1 0/1', GPSLongitudeRef: 'W', GPSLongitude: '0/1 7/1 30/1' },
    })
    .withXmp('<x:xmpmeta xmlns:x="adobe:ns:meta/"><rdf:RDF xmlns:rdf="http://www.w3.org/1999/02/22-rdf-syntax-ns#"/></x:xmpmeta>')
    .toBuffer();

beforeEach(() => {
  decoder.calls = 0;
});

describe('reencodeImage', () => {
  it('drops EXIF (with the GPS position) and XMP from a camera JPEG', async () => {
    const input = await cameraJpeg();
    const before = await sharp(input).metadata();
    // The fixture really carries what must go, else the test below proves nothing.
    expect(before.exif).toBeDefined();
    expect(ifd0Tags(before.exif!)).toContain(GPS_IFD_POINTER);
    expect(before.exif!.includes(Buffer.from('TestCam'))).toBe(true);
    expect(before.xmp).toBeDefined();

    for (const format of ['jpeg', 'webp'] as const) {
      const out = await reencodeImage(input, { limits: photoLimits, maxSidePx: 2048, format, quality: 80 });
      const after = await sharp(out.bytes).metadata();
      expect(after.format).toBe(format);
      expect(after.exif).toBeUndefined();
      expect(after.xmp).toBeUndefined();
      expect(after.icc).toBeUndefined();
      expect(out.bytes.includes(Buffer.from('TestCam'))).toBe(false);
      expect(out).toMatchObject({ width: 64, height: 48, mime: `image/${format}` });
    }
  });

  it('turns a picture upright by its EXIF orientation: a 20 × 10 image tagged 6 comes out 10 × 20, turned clockwise', async () => {
    const input = await sharp(halves(), { raw: { width: 20, height: 10, channels: 3 } })
      .png()
      .toBuffer()
      .then((png) => sharp(png).jpeg({ quality: 95 }).withMetadata({ orientation: 6 }).toBuffer());
    expect((await sharp(input).metadata()).orientation).toBe(6);

    const out = await reencodeImage(input, { limits: photoLimits, maxSidePx: 100, format: 'png', quality: 80 });
    expect([out.width, out.height]).toEqual([10, 20]);
    const meta = await sharp(out.bytes).metadata();
    expect([meta.width, meta.height, meta.orientation]).toEqual([10, 20, undefined]);
    // Orientation 6 means "turn 90° clockwise to view": the left (red) half ends up on top.
    const top = await pixel(out.bytes, 5, 2);
    const bottom = await pixel(out.bytes, 5, 17);
    expect(top[0]).toBeGreaterThan(200);
    expect(top[2]).toBeLessThan(60);
    expect(bottom[2]).toBeGreaterThan(200);
    expect(bottom[0]).toBeLessThan(60);
  });

  it('shrinks to fit inside the longest side, keeping the aspect, and never enlarges', async () => {
    const wide = await solid(800, 200).png().toBuffer();
    const shrunk = await reencodeImage(wide, { limits: photoLimits, maxSidePx: 400, format: 'webp', quality: 80 });
    expect([shrunk.width, shrunk.height]).toEqual([400, 100]);
    const meta = await sharp(shrunk.bytes).metadata();
    expect([meta.width, meta.height, meta.format]).toEqual([400, 100, 'webp']);

    const tall = await solid(300, 900).jpeg().toBuffer();
    const tallOut = await reencodeImage(tall, { limits: photoLimits, maxSidePx: 450, format: 'jpeg', quality: 80 });
    expect([tallOut.width, tallOut.height]).toEqual([150, 450]);

    const small = await solid(120, 90).png().toBuffer();
    const kept = await reencodeImage(small, { limits: photoLimits, maxSidePx: 4096, format: 'jpeg', quality: 80 });
    expect([kept.width, kept.height]).toEqual([120, 90]);
  });

  it('refuses text, a GIF, a PNG cut off in its header, and a header claiming 20000 × 20000, naming the field, without decoding', async () => {
    const gif = Buffer.concat([Buffer.from('GIF89a', 'latin1'), Buffer.from([1, 0, 1, 0]), Buffer.alloc(20)]);
    const cutHeader = (await solid(30, 30).png().toBuffer()).subarray(0, 20);
    const bomb = pngHeader(20000, 20000);
    const roomySides = { ...photoLimits, maxSidePx: 65535 };
    const cases: [Buffer, typeof photoLimits, string | RegExp][] = [
      [Buffer.from('date,note\n2026-05-01,sowed\n'), photoLimits, 'The file is not an image we can read; use a PNG, JPEG or WebP image'],
      [gif, photoLimits, 'The file is a GIF file; use a PNG, JPEG or WebP image'],
      [cutHeader, photoLimits, 'The image looks damaged: its width and height could not be read'],
      [bomb, photoLimits, 'The image is 20000 × 20000 pixels; at most 16384 on each side'],
      [bomb, roomySides, 'The image is 20000 × 20000 pixels (400 megapixels); at most 40 megapixels'],
    ];
    decoder.calls = 0;
    for (const [bytes, limits, message] of cases) {
      await expect(reencodeImage(bytes, { limits, maxSidePx: 1024, format: 'webp', quality: 80 })).rejects.toMatchObject({
        code: 'validation_failed',
        fields: { photo: message },
      });
      await expect(makeThumbnail(bytes, 320, limits)).rejects.toMatchObject({ fields: { photo: message } });
    }
    expect(decoder.calls).toBe(0);
  });

  it('refuses a PNG whose header is sound but whose pixel data is cut short, as damaged, naming the field', async () => {
    const whole = await solid(200, 200, '#123456').png({ compressionLevel: 0 }).toBuffer();
    const cut = whole.subarray(0, Math.floor(whole.length / 2));
    expect(await inspectImage(cut, photoLimits)).toEqual({ mime: 'image/png', width: 200, height: 200 });
    decoder.calls = 0;
    await expect(reencodeImage(cut, { limits: photoLimits, maxSidePx: 100, format: 'webp', quality: 80 })).rejects.toMatchObject({
      fields: { photo: 'The image looks damaged: it could not be decoded' },
    });
    // Only the decoder can find this fault, and the counter does see the module's calls into sharp.
    expect(decoder.calls).toBe(1);
  });

  it('names the limit in megabytes from the limits given', async () => {
    const limits = { ...photoLimits, maxBytes: 1024 * 1024 };
    const big = Buffer.concat([await solid(2, 2).png().toBuffer(), Buffer.alloc(1024 * 1024)]);
    await expect(inspectImage(big, limits)).rejects.toMatchObject({ fields: { photo: 'The image is larger than 1 MB' } });
    await expect(inspectImage(Buffer.alloc(0), limits)).rejects.toMatchObject({ fields: { photo: 'The file is empty' } });
  });
});

describe('makeThumbnail', () => {
  it('makes a square WebP exactly the side asked for, from wide, tall and small pictures', async () => {
    for (const [w, h] of [
      [1600, 900],
      [600, 1800],
      [100, 60],
    ]) {
      const thumb = await makeThumbnail(await solid(w, h).jpeg().toBuffer(), 320, photoLimits);
      expect(thumb).toMatchObject({ width: 320, height: 320, mime: 'image/webp' });
      const meta = await sharp(thumb.bytes).metadata();
      expect([meta.width, meta.height, meta.format, meta.exif]).toEqual([320, 320, 'webp', undefined]);
    }
  });

  it('crops from the centre of the upright picture', async () => {
    // Tagged 6, the left-red/right-blue picture shows red on top: a centre square crop keeps both colours.
    const input = await sharp(halves(), { raw: { width: 20, height: 10, channels: 3 } })
      .jpeg({ quality: 95 })
      .withMetadata({ orientation: 6 })
      .toBuffer();
    const thumb = await makeThumbnail(input, 10, photoLimits);
    expect((await pixel(thumb.bytes, 5, 1))[0]).toBeGreaterThan(180);
    expect((await pixel(thumb.bytes, 5, 8))[2]).toBeGreaterThan(180);
  });
});

describe('prepareBackground', () => {
  it('keeps a small PNG plan at its size, in PNG, with the scale from the measured width', async () => {
    const plan = await solid(40, 25).png().toBuffer();
    const out = await prepareBackground(plan, 40);
    expect(out).toMatchObject({ mime: 'image/png', width: 40, height: 25, metresPerPixel: 1 });
    expect((await sharp(out.bytes).metadata()).format).toBe('png');
  });

  it('shrinks a large plan to the stored side and divides the measured width by the stored width', async () => {
    const plan = await solid(6000, 1500).png().toBuffer();
    const out = await prepareBackground(plan, 60);
    expect([out.width, out.height]).toEqual([STORED_BACKGROUND_SIDE_PX, 1024]);
    // 60 m spanned 6000 px (0.01 m each); the same 60 m now spans 4096 px.
    expect(out.metresPerPixel).toBeCloseTo(60 / 4096, 12);
    expect(out.metresPerPixel! * out.width).toBeCloseTo(60, 9);
    expect(out.metresPerPixel).not.toBeCloseTo(60 / 6000, 6);
    const meta = await sharp(out.bytes).metadata();
    expect([meta.width, meta.height]).toEqual([4096, 1024]);
  });

  it('measures the width across the upright picture and stores a JPEG without its EXIF', async () => {
    const photo = await solid(3000, 2000).jpeg().withMetadata({ orientation: 6 }).withExifMerge({ IFD3: { GPSLatitudeRef: 'N' } }).toBuffer();
    const out = await prepareBackground(photo, 20);
    // Upright it is 2000 wide and 3000 tall; nothing to shrink.
    expect(out).toMatchObject({ mime: 'image/jpeg', width: 2000, height: 3000, metresPerPixel: 0.01 });
    expect((await sharp(out.bytes).metadata()).exif).toBeUndefined();
  });

  it('leaves the scale empty without a measured width, and keeps WebP as WebP', async () => {
    const out = await prepareBackground(await solid(50, 50).webp().toBuffer());
    expect(out).toMatchObject({ mime: 'image/webp', width: 50, height: 50, metresPerPixel: null });
  });
});
