import { readdirSync } from 'node:fs';
import { join } from 'node:path';
import { crc32, deflateSync } from 'node:zlib';
import sharp from 'sharp';

/**
 * Upload fixtures, made in the test process so nothing binary is committed and every hostile
 * property (GPS in the EXIF, HTML after the PNG, a bomb's header) is visible right here.
 */

export const SERIAL = 'SN-TL-004217';
export const CAMERA_MODEL = 'Fieldcam 9';

/** A noisy photo-like JPEG with a camera serial, a GPS position and "rotate 90° clockwise". */
export async function photoWithGps(width = 1200, height = 900): Promise<Buffer> {
  return sharp({ create: { width, height, channels: 3, background: '#000', noise: { type: 'gaussian', mean: 110, sigma: 40 } } })
    .jpeg({ quality: 85 })
    .withMetadata({ orientation: 6 })
    .withExif({
      IFD0: { Make: 'Throwline Test Optics', Model: CAMERA_MODEL, Software: 'fixture' },
      IFD2: { BodySerialNumber: SERIAL, LensSerialNumber: 'LENS-77' },
      IFD3: { GPSLatitudeRef: 'N', GPSLatitude: '52/1 22/1 3088/100', GPSLongitudeRef: 'W', GPSLongitude: '1/1 53/1 4012/100' },
    })
    .toBuffer();
}

export async function plainJpeg(width = 640, height = 480, seed = 128): Promise<Buffer> {
  return sharp({ create: { width, height, channels: 3, background: '#000', noise: { type: 'gaussian', mean: seed, sigma: 30 } } }).jpeg({ quality: 80 }).toBuffer();
}

export async function pngWithHtml(): Promise<Buffer> {
  const png = await sharp({ create: { width: 200, height: 120, channels: 4, background: '#3366aa' } }).png().toBuffer();
  return Buffer.concat([png, Buffer.from('<html><body><script>alert(document.cookie)</script></body></html>')]);
}

export const SVG_WITH_SCRIPT = Buffer.from(
  '<?xml version="1.0"?><svg xmlns="http://www.w3.org/2000/svg" width="100" height="100"><script>alert(document.domain)</script><rect width="100" height="100" fill="red"/></svg>',
);

export const HTML_PAGE = Buffer.from('<!doctype html><html><body><script>fetch("/api/venues")</script></body></html>');

/** A zip archive's local-file header: archives are refused whatever they contain. */
export const ZIP_BYTES = Buffer.concat([Buffer.from([0x50, 0x4b, 0x03, 0x04, 0x14, 0, 0, 0, 8, 0]), Buffer.alloc(200, 1)]);

function pngChunk(type: string, data: Buffer): Buffer {
  const length = Buffer.alloc(4);
  length.writeUInt32BE(data.length);
  const typed = Buffer.concat([Buffer.from(type, 'latin1'), data]);
  const crc = Buffer.alloc(4);
  crc.writeUInt32BE(crc32(typed));
  return Buffer.concat([length, typed, crc]);
}

/**
 * A complete, valid 1-bit greyscale PNG of the given size: 20,000 × 20,000 is 400 megapixels
 * that deflate to about 50 KB, the shape of a decompression bomb.
 */
export function blankPng(width: number, height: number): Buffer {
  const header = Buffer.alloc(13);
  header.writeUInt32BE(width, 0);
  header.writeUInt32BE(height, 4);
  header[8] = 1; // bit depth
  header[9] = 0; // greyscale
  const rows = Buffer.alloc(height * (1 + Math.ceil(width / 8)));
  return Buffer.concat([
    Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
    pngChunk('IHDR', header),
    pngChunk('IDAT', deflateSync(rows, { level: 9 })),
    pngChunk('IEND', Buffer.alloc(0)),
  ]);
}

export async function truncatedJpeg(): Promise<Buffer> {
  const whole = await plainJpeg(800, 600);
  return whole.subarray(0, Math.floor(whole.length / 2));
}

/**
 * An HEIF file whose image is HEVC-coded, as an iPhone writes it. The prebuilt libvips in sharp
 * decodes only AV1 inside HEIF, so this stands for "a HEIC photo this server cannot read".
 */
export async function heicTheServerCannotRead(): Promise<Buffer> {
  const avif = await sharp({ create: { width: 64, height: 48, channels: 3, background: '#2050c0' } }).avif().toBuffer();
  return Buffer.from(avif.toString('latin1').replaceAll('avif', 'heic').replaceAll('av01', 'hvc1').replaceAll('av1C', 'hvcC'), 'latin1');
}

/** An AV1-coded image in a HEIF container branded "heic": readable, so it is taken and stored as JPEG. */
export async function heifTheServerCanRead(): Promise<Buffer> {
  const avif = await sharp({ create: { width: 64, height: 48, channels: 3, background: '#20c050' } }).avif().toBuffer();
  const bytes = Buffer.from(avif);
  bytes.write('heic', 8, 'latin1');
  return bytes;
}

export const PDF_BYTES = Buffer.from(
  '%PDF-1.4\n1 0 obj<</Type/Catalog/Pages 2 0 R>>endobj\n2 0 obj<</Type/Pages/Kids[3 0 R]/Count 1>>endobj\n3 0 obj<</Type/Page/Parent 2 0 R/MediaBox[0 0 200 200]>>endobj\ntrailer<</Root 1 0 R>>\n%%EOF\n',
);

/** `filenameParam` is put into the header as it is, e.g. `filename*=UTF-8''%07evil.jpg`. */
export function multipartBody(boundary: string, parts: { name: string; value: string | Buffer; filename?: string; filenameParam?: string; type?: string }[]): Uint8Array<ArrayBuffer> {
  const chunks: Buffer[] = [];
  for (const part of parts) {
    const isFile = part.filename !== undefined || part.filenameParam !== undefined;
    const param = part.filenameParam ?? (part.filename !== undefined ? `filename="${part.filename}"` : '');
    const disposition = `form-data; name="${part.name}"${param ? `; ${param}` : ''}`;
    const type = isFile ? `\r\nContent-Type: ${part.type ?? 'application/octet-stream'}` : '';
    chunks.push(Buffer.from(`--${boundary}\r\nContent-Disposition: ${disposition}${type}\r\n\r\n`));
    chunks.push(Buffer.isBuffer(part.value) ? part.value : Buffer.from(part.value));
    chunks.push(Buffer.from('\r\n'));
  }
  chunks.push(Buffer.from(`--${boundary}--\r\n`));
  return new Uint8Array(Buffer.concat(chunks));
}

/** Entries of UPLOADS_DIR/.tmp (none may survive an upload, good or bad). */
export function tempEntries(uploadsDir: string): string[] {
  try {
    return readdirSync(join(uploadsDir, '.tmp'));
  } catch {
    return [];
  }
}

/** Stored files (content-addressed names only). */
export function storedEntries(uploadsDir: string): string[] {
  return readdirSync(uploadsDir).filter((n) => /^[0-9a-f]{64}/.test(n));
}
