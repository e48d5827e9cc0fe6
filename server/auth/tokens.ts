import { createHash, randomBytes } from 'node:crypto';

/** 256-bit random token for links (invite, reset), URL-safe. */
export function newToken(): string {
  return randomBytes(32).toString('base64url');
}

/** Tokens are stored only as their SHA-256, so a database leak does not hand out links. */
export function hashToken(token: string): string {
  return createHash('sha256').update(token).digest('hex');
}
