import { BadRequestException, type INestApplication } from '@nestjs/common';
import type { ValidationError } from 'class-validator';
import type { NestExpressApplication } from '@nestjs/platform-express';
import { DocumentBuilder, SwaggerModule } from '@nestjs/swagger';
import type { NextFunction, Request, Response } from 'express';
import helmet from 'helmet';
import { existsSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { ApiExceptionFilter } from './common/filters/api-exception.filter';
import { FeedsIoAdapter } from './feeds/feeds-io.adapter';
import { configureBodyParsing } from './common/http/body-parsing';
import { StrictValidationPipe } from './common/pipes/strict-validation.pipe';
import type { AppConfig } from './config/configuration';
import { INSTANT_EXAMPLE, TIME_WINDOW_RULE } from '@morrowline/shared';
import { MAX_BODY_BYTES, MAX_BODY_DEPTH } from './common/http/body-limits';

/**
 * Everything about the HTTP edge that the server and the integration tests must share: the /api
 * prefix, body parsing and its limits, validation, the error shape, security headers, CORS,
 * OpenAPI and the built client.
 */
export function configureApp(app: NestExpressApplication, config: AppConfig): void {
  app.setGlobalPrefix('api');
  // X-Forwarded-For is believed only from proxies named in TRUST_PROXY: otherwise anyone could
  // pick their own address and step around the per-address sign-in limit.
  app.set('trust proxy', config.trustProxy);
  configureBodyParsing(app);
  app.useGlobalPipes(
    new StrictValidationPipe({
      whitelist: true,
      forbidNonWhitelisted: true,
      transform: true,
      exceptionFactory: (errors) => new BadRequestException(validationMessages(errors)),
    }),
  );
  app.useGlobalFilters(new ApiExceptionFilter());
  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          defaultSrc: ["'self'"],
          connectSrc: ["'self'", 'ws:', 'wss:'],
          imgSrc: ["'self'", 'data:', 'blob:'],
          styleSrc: ["'self'", "'unsafe-inline'"],
          fontSrc: ["'self'", 'data:'],
          scriptSrc: ["'self'"],
          upgradeInsecureRequests: null,
        },
      },
    }),
  );
  app.enableCors(config.corsOrigins.length > 0 ? { origin: config.corsOrigins, credentials: false } : { origin: false });
  app.enableShutdownHooks();
  // One socket.io server for every gateway, with the feeds' documented message limit.
  app.useWebSocketAdapter(new FeedsIoAdapter(app));

  const document = SwaggerModule.createDocument(
    app as unknown as INestApplication,
    new DocumentBuilder().setTitle('Morrowline API').setDescription(API_DESCRIPTION).setVersion('0.1').addBearerAuth().build(),
  );
  SwaggerModule.setup('api/docs', app as unknown as INestApplication, document);

  serveClient(app, resolve(config.clientDist));
}

/** The input rules every route shares, at the top of the OpenAPI page. */
const API_DESCRIPTION = [
  'The day-ahead load forecasting desk.',
  `Times are ISO 8601 with an offset (${INSTANT_EXAMPLE} or 2026-03-08T02:00:00-07:00); a time without one, a date that does not exist or hour 24:00 is refused.`,
  `Operating days are YYYY-MM-DD. Times and days must lie in the ${TIME_WINDOW_RULE} (UTC for times).`,
  'Path ids are plain digits from 1. A field that may be left out may not be sent as null unless its description says null means something.',
  `JSON bodies: at most ${MAX_BODY_BYTES / 1024} KiB (413 beyond), ${MAX_BODY_DEPTH} levels deep, no __proto__, constructor or prototype keys.`,
  'Every refusal is a 4xx with statusCode, error, message, details (one line per field), path and timestamp.',
].join(' ');

/** Every constraint message, nested ones included (items[2].text → "each item needs a line of text"). */
export function validationMessages(errors: ValidationError[]): string[] {
  return errors.flatMap((error) => [
    ...Object.values(error.constraints ?? {}),
    ...validationMessages(error.children ?? []),
    ...(!error.constraints && !error.children?.length ? [`${error.property} is not valid`] : []),
  ]);
}

/** The built client at /, with every non-API path answered by index.html (client-side routes). */
function serveClient(app: NestExpressApplication, dist: string): void {
  const index = join(dist, 'index.html');
  if (!existsSync(index)) return;
  app.useStaticAssets(dist, { index: false, maxAge: '1h' });
  app.use((req: Request, res: Response, next: NextFunction) => {
    if (req.method !== 'GET' || req.path.startsWith('/api') || req.path.startsWith('/socket.io')) return next();
    res.setHeader('Cache-Control', 'no-cache');
    res.sendFile(index);
  });
}
