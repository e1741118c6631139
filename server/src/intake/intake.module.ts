import { Module } from '@nestjs/common';
import { MulterModule } from '@nestjs/platform-express';
import { APP_CONFIG, type AppConfig } from '../config/config.js';
import { JobsModule } from '../jobs/jobs.module.js';
import { RadarModule } from '../radar/radar.module.js';
import { RegimesModule } from '../regimes/regimes.module.js';
import { AnomalyIntakeHandler } from './anomaly-intake.handler.js';
import { IntakeController } from './intake.controller.js';
import { IntakeService } from './intake.service.js';
import { RadarIntakeHandler } from './radar-intake.handler.js';
import { UploadStore } from './upload-store.js';
import { UploadsRepository } from './uploads.repository.js';

@Module({
  imports: [
    JobsModule,
    RadarModule,
    RegimesModule,
    MulterModule.registerAsync({
      inject: [APP_CONFIG],
      useFactory: (config: AppConfig) => ({ limits: { fileSize: config.uploadLimitBytes, files: 500 } }),
    }),
  ],
  controllers: [IntakeController],
  providers: [
    IntakeService,
    UploadsRepository,
    RadarIntakeHandler,
    AnomalyIntakeHandler,
    // Files on disk by content hash, shared by the service that takes uploads and the jobs that read them.
    {
      provide: UploadStore,
      inject: [APP_CONFIG],
      useFactory: (config: AppConfig) => new UploadStore(config.filesDir),
    },
  ],
  exports: [IntakeService],
})
export class IntakeModule {}
