import { fileTypeFromBuffer } from 'file-type';
import sharp from 'sharp';
import { AppError } from '../errors';

// One pipeline for every uploaded picture (map backgrounds, plot-book photos): the header is read and
// checked by hand first, so a file that claims a huge size in a few bytes is refused before any decoder
// allocates memory for it; only then does sharp decode, turn, shrink and re-encode it.

export const imageMimes = ['image/png', 'image/jpeg', 'image/webp'] as const;
export type ImageMime = (typeof imageMimes)[number];

export interface ImageSize {
  width: number;
  height: number;
}

/** What one upload field accepts; `field` names the form field in the 400 body (e.g. `image`, `photo`). */
export interface ImageLimits {
  field: string;
  maxBytes: number;
  maxSidePx: number;
  maxPixels: number;
}

export type InspectedImage = { mime: ImageMime } & ImageSize;

export type OutputFormat = 'webp' | 'jpeg' | 'png';

export interface EncodedImage extends ImageSize {
  bytes: Buffer;
  mime: ImageMime;
}

const mimeOf: Record<OutputFormat, ImageMime> = { webp: 'image/webp', jpeg: 'image/jpeg', png: 'image/png' };

const u16be = (b: Uint8Array, i: number) => (b[i] << 8) | b[i + 1];
const u32be = (b: Uint8Array, i: number) => ((b[i] << 24) | (b[i + 1] << 16) | (b[i + 2] << 8) | b[i + 3]) >>> 0;
const u16le = (b: Uint8Array, i: number) => b[i] | (b[i + 1] << 8);
const u24le = (b: Uint8Array, i: number) => b[i] | (b[i + 1] << 8) | (b[i + 2] << 16);
const ascii = (b: Uint8Array, i: number, n: number) => String.fromCharCode(...b.subarray(i, i + n));

const PNG_SIGNATURE = [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a];

function pngSize(b: Uint8Array): ImageSize | null {
  // The first chunk must be IHDR: length, type, then width and height as big-endian 32-bit numbers.
  if (b.length < 24 || PNG_SIGNATURE.some((v, i) => b[i] !== v) || ascii(b, 12, 4) !== 'IHDR') return null;
  return { width: u32be(b, 16), height: u32be(b, 20) };
}

/** EXIF orientations 5 to 8 turn the picture a quarter turn, so a browser shows it with sides swapped. */
function exifTurnsQuarter(b: Uint8Array, start: number, end: number): boolean {
  if (end - start < 14 || ascii(b, start, 6) !== 'Exif\0\0') return false;
  const tiff = start + 6;
  const order = ascii(b, tiff, 2);
  if (order !== 'II' && order !== 'MM') return false;
  const le = order === 'II';
  const r16 = (i: number) => (le ? u16le(b, i) : u16be(b, i));
  const r32 = (i: number) => (le ? (u16le(b, i) | (u16le(b, i + 2) << 16)) >>> 0 : u32be(b, i));
  const ifd = tiff + r32(tiff + 4);
  if (ifd + 2 > end) return false;
  const count = r16(ifd);
  for (let k = 0; k < count; k++) {
    const entry = ifd + 2 + k * 12;
    if (entry + 12 > end) return false;
    if (r16(entry) === 0x0112) {
      const orientation = r16(entry + 8);
      return orientation >= 5 && orientation <= 8;
    }
  }
  return false;
}

// Start-of-frame markers carry the frame size; C4 (DHT), C8 (JPG) and CC (DAC) share the range but do not.
const isStartOfFrame = (m: number) => m >= 0xc0 && m <= 0xcf && m !== 0xc4 && m !== 0xc8 && m !== 0xcc;

function jpegSize(b: Uint8Array): ImageSize | null {
  if (b.length < 4 || b[0] !== 0xff || b[1] !== 0xd8) return null;
  let quarterTurn = false;
  let i = 2;
  while (i + 1 < b.length) {
    if (b[i] !== 0xff) return null;
    const marker = b[i + 1];
    if (marker === 0xff) {
      i += 1; // fill byte before a marker
      continue;
    }
    if (marker === 0x01 || (marker >= 0xd0 && marker <= 0xd8)) {
      i += 2; // markers without a length
      continue;
    }
    // Image data or the end came before any frame header.
    if (marker === 0xd9 || marker === 0xda || i + 4 > b.length) return null;
    const length = u16be(b, i + 2);
    if (length < 2) return null;
    if (isStartOfFrame(marker)) {
      if (i + 9 > b.length) return null;
      const height = u16be(b, i + 5);
      const width = u16be(b, i + 7);
      return quarterTurn ? { width: height, height: width } : { width, height };
    }
    if (marker === 0xe1) quarterTurn ||= exifTurnsQuarter(b, i + 4, Math.min(b.length, i + 2 + length));
    i += 2 + length;
  }
  return null;
}

function webpSize(b: Uint8Array): ImageSize | null {
  if (b.length < 30 || ascii(b, 0, 4) !== 'RIFF' || ascii(b, 8, 4) !== 'WEBP') return null;
  const chunk = ascii(b, 12, 4);
  if (chunk === 'VP8 ') {
    // Lossy: a 3-byte frame tag, the start code 9D 01 2A, then 14-bit width and height (top 2 bits are scaling).
    if (b[23] !== 0x9d || b[24] !== 0x01 || b[25] !== 0x2a) return null;
    return { width: u16le(b, 26) & 0x3fff, height: u16le(b, 28) & 0x3fff };
  }
  if (chunk === 'VP8L') {
    // Lossless: signature 0x2F, then width-1 and height-1 as 14-bit fields, least significant bit first.
    if (b[20] !== 0x2f) return null;
    const bits = (b[21] | (b[22] << 8) | (b[23] << 16) | (b[24] << 24)) >>> 0;
    return { width: (bits & 0x3fff) + 1, height: ((bits >>> 14) & 0x3fff) + 1 };
  }
  if (chunk === 'VP8X') {
    // Extended: flags and reserved bytes, then canvas width-1 and height-1 as 24-bit little-endian numbers.
    return { width: u24le(b, 24) + 1, height: u24le(b, 27) + 1 };
  }
  return null;
}

