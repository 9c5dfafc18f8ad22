import { readdirSync } from 'node:fs';
import sharp from 'sharp';
import { and, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  CONCERN_MAX_LENGTH,
  type BoardSnapshot,
  type FindingAnswerResult,
  type FindingDto,
  type MyDay,
  type MyJobLine,
  type SignInAnswer,
} from '@baytime/shared';
import { countRows, DB, type Db } from '../db/database.js';
import { attachments, auditLog, findings, jobLines } from '../db/schema/index.js';
import { DEMO, nextEvent, startTestApp, type TestApp } from '../test-support/test-app.js';
import { concernFromNote, titleFromNote } from './finding-words.js';
import { FindingsService } from './findings.service.js';

interface Photo {
  buffer: Buffer;
  filename: string;
  contentType: string;
}

describe(FindingsService.name, () => {
  let sut: TestApp;
  let db: Db;
  let advisor: string;
  let foreman: string;
  let dana: SignInAnswer;
  let sam: SignInAnswer;
  let danaLine: MyJobLine;
  let png: Buffer;
  let jpeg: Buffer;

  const as = (token: string) => ({
    get: (path: string) => sut.http().get(path).auth(token, { type: 'bearer' }),
    post: (path: string, body: object = {}) =>
      sut.http().post(path).auth(token, { type: 'bearer' }).send(body),
  });
  /** A multipart finding, as the kiosk sends it. */
  const record = (token: string, lineId: number, fields: Record<string, string>, photos: Photo[] = []) => {
    let request = sut.http().post(`/api/job-lines/${lineId}/findings`).auth(token, { type: 'bearer' });
    for (const [name, value] of Object.entries(fields)) request = request.field(name, value);
    for (const photo of photos)
      request = request.attach('photos', photo.buffer, {
        filename: photo.filename,
        contentType: photo.contentType,
      });
    return request;
  };
  const pngPhoto = (filename = 'pan-magnet.png'): Photo => ({
    buffer: png,
    filename,
    contentType: 'image/png',
  });
  const storedFiles = () =>
    readdirSync(sut.config.uploadsDir, { recursive: true, withFileTypes: true })
      .filter((entry) => entry.isFile())
      .map((entry) => entry.name)
      .sort();
  const stored = () => ({
    findings: countRows(db, findings),
    attachments: countRows(db, attachments),
    files: storedFiles(),
  });
  const board = async () => (await as(foreman).get('/api/board').expect(200)).body as BoardSnapshot;
  const bayOf = async (lineId: number) => (await board()).bays.find((bay) => bay.jobLine?.id === lineId);
  const lineRow = (id: number) => db.select().from(jobLines).where(eq(jobLines.id, id)).get()!;

  beforeAll(async () => {
    sut = await startTestApp();
    db = sut.app.get<Db>(DB);
    advisor = await sut.signIn(DEMO.advisor);
    foreman = await sut.signIn(DEMO.foreman);
    dana = await sut.badge('1041');
    sam = await sut.badge('1046');
    const day = (await as(dana.accessToken).get('/api/me/day').expect(200)).body as MyDay;
    danaLine = day.lines.find((line) => line.clockedOn)!;
    png = await sharp({ create: { width: 1200, height: 900, channels: 3, background: '#a04a2c' } })
      .png()
      .toBuffer();
    jpeg = await sharp({ create: { width: 48, height: 64, channels: 3, background: '#556070' } })
      .jpeg()
      .toBuffer();
  });
  afterAll(() => sut.close());

  it('records a finding with photos, holds the line for approval and tells the office at once', async () => {
    const office = sut.connect(foreman);
    await nextEvent(office, 'board.snapshot');
    const heard = nextEvent(office, 'finding.created');
    const { body } = await record(
      dana.accessToken,
      danaLine.id,
      {
        note: 'Fine metal shavings on the pan magnet\nTorque converter wear likely',
        severity: 'soon',
        suggestedHours: '1.5',
        holdForApproval: 'true',
      },
      [pngPhoto(), { buffer: jpeg, filename: 'gasket.jpeg', contentType: 'image/jpeg' }],
    ).expect(201);
    const finding = body as FindingDto;
    expect(finding).toMatchObject({
      jobLineId: danaLine.id,
      repairOrderNumber: danaLine.repairOrderNumber,
      vehicle: danaLine.vehicle,
      lineTitle: danaLine.title,
      technicianName: 'Dana Okafor',
      severity: 'soon',
      suggestedHours: 1.5,
      answer: 'pending',
      lineStatus: 'held',
      holdReason: 'approval',
    });
    expect(finding.photos.map((photo) => photo.mimeType)).toEqual(['image/png', 'image/jpeg']);
    expect(await heard).toMatchObject({ findingId: finding.id, jobLineId: danaLine.id });
    expect(await bayOf(danaLine.id)).toMatchObject({ state: 'held', holdReason: 'approval' });

    // Random server-made names: an original and a JPEG preview per photo, never the client's name.
    const files = storedFiles();
    expect(files).toHaveLength(4);
    for (const name of files) expect(name).toMatch(/^[0-9a-f-]{36}\.(png|jpg|preview\.jpg)$/);

    const inbox = (await as(advisor).get('/api/findings?answer=pending').expect(200)).body
      .items as FindingDto[];
    expect(inbox[0]).toMatchObject({ id: finding.id, technicianName: 'Dana Okafor' });
  });

  it('serves a photo with its sniffed type and nosniff, and a preview about 640 px wide', async () => {
    const [finding] = (await as(advisor).get('/api/findings').expect(200)).body.items as FindingDto[];
    const photo = finding!.photos[0]!;
    const original = await as(advisor).get(photo.url).buffer(true).expect(200);
    expect(original.headers['content-type']).toBe('image/png');
    expect(original.headers['x-content-type-options']).toBe('nosniff');
    // Re-encoded on arrival: the same picture, not the bytes the kiosk sent.
    expect(await sharp(original.body as Buffer).metadata()).toMatchObject({
      format: 'png',
      width: 1200,
      height: 900,
    });
    expect(Number(original.headers['content-length'])).toBe(photo.sizeBytes);
    const preview = await as(dana.accessToken).get(photo.previewUrl).buffer(true).expect(200);
    expect(preview.headers['content-type']).toBe('image/jpeg');
    expect(await sharp(preview.body as Buffer).metadata()).toMatchObject({
      format: 'jpeg',
      width: 640,
      height: 480,
    });
  });

  it('refuses a technician who is not on the repair order, for findings and for photos', async () => {
    const [finding] = (await as(advisor).get('/api/findings').expect(200)).body.items as FindingDto[];
    const photo = finding!.photos[0]!;
    // A photo Sam may not see answers exactly as one that does not exist: the id reveals nothing.
    const missing = await as(sam.accessToken).get('/api/attachments/999999').expect(404);
    for (const url of [photo.url, photo.previewUrl]) {
      const hidden = await as(sam.accessToken).get(url).expect(404);
      expect(hidden.body).toEqual(missing.body);
    }
    expect(missing.body).toEqual({ statusCode: 404, message: 'Photo not found', error: 'Not Found' });
    const before = stored();
    await record(sam.accessToken, danaLine.id, { note: 'Not my car', severity: 'watch' }, [
      pngPhoto(),
    ]).expect(403);
    expect(stored()).toEqual(before);
  });

  it('refuses a renamed executable by its content: 400 naming the photo, and nothing stored', async () => {
    const before = stored();
    const windowsExe = Buffer.concat([
      Buffer.from('MZ\x90\x00\x03\x00\x00\x00', 'latin1'),
      Buffer.alloc(4096, 7),
    ]);
    const { body } = await record(dana.accessToken, danaLine.id, { note: 'Leak', severity: 'soon' }, [
      pngPhoto(),
      { buffer: windowsExe, filename: 'photo.jpg', contentType: 'image/jpeg' },
    ]).expect(400);
    expect(body.message).toBe('Photo 2 is not a JPEG, PNG or WebP image');
    const linuxElf = Buffer.concat([Buffer.from('\x7fELF\x02\x01\x01\x00', 'latin1'), Buffer.alloc(4096)]);
    const elf = await record(dana.accessToken, danaLine.id, { note: 'Leak', severity: 'soon' }, [
      { buffer: linuxElf, filename: 'photo.png', contentType: 'image/png' },
    ]).expect(400);
    expect(elf.body.message).toBe('Photo 1 is not a JPEG, PNG or WebP image');
    expect(stored()).toEqual(before);
  });

  it('refuses a photo that only starts like an image', async () => {
    const before = stored();
    const truncated = png.subarray(0, 64);
    const { body } = await record(dana.accessToken, danaLine.id, { note: 'Leak', severity: 'soon' }, [
      { buffer: truncated, filename: 'cut.png', contentType: 'image/png' },
    ]).expect(400);
    expect(body.message).toBe('Photo 1 could not be read as an image');
    expect(stored()).toEqual(before);
  });

  it('refuses an 11 MB photo with a clear 413, and stores nothing', async () => {
    const before = stored();
    const huge = Buffer.concat([png, Buffer.alloc(11 * 1024 * 1024 - png.length)]);
    const { body } = await record(dana.accessToken, danaLine.id, { note: 'Huge', severity: 'watch' }, [
      pngPhoto(),
      { buffer: huge, filename: 'huge.png', contentType: 'image/png' },
    ]).expect(413);
    expect(body.message).toBe('Photo 2 is larger than 10 MB');
    expect(stored()).toEqual(before);
  });

  it('refuses a seventh photo, and stores nothing', async () => {
    const before = stored();
    const seven = Array.from({ length: 7 }, (_, i) => pngPhoto(`p${i}.png`));
    const { body } = await record(
      dana.accessToken,
      danaLine.id,
      { note: 'Many', severity: 'watch' },
      seven,
    ).expect(400);
    expect(body.message).toBe('Up to 6 photos per finding');
    expect(stored()).toEqual(before);
  });

  it('checks the text fields with the shared schema', async () => {
    const { body } = await record(dana.accessToken, danaLine.id, {
      severity: 'someday',
      suggestedHours: 'lots',
    }).expect(400);
    expect(body.issues.map((issue: { path: string[] }) => issue.path.join('.')).sort()).toEqual([
      'note',
      'severity',
      'suggestedHours',
    ]);
  });

  it('approval adds a queued line to the RO and resumes the held line, so the bay leaves held', async () => {
    const [finding] = (await as(advisor).get('/api/findings?answer=pending').expect(200)).body
      .items as FindingDto[];
    const linesBefore = db
      .select()
      .from(jobLines)
      .where(eq(jobLines.repairOrderId, finding!.repairOrderId))
      .all();
    const { body } = await as(advisor)
      .post(`/api/findings/${finding!.id}/answer`, { answer: 'approved', channel: 'phone', bookHours: 1.2 })
      .expect(200);
    const result = body as FindingAnswerResult;
    expect(result.createdLine).toMatchObject({
      repairOrderId: finding!.repairOrderId,
      lineNo: Math.max(...linesBefore.map((line) => line.lineNo)) + 1,
      title: 'Fine metal shavings on the pan magnet',
      concern: 'Fine metal shavings on the pan magnet\nTorque converter wear likely',
      bookHours: 1.2,
      status: 'queued',
      technicianId: null,
    });
    expect(result.finding).toMatchObject({
      answer: 'approved',
      answerChannel: 'phone',
      answeredBy: 'Nell Ashby',
      createdLineId: result.createdLine!.id,
    });
    expect(result.resumedLine).toMatchObject({ id: finding!.jobLineId, status: 'queued', holdReason: null });
    expect((await bayOf(finding!.jobLineId))?.state).not.toBe('held');
    expect((await board()).queue.map((item) => item.jobLineId)).toContain(result.createdLine!.id);
    const audited = db
      .select()
      .from(auditLog)
      .where(and(eq(auditLog.entity, 'finding'), eq(auditLog.entityId, String(finding!.id))))
      .all()
      .map((entry) => entry.action);
    expect(audited).toEqual(['create', 'approve']);

    await as(advisor)
      .post(`/api/findings/${finding!.id}/answer`, { answer: 'declined', channel: 'phone' })
      .expect(409);
  });

  it('keeps a line held while another finding on it waits; a decline is noted on the RO', async () => {
    const hold = { severity: 'safety-now', holdForApproval: 'true' };
    const first = (
      await record(dana.accessToken, danaLine.id, { ...hold, note: 'Cracked pan flange' }).expect(201)
    ).body as FindingDto;
    const second = (
      await record(dana.accessToken, danaLine.id, { ...hold, note: 'Cooler line chafed' }).expect(201)
    ).body as FindingDto;
    const declined = (
      await as(foreman)
        .post(`/api/findings/${first.id}/answer`, {
          answer: 'declined',
          channel: 'in-person',
          note: 'Customer will think about it',
        })
        .expect(200)
    ).body as FindingAnswerResult;
    expect(declined).toMatchObject({
      finding: { answer: 'declined', answerNote: 'Customer will think about it', createdLineId: null },
      createdLine: null,
      resumedLine: null,
    });
    expect(lineRow(danaLine.id)).toMatchObject({ status: 'held', holdReason: 'approval' });
    const onRo = db
      .select()
      .from(auditLog)
      .where(and(eq(auditLog.entity, 'repair-order'), eq(auditLog.action, 'finding-declined')))
      .all();
    expect(onRo.at(-1)?.detail).toEqual({
      findingId: first.id,
      note: 'Customer will think about it',
      channel: 'in-person',
    });

    const approved = (
      await as(advisor)
        .post(`/api/findings/${second.id}/answer`, {
          answer: 'approved',
          channel: 'phone',
          bookHours: 0.6,
          title: 'Replace cooler line',
        })
        .expect(200)
    ).body as FindingAnswerResult;
    expect(approved.createdLine).toMatchObject({ title: 'Replace cooler line', priority: 'high' });
    expect(approved.resumedLine).toMatchObject({ status: 'queued' });
  });

  it('needs book hours to approve', async () => {
    const finding = (
      await record(foreman, danaLine.id, { note: 'Worn wiper blades', severity: 'watch' }).expect(201)
    ).body as FindingDto;
    expect(finding).toMatchObject({ technicianName: 'Theo Varga', lineStatus: 'queued', photos: [] });
    const { body } = await as(advisor)
      .post(`/api/findings/${finding.id}/answer`, { answer: 'approved' })
      .expect(400);
    expect(body.issues.map((issue: { path: string[] }) => issue.path)).toEqual([['channel'], ['bookHours']]);
  });

  it('makes a line title from the first line of the note, cut at a word', () => {
    expect(titleFromNote('  Brake hose cracked \n near the caliper')).toBe('Brake hose cracked');
    const long = titleFromNote(`${'word '.repeat(40)}end`);
    expect(long.length).toBeLessThanOrEqual(120);
    expect(long.endsWith('word…')).toBe(true);
  });

  it('gives a line the finding added what the technician found as its concern, cut at a word to fit', () => {
    expect(concernFromNote(' Coolant weeping at the water pump\nHose clamps corroded \n')).toBe(
      'Coolant weeping at the water pump\nHose clamps corroded',
    );
    const long = concernFromNote('Oil seeps '.repeat(150));
    expect(long.length).toBeLessThanOrEqual(CONCERN_MAX_LENGTH);
    // By hand: the first 1,000 characters are a hundred whole "Oil seeps ", so the cut keeps the last
    // "seeps" whole (999 characters) and the ellipsis makes 1,000.
    expect(long).toBe(`${'Oil seeps '.repeat(100).trimEnd()}…`);
  });
});
