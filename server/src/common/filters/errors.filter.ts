import { Catch, HttpException, Logger, type ArgumentsHost, type ExceptionFilter } from '@nestjs/common';
import type { Response } from 'express';
import { RetryLaterException } from '../retry-later.exception.js';

/** Known errors answer as thrown; anything else is logged and answers a plain 500. */
@Catch()
export class ErrorsFilter implements ExceptionFilter {
  private readonly logger = new Logger('Errors');

  catch(error: unknown, host: ArgumentsHost): void {
    if (host.getType() !== 'http') return;
    const response = host.switchToHttp().getResponse<Response>();
    if (response.headersSent) return;
    if (error instanceof HttpException) {
      const body = error.getResponse();
      if (error instanceof RetryLaterException)
        response.setHeader('Retry-After', String(error.retryAfterSeconds));
      response
        .status(error.getStatus())
        .json(typeof body === 'string' ? { statusCode: error.getStatus(), message: body } : body);
      return;
    }
    if (isBodyParserError(error)) {
      response
        .status(error.status)
        .json({ statusCode: error.status, message: 'The request body is not valid JSON' });
      return;
    }
    this.logger.error(error instanceof Error ? (error.stack ?? error.message) : String(error));
    response.status(500).json({ statusCode: 500, message: 'Something went wrong on the server' });
  }
}

function isBodyParserError(error: unknown): error is { status: number } {
  const status = (error as { status?: unknown } | null)?.status;
  return typeof status === 'number' && status >= 400 && status < 500;
}
