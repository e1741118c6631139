import { Controller, Get, Query } from '@nestjs/common';
import { ApiBearerAuth, ApiTags } from '@nestjs/swagger';
import { type AtlasFilter, AtlasMapQuery, AtlasQuery, AtlasTimeDistanceQuery } from '@stormhour/shared';
import { Roles } from '../common/access.decorators.js';
import { zodQuery } from '../common/zod-validation.pipe.js';
import { AtlasService, type MapQuery, type TimeDistanceQuery } from './atlas.service.js';

/** The scientist's explorer: every view takes the same filter (site, period, regime, district, cell type). */
@ApiTags('atlas')
@ApiBearerAuth()
@Controller('atlas')
@Roles('scientist')
export class AtlasController {
  constructor(private readonly atlas: AtlasService) {}

  /** Onset points of a local-time bin and their density contoured into bands (GeoJSON, lon/lat). */
  @Get('map')
  map(@Query(zodQuery(AtlasMapQuery)) q: MapQuery) {
    return this.atlas.map(q);
  }

  /** Onsets and mean cell properties by local hour, overall and by cell type. */
  @Get('diurnal')
  diurnal(@Query(zodQuery(AtlasQuery)) q: AtlasFilter) {
    return this.atlas.diurnal(q);
  }

  /** Area, duration and 35 dBZ top with a log-normal fit and its Kolmogorov–Smirnov distance. */
  @Get('distributions')
  distributions(@Query(zodQuery(AtlasQuery)) q: AtlasFilter) {
    return this.atlas.distributions(q);
  }

  /** Onsets by local hour and distance along an axis, within a corridor. */
  @Get('time-distance')
  timeDistance(@Query(zodQuery(AtlasTimeDistanceQuery)) q: TimeDistanceQuery) {
    return this.atlas.timeDistance(q);
  }

  /** A rose of storm motion with the mean anomaly wind of the regime's days. */
  @Get('motion')
  motion(@Query(zodQuery(AtlasQuery)) q: AtlasFilter) {
    return this.atlas.motion(q);
  }
}
