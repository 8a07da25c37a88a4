import { rm } from 'node:fs/promises';
import { Transform, type Readable } from 'node:stream';
import type { Request } from 'express';
import multer, { type StorageEngine } from 'multer';
import { AppError } from '../errors';
import { IMAGE_LIMIT_BYTES } from '../services/attachments';
import { sniffImage } from '../services/image-intake';

// Names and types of pictures; a picture under any name is also known by its first bytes.
const IMAGE_EXTENSIONS = new Set(['png', 'jpg', 'jpeg', 'jpe', 'gif', 'bmp', 'webp', 'tif', 'tiff', 'heic', 'avif']);
// Enough of the head for every magic number sniffImage knows.
const HEAD_BYTES = 16;

type UploadFile = Express.Multer.File & { namedImage?: boolean };

/** multer's fileFilter: notes whether the part's name or declared type says it is a picture (every part is accepted). */
export function markNamedImages(_req: Request, file: UploadFile, cb: multer.FileFilterCallback) {
  const ext = file.originalname.toLowerCase().match(/\.([a-z0-9]+)$/)?.[1] ?? '';
  file.namedImage = IMAGE_EXTENSIONS.has(ext) || /^image\//i.test(file.mimetype);
  cb(null, true);
}

export const imageTooLarge = () =>
  new AppError('too_large', `Screenshots are limited to ${IMAGE_LIMIT_BYTES / 1048576} MB; this image was refused while it was still arriving, after its first ${IMAGE_LIMIT_BYTES / 1048576} MB`);

/**
 * Counts the bytes of a part on their way to disk and fails the upload as soon as a picture
 * (by name, declared type or first bytes) passes the screenshot limit, instead of letting it
 * fill the disk up to the much larger capture limit first.
 */
function imageByteCounter(namedImage: boolean, limitBytes: number): Transform {
  let bytes = 0;
  let head: Buffer | null = namedImage ? null : Buffer.alloc(0);
  let image = namedImage;
  return new Transform({
    transform(chunk: Buffer, _enc, done) {
      bytes += chunk.length;
      if (head !== null) {
        head = Buffer.concat([head, chunk.subarray(0, HEAD_BYTES)]).subarray(0, HEAD_BYTES);
        if (head.length >= HEAD_BYTES) {
          image = sniffImage(head) !== null;
          head = null;
        }
      }
      if (image && bytes > limitBytes) return done(imageTooLarge());
      done(null, chunk);
    },
  });
}

/** multer's disk storage, with the screenshot limit enforced on the stream. */
export function imageLimitedStorage(destination: string, limitBytes = IMAGE_LIMIT_BYTES): StorageEngine {
  const disk = multer.diskStorage({ destination });
  return {
    _handleFile(req, file: UploadFile, cb) {
      const source = file.stream as Readable;
      const counted = imageByteCounter(file.namedImage === true, limitBytes);
      counted.once('error', () => {
        // let the rest of the part flow past, so the request ends and the 413 is read
        source.unpipe(counted);
        source.resume();
      });
      source.pipe(counted);
      Object.defineProperty(file, 'stream', { configurable: true, enumerable: false, value: counted });
      disk._handleFile(req, file, (err, info) => {
        if (!err) return cb(null, info);
        // multer removes only files stored whole; the part written so far is ours to remove
        const partial = file.path;
        void (partial ? rm(partial, { force: true }) : Promise.resolve()).finally(() => cb(err));
      });
    },
    _removeFile: (req, file, cb) => disk._removeFile(req, file, cb),
  };
}
