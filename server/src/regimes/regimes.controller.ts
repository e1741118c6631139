import { Body, Controller, Get, Put, Query } from '@nestjs/common';
import { ApiBearerAuth, ApiBody, ApiTags } from '@nestjs/swagger';
import { RegimeSettings, type SessionUser } from '@stormhour/shared';
import { z } from 'zod';
import { CurrentUser, Roles } from '../common/access.decorators.js';
import { jsonSchema } from '../common/openapi.js';
import { zodBody, zodQuery } from '../common/zod-validation.pipe.js';
import { RegimesService } from './regimes.service.js';

const day = z.string().regex(/^\d{4}-\d{2}-\d{2}$/, 'Use a date such as 2025-06-01');
const Period = z.object({
  siteId: z.coerce.number().int().positive(),
  from: day.optional(),
  to: day.optional(),
  /** Average over this district's blocks instead of the radar coverage. */
  districtId: z.coerce.number().int().positive().optional(),
});
const CompositeQuery = Period.extend({
  regime: z.string().trim().min(1, 'Name the regime, e.g. "moist / onshore"'),
});
const SiteQuery = z.object({ siteId: z.coerce.number().int().positive() });
const ExpectedQuery = z
  .object({ siteId: z.coerce.number().int().positive(), from: day, to: day })
  .refine((q) => q.from <= q.to, { message: 'The period must not end before it starts', path: ['to'] });

@ApiTags('regimes')
@ApiBearerAuth()
@Controller('regimes')
export class RegimesController {
  constructor(private readonly regimes: RegimesService) {}

  @Get()
  @Roles('scientist', 'writer')
  list(@Query(zodQuery(Period)) q: z.infer<typeof Period>) {
    return this.regimes.regimes(q.siteId, q.from, q.to, q.districtId);
  }

  @Get('composite')
  @Roles('scientist', 'writer')
  composite(@Query(zodQuery(CompositeQuery)) q: z.infer<typeof CompositeQuery>) {
    return this.regimes.composite(q.siteId, q.regime, q.from, q.to, q.districtId);
  }

  /** The regime expected for a coming period, from the forecast grids (analysis bounds and sectors). */
  @Get('expected')
  @Roles('scientist', 'writer')
  expected(@Query(zodQuery(ExpectedQuery)) q: z.infer<typeof ExpectedQuery>) {
    return this.regimes.expected(q.siteId, q.from, q.to);
  }

  /** Which fields are stored: analysis or forecast, anomalies as uploaded or totals − climatology. */
  @Get('sources')
  @Roles('scientist', 'writer')
  sources() {
    return this.regimes.sources();
  }

  @Get('settings')
  @Roles('scientist', 'writer')
  settings(@Query(zodQuery(SiteQuery)) q: z.infer<typeof SiteQuery>) {
    return this.regimes.settings(q.siteId);
  }

  /** Replaces the site's regime settings with a new version; the days are reclassified on the next read. */
  @Put('settings')
  @Roles('scientist')
  @ApiBody({ schema: jsonSchema(RegimeSettings) })
  updateSettings(
    @CurrentUser() actor: SessionUser,
    @Query(zodQuery(SiteQuery)) q: z.infer<typeof SiteQuery>,
    @Body(zodBody(RegimeSettings)) body: RegimeSettings,
  ) {
    return this.regimes.updateSettings(actor, q.siteId, body);
  }
}
