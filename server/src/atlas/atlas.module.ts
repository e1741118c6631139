import { Module } from '@nestjs/common';
import { RadarModule } from '../radar/radar.module.js';
import { RegimesModule } from '../regimes/regimes.module.js';
import { RegionsModule } from '../regions/regions.module.js';
import { AtlasController } from './atlas.controller.js';
import { AtlasRepository } from './atlas.repository.js';
import { AtlasService } from './atlas.service.js';

@Module({
  imports: [RadarModule, RegimesModule, RegionsModule],
  controllers: [AtlasController],
  providers: [AtlasRepository, AtlasService],
})
export class AtlasModule {}
