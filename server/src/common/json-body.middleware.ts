import {
  BadRequestException,
  Injectable,
  type NestMiddleware,
  PayloadTooLargeException,
} from '@nestjs/common';
import express, { type NextFunction, type Request, type Response } from 'express';

/**
 * JSON parsing as Nest middleware (not Express's), so malformed or oversized bodies reach the
 * exception filter and get the API's error shape instead of an HTML page.
 */
@Injectable()
export class JsonBodyMiddleware implements NestMiddleware {
  private readonly parse = express.json({ limit: '2mb' });

  use(req: Request, res: Response, next: NextFunction): void {
    this.parse(req, res, (err?: unknown) => {
      if (!err) return next();
      const e = err as { type?: string; message?: string };
      if (e.type === 'entity.too.large')
        return next(new PayloadTooLargeException('The JSON body is larger than 2 MB.'));
      if (e.type === 'entity.parse.failed')
        return next(new BadRequestException(`The request body is not valid JSON: ${e.message}`));
      next(err);
    });
  }
}
