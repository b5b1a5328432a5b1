import zlib from 'node:zlib';
import { describe, expect, it } from 'vitest';
import { inspectBackground, MAX_BACKGROUND_BYTES, readImageSize } from './site-backgrounds';

// The images below are built byte by byte from the format specifications, so each test knows
// the size it wrote and checks that the reader finds exactly that.

const be32 = (n: number) => Buffer.from([(n >>> 24) & 255, (n >>> 16) & 255, (n >>> 8) & 255, n & 255]);
const be16 = (n: number) => Buffer.from([(n >>> 8) & 255, n & 255]);
const le16 = (n: number) => Buffer.from([n & 255, (n >>> 8) & 255]);
const le24 = (n: number) => Buffer.from([n & 255, (n >>> 8) & 255, (n >>> 16) & 255]);
const le32 = (n: number) => Buffer.from([n & 255, (n >>> 8) & 255, (n >>> 16) & 255, (n >>> 24) & 255]);

function pngChunk(type: string, data: Buffer): Buffer {
  const body = Buffer.concat([Buffer.from(type, 'latin1'), data]);
  return Buffer.concat([be32(data.length), body, be32(zlib.crc32(body))]);
}

/** A complete, decodable RGB PNG (W3C PNG Specification, 3rd ed., §5.2 signature, §11.2.1 IHDR, §11.2.4 IDAT). */
function png(width: number, height: number): Buffer {
  const ihdr = Buffer.concat([be32(width), be32(height), Buffer.from([8, 2, 0, 0, 0])]);
  const row = Buffer.concat([Buffer.from([0]), Buffer.alloc(width * 3, 0x7f)]); // filter type 0, grey pixels
  const idat = zlib.deflateSync(Buffer.concat(Array.from({ length: height }, () => row)));
  return Buffer.concat([
    Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
    pngChunk('IHDR', ihdr),
    pngChunk('IDAT', idat),
    pngChunk('IEND', Buffer.alloc(0)),
  ]);
}

const segment = (marker: number, body: Buffer) => Buffer.concat([Buffer.from([0xff, marker]), be16(body.length + 2), body]);

/** An APP1 segment holding only the EXIF orientation tag 0x0112 (CIPA DC-008 Exif 2.32, §4.6.4 TIFF Rev. 6.0 Attribute Information). */
function exifOrientation(orientation: number, littleEndian = false): Buffer {
  const w16 = littleEndian ? le16 : be16;
  const w32 = littleEndian ? le32 : be32;
  const tiff = Buffer.concat([
    Buffer.from(littleEndian ? 'II' : 'MM', 'latin1'),
    w16(42),
    w32(8), // IFD0 right after the header
    w16(1), // one entry
    w16(0x0112),
    w16(3), // SHORT
    w32(1),
    w16(orientation),
    w16(0),
    w32(0), // no next IFD
  ]);
  return segment(0xe1, Buffer.concat([Buffer.from('Exif\0\0', 'latin1'), tiff]));
}

/** A JPEG header up to the frame header (ITU-T T.81 Annex B.2.2: P, Y (height), X (width), Nf). */
function jpeg(width: number, height: number, opts: { sof?: number; before?: Buffer[] } = {}): Buffer {
  const app0 = segment(0xe0, Buffer.from([0x4a, 0x46, 0x49, 0x46, 0, 1, 1, 0, 0, 1, 0, 1, 0, 0]));
  const dht = segment(0xc4, Buffer.concat([Buffer.from([0x00]), Buffer.alloc(16, 0)]));
  const sof = segment(opts.sof ?? 0xc0, Buffer.concat([Buffer.from([8]), be16(height), be16(width), Buffer.from([1, 1, 0x11, 0])]));
  return Buffer.concat([Buffer.from([0xff, 0xd8]), app0, ...(opts.before ?? []), dht, sof, Buffer.from([0xff, 0xd9])]);
}

