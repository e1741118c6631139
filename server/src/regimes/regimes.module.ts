import { Module } from '@nestjs/common';
import { RadarModule } from '../radar/radar.module.js';
import { RegionsModule } from '../regions/regions.module.js';
import { AnomaliesRepository } from './anomalies.repository.js';
import { RegimesController } from './regimes.controller.js';
import { RegimesService } from './regimes.service.js';

@Module({
  imports: [RadarModule, RegionsModule],
  controllers: [RegimesController],
  providers: [AnomaliesRepository, RegimesService],
  exports: [AnomaliesRepository, RegimesService],
})
export class RegimesModule {}
