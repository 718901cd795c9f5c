import type { Server } from 'node:http';
import { appLocals, createApp } from './app';
import { loadConfig } from './config';
import { openDatabase } from './db/orm';
import { startMail } from './mail';
import { seedDemo } from './seed/demo';

/** Starts the server: database (migrated, seeded on request), mail, then HTTP; stops all cleanly on SIGINT/SIGTERM. */
async function main(): Promise<void> {
  const config = loadConfig();
  const orm = await openDatabase();
  if (config.seedDemo && (await seedDemo(orm, config))) {
    console.log('[server] seeded the demo workspace "Tidewater Assay Lab" (password from DEMO_PASSWORD)');
  }
  const mail = await startMail(config);
  if (!config.smtpUrl) console.log(`[server] mail goes to the local stand-in at ${mail.smtpUrl}${config.devRoutes ? ' (read it at /api/dev/mailbox)' : ''}`);
  const app = createApp({ config, orm, mail });
  const server: Server = app.listen(config.port, config.host, () => {
    console.log(`[server] Osmolane ${config.version} on http://${config.host}:${config.port}`);
  });
  server.on('error', (err) => {
    console.error(`[server] cannot listen on ${config.host}:${config.port}: ${err.message}`);
    process.exit(1);
  });

  let stopping = false;
  const stop = (signal: string) => {
    if (stopping) return;
    stopping = true;
    console.log(`[server] ${signal}: finishing open requests, then stopping`);
    const force = setTimeout(() => process.exit(1), 10_000);
    force.unref();
    server.close(async () => {
      await appLocals(app).idle();
      await mail.close().catch((err: unknown) => console.error('[server] mail did not stop cleanly:', err));
      await orm.close(true);
      process.exit(0);
    });
    server.closeIdleConnections();
  };
  process.on('SIGINT', () => stop('SIGINT'));
  process.on('SIGTERM', () => stop('SIGTERM'));
}

main().catch((err: unknown) => {
  console.error('[server] failed to start:', err instanceof Error ? err.message : err);
  process.exit(1);
});