/** A RIFF WebP file with one chunk (RFC 9649 §2.4 file header, §2.5 simple lossy, §2.6 lossless, §2.7 extended). */
function webp(fourcc: string, payload: Buffer): Buffer {
  const chunk = Buffer.concat([Buffer.from(fourcc, 'latin1'), le32(payload.length), payload]);
  const body = Buffer.concat([Buffer.from('WEBP', 'latin1'), chunk]);
  return Buffer.concat([Buffer.from('RIFF', 'latin1'), le32(body.length), body]);
}

/** VP8 key frame header (RFC 6386 §9.1): 3-byte frame tag, start code 9D 01 2A, 14-bit sizes with 2 scale bits. */
const vp8 = (width: number, height: number, scale = 0) =>
  webp(
    'VP8 ',
    Buffer.concat([Buffer.from([0x10, 0x02, 0x00, 0x9d, 0x01, 0x2a]), le16(width | (scale << 14)), le16(height | (scale << 14)), Buffer.alloc(4)]),
  );

/** VP8L header (RFC 9649 §3.2): signature 0x2F, then 14 bits width-1, 14 bits height-1, alpha bit, 3 version bits. */
const vp8l = (width: number, height: number) => {
  const bits = ((width - 1) | ((height - 1) << 14) | (1 << 28)) >>> 0;
  return webp('VP8L', Buffer.concat([Buffer.from([0x2f]), le32(bits), Buffer.alloc(5)]));
};

/** VP8X header (RFC 9649 §2.7): 1 flag byte, 3 reserved, 24-bit canvas width-1 and height-1. */
const vp8x = (width: number, height: number) =>
  webp('VP8X', Buffer.concat([Buffer.from([0x10, 0, 0, 0]), le24(width - 1), le24(height - 1)]));

describe('readImageSize', () => {
  it('reads width and height from a PNG IHDR chunk', () => {
    expect(readImageSize(png(3, 2), 'image/png')).toEqual({ width: 3, height: 2 });
    expect(readImageSize(png(1, 100), 'image/png')).toEqual({ width: 1, height: 100 });
  });

  it('reads sizes above 65535 from the PNG header (32-bit fields)', () => {
    const header = png(1, 1).subarray(0, 33);
    header.writeUInt32BE(70000, 16);
    header.writeUInt32BE(65536, 20);
    expect(readImageSize(header, 'image/png')).toEqual({ width: 70000, height: 65536 });
  });

  it('refuses a PNG whose first chunk is not IHDR, or that is cut short', () => {
    const bad = Buffer.from(png(4, 4));
    bad.write('IDAT', 12, 'latin1');
    expect(readImageSize(bad, 'image/png')).toBeNull();
    expect(readImageSize(png(4, 4).subarray(0, 20), 'image/png')).toBeNull();
  });

  it('reads a baseline (SOF0) and a progressive (SOF2) JPEG frame header, skipping the Huffman table before it', () => {
    expect(readImageSize(jpeg(640, 480), 'image/jpeg')).toEqual({ width: 640, height: 480 });
    expect(readImageSize(jpeg(1200, 900, { sof: 0xc2 }), 'image/jpeg')).toEqual({ width: 1200, height: 900 });
  });

  it('tolerates fill bytes before a JPEG marker', () => {
    const withFill = jpeg(10, 20);
    const at = withFill.indexOf(Buffer.from([0xff, 0xc0]));
    const padded = Buffer.concat([withFill.subarray(0, at), Buffer.from([0xff, 0xff]), withFill.subarray(at)]);
    expect(readImageSize(padded, 'image/jpeg')).toEqual({ width: 10, height: 20 });
  });

  it('swaps JPEG sides when EXIF says the picture is turned a quarter (orientations 5–8), in either byte order', () => {
    expect(readImageSize(jpeg(4000, 3000, { before: [exifOrientation(6)] }), 'image/jpeg')).toEqual({ width: 3000, height: 4000 });
    expect(readImageSize(jpeg(4000, 3000, { before: [exifOrientation(8, true)] }), 'image/jpeg')).toEqual({
      width: 3000,
      height: 4000,
    });
    expect(readImageSize(jpeg(4000, 3000, { before: [exifOrientation(3)] }), 'image/jpeg')).toEqual({ width: 4000, height: 3000 });
  });

  it('refuses a JPEG with no frame header before the image data', () => {
    const noFrame = Buffer.concat([Buffer.from([0xff, 0xd8]), segment(0xe0, Buffer.alloc(14)), Buffer.from([0xff, 0xda, 0, 2])]);
    expect(readImageSize(noFrame, 'image/jpeg')).toBeNull();
    expect(readImageSize(jpeg(10, 10).subarray(0, 30), 'image/jpeg')).toBeNull();
  });

  it('reads lossy (VP8), lossless (VP8L) and extended (VP8X) WebP headers', () => {
    expect(readImageSize(vp8(800, 600), 'image/webp')).toEqual({ width: 800, height: 600 });
    expect(readImageSize(vp8(800, 600, 2), 'image/webp')).toEqual({ width: 800, height: 600 });
    expect(readImageSize(vp8l(16383, 1), 'image/webp')).toEqual({ width: 16383, height: 1 });
    expect(readImageSize(vp8l(301, 7777), 'image/webp')).toEqual({ width: 301, height: 7777 });
    expect(readImageSize(vp8x(16, 16), 'image/webp')).toEqual({ width: 16, height: 16 });
    expect(readImageSize(vp8x(100000, 3), 'image/webp')).toEqual({ width: 100000, height: 3 });
  });

  it('refuses a VP8 frame without its start code', () => {
    const bad = Buffer.from(vp8(10, 10));
    bad[24] = 0x00;
    expect(readImageSize(bad, 'image/webp')).toBeNull();
  });

  it('refuses a zero-sized picture', () => {
    expect(readImageSize(png(0, 5), 'image/png')).toBeNull();
    expect(readImageSize(jpeg(0, 5), 'image/jpeg')).toBeNull();
  });
});

