import { Module } from '@nestjs/common';
import { RegionsModule } from '../regions/regions.module.js';
import { RadarDataRepository } from './radar-data.repository.js';
import { RadarDataService } from './radar-data.service.js';
import { SitesController } from './sites.controller.js';
import { SitesRepository } from './sites.repository.js';
import { SitesService } from './sites.service.js';
import { TracksController } from './tracks.controller.js';

@Module({
  imports: [RegionsModule],
  controllers: [SitesController, TracksController],
  providers: [SitesRepository, SitesService, RadarDataRepository, RadarDataService],
  exports: [SitesService, SitesRepository, RadarDataService],
})
export class RadarModule {}
