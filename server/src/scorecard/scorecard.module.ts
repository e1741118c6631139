import { Module } from '@nestjs/common';
import { AdviceModule } from '../advice/advice.module.js';
import { OutlookModule } from '../outlook/outlook.module.js';
import { ScorecardController } from './scorecard.controller.js';
import { ScorecardRepository } from './scorecard.repository.js';
import { ScorecardService } from './scorecard.service.js';

/** How good the issued chances were: sent bulletins paired with radar onsets and field reports. */
@Module({
  imports: [OutlookModule, AdviceModule],
  controllers: [ScorecardController],
  providers: [ScorecardRepository, ScorecardService],
})
export class ScorecardModule {}
