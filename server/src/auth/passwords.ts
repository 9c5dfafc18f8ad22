import { randomBytes, scrypt, timingSafeEqual, type ScryptOptions } from 'node:crypto';

const KEY_LENGTH = 32;
const COST: ScryptOptions = { N: 16384, r: 8, p: 1 };

function derive(secret: string, salt: Buffer, options: ScryptOptions): Promise<Buffer> {
  return new Promise((resolve, reject) =>
    scrypt(secret.normalize('NFKC'), salt, KEY_LENGTH, options, (error, key) =>
      error ? reject(error) : resolve(key),
    ),
  );
}

/** `scrypt$N$r$p$salt$key`, so the cost can rise later without breaking stored hashes. */
export async function hashSecret(secret: string): Promise<string> {
  const salt = randomBytes(16);
  const key = await derive(secret, salt, COST);
  return ['scrypt', COST.N, COST.r, COST.p, salt.toString('base64'), key.toString('base64')].join('$');
}

export async function verifySecret(secret: string, stored: string | null): Promise<boolean> {
  const [scheme, n, r, p, salt, key] = (stored ?? '').split('$');
  if (scheme !== 'scrypt' || !salt || !key) {
    await derive(secret, randomBytes(16), COST); // same work either way: no timing hint
    return false;
  }
  const expected = Buffer.from(key, 'base64');
  const actual = await derive(secret, Buffer.from(salt, 'base64'), {
    N: Number(n),
    r: Number(r),
    p: Number(p),
  });
  return actual.length === expected.length && timingSafeEqual(actual, expected);
}
