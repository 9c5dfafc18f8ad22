import type { INestApplication } from '@nestjs/common';
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApp } from '../app.js';
import { loadConfig } from '../config/app-config.js';

describe('HTTP answers', () => {
  let dir: string;
  let app: INestApplication;
  const http = () => request(app.getHttpServer());

  beforeAll(async () => {
    dir = mkdtempSync(join(tmpdir(), 'baytime-answers-'));
    for (const front of ['board', 'kiosk']) {
      mkdirSync(join(dir, front, 'dist'), { recursive: true });
      writeFileSync(join(dir, front, 'dist', 'index.html'), `<!doctype html><title>${front}</title>`);
    }
    app = await createApp(loadConfig({ BAYTIME_DATA_DIR: join(dir, 'data'), BAYTIME_DEMO: '1' }, dir), false);
    await app.init();
  });
  afterAll(async () => {
    await app.close();
    rmSync(dir, { recursive: true, force: true });
  });

  it('answers the API without an ETag or X-Powered-By', async () => {
    const { headers } = await http().get('/api/health').expect(200);
    expect(headers.etag).toBeUndefined();
    expect(headers['x-powered-by']).toBeUndefined();
    expect(headers['content-type']).toBe('application/json; charset=utf-8');
  });

  it('keeps the ETag of the front ends, their files and the pages that fall back to them', async () => {
    for (const path of ['/', '/kiosk/', '/wall', '/kiosk/day']) {
      const { headers } = await http().get(path).expect(200);
      expect(headers.etag, path).toMatch(/^W\/"/);
      await http()
        .get(path)
        .set('if-none-match', headers.etag as string)
        .expect(304);
    }
  });

  it('answers a docs address the docs do not serve as any unknown API address', async () => {
    const { body, headers } = await http().get('/api/docs/nothing-here').expect(404);
    expect(body).toEqual({
      message: 'Cannot GET /api/docs/nothing-here',
      error: 'Not Found',
      statusCode: 404,
    });
    expect(headers.etag).toBeUndefined();
  });
});
