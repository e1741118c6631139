import { Module } from '@nestjs/common';
import { AdviceModule } from '../advice/advice.module.js';
import { MailModule } from '../mail/mail.module.js';
import { OutlookModule } from '../outlook/outlook.module.js';
import { RadarModule } from '../radar/radar.module.js';
import { RegimesModule } from '../regimes/regimes.module.js';
import { RegionsModule } from '../regions/regions.module.js';
import { BulletinRenderer } from './bulletin-renderer.js';
import { BulletinsController } from './bulletins.controller.js';
import { BulletinsRepository } from './bulletins.repository.js';
import { BulletinsService } from './bulletins.service.js';
import { InboxController } from './inbox.controller.js';
import { InboxService } from './inbox.service.js';

/** District bulletins: drafting from the outlook and the rules, review, sending, the officers' inbox. */
@Module({
  imports: [RegionsModule, AdviceModule, OutlookModule, RadarModule, RegimesModule, MailModule],
  controllers: [BulletinsController, InboxController],
  providers: [BulletinsRepository, BulletinsService, InboxService, BulletinRenderer],
  exports: [BulletinsService],
})
export class BulletinsModule {}
