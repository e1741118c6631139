import { Controller, Get, Query, Req, Res } from '@nestjs/common';
import { ApiBearerAuth, ApiTags } from '@nestjs/swagger';
import { OutlookQuery } from '@stormhour/shared';
import type { Request, Response } from 'express';
import type { z } from 'zod';
import { Roles } from '../common/access.decorators.js';
import { zodQuery } from '../common/zod-validation.pipe.js';
import { OutlookService } from './outlook.service.js';

/** The parsed query; named apart from the schema so decorator metadata does not mistake the schema for a class. */
type OutlookParams = z.infer<typeof OutlookQuery>;

@ApiTags('outlook')
@ApiBearerAuth()
@Controller()
export class OutlookController {
  constructor(private readonly outlook: OutlookService) {}

  /**
   * Storm chances per block and local bin. The answer is sent as the cached bytes (compressed when the
   * client accepts gzip), with an ETag so an unchanged outlook is not sent twice.
   */
  @Get('outlook')
  @Roles('scientist', 'writer')
  async get(@Query(zodQuery(OutlookQuery)) q: OutlookParams, @Req() req: Request, @Res() res: Response) {
    const answer = await this.outlook.outlook(q);
    // The cached bytes are written as they are (Express's send would look at them again).
    // Set before asking req.fresh, which compares the request's If-None-Match with it.
    res.setHeader('ETag', answer.etag);
    const headers = {
      'Cache-Control': 'private, no-cache',
      Vary: 'Accept-Encoding',
      'Content-Type': 'application/json; charset=utf-8',
    };
    if (req.fresh) {
      res.writeHead(304, headers).end();
      return;
    }
    const gzip = req.acceptsEncodings('gzip') === 'gzip';
    const body = gzip ? answer.gzip : answer.json;
    res
      .writeHead(200, {
        ...headers,
        ...(gzip ? { 'Content-Encoding': 'gzip' } : {}),
        'Content-Length': body.length,
      })
      .end(body);
  }

  /** The same table as CSV, one row per block and bin. */
  @Get('outlook.csv')
  @Roles('scientist', 'writer')
  async csv(@Query(zodQuery(OutlookQuery)) q: OutlookParams, @Res() res: Response) {
    const answer = await this.outlook.outlook(q);
    const name = `outlook-${answer.body.siteCode}-${q.regime === 'all' ? 'all-days' : q.regime.replace(/[^a-z0-9]+/gi, '-')}.csv`;
    res.setHeader('Content-Disposition', `attachment; filename="${name}"`);
    res.type('text/csv').send(answer.csv());
  }
}
