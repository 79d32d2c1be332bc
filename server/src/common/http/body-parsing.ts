import { BadRequestException, HttpException, HttpStatus, PayloadTooLargeException, UnsupportedMediaTypeException } from '@nestjs/common';
import type { NestExpressApplication } from '@nestjs/platform-express';
import type { NextFunction, Request, Response } from 'express';
import { toApiError } from '../filters/api-exception.filter';
import { bodyProblem } from './body-guard';
import { MAX_BODY_BYTES } from './body-limits';

/** An error as the body parsers raise it (http-errors): a status and a type such as "entity.too.large". */
interface ParserError {
  status?: number;
  type?: string;
}

/** A body parser's error as the HTTP exception it stands for, in words a client can act on. */
export function parserErrorToHttp(error: unknown): HttpException {
  const { status, type } = (error ?? {}) as ParserError;
  switch (type) {
    case 'entity.too.large':
      return new PayloadTooLargeException(`The request body is larger than the ${MAX_BODY_BYTES / 1024} KiB limit`);
    case 'entity.parse.failed':
      return new BadRequestException('The request body is not valid JSON');
    case 'encoding.unsupported':
    case 'charset.unsupported':
      return new UnsupportedMediaTypeException('The request body must be UTF-8 JSON');
    case 'request.size.invalid':
    case 'request.aborted':
      return new BadRequestException('The request body ended before its declared length');
    case 'parameters.too.many':
      return new PayloadTooLargeException('The form has too many fields');
    default:
      return new HttpException(status && status >= 400 && status < 500 ? 'The request body could not be read' : 'Something went wrong on the server; it has been logged', status && status >= 400 && status < 600 ? status : HttpStatus.INTERNAL_SERVER_ERROR);
  }
}

/**
 * The body parsers with our limits, their errors answered in the one error shape (ApiError), and
 * every parsed body checked for depth and prototype keys before any route sees it. Registered
 * before Nest's own, so Nest finds them in place and adds no parser of its own.
 */
export function configureBodyParsing(app: NestExpressApplication): void {
  app.useBodyParser('json', { limit: MAX_BODY_BYTES });
  app.useBodyParser('urlencoded', { limit: MAX_BODY_BYTES, extended: false, parameterLimit: 100 });
  app.use((error: unknown, req: Request, res: Response, next: NextFunction) => {
    if (!error) return next();
    const body = toApiError(parserErrorToHttp(error), req.originalUrl ?? req.url);
    res.status(body.statusCode).json(body);
  });
  app.use((req: Request, res: Response, next: NextFunction) => {
    const problem = bodyProblem(req.body);
    if (!problem) return next();
    const body = toApiError(new BadRequestException(problem), req.originalUrl ?? req.url);
    res.status(body.statusCode).json(body);
  });
}