describe('inspectBackground', () => {
  it('accepts PNG, JPEG and WebP by their content', async () => {
    expect(await inspectBackground(png(5, 4))).toEqual({ mime: 'image/png', width: 5, height: 4 });
    expect(await inspectBackground(jpeg(30, 20))).toEqual({ mime: 'image/jpeg', width: 30, height: 20 });
    expect(await inspectBackground(vp8l(64, 32))).toEqual({ mime: 'image/webp', width: 64, height: 32 });
  });

  it('refuses text, whatever the file was called, naming the image field', async () => {
    await expect(inspectBackground(Buffer.from('plot,x,y\nA-1,0,0\n'))).rejects.toMatchObject({
      code: 'validation_failed',
      fields: { image: 'The file is not an image we can read; use a PNG, JPEG or WebP image' },
    });
  });

  it('refuses other image types such as GIF', async () => {
    const gif = Buffer.concat([Buffer.from('GIF89a', 'latin1'), le16(1), le16(1), Buffer.alloc(20)]);
    await expect(inspectBackground(gif)).rejects.toMatchObject({
      fields: { image: 'The file is a GIF file; use a PNG, JPEG or WebP image' },
    });
  });

  it('refuses an image whose header is damaged, an empty file, and one over the size limit', async () => {
    const damaged = Buffer.from(png(4, 4));
    damaged.write('IDAT', 12, 'latin1');
    await expect(inspectBackground(damaged)).rejects.toMatchObject({ fields: { image: expect.stringMatching(/damaged/) } });
    await expect(inspectBackground(Buffer.alloc(0))).rejects.toMatchObject({ fields: { image: 'The file is empty' } });
    const big = Buffer.concat([png(1, 1), Buffer.alloc(MAX_BACKGROUND_BYTES)]);
    await expect(inspectBackground(big)).rejects.toMatchObject({ fields: { image: 'The image is larger than 5 MB' } });
  });

  it('refuses a picture wider than a browser can paint', async () => {
    await expect(inspectBackground(vp8x(20000, 10))).rejects.toMatchObject({
      fields: { image: expect.stringMatching(/20000 × 10 pixels; at most 16384/) },
    });
  });
});
