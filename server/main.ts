import type { Server } from 'node:http';
import { appLocals, createApp } from './app';
import { loadConfig } from './config';
import { openDatabase } from './db/orm';
import { startMail } from './mail';
import { spawnWorker } from './jobs/spawn';
import { seedDemo } from './seed/demo';
import { startStorage } from './storage';

/** Starts the server: database (migrated, seeded on request), mail, then HTTP; stops all cleanly on SIGINT/SIGTERM. */
async function main(): Promise<void> {
  const config = loadConfig();
  const orm = await openDatabase();
  if (config.seedDemo && (await seedDemo(orm, config))) {
    console.log('[server] seeded the demo workspace "Tidewater Assay Lab" (password from DEMO_PASSWORD)');
  }
  const mail = await startMail(config);
  if (!config.smtpUrl) console.log(`[server] mail goes to the local stand-in at ${mail.smtpUrl}${config.devRoutes ? ' (read it at /api/dev/mailbox)' : ''}`);
  const storage = await startStorage(config, orm);
  console.log(`[server] run fields and uploaded drawings go to ${storage.where}`);
  const app = createApp({ config, orm, mail, blobs: storage.blobs });
  const server: Server = app.listen(config.port, config.host, () => {
    console.log(`[server] Osmolane ${config.version} on http://${config.host}:${config.port}`);
  });
  const worker = process.env['START_WORKER'] === '1' ? keepWorker() : null;
  server.on('error', (err) => {
    console.error(`[server] cannot listen on ${config.host}:${config.port}: ${err.message}`);
    process.exit(1);
  });

  let stopping = false;
  const stop = (signal: string) => {
    if (stopping) return;
    stopping = true;
    console.log(`[server] ${signal}: finishing open requests, then stopping`);
    worker?.stop();
    const background = appLocals(app).stop();
    const force = setTimeout(() => process.exit(1), 10_000);
    force.unref();
    server.close(async () => {
      await appLocals(app).idle();
      await background.catch((err: unknown) => console.error('[server] sweep queue did not stop cleanly:', err));
      await mail.close().catch((err: unknown) => console.error('[server] mail did not stop cleanly:', err));
      await storage.close().catch((err: unknown) => console.error('[server] storage did not stop cleanly:', err));
      await orm.close(true);
      process.exit(0);
    });
    server.closeIdleConnections();
  };
  process.on('SIGINT', () => stop('SIGINT'));
  process.on('SIGTERM', () => stop('SIGTERM'));
}

/** START_WORKER=1 (npm start, the e2e server): one sweep worker process beside the server, restarted if it dies. */
function keepWorker(): { stop(): void } {
  let stopped = false;
  let child = start();
  function start() {
    const c = spawnWorker();
    c.on('exit', (code, signal) => {
      if (stopped) return;
      console.error(`[server] the sweep worker stopped (${signal ?? `exit code ${code}`}); starting another in 2 s`);
      setTimeout(() => {
        if (!stopped) child = start();
      }, 2000).unref();
    });
    return c;
  }
  return {
    stop() {
      stopped = true;
      child.kill('SIGTERM');
    },
  };
}

main().catch((err: unknown) => {
  console.error('[server] failed to start:', err instanceof Error ? err.message : err);
  process.exit(1);
});
