import { Module } from '@nestjs/common';
import { AdviceModule } from '../advice/advice.module.js';
import { BulletinsModule } from '../bulletins/bulletins.module.js';
import { IntakeModule } from '../intake/intake.module.js';
import { RadarModule } from '../radar/radar.module.js';
import { RegionsModule } from '../regions/regions.module.js';
import { UsersModule } from '../users/users.module.js';
import { DemoSeeder } from './demo.seeder.js';

@Module({
  imports: [UsersModule, RegionsModule, RadarModule, IntakeModule, AdviceModule, BulletinsModule],
  providers: [DemoSeeder],
})
export class DemoModule {}
