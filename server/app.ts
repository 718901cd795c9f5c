import express, { type Express } from 'express';
import helmet from 'helmet';
import morgan from 'morgan';
import { existsSync } from 'node:fs';
import { join } from 'node:path';
import type { MikroORM } from '@mikro-orm/postgresql';
import type { ServerConfig } from './config';
import { errorHandler, notFoundRoute } from './errors';
import { healthRoutes } from './routes/health';

export interface AppContext {
  config: ServerConfig;
  orm: MikroORM;
}

/** Builds the Express app: security headers, body limits, request log, the API under /api, then the built Angular app. */
export function createApp(ctx: AppContext): Express {
  const { config, orm } = ctx;
  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', 'loopback');
  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          defaultSrc: ["'self'"],
          scriptSrc: ["'self'"],
          styleSrc: ["'self'", "'unsafe-inline'"],
          imgSrc: ["'self'", 'data:', 'blob:'],
          fontSrc: ["'self'"],
          workerSrc: ["'self'", 'blob:'],
          connectSrc: ["'self'"],
          objectSrc: ["'none'"],
          frameAncestors: ["'none'"],
        },
      },
    }),
  );
  if (config.logRequests) app.use(morgan(':method :url :status :res[content-length] - :response-time ms'));
  app.use('/api', express.json({ limit: config.jsonLimit }));

  const api = express.Router();
  api.use(healthRoutes(orm, config.version));
  api.use(notFoundRoute);
  app.use('/api', api);

  const index = join(config.webRoot, 'index.html');
  if (existsSync(index)) {
    app.use(express.static(config.webRoot, { index: false, maxAge: '1h' }));
    // Client-side routes of the single-page app all answer with index.html.
    app.get('/{*splat}', (_req, res) => res.sendFile(index));
  }
  app.use(errorHandler());
  return app;
}
