import { Controller, Get, Param, ParseIntPipe, Query } from '@nestjs/common';
import { ApiBearerAuth, ApiTags } from '@nestjs/swagger';
import { TracksQuery } from '@stormhour/shared';
import { z } from 'zod';
import { Roles } from '../common/access.decorators.js';
import { zodQuery } from '../common/zod-validation.pipe.js';
import { RadarDataService } from './radar-data.service.js';

const CellsQuery = z.object({
  siteId: z.coerce.number().int().positive(),
  scanTime: z.iso.datetime({
    offset: true,
    message: 'scanTime must be an ISO 8601 time such as 2031-08-01T09:30:00Z',
  }),
});

@ApiTags('tracks and cells')
@ApiBearerAuth()
@Controller()
@Roles('scientist')
export class TracksController {
  constructor(private readonly radar: RadarDataService) {}

  @Get('tracks')
  list(@Query(zodQuery(TracksQuery)) q: z.output<typeof TracksQuery>) {
    return this.radar.listTracks({
      ...q,
      from: q.from ? new Date(q.from) : undefined,
      to: q.to ? new Date(q.to) : undefined,
    });
  }

  @Get('tracks/:id')
  get(@Param('id', ParseIntPipe) id: number) {
    return this.radar.track(id);
  }

  @Get('cells')
  cells(@Query(zodQuery(CellsQuery)) q: z.infer<typeof CellsQuery>) {
    return this.radar.cellsAt(q.siteId, new Date(q.scanTime));
  }
}
