import { BadRequestException, type INestApplication, ValidationPipe } from '@nestjs/common';
import type { ValidationError } from 'class-validator';
import type { NestExpressApplication } from '@nestjs/platform-express';
import { DocumentBuilder, SwaggerModule } from '@nestjs/swagger';
import type { NextFunction, Request, Response } from 'express';
import helmet from 'helmet';
import { existsSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { ApiExceptionFilter } from './common/filters/api-exception.filter';
import type { AppConfig } from './config/configuration';

/**
 * Everything about the HTTP edge that the server and the integration tests must share: the /api
 * prefix, validation, the error shape, security headers, CORS, OpenAPI and the built client.
 */
export function configureApp(app: NestExpressApplication, config: AppConfig): void {
  app.setGlobalPrefix('api');
  app.set('trust proxy', 'loopback');
  app.useGlobalPipes(
    new ValidationPipe({
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

  const document = SwaggerModule.createDocument(
    app as unknown as INestApplication,
    new DocumentBuilder().setTitle('Morrowline API').setDescription('The day-ahead load forecasting desk').setVersion('0.1').addBearerAuth().build(),
  );
  SwaggerModule.setup('api/docs', app as unknown as INestApplication, document);

  serveClient(app, resolve(config.clientDist));
}

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
