import { createHash, randomBytes } from 'node:crypto';

/** A URL-safe single-use token; only its SHA-256 is stored, so a leaked table opens nothing. */
export function createToken(): { token: string; tokenHash: string } {
  const token = randomBytes(32).toString('base64url');
  return { token, tokenHash: hashToken(token) };
}

export function hashToken(token: string): string {
  return createHash('sha256').update(token).digest('hex');
}
