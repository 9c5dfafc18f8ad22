import { Inject, Injectable } from '@nestjs/common';
import {
  constants,
  createHash,
  createPrivateKey,
  createPublicKey,
  generateKeyPairSync,
  privateDecrypt,
  type KeyObject,
} from 'node:crypto';
import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import type { OfflineKeyDto } from '@baytime/shared';
import { APP_CONFIG, type AppConfig } from '../config/app-config.js';

const KEY_FILE = 'kiosk-offline-key.pem';

/**
 * The key kiosks seal a typed badge and PIN to while the server is out of reach. Only the public half
 * goes to the tablets, so nothing on a tablet lets anyone check a PIN guess offline; only this server
 * can open what they sealed. Made once and kept in the data dir beside the JWT secret.
 */
@Injectable()
export class OfflineKeyService {
  private key: { privateKey: KeyObject; dto: OfflineKeyDto } | null = null;

  constructor(@Inject(APP_CONFIG) private readonly config: AppConfig) {}

  publicKey(): OfflineKeyDto {
    return this.loaded().dto;
  }

  /** The sealed text, or null when it was not sealed to this server's current key. */
  open(keyId: string, sealed: string): string | null {
    const { privateKey, dto } = this.loaded();
    if (keyId !== dto.keyId) return null;
    try {
      return privateDecrypt(
        { key: privateKey, padding: constants.RSA_PKCS1_OAEP_PADDING, oaepHash: 'sha256' },
        Buffer.from(sealed, 'base64'),
      ).toString('utf8');
    } catch {
      return null;
    }
  }

  private loaded(): { privateKey: KeyObject; dto: OfflineKeyDto } {
    if (this.key) return this.key;
    const file = join(this.config.dataDir, KEY_FILE);
    if (!existsSync(file)) {
      const { privateKey } = generateKeyPairSync('rsa', { modulusLength: 3072 });
      writeFileSync(file, privateKey.export({ type: 'pkcs8', format: 'pem' }), { mode: 0o600 });
    }
    const privateKey = createPrivateKey(readFileSync(file));
    const publicKey = createPublicKey(privateKey);
    const der = publicKey.export({ type: 'spki', format: 'der' });
    const keyId = createHash('sha256').update(der).digest('hex').slice(0, 16);
    const jwk = publicKey.export({ format: 'jwk' });
    this.key = {
      privateKey,
      dto: { keyId, publicKey: { ...jwk, alg: 'RSA-OAEP-256', use: 'enc', ext: true, key_ops: ['encrypt'] } },
    };
    return this.key;
  }
}
