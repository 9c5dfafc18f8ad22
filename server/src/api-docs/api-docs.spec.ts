import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createRepairOrderSchema } from '@baytime/shared';
import { z } from 'zod';
import { ROUTES } from '../test-support/routes.js';
import { startTestApp, type TestApp } from '../test-support/test-app.js';
import { DOCS_PATH, OPENAPI_PATH } from './api-docs.js';

interface OpenApi {
  openapi: string;
  paths: Record<string, Record<string, { requestBody?: { content: Record<string, { schema: unknown }> } }>>;
}

/** `/api/users/1` and `/api/users/:id` both match the document's `/api/users/{id}`. */
function documented(doc: OpenApi, method: string, path: string): boolean {
  return Object.entries(doc.paths).some(
    ([template, operations]) =>
      method in operations &&
      new RegExp(`^${template.replace(/\{[^}]+\}/g, '[^/]+')}$`).test(path.replace(/:[^/]+/g, 'x')),
  );
}

describe('the OpenAPI document', () => {
  let sut: TestApp;
  let doc: OpenApi;
  /** Every route the server answers, as Express holds them, less the document and its page. */
  let served: [string, string][];

  beforeAll(async () => {
    sut = await startTestApp();
    doc = (await sut.http().get(`/${OPENAPI_PATH}`).expect(200)).body as OpenApi;
    const express = sut.app.getHttpAdapter().getInstance() as {
      router: { stack: { route?: { path: string; methods: Record<string, boolean> } }[] };
    };
    served = express.router.stack.flatMap(({ route }) =>
      route && !route.path.startsWith(`/${DOCS_PATH}`) && route.path !== `/${OPENAPI_PATH}`
        ? Object.keys(route.methods).map((method): [string, string] => [method, route.path])
        : [],
    );
  });
  afterAll(() => sut.close());

  it('is OpenAPI 3.1', () => {
    expect(doc.openapi).toBe('3.1.0');
  });

  it('has every route the server serves', () => {
    expect(served.length).toBeGreaterThan(ROUTES.length);
    expect(served.filter(([method, path]) => !documented(doc, method, path))).toEqual([]);
  });

  it('has every route of the role table', () => {
    expect(ROUTES.filter(([method, path]) => !documented(doc, method, path))).toEqual([]);
  });

  it('describes a body with the zod schema that validates it', () => {
    const body = doc.paths['/api/repair-orders']!.post!.requestBody!.content['application/json']!.schema;
    const fromZod = z.toJSONSchema(createRepairOrderSchema, { io: 'input', target: 'draft-2020-12' });
    expect(body).toMatchObject({ required: fromZod.required, properties: { lines: { minItems: 1 } } });
  });

  it('is read at /api/docs on a page whose scripts come from this server', async () => {
    const page = await sut.http().get(`/${DOCS_PATH}`).expect(200);
    const scripts = [...(page.text as string).matchAll(/<script src="([^"]+)"/g)].map((m) => m[1]!);
    expect(scripts).toContain('./docs/swagger-ui-bundle.js');
    expect(scripts.every((src) => src.startsWith('./'))).toBe(true);
    await sut
      .http()
      .get(`/${DOCS_PATH}/swagger-ui-bundle.js`)
      .expect(200)
      .expect('content-type', /javascript/);
  });
});
