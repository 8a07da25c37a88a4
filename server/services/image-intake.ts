import { Jimp } from 'jimp';

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
const THUMB = { w: 360, h: 240 };

export interface ReencodedImage {
  image: Buffer;
  thumbnail: Buffer;
  contentType: 'image/png' | 'image/jpeg';
  extension: 'png' | 'jpg';
  width: number;
  height: number;
}

/**
 * Decodes and re-encodes the screenshot, which drops every metadata block (EXIF, GPS, comments),
 * and makes a thumbnail. JPEG stays JPEG; PNG, GIF (first frame) and BMP become PNG.
 * Returns null when the bytes do not decode as the image they claim to be.
 */
export async function reencodeImage(bytes: Buffer, format: ImageFormat): Promise<ReencodedImage | 'too_many_pixels' | null> {
  let img: Awaited<ReturnType<typeof Jimp.read>>;
  try {
    img = await Jimp.read(bytes);
  } catch {
    return null;
  }
  const { width, height } = img.bitmap;
  if (width * height > MAX_IMAGE_PIXELS) return 'too_many_pixels';
  const jpeg = format === 'jpeg';
  const mime = jpeg ? 'image/jpeg' : 'image/png';
  const encode = (i: typeof img) => (jpeg ? i.getBuffer('image/jpeg', { quality: 88 }) : i.getBuffer('image/png'));
  const image = await encode(img);
  const thumb = img.clone();
  if (width > THUMB.w || height > THUMB.h) thumb.scaleToFit({ w: THUMB.w, h: THUMB.h });
  const thumbnail = await encode(thumb);
  return { image, thumbnail, contentType: mime, extension: jpeg ? 'jpg' : 'png', width, height };
}
