import { existsSync } from 'node:fs';
import { join, resolve } from 'node:path';
import type { LoggerService, LogLevel } from '@nestjs/common';
import { NestFactory } from '@nestjs/core';
import type { NestExpressApplication } from '@nestjs/platform-express';
import { DocumentBuilder, SwaggerModule } from '@nestjs/swagger';
import express, { type NextFunction, type Request, type Response } from 'express';
import { cleanupOpenApiDoc } from 'nestjs-zod';
import { AppModule } from './app.module';
import { correlationIdMiddleware } from './common/correlation-id.middleware';
import { jsonBodies } from './common/json-bodies';
import { JsonReplyAdapter } from './common/json-reply.adapter';
import { securityHeaders } from './common/security/security-headers';
import type { Env } from './config/env';
import { answerLivenessFirst } from './health/liveness';

export interface CreateAppOptions {
  logger?: LoggerService | LogLevel[] | false;
  /** Let Nest close the app on SIGTERM/SIGINT. Off under the local stack, which stops its parts itself, MariaDB last. */
  shutdownHooks?: boolean;
}

/** Builds the API (and, when WEB_DIST holds a build, the web app on the same origin); does not listen. */
export async function createApp(env: Env, options: CreateAppOptions = {}): Promise<NestExpressApplication> {
  const app = await NestFactory.create<NestExpressApplication>(AppModule.forRoot(env), new JsonReplyAdapter(), {
    logger: options.logger ?? ['error', 'warn', 'log'],
    // JSON bodies only (below, with our limit): no route takes form-encoded bodies, and Nest's
    // default added a urlencoded parser to every request's middleware chain.
    bodyParser: false,
  });
  answerLivenessFirst(app.getHttpServer());
  // X-Forwarded-For is believed only from the proxies TRUST_PROXY names (none by default),
  // so a client cannot pick its own address to dodge the per-address limits.
  app.set('trust proxy', env.TRUST_PROXY);
  app.disable('x-powered-by');
  // No ETag on API answers: Express hashed every JSON body (SHA-1) for it, and no client of the
  // API sends If-None-Match. The web app's static files keep theirs (serve-static's own).
  app.set('etag', false);
  app.use(securityHeaders(env));
  // The id first, so that a body refused by the parser gets one in its error answer too.
  app.use(correlationIdMiddleware);
  app.use(jsonBodies('2mb'));
  app.setGlobalPrefix('api');
  if (options.shutdownHooks) app.enableShutdownHooks();

  // The API description is a map for attackers as much as for developers: not served in production.
  if (env.NODE_ENV !== 'production') {
    const document = SwaggerModule.createDocument(
      app,
      new DocumentBuilder().setTitle('Shuntwise API').setDescription('JSON in SI units.').setVersion('1').addBearerAuth().build(),
    );
    SwaggerModule.setup('api/docs', app, cleanupOpenApiDoc(document));
  }

  const webDist = resolve(env.WEB_DIST ?? join(__dirname, '..', '..', 'web', 'dist'));
  if (existsSync(join(webDist, 'index.html'))) serveWeb(app, webDist);
  return app;
}

/**
 * Static files, then index.html for every other non-API GET so client-side routes load. API
 * paths never reach the static files: serve-static looked each one up on disk first (a stat that
 * failed), about a tenth of the CPU of an API read in the profile.
 */
function serveWeb(app: NestExpressApplication, webDist: string): void {
  const isApi = (req: Request) => req.path === '/api' || req.path.startsWith('/api/');
  const files = express.static(webDist, { index: false, maxAge: '1h', immutable: false });
  app.use((req: Request, res: Response, next: NextFunction) => (isApi(req) ? next() : files(req, res, next)));
  const index = join(webDist, 'index.html');
  app.use((req: Request, res: Response, next: NextFunction) => {
    if (req.method !== 'GET' || isApi(req)) return next();
    res.setHeader('Cache-Control', 'no-cache');
    res.sendFile(index);
  });
}
