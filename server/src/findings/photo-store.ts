import {
  BadRequestException,
  Inject,
  Injectable,
  NotFoundException,
  PayloadTooLargeException,
  StreamableFile,
} from '@nestjs/common';
import { randomUUID } from 'node:crypto';
import { createReadStream, existsSync, statSync } from 'node:fs';
import { mkdir, rm, writeFile } from 'node:fs/promises';
import { basename, join } from 'node:path';
import {
  FINDING_PHOTO_TYPES,
  MAX_FINDING_PHOTO_BYTES,
  MAX_FINDING_PHOTOS,
  type FindingPhotoType,
} from '@baytime/shared';
import { APP_CONFIG, type AppConfig } from '../config/app-config.js';
import { MAX_PHOTO_MB, type UploadedPhoto } from './photo-upload.js';

export interface CheckedPhoto {
  buffer: Buffer;
  mimeType: FindingPhotoType;
  extension: string;
  preview: Buffer;
}

export interface StoredPhoto {
  storedName: string;
  previewName: string;
  mimeType: FindingPhotoType;
  sizeBytes: number;
}

const PREVIEW_PX = 640;
/** Well above any phone camera; refuses decompression bombs before sharp allocates them. */
const MAX_INPUT_PIXELS = 100_000_000;

/**
 * Finding photos on disk under `uploads/findings/`, named by the server, never by the client. sharp and
 * file-type load with the first photo, not at start-up.
 */
@Injectable()
export class PhotoStore {
  readonly dir: string;

  constructor(@Inject(APP_CONFIG) config: AppConfig) {
    this.dir = join(config.uploadsDir, 'findings');
  }

  /**
   * Checks each photo by its content (magic bytes, then a full decode) and makes its preview. Throws
   * on the first refused photo, naming it; nothing is written.
   */
  async check(photos: UploadedPhoto[]): Promise<CheckedPhoto[]> {
    if (photos.length > MAX_FINDING_PHOTOS)
      throw new BadRequestException(`Up to ${MAX_FINDING_PHOTOS} photos per finding`);
    const checked: CheckedPhoto[] = [];
    for (const [index, photo] of photos.entries()) {
      const n = index + 1;
      if (photo.buffer.length > MAX_FINDING_PHOTO_BYTES)
        throw new PayloadTooLargeException(`Photo ${n} is larger than ${MAX_PHOTO_MB} MB`);
      const sniffed = await (await import('file-type')).fileTypeFromBuffer(photo.buffer);
      const mimeType = FINDING_PHOTO_TYPES.find((type) => type === sniffed?.mime);
      if (!sniffed || !mimeType) throw new BadRequestException(`Photo ${n} is not a JPEG, PNG or WebP image`);
      checked.push({
        buffer: photo.buffer,
        mimeType,
        extension: sniffed.ext,
        preview: await this.preview(photo.buffer, n),
      });
    }
    return checked;
  }

  /** Writes photos and previews under random names; on any failure removes what it wrote. */
  async write(photos: CheckedPhoto[]): Promise<StoredPhoto[]> {
    if (!photos.length) return [];
    await mkdir(this.dir, { recursive: true });
    const written: string[] = [];
    const stored: StoredPhoto[] = [];
    try {
      for (const photo of photos) {
        const id = randomUUID();
        const storedName = `${id}.${photo.extension}`;
        const previewName = `${id}.preview.jpg`;
        await writeFile(join(this.dir, storedName), photo.buffer, { flag: 'wx' });
        written.push(storedName);
        await writeFile(join(this.dir, previewName), photo.preview, { flag: 'wx' });
        written.push(previewName);
        stored.push({ storedName, previewName, mimeType: photo.mimeType, sizeBytes: photo.buffer.length });
      }
    } catch (error) {
      await this.remove(written);
      throw error;
    }
    return stored;
  }

  async remove(names: string[]): Promise<void> {
    await Promise.all(names.map((name) => rm(this.path(name), { force: true })));
  }

  /** The file's place on disk; a name is only ever one the server made, inside the photos folder. */
  path(name: string): string {
    if (basename(name) !== name || name.startsWith('.')) throw new NotFoundException('Photo not found');
    return join(this.dir, name);
  }

  stream(name: string, mimeType: string, downloadName: string): StreamableFile {
    const file = this.path(name);
    if (!existsSync(file)) throw new NotFoundException('The photo file is missing on the server');
    return new StreamableFile(createReadStream(file), {
      type: mimeType,
      length: statSync(file).size,
      disposition: `inline; filename="${downloadName}"`,
    });
  }

  private async preview(buffer: Buffer, n: number): Promise<Buffer> {
    const { default: sharp } = await import('sharp');
    try {
      return await sharp(buffer, { limitInputPixels: MAX_INPUT_PIXELS })
        .rotate()
        .resize({ width: PREVIEW_PX, height: PREVIEW_PX, fit: 'inside', withoutEnlargement: true })
        .flatten({ background: '#ffffff' })
        .jpeg({ quality: 80 })
        .toBuffer();
    } catch {
      throw new BadRequestException(`Photo ${n} could not be read as an image`);
    }
  }
}
