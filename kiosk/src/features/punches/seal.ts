import { identityText, type OfflineIdentity, type OfflineKeyDto } from '@baytime/shared';

export const NEEDS_SECURE_PAGE =
  'Offline punches need the kiosk opened over HTTPS (or on the server itself): ask the owner.';

/**
 * Seals the typed badge and PIN, bound to one punch, to the server's public key (RSA-OAEP, SHA-256):
 * only the server can open it. Nothing kept on the tablet lets anyone test a PIN: no hash, no key that
 * opens it, and each sealing comes out different.
 */
export async function sealIdentity(key: OfflineKeyDto, identity: OfflineIdentity): Promise<string> {
  const subtle = globalThis.crypto?.subtle;
  if (!subtle) throw new Error(NEEDS_SECURE_PAGE);
  const publicKey = await subtle.importKey(
    'jwk',
    { ...key.publicKey, key_ops: ['encrypt'] } as JsonWebKey,
    { name: 'RSA-OAEP', hash: 'SHA-256' },
    false,
    ['encrypt'],
  );
  const sealed = await subtle.encrypt(
    { name: 'RSA-OAEP' },
    publicKey,
    new TextEncoder().encode(identityText(identity)),
  );
  let binary = '';
  for (const byte of new Uint8Array(sealed)) binary += String.fromCharCode(byte);
  return btoa(binary);
}
