import type { INestApplication } from '@nestjs/common';
import { DocumentBuilder, SwaggerModule, type OpenAPIObject } from '@nestjs/swagger';

export const OPENAPI_PATH = 'api/openapi.json';
export const DOCS_PATH = 'api/docs';

/**
 * The API's description, made from the routes and the same zod schemas that validate their bodies,
 * queries and parameters (Nest reads them from `@Body({ schema })` and friends through zod's own
 * JSON Schema output). Nothing in it is written by hand but the titles.
 */
export function apiDocument(app: INestApplication): OpenAPIObject {
  const config = new DocumentBuilder()
    .setOpenAPIVersion('3.1.0')
    .setTitle('Baytime API')
    .setDescription(
      'The shop floor board and time clock. Sign in for a bearer token, or use an integration key ' +
        'made by the owner (Admin, Integration keys) in the `Authorization: Bearer` header.',
    )
    .addBearerAuth()
    .build();
  return SwaggerModule.createDocument(app, config, { autoTagControllers: true });
}

/**
 * Serves the document at /api/openapi.json and the reference page at /api/docs, with the page's
 * scripts and styles from swagger-ui-dist on this server: nothing from a CDN, within the app's
 * content security policy.
 */
export function serveApiDocs(app: INestApplication): void {
  SwaggerModule.setup(DOCS_PATH, app, () => apiDocument(app), {
    jsonDocumentUrl: OPENAPI_PATH,
    raw: ['json'],
    customSiteTitle: 'Baytime API',
    swaggerOptions: { persistAuthorization: false, validatorUrl: null },
  });
}
