import { createHash, randomBytes, timingSafeEqual } from 'node:crypto';
import bcrypt from 'bcryptjs';

/** A random token for links and refresh cookies (256 bits, base64url). */
export function newToken(): string {
  return randomBytes(32).toString('base64url');
}

/** Tokens are stored only as this hash, so a copy of the database gives no working links. */
export function tokenHash(token: string): string {
  return createHash('sha256').update(token).digest('hex');
}

export function sameHash(a: string, b: string): boolean {
  const x = Buffer.from(a, 'hex');
  const y = Buffer.from(b, 'hex');
  return x.length === y.length && timingSafeEqual(x, y);
}

export function hashPassword(password: string, cost: number): Promise<string> {
  return bcrypt.hash(password, cost);
}

const dummyHashes = new Map<number, Promise<string>>();

/**
 * Compares a password with a bcrypt hash. Without a hash (no such account) it compares against a throwaway hash
 * of the same cost, so that an unknown e-mail takes as long to refuse as a wrong password.
 */
export async function passwordMatches(password: string, hash: string | null, cost: number): Promise<boolean> {
  if (hash) return bcrypt.compare(password, hash);
  let dummy = dummyHashes.get(cost);
  if (!dummy) dummyHashes.set(cost, (dummy = bcrypt.hash(newToken(), cost)));
  await bcrypt.compare(password, await dummy);
  return false;
}
