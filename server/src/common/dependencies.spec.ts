import { FileTypeValidator } from '@nestjs/common';
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { dirname, join } from 'node:path';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { MyDay } from '@baytime/shared';
import { startTestApp, type TestApp } from '../test-support/test-app.js';

const repoRoot = join(dirname(new URL(import.meta.url).pathname), '../../..');
const rootPackage = JSON.parse(readFileSync(join(repoRoot, 'package.json'), 'utf8')) as {
  overrides: Record<string, string>;
};

/** The package.json of `name` as `from` resolves it, which is what runs. */
function resolvedPackage(name: string, from: string): { version: string; engines?: { node?: string } } {
  const fromRequire = createRequire(createRequire(import.meta.url).resolve(`${from}/package.json`));
  const entry = fromRequire.resolve(name);
  let dir = dirname(entry);
  while (!dir.endsWith(`node_modules/${name}`)) dir = dirname(dir);
  return JSON.parse(readFileSync(join(dir, 'package.json'), 'utf8')) as { version: string };
}

describe('file-type under Node 20', () => {
  let sut: TestApp;
  let png: Buffer;

  beforeAll(async () => {
    sut = await startTestApp();
    png = await sharp({ create: { width: 64, height: 48, channels: 3, background: '#2c6aa0' } })
      .png()
      .toBuffer();
  });
  afterAll(() => sut.close());

  it('is the overridden version for Nest too, one that declares this Node', () => {
    const nests = resolvedPackage('file-type', '@nestjs/common');
    expect(nests.version).toBe(rootPackage.overrides['file-type']);
    expect(nests.engines?.node).toBe('>=20');
  });

  it("lets Nest's file type validator read a PNG by its magic bytes", async () => {
    const validator = new FileTypeValidator({ fileType: 'image/png' });
    const file = { buffer: png, mimetype: 'image/png', size: png.length } as Express.Multer.File;
    expect(await validator.isValid(file)).toBe(true);
    const text = Buffer.from('not a picture at all, only words');
    expect(await validator.isValid({ ...file, buffer: text, size: text.length })).toBe(false);
  });

  it('takes a finding photo uploaded over HTTP and sniffs its type', async () => {
    const dana = await sut.badge('1041');
    const day = (await sut.http().get('/api/me/day').auth(dana.accessToken, { type: 'bearer' }).expect(200))
      .body as MyDay;
    const response = await sut
      .http()
      .post(`/api/job-lines/${day.lines[0]!.id}/findings`)
      .auth(dana.accessToken, { type: 'bearer' })
      .field('note', 'Seal weeping at the pan')
      .field('severity', 'soon')
      .attach('photos', png, { filename: 'pan.png', contentType: 'application/octet-stream' })
      .expect(201);
    expect((response.body as { photos: { mimeType: string }[] }).photos.map((p) => p.mimeType)).toEqual([
      'image/png',
    ]);
  });
});
