import { imageSize } from 'image-size';
import { AppError } from '../errors';
import { imageWorkers } from '../images/image-pool';

export type ImageFormat = 'png' | 'jpeg' | 'gif' | 'bmp';

/** The image format from the file's first bytes (its magic number), or null. Names and declared types are ignored. */
export function sniffImage(head: Buffer): ImageFormat | null {
  if (head.length >= 8 && head.subarray(0, 8).equals(Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]))) return 'png';
  if (head.length >= 3 && head[0] === 0xff && head[1] === 0xd8 && head[2] === 0xff) return 'jpeg';
  if (head.length >= 6 && /^GIF8[79]a$/.test(head.subarray(0, 6).toString('latin1'))) return 'gif';
  if (head.length >= 14 && head[0] === 0x42 && head[1] === 0x4d) return 'bmp';
  return null;
}

export const MAX_IMAGE_PIXELS = 60_000_000;

export interface ReencodedImage {
  image: Buffer;
  thumbnail: Buffer;
  contentType: 'image/png' | 'image/jpeg';
  extension: 'png' | 'jpg';
  width: number;
  height: number;
}

/** Width and height as the file's header states them (PNG IHDR, JPEG SOF, GIF, BMP), without decoding; null when unreadable. */
export function headerSize(bytes: Buffer): { width: number; height: number } | null {
  try {
    const { width, height } = imageSize(bytes);
    return width && height ? { width, height } : null;
  } catch {
    return null;
  }
}

/**
 * Checks the header's dimensions, then decodes and re-encodes the screenshot in a worker, which
 * drops every metadata block (EXIF, GPS, comments), and makes a thumbnail. JPEG stays JPEG; PNG,
 * GIF (first frame) and BMP become PNG. A pixel bomb is refused from its header, before any
 * decoding. Returns null when the bytes do not decode as the image they claim to be.
 */
export async function reencodeImage(bytes: Buffer, format: ImageFormat): Promise<ReencodedImage | 'too_many_pixels' | null> {
  const size = headerSize(bytes);
  if (!size) return null;
  if (size.width * size.height > MAX_IMAGE_PIXELS) return 'too_many_pixels';
  const jpeg = format === 'jpeg';
  let done;
  try {
    done = await imageWorkers.reencode(bytes, jpeg);
  } catch (err) {
    if (/queue/i.test((err as Error).message)) throw new AppError('rate_limited', 'The server is busy with other images; try again in a minute');
    throw new AppError('too_large', `The image could not be decoded within the server's memory limit (${(err as Error).message}); scale it down first`);
  }
  if (!done) return null;
  // the header may lie; the decoded bitmap is what counts
  if (done.width * done.height > MAX_IMAGE_PIXELS) return 'too_many_pixels';
  return {
    image: Buffer.from(done.image),
    thumbnail: Buffer.from(done.thumbnail),
    contentType: jpeg ? 'image/jpeg' : 'image/png',
    extension: jpeg ? 'jpg' : 'png',
    width: done.width,
    height: done.height,
  };
}
