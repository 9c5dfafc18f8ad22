import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { crc32, deflateSync } from 'node:zlib';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { FindingDto, MyDay, SignInAnswer } from '@baytime/shared';
import { SQLITE, type Sqlite } from '../db/database.js';
import { tableDigests } from '../test-support/table-digests.js';
import { DEMO, startTestApp, type TestApp } from '../test-support/test-app.js';
import { FINDINGS_PER_MINUTE } from './finding-rate-limit.js';
import { PhotoStore } from './photo-store.js';

function pngChunk(type: string, data: Buffer): Buffer {
  const length = Buffer.alloc(4);
  length.writeUInt32BE(data.length);
  const body = Buffer.concat([Buffer.from(type, 'latin1'), data]);
  const crc = Buffer.alloc(4);
  crc.writeUInt32BE(crc32(body));
  return Buffer.concat([length, body, crc]);
}

/**
 * A valid 8-bit greyscale PNG of all-black rows, written by hand (PNG specification, 3rd edition,
 * §11.2 IHDR): tiny on the wire, `width × height` bytes once decoded.
 */
function blackPng(width: number, height: number): Buffer {
  const header = Buffer.alloc(13);
  header.writeUInt32BE(width, 0);
  header.writeUInt32BE(height, 4);
  header.set([8, 0, 0, 0, 0], 8); // bit depth 8, greyscale, deflate, adaptive filter, no interlace
  // Each row is a filter-type byte (0, none) and `width` zero samples.
  const rows = deflateSync(Buffer.alloc((width + 1) * height), { level: 9 });
  return Buffer.concat([
    Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
    pngChunk('IHDR', header),
    pngChunk('IDAT', rows),
    pngChunk('IEND', Buffer.alloc(0)),
  ]);
}

