import crypto from 'node:crypto';
import fs from 'node:fs/promises';
import path from 'node:path';
import { fileTypeFromBuffer } from 'file-type';
import type { Knex } from 'knex';
import type { Site } from '@shared/schemas/sites';
import { AppError, notFound } from '../errors';
import type { Db } from '../db/knex';
import { getSite } from './sites';

/** The largest background image accepted, in bytes. */
export const MAX_BACKGROUND_BYTES = 5 * 1024 * 1024;
/** Longest side accepted, in pixels: browsers refuse to paint much larger images on a canvas. */
export const MAX_BACKGROUND_SIDE_PX = 16384;
/**
 * Most pixels accepted: a header may claim any size in a few bytes, and a browser decodes the whole
 * picture (4 bytes a pixel, so 40 megapixels is 160 MB) before painting it (common practice).
 */
export const MAX_BACKGROUND_PIXELS = 40_000_000;

export const backgroundMimes = ['image/png', 'image/jpeg', 'image/webp'] as const;
export type BackgroundMime = (typeof backgroundMimes)[number];

const extensionFor: Record<BackgroundMime, string> = { 'image/png': 'png', 'image/jpeg': 'jpg', 'image/webp': 'webp' };
// Names are ours (random hex), so anything else in the column is refused rather than joined into a path.
const STORED_NAME = /^[0-9a-f]{32}\.(png|jpg|webp)$/;
const FOLDER = 'site-backgrounds';

export interface ImageSize {
  width: number;
  height: number;
}

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
export function readImageSize(bytes: Uint8Array, mime: BackgroundMime): ImageSize | null {
  const size = mime === 'image/png' ? pngSize(bytes) : mime === 'image/jpeg' ? jpegSize(bytes) : webpSize(bytes);
  if (!size || size.width <= 0 || size.height <= 0) return null;
  return size;
}

const imageError = (message: string) => new AppError('validation_failed', message, { image: message });

/** Checks an uploaded file by its content and returns its type and size, or throws a 400 naming the image field. */
export async function inspectBackground(bytes: Uint8Array): Promise<{ mime: BackgroundMime } & ImageSize> {
  if (bytes.length === 0) throw imageError('The file is empty');
  if (bytes.length > MAX_BACKGROUND_BYTES) throw imageError('The image is larger than 5 MB');
  const type = await fileTypeFromBuffer(bytes);
  if (!type || !(backgroundMimes as readonly string[]).includes(type.mime)) {
    const what = type ? `a ${type.ext.toUpperCase()} file` : 'not an image we can read';
    throw imageError(`The file is ${what}; use a PNG, JPEG or WebP image`);
  }
  const mime = type.mime as BackgroundMime;
  const size = readImageSize(bytes, mime);
  if (!size) throw imageError('The image looks damaged: its width and height could not be read');
  if (size.width > MAX_BACKGROUND_SIDE_PX || size.height > MAX_BACKGROUND_SIDE_PX) {
    throw imageError(`The image is ${size.width} × ${size.height} pixels; at most ${MAX_BACKGROUND_SIDE_PX} on each side`);
  }
  if (size.width * size.height > MAX_BACKGROUND_PIXELS) {
    const megapixels = Math.round((size.width * size.height) / 1e5) / 10;
    throw imageError(
      `The image is ${size.width} × ${size.height} pixels (${megapixels} megapixels); at most ${MAX_BACKGROUND_PIXELS / 1e6} megapixels`,
    );
  }
  return { mime, ...size };
}

const folderOf = (uploadDir: string) => path.join(path.resolve(uploadDir), FOLDER);

async function removeQuietly(file: string) {
  await fs.rm(file, { force: true });
}

/** Deletes a stored background file by its stored name (names that are not ours are left alone). */
export async function removeBackgroundFile(uploadDir: string, name: string): Promise<void> {
  if (STORED_NAME.test(name)) await removeQuietly(path.join(folderOf(uploadDir), name));
}

/** Stores a new map background for a site, replacing (and deleting) the previous one; returns the site. */
export async function setSiteBackground(
  db: Knex,
  opts: { siteId: number; uploadDir: string; bytes: Uint8Array; widthMetres?: number },
): Promise<Site> {
  const image = await inspectBackground(opts.bytes);
  const folder = folderOf(opts.uploadDir);
  // Only the innermost folder is private; parents such as .data stay as the system makes them.
  await fs.mkdir(path.dirname(folder), { recursive: true });
  await fs.mkdir(folder, { recursive: true, mode: 0o700 });
  const name = `${crypto.randomBytes(16).toString('hex')}.${extensionFor[image.mime]}`;
  const file = path.join(folder, name);
  await fs.writeFile(file, opts.bytes, { flag: 'wx', mode: 0o600 });
  let previous: string | null;
  try {
    previous = await db.transaction(async (trx) => {
      const site = await trx('sites').where({ id: opts.siteId }).forUpdate().first('version', 'background_file');
      if (!site) throw notFound('The site');
      await trx('sites')
        .where({ id: opts.siteId })
        .update({
          background_file: name,
          background_mime: image.mime,
          background_width_px: image.width,
          background_height_px: image.height,
          background_m_per_px: opts.widthMetres === undefined ? null : opts.widthMetres / image.width,
          version: site.version + 1,
          updated_at: trx.fn.now(),
        });
      return site.background_file as string | null;
    });
  } catch (err) {
    await removeQuietly(file);
    throw err;
  }
  // Only after the new name is committed can the old file go; a crash here leaves an orphan, never a broken map.
  if (previous && STORED_NAME.test(previous)) await removeQuietly(path.join(folder, previous));
  return getSite(db, opts.siteId);
}

/** Where a site's background image lives on disk and its type; 404 when the site has none. */
export async function findSiteBackground(
  db: Db,
  opts: { siteId: number; uploadDir: string },
): Promise<{ folder: string; name: string; mime: string }> {
  const row = await db('sites').where({ id: opts.siteId }).first('background_file', 'background_mime');
  if (!row) throw notFound('The site');
  if (!row.background_file || !row.background_mime || !STORED_NAME.test(row.background_file)) {
    throw notFound('The background image');
  }
  return { folder: folderOf(opts.uploadDir), name: row.background_file, mime: row.background_mime };
}

/** Takes the background image off a site and deletes its file; 404 when there is none. */
export async function deleteSiteBackground(db: Knex, opts: { siteId: number; uploadDir: string }): Promise<void> {
  const previous = await db.transaction(async (trx) => {
    const site = await trx('sites').where({ id: opts.siteId }).forUpdate().first('version', 'background_file');
    if (!site) throw notFound('The site');
    if (!site.background_file) throw notFound('The background image');
    await trx('sites').where({ id: opts.siteId }).update({
      background_file: null,
      background_mime: null,
      background_width_px: null,
      background_height_px: null,
      background_m_per_px: null,
      version: site.version + 1,
      updated_at: trx.fn.now(),
    });
    return site.background_file as string;
  });
  if (STORED_NAME.test(previous)) await removeQuietly(path.join(folderOf(opts.uploadDir), previous));
}
