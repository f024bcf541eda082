import sharp from 'sharp';
import { photoLimits } from '@shared/schemas/publishing';
import { HttpError } from '../errors';

/** Image formats accepted for photos, recognised by their first bytes (never by name or declared type). */
const SIGNATURES: { format: 'jpeg' | 'png' | 'webp' | 'tiff'; test: (b: Buffer) => boolean }[] = [
  { format: 'jpeg', test: (b) => b.length > 3 && b[0] === 0xff && b[1] === 0xd8 && b[2] === 0xff },
  { format: 'png', test: (b) => b.length > 8 && b.subarray(0, 8).equals(Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a])) },
  { format: 'webp', test: (b) => b.length > 12 && b.toString('latin1', 0, 4) === 'RIFF' && b.toString('latin1', 8, 12) === 'WEBP' },
  { format: 'tiff', test: (b) => b.length > 4 && (b.toString('latin1', 0, 4) === 'II*\0' || b.toString('latin1', 0, 4) === 'MM\0*') },
];

const unsupported = (message: string) => new HttpError(415, 'unsupported_media_type', message, [{ path: 'photo', message }]);

/** A photo as stored: the re-encoded image and its thumbnail (JPEG, no metadata), with the image's size in pixels. */
export interface ProcessedPhoto {
  image: Buffer;
  thumb: Buffer;
  width: number;
  height: number;
}

/** Longest side of the stored image and of its thumbnail, px. */
const IMAGE_MAX_PX = 2400;
const THUMB_MAX_PX = 400;

/**
 * Checks an upload by content (JPEG, PNG, WebP or TIFF signature, confirmed by sharp's own
 * reading; SVG and everything else refused), then re-encodes it with sharp: turned upright by
 * its EXIF orientation, scaled to fit 2400 px, written as a fresh JPEG. sharp writes no input
 * metadata unless asked to, so EXIF (GPS included), XMP and IPTC are gone. Decoding stops at
 * 50 megapixels (`limitInputPixels`), so a small file cannot expand into a huge image.
 */
export async function processPhoto(upload: Buffer): Promise<ProcessedPhoto> {
  const signature = SIGNATURES.find((s) => s.test(upload));
  if (!signature) throw unsupported('The file is not a JPEG, PNG, WebP or TIFF image (checked by its content, not its name).');
  const input = () => sharp(upload, { limitInputPixels: photoLimits.pixelsMax, failOn: 'error' });
  let format: string | undefined;
  try {
    format = (await input().metadata()).format;
  } catch {
    throw unsupported('The image could not be read; it may be damaged.');
  }
  if (format !== signature.format) throw unsupported('The file’s content does not match an image format we accept.');
  try {
    const upright = await input()
      .rotate()
      .flatten({ background: '#ffffff' })
      .resize({ width: IMAGE_MAX_PX, height: IMAGE_MAX_PX, fit: 'inside', withoutEnlargement: true })
      .jpeg({ quality: 85, mozjpeg: true })
      .toBuffer({ resolveWithObject: true });
    const thumb = await sharp(upright.data).resize({ width: THUMB_MAX_PX, height: THUMB_MAX_PX, fit: 'inside', withoutEnlargement: true }).jpeg({ quality: 78, mozjpeg: true }).toBuffer();
    return { image: upright.data, thumb, width: upright.info.width, height: upright.info.height };
  } catch (err) {
    const message = String((err as Error).message ?? '');
    if (/pixel limit/i.test(message)) throw new HttpError(413, 'too_large', `The image has more than ${photoLimits.pixelsMax / 1e6} megapixels.`, [{ path: 'photo', message: 'too many pixels' }]);
    throw unsupported('The image could not be read; it may be damaged.');
  }
}
