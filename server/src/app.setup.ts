import type { INestApplication } from '@nestjs/common';
import type { NestExpressApplication } from '@nestjs/platform-express';
import { DocumentBuilder, SwaggerModule } from '@nestjs/swagger';
import cookieParser from 'cookie-parser';
import helmet from 'helmet';

/** Everything about the HTTP app that main.ts and the API tests must share. */
export function setUpApp(app: INestApplication): void {
  const express = app as NestExpressApplication;
  express.set('trust proxy', 'loopback');
  express.disable('x-powered-by');
  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          defaultSrc: ["'self'"],
          // The API docs page and the components set inline styles; no script is inline.
          styleSrc: ["'self'", "'unsafe-inline'"],
          imgSrc: ["'self'", 'data:'],
          fontSrc: ["'self'"],
          connectSrc: ["'self'"],
        },
      },
    }),
  );
  // Only the sign-in routes read a cookie (the refresh token); other requests skip the parsing.
  app.use('/api/auth', cookieParser());
  app.setGlobalPrefix('api');
  const document = SwaggerModule.createDocument(
    app,
    new DocumentBuilder()
      .setTitle('Stormhour API')
      .setDescription('Block storm chances, intake and bulletins. Errors: { statusCode, message, details }.')
      .setVersion('0.1.0')
      .addBearerAuth()
      .build(),
  );
  SwaggerModule.setup('api/docs', app, document, { useGlobalPrefix: false });
}
