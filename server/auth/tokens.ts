import { createHash, randomBytes } from 'node:crypto';

/** A URL-safe random token for a mailed link, and the hash that is stored instead of it. */
export function newLinkToken(): { token: string; tokenHash: string } {
  const token = randomBytes(32).toString('base64url');
  return { token, tokenHash: hashLinkToken(token) };
}

export const hashLinkToken = (token: string) => createHash('sha256').update(token).digest('hex');
