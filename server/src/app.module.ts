import { type DynamicModule, type MiddlewareConsumer, Module, type NestModule } from '@nestjs/common';
import { APP_FILTER, APP_GUARD } from '@nestjs/core';
import { ServeStaticModule } from '@nestjs/serve-static';
import { AdviceModule } from './advice/advice.module.js';
import { AtlasModule } from './atlas/atlas.module.js';
import { AuditModule } from './audit/audit.module.js';
import { AuthModule } from './auth/auth.module.js';
import { BulletinsModule } from './bulletins/bulletins.module.js';
import { JwtAuthGuard, RolesGuard } from './common/access.guards.js';
import { ApiExceptionFilter } from './common/api-exception.filter.js';
import { JsonBodyMiddleware } from './common/json-body.middleware.js';
import type { AppConfig } from './config/config.js';
import { ConfigModule } from './config/config.module.js';
import { DatabaseModule } from './database/database.module.js';
import { DemoModule } from './demo/demo.module.js';
import { HealthModule } from './health/health.module.js';
import { IntakeModule } from './intake/intake.module.js';
import { JobsModule } from './jobs/jobs.module.js';
import { MailModule } from './mail/mail.module.js';
import { OutlookModule } from './outlook/outlook.module.js';
import { RadarModule } from './radar/radar.module.js';
import { RegimesModule } from './regimes/regimes.module.js';
import { RegionsModule } from './regions/regions.module.js';
import { ScorecardModule } from './scorecard/scorecard.module.js';
import { UsersModule } from './users/users.module.js';

@Module({})
export class AppModule implements NestModule {
  static register(config: AppConfig): DynamicModule {
    const staticClient = config.clientDist
      ? [
          ServeStaticModule.forRoot({
            rootPath: config.clientDist,
            // Unknown API paths must answer the API's JSON 404, not the client's index.html.
            exclude: ['/api/{*splat}'],
          }),
        ]
      : [];
    return {
      module: AppModule,
      imports: [
        ConfigModule.with(config),
        DatabaseModule,
        AuditModule,
        AuthModule,
        UsersModule,
        RegionsModule,
        HealthModule,
        JobsModule,
        RadarModule,
        RegimesModule,
        AtlasModule,
        IntakeModule,
        MailModule,
        AdviceModule,
        OutlookModule,
        BulletinsModule,
        ScorecardModule,
        DemoModule,
        ...staticClient,
      ],
      providers: [
        // Order matters: authenticate first, then check the role. Together they deny by default.
        { provide: APP_GUARD, useClass: JwtAuthGuard },
        { provide: APP_GUARD, useClass: RolesGuard },
        { provide: APP_FILTER, useClass: ApiExceptionFilter },
      ],
    };
  }

  configure(consumer: MiddlewareConsumer): void {
    consumer.apply(JsonBodyMiddleware).forRoutes('*');
  }
}
