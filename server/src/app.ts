import 'reflect-metadata';
import { Logger, type INestApplication, type LogLevel } from '@nestjs/common';
import { NestFactory } from '@nestjs/core';
import type { NestExpressApplication } from '@nestjs/platform-express';
import helmet from 'helmet';
import { serveApiDocs } from './api-docs/api-docs.js';
import { AppModule } from './app.module.js';
import { ErrorsFilter } from './common/filters/errors.filter.js';
import { validationPipe } from './common/validation.js';
import type { AppConfig } from './config/app-config.js';
import { StartupService } from './demo/startup.service.js';

export async function createApp(
  config: AppConfig,
  logger: LogLevel[] | false = ['log', 'warn', 'error'],
): Promise<INestApplication> {
  const app = await NestFactory.create<NestExpressApplication>(AppModule.forRoot(config), {
    logger,
    abortOnError: false,
  });
  app.setGlobalPrefix('api', { exclude: [] });
  // No client revalidates an API answer, so none is hashed for an ETag: this function answers none for
  // `res.send`. Static files keep theirs, from their size and time, wherever ETags stay enabled.
  // Helmet would only take back the X-Powered-By set for each request.
  app.set('etag', () => undefined);
  app.disable('x-powered-by');
  // Behind a reverse proxy on this machine (the shop's HTTPS), each tablet's own address comes in
  // X-Forwarded-For: sign-in throttling counts per tablet, not one count for the whole shop. Only a
  // proxy on this machine is believed, so no tablet can pass for another.
  app.set('trust proxy', 'loopback');
  app.use(
    helmet({
      // Shop tablets reach the server over plain http on the LAN: no https upgrade, no HSTS.
      // Photos are shown from blob: URLs fetched with the token. The kiosk's service worker comes
      // from this server only.
      contentSecurityPolicy: {
        directives: {
          upgradeInsecureRequests: null,
          imgSrc: ["'self'", 'data:', 'blob:'],
          workerSrc: ["'self'"],
          manifestSrc: ["'self'"],
        },
      },
      strictTransportSecurity: false,
    }),
  );
  app.useGlobalPipes(validationPipe());
  app.useGlobalFilters(new ErrorsFilter());
  app.enableShutdownHooks();
  serveApiDocs(app);
  await app.get(StartupService).prepare();
  return app;
}

export async function listen(app: INestApplication, port: number): Promise<string> {
  await app.listen(port);
  const url = (await app.getUrl()).replace('[::1]', 'localhost').replace('127.0.0.1', 'localhost');
  new Logger('Baytime').log(`Serving on ${url}: wall board ${url}/wall, kiosk ${url}/kiosk/, office ${url}/`);
  return url;
}
