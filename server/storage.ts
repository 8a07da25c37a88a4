import { randomUUID } from 'node:crypto';
import { mkdirSync } from 'node:fs';
import { rm } from 'node:fs/promises';
import path from 'node:path';
import { copyFileAtomic, moveFileAtomic, writeFileAtomic } from './atomic-file';
import type { Config } from './config';

/** UPLOADS_DIR when set (a folder every instance shares), else DATA_DIR/uploads. */
export const uploadsDirOf = (config: Pick<Config, 'dataDir' | 'uploadsDir'>) => config.uploadsDir ?? path.join(config.dataDir, 'uploads');

/**
 * Uploaded files live in the uploads folder under random names; multer's partial files in its
 * incoming/ folder. Every final name is written atomically (see atomic-file.ts), so another
 * instance never serves half a file.
 */
export function storagePaths(config: Pick<Config, 'dataDir' | 'uploadsDir'>) {
  const uploadsDir = uploadsDirOf(config);
  const incomingDir = path.join(uploadsDir, 'incoming');
  mkdirSync(incomingDir, { recursive: true });
  const fileFor = (storageName: string) => path.join(uploadsDir, path.basename(storageName));
  return {
    uploadsDir,
    incomingDir,
    fileFor,
    newName: (extension: string) => `${randomUUID()}.${extension}`,
    // a capture's compact samples for plots live beside it (`<name>.plot`) and go with it
    remove: async (storageName: string) => {
      const file = fileFor(storageName);
      await rm(file, { force: true });
      await rm(`${file}.plot`, { recursive: true, force: true });
    },
    /** Stores bytes under `storageName`. */
    write: (storageName: string, data: Uint8Array) => writeFileAtomic(fileFor(storageName), data),
    /** Moves a finished file (an upload in incoming/) under `storageName`. */
    moveIn: (source: string, storageName: string) => moveFileAtomic(source, fileFor(storageName)),
    /** Copies a file (an unpacked archive entry) under `storageName`. */
    copyIn: (source: string, storageName: string) => copyFileAtomic(source, fileFor(storageName)),
  };
}
export type StoragePaths = ReturnType<typeof storagePaths>;
