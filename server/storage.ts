import { randomUUID } from 'node:crypto';
import { mkdirSync } from 'node:fs';
import { rm } from 'node:fs/promises';
import path from 'node:path';
import type { Config } from './config';

/** Uploaded files live in DATA_DIR/uploads under random names; multer's partial files in uploads/incoming. */
export function storagePaths(config: Config) {
  const uploadsDir = path.join(config.dataDir, 'uploads');
  const incomingDir = path.join(uploadsDir, 'incoming');
  mkdirSync(incomingDir, { recursive: true });
  return {
    uploadsDir,
    incomingDir,
    fileFor: (storageName: string) => path.join(uploadsDir, path.basename(storageName)),
    newName: (extension: string) => `${randomUUID()}.${extension}`,
    // a capture's compact samples for plots live beside it (`<name>.plot`) and go with it
    remove: async (storageName: string) => {
      const file = path.join(uploadsDir, path.basename(storageName));
      await rm(file, { force: true });
      await rm(`${file}.plot`, { recursive: true, force: true });
    },
  };
}
export type StoragePaths = ReturnType<typeof storagePaths>;
