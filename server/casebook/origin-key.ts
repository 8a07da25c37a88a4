import { createHash } from 'node:crypto';

/**
 * The key that says "this is the same case" across casebooks: its author's e-mail and the moment
 * it was created, hashed. Record numbers differ between casebooks and are not used. A case written
 * here derives its key when exported; an imported case stores the key it came with, so the key
 * survives even if the author's address changes later in this casebook.
 */
export function caseOriginKey(authorEmail: string, createdAt: string): string {
  return createHash('sha256').update(`falsetrace-case\n${authorEmail.trim().toLowerCase()}\n${createdAt}`).digest('hex');
}
