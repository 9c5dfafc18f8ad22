import type { INestApplication } from '@nestjs/common';
import { ExpressAdapter } from '@nestjs/platform-express';
import type { NextFunction, Request, Response } from 'express';

export const OPENAPI_PATH = 'api/openapi.json';
export const DOCS_PATH = 'api/docs';

const isDocsRequest = (path: string) => path === `/${OPENAPI_PATH}` || path.startsWith(`/${DOCS_PATH}`);

/**
 * Serves the document at /api/openapi.json and the reference page at /api/docs, with the page's
 * scripts and styles from swagger-ui-dist on this server: nothing from a CDN, within the app's
 * content security policy. The Swagger module (some 500 files) loads on the first request for either,
 * not at start-up: its routes go into an Express app of their own, in front of the API's routes.
 */
export function serveApiDocs(app: INestApplication): void {
  const docs = new ExpressAdapter();
  docs.getInstance().disable('x-powered-by');
  let mounted: Promise<void> | null = null;
  // Only a request for the docs enters their Express app: on the way in it swaps the request's and
  // response's prototypes for its own, put back here if it passes the request on.
  app.use((request: Request, response: Response, next: NextFunction) => {
    if (!isDocsRequest(request.path)) return next();
    mounted ??= mountSwagger(app, docs);
    const prototypes = [Object.getPrototypeOf(request), Object.getPrototypeOf(response)] as const;
    const passOn = (error?: unknown) => {
      Object.setPrototypeOf(request, prototypes[0]);
      Object.setPrototypeOf(response, prototypes[1]);
      next(error);
    };
    mounted.then(() => docs.getInstance()(request, response, passOn), next);
  });
}

/**
 * The API's description is made from the routes and the same zod schemas that validate their bodies,
 * queries and parameters (Nest reads them from `@Body({ schema })` and friends through zod's own JSON
 * Schema output), when first asked for. Nothing in it is written by hand but the titles.
 */
async function mountSwagger(app: INestApplication, docs: ExpressAdapter): Promise<void> {
  const { DocumentBuilder, SwaggerModule } = await import('@nestjs/swagger');
  const config = new DocumentBuilder()
    .setOpenAPIVersion('3.1.0')
    .setTitle('Baytime API')
    .setDescription(
      'The shop floor board and time clock. Sign in for a bearer token, or use an integration key ' +
        'made by the owner (Admin, Integration keys) in the `Authorization: Bearer` header.',
    )
    .addBearerAuth()
    .build();
  // Only what `SwaggerModule.setup` asks of an application: its HTTP adapter and static files.
  const host = {
    getHttpAdapter: () => docs,
    useStaticAssets: (path: string, options: { prefix: string }) => docs.useStaticAssets(path, options),
  } as unknown as INestApplication;
  SwaggerModule.setup(
    DOCS_PATH,
    host,
    () => SwaggerModule.createDocument(app, config, { autoTagControllers: true }),
    {
      jsonDocumentUrl: OPENAPI_PATH,
      raw: ['json'],
      customSiteTitle: 'Baytime API',
      swaggerOptions: { persistAuthorization: false, validatorUrl: null },
    },
  );
}
