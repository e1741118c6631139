import { Global, Inject, Module, type OnApplicationShutdown } from '@nestjs/common';
import { APP_CONFIG, type AppConfig } from '../config/config.js';
import { DATABASE, type DatabaseHandle, migrateDatabase, openDatabase } from './database.js';

/** Provides the one database handle; nothing else knows it is PGlite. */
@Global()
@Module({
  providers: [
    {
      provide: DATABASE,
      inject: [APP_CONFIG],
      useFactory: async (config: AppConfig): Promise<DatabaseHandle> => {
        const handle = await openDatabase(config.dataDir);
        await migrateDatabase(handle);
        return handle;
      },
    },
  ],
  exports: [DATABASE],
})
export class DatabaseModule implements OnApplicationShutdown {
  constructor(@Inject(DATABASE) private readonly handle: DatabaseHandle) {}

  async onApplicationShutdown(): Promise<void> {
    if (!this.handle.pg.closed) await this.handle.pg.close();
  }
}
