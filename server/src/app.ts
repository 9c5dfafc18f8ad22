import 'reflect-metadata';
import { Logger, type INestApplication, type LogLevel } from '@nestjs/common';
import { NestFactory } from '@nestjs/core';
import helmet from 'helmet';
import { AppModule } from './app.module.js';
import { ErrorsFilter } from './common/filters/errors.filter.js';
import { validationPipe } from './common/validation.js';
import type { AppConfig } from './config/app-config.js';
import { StartupService } from './demo/startup.service.js';

export async function createApp(
  config: AppConfig,
  logger: LogLevel[] | false = ['log', 'warn', 'error'],
): Promise<INestApplication> {
  const app = await NestFactory.create(AppModule.forRoot(config), { logger, abortOnError: false });
  app.setGlobalPrefix('api', { exclude: [] });
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
  await app.get(StartupService).prepare();
  return app;
}

export async function listen(app: INestApplication, port: number): Promise<string> {
  await app.listen(port);
  const url = (await app.getUrl()).replace('[::1]', 'localhost').replace('127.0.0.1', 'localhost');
  new Logger('Baytime').log(`Serving on ${url}: wall board ${url}/wall, kiosk ${url}/kiosk/, office ${url}/`);
  return url;
}
