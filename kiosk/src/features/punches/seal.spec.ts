// @vitest-environment node
import { constants, generateKeyPairSync, privateDecrypt } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { readIdentityText, type OfflineIdentity } from '@baytime/shared';
import { sealIdentity } from './seal';

describe(sealIdentity.name, () => {
  const { publicKey, privateKey } = generateKeyPairSync('rsa', { modulusLength: 2048 });
  const key = {
    keyId: '0123456789abcdef',
    publicKey: publicKey.export({ format: 'jwk' }) as Record<string, unknown>,
  };
  const identity: OfflineIdentity = {
    badge: '1046',
    pin: '4321',
    id: '00000000-0000-4000-8000-000000000001',
    kind: 'shift-in',
    at: '2026-03-10T13:02:00.000Z',
  };
  const open = (sealed: string) =>
    privateDecrypt(
      { key: privateKey, padding: constants.RSA_PKCS1_OAEP_PADDING, oaepHash: 'sha256' },
      Buffer.from(sealed, 'base64'),
    ).toString('utf8');

  it('seals badge, PIN and punch so that only the private key opens them', async () => {
    const sealed = await sealIdentity(key, identity);
    expect(readIdentityText(open(sealed))).toEqual(identity);
    expect(sealed).not.toContain('4321');
    expect(Buffer.from(sealed, 'base64').toString('latin1')).not.toContain('4321');
  });

  it('comes out different each time, so a sealed PIN cannot be matched against a guess', async () => {
    const [a, b] = [await sealIdentity(key, identity), await sealIdentity(key, identity)];
    expect(a).not.toBe(b);
    expect(open(a)).toBe(open(b));
  });
});
