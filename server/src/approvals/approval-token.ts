import { createHash, randomBytes } from 'node:crypto';

/** 32 random bytes: 256 bits, far past guessing, written as 43 base64url characters. */
const TOKEN_BYTES = 32;
export const TOKEN_PATTERN = /^[A-Za-z0-9_-]{43}$/;

export function newApprovalToken(): { token: string; hash: string } {
  const token = randomBytes(TOKEN_BYTES).toString('base64url');
  return { token, hash: hashApprovalToken(token) };
}

/** What the database keeps instead of the token: someone who reads it cannot answer for the customer. */
export function hashApprovalToken(token: string): string {
  return createHash('sha256').update(token).digest('hex');
}
