import cookieParser from 'cookie-parser';
import express, { type Express } from 'express';
import helmet from 'helmet';
import { existsSync } from 'node:fs';
import { join } from 'node:path';
import type { MikroORM } from '@mikro-orm/postgresql';
import { createAuthMiddleware } from './auth/passport';
import type { ServerConfig } from './config';
import { errorHandler, notFoundRoute } from './errors';
import { Mailbox } from './mail/mailbox';
import { Mailer } from './mail/mailer';
import { requestLog } from './request-log';
import { authRoutes } from './routes/auth';
import { ApiRoutes, type RouteInfo } from './routes/define';
import { designRoutes } from './routes/designs';
import { devRoutes } from './routes/dev';
import { fileRoutes } from './routes/files';
import { healthRoutes } from './routes/health';
import { libraryRoutes } from './routes/library';
import { sweepRoutes } from './routes/sweeps';
import { workspaceRoutes } from './routes/workspaces';
import { createServices, type Services } from './services';
import type { BlobStore } from './services/blob-store';

export interface AppContext {
  config: ServerConfig;
  orm: MikroORM;
  /** Outgoing mail and the mailbox the dev routes show; without it, mail goes straight into a fresh mailbox. */
  mail?: { mailer: Mailer; mailbox: Mailbox };
  blobs?: BlobStore;
}

/** What createApp builds, for main.ts and the tests: the services and the list of API routes ride on app.locals. */
export interface AppLocals {
  services: Services;
  routes: RouteInfo[];
  mailbox: Mailbox;
  /** Resolves when no API handler is running (for shutdown). */
  idle: () => Promise<void>;
  /** Ends the sweep event streams and stops the job queue and solver threads (first thing at shutdown). */
  stop: () => Promise<void>;
}

export function appLocals(app: Express): AppLocals {
  return app.locals as unknown as AppLocals;
}

/** Builds the Express app: security headers, body limits, request log, the API under /api, then the built Angular app. */
export function createApp(ctx: AppContext): Express {
  const { config, orm } = ctx;
  const mailbox = ctx.mail?.mailbox ?? new Mailbox();
  const mailer = ctx.mail?.mailer ?? Mailer.memory(mailbox, config.mailFrom);
  const services = createServices({ orm, config, mailer, blobs: ctx.blobs });

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
  if (config.logRequests) app.use(requestLog());
  app.use('/api', express.json({ limit: config.jsonLimit }));
  app.use('/api', cookieParser());

  const api = new ApiRoutes(createAuthMiddleware(config, (sid, uid) => services.auth.findSession(sid, uid)));
  healthRoutes(api, orm, config.version);
  authRoutes(api, services, config);
  workspaceRoutes(api, services);
  designRoutes(api, services);
  libraryRoutes(api, services);
  sweepRoutes(api, services);
  fileRoutes(api, services, config);
  // The mailbox holds live invitation and reset links: only outside production, and only for the local stand-in.
  if (config.devRoutes && !config.smtpUrl) devRoutes(api, mailbox);
  api.router.use(notFoundRoute);
  app.use('/api', api.router);
  const locals: AppLocals = { services, routes: api.routes, mailbox, idle: () => api.idle(), stop: () => services.stop() };
  Object.assign(app.locals, locals);

  const index = join(config.webRoot, 'index.html');
  if (existsSync(index)) {
    app.use(express.static(config.webRoot, { index: false, maxAge: '1h' }));
    // Client-side routes of the single-page app all answer with index.html.
    app.get('/{*splat}', (_req, res) => res.sendFile(index));
  }
  app.use(errorHandler());
  return app;
}
