import { Module } from '@nestjs/common';
import { MulterModule } from '@nestjs/platform-express';
import { APP_CONFIG, type AppConfig } from '../config/config.js';
import { RegionsModule } from '../regions/regions.module.js';
import { AdviceController } from './advice.controller.js';
import { AdviceRepository } from './advice.repository.js';
import { AdviceRulesService } from './advice-rules.service.js';
import { CropCalendarService } from './crop-calendar.service.js';

/** Crop calendars and the advice rules that, with the outlook, propose a bulletin's advice. */
@Module({
  imports: [
    RegionsModule,
    MulterModule.registerAsync({
      inject: [APP_CONFIG],
      useFactory: (config: AppConfig) => ({ limits: { fileSize: config.uploadLimitBytes, files: 1 } }),
    }),
  ],
  controllers: [AdviceController],
  providers: [AdviceRepository, CropCalendarService, AdviceRulesService],
  exports: [AdviceRepository, CropCalendarService, AdviceRulesService],
})
export class AdviceModule {}