/** Reads an image's pixel size, as a browser shows it, from its PNG, JPEG or WebP header; null when the header is unreadable. */
export function readImageSize(bytes: Uint8Array, mime: ImageMime): ImageSize | null {
  const size = mime === 'image/png' ? pngSize(bytes) : mime === 'image/jpeg' ? jpegSize(bytes) : webpSize(bytes);
  if (!size || size.width <= 0 || size.height <= 0) return null;
  return size;
}

const fieldError = (field: string, message: string) => new AppError('validation_failed', message, { [field]: message });

function formatMegabytes(bytes: number): string {
  const mb = bytes / (1024 * 1024);
  return `${Number.isInteger(mb) ? mb : Math.round(mb * 10) / 10} MB`;
}

/** Checks an uploaded file by its content and header alone (never decoding it) and returns its type and size, or throws a 400 naming `limits.field`. */
export async function inspectImage(bytes: Uint8Array, limits: ImageLimits): Promise<InspectedImage> {
  const refuse = (message: string) => fieldError(limits.field, message);
  if (bytes.length === 0) throw refuse('The file is empty');
  if (bytes.length > limits.maxBytes) throw refuse(`The image is larger than ${formatMegabytes(limits.maxBytes)}`);
  const type = await fileTypeFromBuffer(bytes);
  if (!type || !(imageMimes as readonly string[]).includes(type.mime)) {
    const what = type ? `a ${type.ext.toUpperCase()} file` : 'not an image we can read';
    throw refuse(`The file is ${what}; use a PNG, JPEG or WebP image`);
  }
  const mime = type.mime as ImageMime;
  const size = readImageSize(bytes, mime);
  if (!size) throw refuse('The image looks damaged: its width and height could not be read');
  if (size.width > limits.maxSidePx || size.height > limits.maxSidePx) {
    throw refuse(`The image is ${size.width} × ${size.height} pixels; at most ${limits.maxSidePx} on each side`);
  }
  if (size.width * size.height > limits.maxPixels) {
    const megapixels = Math.round((size.width * size.height) / 1e5) / 10;
    throw refuse(
      `The image is ${size.width} × ${size.height} pixels (${megapixels} megapixels); at most ${limits.maxPixels / 1e6} megapixels`,
    );
  }
  return { mime, ...size };
}

/** Starts a sharp pipeline on bytes that have passed `inspectImage`, with the decoder's own pixel cap as a second guard. */
async function decoderFor(bytes: Uint8Array, limits: ImageLimits): Promise<sharp.Sharp> {
  await inspectImage(bytes, limits);
  // 'error' refuses truncated or corrupt pixel data but lets through the harmless warnings some cameras cause.
  return sharp(bytes, { limitInputPixels: limits.maxPixels, failOn: 'error' });
}

async function finish(pipeline: sharp.Sharp, format: OutputFormat, field: string): Promise<EncodedImage> {
  try {
    const { data, info } = await pipeline.toBuffer({ resolveWithObject: true });
    return { bytes: data, width: info.width, height: info.height, mime: mimeOf[format] };
  } catch {
    // The header was sound, so the fault is in the picture data (cut short or corrupt).
    throw fieldError(field, 'The image looks damaged: it could not be decoded');
  }
}

function encode(pipeline: sharp.Sharp, format: OutputFormat, quality: number): sharp.Sharp {
  // No withMetadata/keepExif: sharp then writes no EXIF (camera, time, GPS position), XMP, IPTC or ICC.
  if (format === 'jpeg') return pipeline.flatten({ background: '#ffffff' }).jpeg({ quality, mozjpeg: true });
  if (format === 'webp') return pipeline.webp({ quality });
  return pipeline.png(); // lossless: quality does not apply
}

/** Checks, then decodes an upload, turns it upright by its EXIF orientation, shrinks it to fit inside `maxSidePx` (never enlarging) and re-encodes it without metadata. */
export async function reencodeImage(
  bytes: Uint8Array,
  opts: { limits: ImageLimits; maxSidePx: number; format: OutputFormat; quality: number },
): Promise<EncodedImage> {
  const pipeline = (await decoderFor(bytes, opts.limits))
    .rotate()
    .resize({ width: opts.maxSidePx, height: opts.maxSidePx, fit: 'inside', withoutEnlargement: true });
  return finish(encode(pipeline, opts.format, opts.quality), opts.format, opts.limits.field);
}

/**
 * Checks, then makes an upright, square WebP thumbnail exactly `sidePx` on each side, cropped from the centre
 * (a tidy grid matters more than showing the edges; small pictures are enlarged to fill it).
 */
export async function makeThumbnail(bytes: Uint8Array, sidePx: number, limits: ImageLimits): Promise<EncodedImage> {
  const pipeline = (await decoderFor(bytes, limits)).rotate().resize({ width: sidePx, height: sidePx, fit: 'cover', position: 'centre' });
  return finish(encode(pipeline, 'webp', 70), 'webp', limits.field);
}
