import { Controller, Get, Inject, Query, Res } from '@nestjs/common';
import { ApiBearerAuth, ApiTags } from '@nestjs/swagger';
import { ScorecardQuery } from '@stormhour/shared';
import type { Response } from 'express';
import type { z } from 'zod';
import { Roles } from '../common/access.decorators.js';
import { zodQuery } from '../common/zod-validation.pipe.js';
import { APP_CONFIG, type AppConfig } from '../config/config.js';
import { scorecardCsv, scorecardPdf } from './engine/scorecard-report.js';
import { ScorecardService } from './scorecard.service.js';

/** The parsed query; named apart from the schema so decorator metadata does not take the schema for a class. */
type ScorecardParams = z.infer<typeof ScorecardQuery>;

const fileName = (q: ScorecardParams, ext: string) =>
  `scorecard-${q.districtId}-${q.from}-${q.to}-${q.source}.${ext}`;

@ApiTags('scorecard')
@ApiBearerAuth()
@Controller()
export class ScorecardController {
  constructor(
    private readonly scorecards: ScorecardService,
    @Inject(APP_CONFIG) private readonly config: AppConfig,
  ) {}

  /** How good the sent chances were: scores, reliability, ROC and the worst blocks. */
  @Get('scorecard')
  @Roles('scientist', 'admin')
  async get(@Query(zodQuery(ScorecardQuery)) q: ScorecardParams) {
    return (await this.scorecards.scorecard(q)).view;
  }

  /** The scored pairs, one row per bulletin, block and day. */
  @Get('scorecard.csv')
  @Roles('scientist', 'admin')
  async csv(@Query(zodQuery(ScorecardQuery)) q: ScorecardParams, @Res() res: Response) {
    const { pairs } = await this.scorecards.scorecard({ ...q, resamples: 0 });
    res.setHeader('Content-Disposition', `attachment; filename="${fileName(q, 'csv')}"`);
    res.type('text/csv').send(scorecardCsv(pairs));
  }

  /** The season's report. */
  @Get('scorecard.pdf')
  @Roles('scientist', 'admin')
  async pdf(@Query(zodQuery(ScorecardQuery)) q: ScorecardParams, @Res() res: Response) {
    const { view } = await this.scorecards.scorecard(q);
    const pdf = await scorecardPdf(view, this.config.unitName);
    res.setHeader('Content-Disposition', `attachment; filename="${fileName(q, 'pdf')}"`);
    res.type('application/pdf').send(pdf);
  }
}
