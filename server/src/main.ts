import 'reflect-metadata';
import { Logger } from '@nestjs/common';
import { NestFactory } from '@nestjs/core';
import { AppModule } from './app.module.js';
import { setUpApp } from './app.setup.js';
import { loadConfig } from './config/config.js';

async function main(): Promise<void> {
  const started = Date.now();
  const config = loadConfig();
  // Body parsing is Nest middleware (JsonBodyMiddleware) so its errors get the API's error shape.
  const app = await NestFactory.create(AppModule.register(config), { bodyParser: false });
  setUpApp(app);
  app.enableShutdownHooks();
  await app.listen(config.port);
  new Logger('Stormhour').log(
    `Ready on http://localhost:${config.port} in ${((Date.now() - started) / 1000).toFixed(1)} s ` +
      `(data in ${config.dataDir}${config.demo ? ', demo scenario on' : ''}${config.clientDist ? '' : ', client not built'})`,
  );
}

main().catch((err: unknown) => {
  console.error(err instanceof Error ? err.message : err);
  process.exit(1);
});
