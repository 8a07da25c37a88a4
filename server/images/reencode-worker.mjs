// Runs in a worker thread (plain JavaScript, so node loads it under tsx, vitest and the compiled
// server alike). Decodes a screenshot whose header dimensions were already checked, re-encodes it
// (which drops EXIF, GPS and comments) and makes a thumbnail.
import { Jimp } from 'jimp';

const THUMB = { w: 360, h: 240 };

/** @param {{ bytes: Uint8Array, jpeg: boolean }} task */
export default async function reencode({ bytes, jpeg }) {
  let img;
  try {
    img = await Jimp.read(Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength));
  } catch {
    return null;
  }
  const { width, height } = img.bitmap;
  const encode = (i) => (jpeg ? i.getBuffer('image/jpeg', { quality: 88 }) : i.getBuffer('image/png'));
  const image = await encode(img);
  const thumb = img.clone();
  if (width > THUMB.w || height > THUMB.h) thumb.scaleToFit({ w: THUMB.w, h: THUMB.h });
  const thumbnail = await encode(thumb);
  return { image, thumbnail, width, height };
}
