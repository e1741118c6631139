import { Module } from '@nestjs/common';
import { MulterModule } from '@nestjs/platform-express';
import { APP_CONFIG, type AppConfig } from '../config/config.js';
import { RegionsController } from './regions.controller.js';
import { RegionsRepository } from './regions.repository.js';
import { RegionsService } from './regions.service.js';

@Module({
  imports: [
    MulterModule.registerAsync({
      inject: [APP_CONFIG],
      useFactory: (config: AppConfig) => ({ limits: { fileSize: config.uploadLimitBytes, files: 1 } }),
    }),
  ],
  controllers: [RegionsController],
  providers: [RegionsRepository, RegionsService],
  exports: [RegionsRepository, RegionsService],
})
export class RegionsModule {}
