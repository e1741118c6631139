import { Module } from '@nestjs/common';
import { RadarModule } from '../radar/radar.module.js';
import { RegimesModule } from '../regimes/regimes.module.js';
import { RegionsModule } from '../regions/regions.module.js';
import { OutlookController } from './outlook.controller.js';
import { OutlookRepository } from './outlook.repository.js';
import { OutlookService } from './outlook.service.js';

@Module({
  imports: [RadarModule, RegimesModule, RegionsModule],
  controllers: [OutlookController],
  providers: [OutlookRepository, OutlookService],
  exports: [OutlookService],
})
export class OutlookModule {}
