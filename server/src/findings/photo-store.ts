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
import pLimit from 'p-limit';
import type { Sharp } from 'sharp';
import {
  FINDING_PHOTO_TYPES,
  MAX_FINDING_PHOTO_BYTES,
  MAX_FINDING_PHOTOS,
  type FindingPhotoType,
} from '@baytime/shared';
import { APP_CONFIG, type AppConfig } from '../config/app-config.js';
import { MAX_PHOTO_MB, type UploadedPhoto } from './photo-upload.js';

export interface CheckedPhoto {
  /** The photo re-encoded without its metadata, so nothing the client sent is kept byte for byte. */
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
/**
 * Phone photos under the 10 MB limit are mostly 12 to 24 MP (from memory). A 9999 × 9999 PNG is only
 * 300 KB but decodes to 300 MB: the header's size is checked before any decode.
 */
export const MAX_PHOTO_MEGAPIXELS = 40;
const MAX_INPUT_PIXELS = MAX_PHOTO_MEGAPIXELS * 1_000_000;
/** Photos decoded at once, whatever the number of uploads: each decode takes a core and its pixels in memory. */
const IMAGE_WORK_AT_ONCE = 2;

/**
 * Finding photos on disk under `uploads/findings/`, named by the server, never by the client. sharp and
 * file-type load with the first photo, not at start-up.
 */
@Injectable()
export class PhotoStore {
  readonly dir: string;
  private readonly imageWork = pLimit(IMAGE_WORK_AT_ONCE);

  constructor(@Inject(APP_CONFIG) config: AppConfig) {
    this.dir = join(config.uploadsDir, 'findings');
  }

  /**
   * Checks each photo by its content (magic bytes, pixel count, then a full decode), re-encodes it and
   * makes its preview. Throws on the first refused photo, naming it; nothing is written.
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
      const { buffer, preview } = await this.imageWork(() => this.reencode(photo.buffer, mimeType, n));
      checked.push({ buffer, mimeType, extension: sniffed.ext, preview });
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

  /**
   * The photo decoded and written again in its own format, turned upright, with no metadata (sharp
   * keeps none unless asked) and nothing after the image data; and its preview.
   */
  private async reencode(
    input: Buffer,
    mimeType: FindingPhotoType,
    n: number,
  ): Promise<{ buffer: Buffer; preview: Buffer }> {
    const sharp = await loadSharp();
    const { width = 0, height = 0 } = await sharp(input)
      .metadata()
      .catch(() => ({ width: 0, height: 0 }));
    if (width * height > MAX_INPUT_PIXELS)
      throw new PayloadTooLargeException(`Photo ${n} is larger than ${MAX_PHOTO_MEGAPIXELS} megapixels`);
    try {
      const image = sharp(input, { limitInputPixels: MAX_INPUT_PIXELS }).rotate();
      const [buffer, preview] = await Promise.all([
        encodeAs(image.clone(), mimeType).toBuffer(),
        image
          .clone()
          .resize({ width: PREVIEW_PX, height: PREVIEW_PX, fit: 'inside', withoutEnlargement: true })
          .flatten({ background: '#ffffff' })
          .jpeg({ quality: 80 })
          .toBuffer(),
      ]);
      return { buffer, preview };
    } catch {
      throw new BadRequestException(`Photo ${n} could not be read as an image`);
    }
  }
}

let sharpLoaded: Promise<typeof import('sharp').default> | null = null;

/**
 * sharp loads with the first photo, so start-up stays quick. Each photo is read once: libvips'
 * operation cache would only keep decoded images in memory.
 */
function loadSharp(): Promise<typeof import('sharp').default> {
  sharpLoaded ??= import('sharp').then(({ default: sharp }) => {
    sharp.cache(false);
    return sharp;
  });
  return sharpLoaded;
}

function encodeAs(image: Sharp, mimeType: FindingPhotoType): Sharp {
  switch (mimeType) {
    case 'image/jpeg':
      return image.jpeg({ quality: 90 });
    case 'image/png':
      return image.png();
    case 'image/webp':
      return image.webp({ quality: 90 });
  }
}
