import type { Server } from 'node:http';
import { createApp } from './app';
import { loadConfig } from './config';
import { openDatabase } from './db/orm';

/** Starts the server: database (migrated), then HTTP; stops both cleanly on SIGINT/SIGTERM. */
async function main(): Promise<void> {
  const config = loadConfig();
  const orm = await openDatabase();
  const app = createApp({ config, orm });
  const server: Server = app.listen(config.port, config.host, () => {
    console.log(`[server] Osmolane ${config.version} on http://${config.host}:${config.port}`);
  });

  let stopping = false;
  const stop = (signal: string) => {
    if (stopping) return;
    stopping = true;
    console.log(`[server] ${signal}: finishing open requests, then stopping`);
    const force = setTimeout(() => process.exit(1), 10_000);
    force.unref();
    server.close(async () => {
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