describe(PhotoStore.name, () => {
  let sut: TestApp;
  let dana: SignInAnswer;
  let lineId: number;
  const record = (tech: SignInAnswer, line: number, photos: { buffer: Buffer; filename: string }[] = []) => {
    let request = sut
      .http()
      .post(`/api/job-lines/${line}/findings`)
      .auth(tech.accessToken, { type: 'bearer' })
      .field('note', 'Seeping rear main seal')
      .field('severity', 'watch');
    for (const photo of photos)
      request = request.attach('photos', photo.buffer, { filename: photo.filename });
    return request;
  };
  const queuedMail = () =>
    (
      sut.app
        .get<Sqlite>(SQLITE)
        .connection.prepare("select count(*) as n from mail_outbox where status = 'queued'")
        .get() as { n: number }
    ).n;
  const storedFiles = () => readdirSync(sut.config.uploadsDir, { recursive: true }).map(String).sort();
  const lineOf = async (tech: SignInAnswer) =>
    (
      (await sut.http().get('/api/me/day').auth(tech.accessToken, { type: 'bearer' }).expect(200))
        .body as MyDay
    ).lines[0]!.id;

  beforeAll(async () => {
    sut = await startTestApp();
    dana = await sut.badge('1041');
    lineId = await lineOf(dana);
  });
  afterAll(() => sut.close());

  it('refuses a 9999 × 9999 PNG by its pixel count before decoding it: 413, nothing stored', async () => {
    const bomb = blackPng(9999, 9999);
    expect(bomb.length).toBeLessThan(200_000);
    expect(await sharp(bomb).metadata()).toMatchObject({ format: 'png', width: 9999, height: 9999 });
    const before = tableDigests(sut.app);
    const files = storedFiles();
    const { body } = await record(dana, lineId, [{ buffer: bomb, filename: 'bomb.png' }]).expect(413);
    expect(body.message).toBe('Photo 1 is larger than 40 megapixels');
    expect(tableDigests(sut.app)).toEqual(before);
    expect(storedFiles()).toEqual(files);
  });

  it('stores a re-encoded photo: no metadata, nothing after the image end, never the bytes sent', async () => {
    const photo = await sharp({ create: { width: 64, height: 48, channels: 3, background: '#7a3b1e' } })
      .jpeg()
      .withExif({ IFD0: { Copyright: 'Uploader secret', ImageDescription: 'gps and serials' } })
      .toBuffer();
    const tail = Buffer.from('<script>alert(document.cookie)</script>', 'latin1');
    const sent = Buffer.concat([photo, tail]);
    expect((await sharp(sent).metadata()).exif?.toString('latin1')).toContain('Uploader secret');

    const finding = (await record(dana, lineId, [{ buffer: sent, filename: 'seal.jpg' }]).expect(201))
      .body as FindingDto;
    const kept = storedFiles().filter((name) => name.endsWith('.jpg') && !name.endsWith('.preview.jpg'));
    expect(kept).toHaveLength(1);
    const stored = readFileSync(join(sut.config.uploadsDir, kept[0]!));
    expect(stored.equals(sent)).toBe(false);
    expect(stored.includes(tail)).toBe(false);
    // JPEG (ITU-T T.81, Annex B.2.1): the file ends with the EOI marker FF D9 and nothing after it.
    expect([...stored.subarray(-2)]).toEqual([0xff, 0xd9]);
    const { format, width, height, exif, icc, xmp } = await sharp(stored).metadata();
    expect({ format, width, height, exif, icc, xmp }).toEqual({
      format: 'jpeg',
      width: 64,
      height: 48,
      exif: undefined,
      icc: undefined,
      xmp: undefined,
    });
    expect(finding.photos[0]!.sizeBytes).toBe(stored.length);
  });

  it('decodes at most two photos at once, however many uploads arrive together', async () => {
    const store = sut.app.get(PhotoStore);
    const reencode = Reflect.get(store, 'reencode') as (...args: unknown[]) => Promise<unknown>;
    let running = 0;
    let most = 0;
    Reflect.set(store, 'reencode', async (...args: unknown[]) => {
      most = Math.max(most, ++running);
      try {
        return await reencode.apply(store, args);
      } finally {
        running--;
      }
    });
    try {
      const photo = await sharp({ create: { width: 2400, height: 1800, channels: 3, background: '#335577' } })
        .png()
        .toBuffer();
      const techs = await Promise.all(['1042', '1044'].map((badge) => sut.badge(badge)));
      const lines = await Promise.all(techs.map(lineOf));
      const uploads = techs.flatMap((tech, i) =>
        [1, 2, 3].map(() => record(tech, lines[i]!, [{ buffer: photo, filename: 'wide.png' }])),
      );
      const answers = await Promise.all(uploads);
      expect(answers.map((answer) => answer.status)).toEqual([201, 201, 201, 201, 201, 201]);
      expect(most).toBe(2);
    } finally {
      Reflect.set(store, 'reencode', reencode);
    }
  });

  it(`takes ${FINDINGS_PER_MINUTE} findings a minute from one person, then answers 429 and stores nothing`, async () => {
    const jo = await sut.badge('1045');
    const foreman = await sut.signIn(DEMO.foreman);
    const joLine = await lineOf(jo);
    for (let i = 0; i < FINDINGS_PER_MINUTE; i++) await record(jo, joLine).expect(201);
    // Each finding e-mails the advisor in the background; let the sender finish before comparing.
    await expect.poll(queuedMail, { timeout: 10_000 }).toBe(0);
    const before = tableDigests(sut.app);
    const refused = await record(jo, joLine).expect(429);
    expect(refused.body.message).toBe('More than 10 findings in a minute: wait a moment, then send it again');
    expect(Number(refused.headers['retry-after'])).toBeGreaterThan(0);
    expect(tableDigests(sut.app)).toEqual(before);
    // Someone else is not held back by it.
    await sut
      .http()
      .post(`/api/job-lines/${joLine}/findings`)
      .auth(foreman, { type: 'bearer' })
      .field('note', 'Wiper blades torn')
      .field('severity', 'watch')
      .expect(201);
  });
});
