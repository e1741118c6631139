import { randomUUID } from 'node:crypto';
import {
  type ArgumentsHost,
  Catch,
  type ExceptionFilter,
  HttpException,
  Inject,
  Logger,
} from '@nestjs/common';
import type { ApiErrorBody, ErrorDetail } from '@stormhour/shared';
import type { Request, Response } from 'express';
import { APP_CONFIG, type AppConfig } from '../config/config.js';

/**
 * Turns every error into `{ statusCode, message, details }`. Known HTTP errors keep their message;
 * anything else is logged with a request id and answered as a plain 500, so internals never leak.
 */
@Catch()
export class ApiExceptionFilter implements ExceptionFilter {
  private readonly logger = new Logger('Errors');

  constructor(@Inject(APP_CONFIG) private readonly config: AppConfig) {}

  catch(exception: unknown, host: ArgumentsHost): void {
    const http = host.switchToHttp();
    const res = http.getResponse<Response>();
    const req = http.getRequest<Request>();
    const body = this.toBody(exception, req);
    if (res.headersSent) return;
    res.status(body.statusCode).json(body);
  }

  private toBody(exception: unknown, req: Request): ApiErrorBody {
    if (exception instanceof HttpException) {
      const status = exception.getStatus();
      const response = exception.getResponse();
      const { message, details } = readResponse(response, exception.message);
      return {
        statusCode: status,
        message: this.friendlier(status, message),
        ...(details ? { details } : {}),
      };
    }
    const requestId = randomUUID();
    this.logger.error(
      `${requestId} ${req.method} ${req.originalUrl}: ${exception instanceof Error ? exception.stack : String(exception)}`,
    );
    return {
      statusCode: 500,
      message: 'Something went wrong on the server. Quote this id when reporting it.',
      requestId,
    };
  }

  /** Framework defaults like "Forbidden resource" become sentences a user can act on. */
  private friendlier(status: number, message: string): string {
    if (status === 403 && message === 'Forbidden resource') return 'Your role does not give access to this.';
    if (status === 401 && message === 'Unauthorized')
      return 'Sign in to continue: the session is missing, expired or invalid.';
    if (status === 404 && message.startsWith('Cannot ')) return `No such API route: ${message.slice(7)}`;
    if (status === 413 && message === 'File too large') {
      const mb = Number((this.config.uploadLimitBytes / 1048576).toPrecision(3));
      return `The file is larger than the upload limit of ${mb} MB (UPLOAD_LIMIT_MB).`;
    }
    return message;
  }
}

function readResponse(
  response: string | object,
  fallback: string,
): { message: string; details?: ErrorDetail[] } {
  if (typeof response === 'string') return { message: response };
  const r = response as { message?: unknown; details?: ErrorDetail[] };
  const message = Array.isArray(r.message)
    ? r.message.join('; ')
    : typeof r.message === 'string'
      ? r.message
      : fallback;
  return { message, details: r.details };
}
