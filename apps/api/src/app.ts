import { Logger } from '@nestjs/common';
import { NestFactory } from '@nestjs/core';
import { type NestExpressApplication } from '@nestjs/platform-express';
import { DocumentBuilder, type OpenAPIObject, SwaggerModule } from '@nestjs/swagger';
import { API_PREFIX, REFRESH_COOKIE } from '@rotaplex/contracts';
import compression from 'compression';
import cookieParser from 'cookie-parser';
import { type NextFunction, type Request, type Response } from 'express';
import helmet from 'helmet';
import { existsSync } from 'node:fs';
import { join } from 'node:path';
import { AppModule } from './app.module';
import { useBodyLimits } from './common/http/body-limits';
import { AppValidationPipe } from './common/pipes/app-validation.pipe';
import { AppConfig } from './config/app-config';
import { loadScaleOutConfig, type ScaleOutConfig } from './redis/scale-out-config';

export interface CreateAppOptions {
  /** Nest logger levels; tests pass false. */
  logger?: false | ('log' | 'error' | 'warn' | 'debug' | 'verbose' | 'fatal')[];
  /** Redis settings (default: REDIS_URL and friends from the environment; none: one process). */
  scaleOut?: ScaleOutConfig;
}

/** Builds and initialises the application (database migrated, mail catcher started, demo seeded). Does not listen. */
export async function createApp(
  config: AppConfig,
  options: CreateAppOptions = {},
): Promise<NestExpressApplication> {
  const app = await NestFactory.create<NestExpressApplication>(
    AppModule.forRoot(config, options.scaleOut ?? loadScaleOutConfig(process.env)),
    {
      logger: options.logger ?? ['log', 'error', 'warn', 'fatal'],
      bufferLogs: false,
      // Errors reach the caller (main exits with a message; tests fail) instead of exiting the process.
      abortOnError: false,
      // configureApp installs the JSON parser with its own size, depth and content-type checks.
      bodyParser: false,
    },
  );
  configureApp(app, config);
  await app.init();
  return app;
}

/** Everything main and the tests share: prefix, validation, security headers, cookies, OpenAPI, web app. */
export function configureApp(app: NestExpressApplication, config: AppConfig): OpenAPIObject {
  app.setGlobalPrefix(API_PREFIX.replace(/^\//, ''));
  app.useGlobalPipes(new AppValidationPipe());
  const https = config.publicUrl?.startsWith('https:') ?? false;
  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          // The mailbox shows received HTML in a sandboxed srcdoc frame.
          'frame-src': ["'self'", 'about:'],
          'img-src': ["'self'", 'data:'],
          // Only behind https: on plain http (local use) upgrading would break every request.
          'upgrade-insecure-requests': https ? [] : null,
        },
      },
      strictTransportSecurity: https,
    }),
  );
  // gzip for the web app's scripts and the JSON answers; server-sent event streams stay unbuffered.
  app.use(
    compression({
      filter: (req, res) =>
        !String(res.getHeader('Content-Type') ?? '').startsWith('text/event-stream') &&
        compression.filter(req, res),
    }),
  );
  app.use(cookieParser());
  app.disable('x-powered-by');
  // Behind a reverse proxy, the client address (used by the sign-in rate limit) comes from X-Forwarded-For.
  if (config.trustProxyHops > 0) app.set('trust proxy', config.trustProxyHops);
  app.enableShutdownHooks();

  const document = SwaggerModule.createDocument(
    app,
    new DocumentBuilder()
      .setTitle('Rotaplex API')
      .setDescription(
        'Staff rosters built with integer programming. Every route needs a bearer token unless marked otherwise.',
      )
      .setVersion(config.version)
      .addBearerAuth()
      .addCookieAuth(REFRESH_COOKIE)
      .build(),
  );
  useBodyLimits(app, API_PREFIX, document);
  SwaggerModule.setup(`${API_PREFIX.replace(/^\//, '')}/docs`, app, document, {
    jsonDocumentUrl: `${API_PREFIX.replace(/^\//, '')}/docs-json`,
    customSiteTitle: 'Rotaplex API',
  });

  serveWebApp(app, config);
  return document;
}

/** Serves the built web app (dist/web) when present, with index.html for every non-API page. */
function serveWebApp(app: NestExpressApplication, config: AppConfig): void {
  const index = join(config.webDistDir, 'index.html');
  if (!existsSync(index)) {
    new Logger('WebApp').log(`No built web app at ${config.webDistDir}; serving the API only`);
    return;
  }
  app.useStaticAssets(config.webDistDir, { index: false, maxAge: '1h', immutable: false });
  app.use((req: Request, res: Response, next: NextFunction) => {
    const isApi = req.path === API_PREFIX || req.path.startsWith(`${API_PREFIX}/`);
    if ((req.method !== 'GET' && req.method !== 'HEAD') || isApi || !req.accepts('html')) return next();
    res.setHeader('Cache-Control', 'no-cache');
    res.sendFile(index);
  });
}
