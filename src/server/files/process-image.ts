import sharp from 'sharp';
import { HttpError } from '~/server/http';
import { withImageSlot } from './image-slots';
import type { ImageFormat } from './sniff-type';

/**
 * 64 megapixels: a 24-MP camera and the 48/50-MP modes of recent phones pass; a decompression
 * bomb (a 20,000 × 20,000 PNG is 400 MP) is refused from its header, before any pixel is decoded.
 */
export const MAX_INPUT_PIXELS = 64_000_000;
export const DISPLAY_LONG_EDGE = 1600;
export const THUMB_LONG_EDGE = 400;

let configured = false;
/**
 * Only the four loaders uploads need stay open; SVG (scripts, external entities), PDF, TIFF,
 * GIF, ImageMagick, OpenSlide, FITS, raw and the rest are blocked for the whole process.
 */
function configureSharp(): void {
  if (configured) return;
  configured = true;
  sharp.block({ operation: ['VipsForeignLoad'] });
  sharp.unblock({ operation: ['VipsForeignLoadJpeg', 'VipsForeignLoadPng', 'VipsForeignLoadWebp', 'VipsForeignLoadHeif'] });
  // Each upload is decoded once; caching decoded images only grows the server's memory.
  sharp.cache(false);
}

export interface Rendition {
  bytes: Buffer;
  ext: 'jpg' | 'png' | 'webp';
  mime: string;
}

export interface ProcessedImage {
  original: Rendition;
  display: Rendition;
  thumb: Rendition;
  width: number;
  height: number;
}

const HEIC_UNREADABLE =
  'This HEIC photo cannot be read here. Export the photo as JPEG (on an iPhone: Settings → Camera → Formats → Most Compatible, or share it as JPEG) and upload it again.';
const INCOMPLETE = 'The file is incomplete; upload it again.';

/**
 * Re-encodes an uploaded photo with its orientation applied and every piece of metadata (EXIF,
 * GPS, camera serial, XMP, IPTC, comments) left behind; colour is converted to sRGB. The stored
 * "original" is this re-encoded image at full size, in the same format (HEIC becomes JPEG,
 * which every browser shows), so the camera's metadata never reaches the disk.
 */
export async function processImage(path: string, format: ImageFormat): Promise<ProcessedImage> {
  configureSharp();
  return withImageSlot(async () => {
    const meta = await readHeader(path, format);
    const pixels = meta.width * meta.height;
    if (pixels > MAX_INPUT_PIXELS) {
      const mp = (n: number) => Math.round(n / 1_000_000);
      throw new HttpError(
        422,
        `The image is ${meta.width} × ${meta.height} pixels (${mp(pixels)} megapixels); the limit is ${mp(MAX_INPUT_PIXELS)} megapixels. Resize it and upload it again.`,
        'file',
      );
    }
    const input = () => sharp(path, { limitInputPixels: MAX_INPUT_PIXELS, failOn: 'truncated', sequentialRead: true }).rotate();
    try {
      const { rendition: original, width, height } = await encodeOriginal(input(), format);
      const display = await input()
        .resize(DISPLAY_LONG_EDGE, DISPLAY_LONG_EDGE, { fit: 'inside', withoutEnlargement: true })
        .webp({ quality: 80, effort: 2 })
        .toBuffer();
      const thumb = await sharp(display).resize(THUMB_LONG_EDGE, THUMB_LONG_EDGE, { fit: 'inside', withoutEnlargement: true }).webp({ quality: 72, effort: 2 }).toBuffer();
      return {
        original,
        display: { bytes: display, ext: 'webp', mime: 'image/webp' },
        thumb: { bytes: thumb, ext: 'webp', mime: 'image/webp' },
        width,
        height,
      };
    } catch (err) {
      throw decodeError(err, format);
    }
  });
}

async function readHeader(path: string, format: ImageFormat): Promise<sharp.Metadata & { width: number; height: number }> {
  try {
    // The header alone: no pixels are decoded, so the size check costs nothing for a bomb.
    const meta = await sharp(path, { limitInputPixels: false }).metadata();
    if (!meta.width || !meta.height) throw new Error('no dimensions');
    return meta as sharp.Metadata & { width: number; height: number };
  } catch (err) {
    throw decodeError(err, format);
  }
}

async function encodeOriginal(pipeline: sharp.Sharp, format: ImageFormat): Promise<{ rendition: Rendition; width: number; height: number }> {
  const [encoded, ext, mime] =
    format === 'png'
      ? [pipeline.png({ compressionLevel: 6 }), 'png' as const, 'image/png']
      : format === 'webp'
        ? [pipeline.webp({ quality: 90 }), 'webp' as const, 'image/webp']
        : [pipeline.jpeg({ quality: 90 }), 'jpg' as const, 'image/jpeg'];
  const { data, info } = await encoded.toBuffer({ resolveWithObject: true });
  return { rendition: { bytes: data, ext, mime }, width: info.width, height: info.height };
}

/** libvips errors become answers a person can act on; the sentences never echo internals. */
function decodeError(err: unknown, format: ImageFormat): unknown {
  if (err instanceof HttpError) return err;
  const message = err instanceof Error ? err.message : String(err);
  if (/no space left|ENOSPC/i.test(message)) return err;
  if (format === 'heif') return new HttpError(415, HEIC_UNREADABLE, 'file');
  if (/pixel limit/i.test(message)) return new HttpError(422, `The image has more than ${MAX_INPUT_PIXELS / 1_000_000} megapixels. Resize it and upload it again.`, 'file');
  return new HttpError(422, INCOMPLETE, 'file');
}
