#!/usr/bin/env node
// npm start: from a fresh clone, install what is missing, start PostgreSQL, build the app, serve app and API.
// Ctrl-C stops everything this script started.
import { resolve } from 'node:path';
import { ensureDependencies } from './lib/deps.mjs';
import { run, startChild, step, stopChild } from './lib/run.mjs';

const root = resolve(import.meta.dirname, '..');
const port = process.env.PORT ?? '4300';
const demoPassword = process.env.DEMO_PASSWORD ?? 'osmolane-demo';
const t0 = performance.now();

step('setup', () => ensureDependencies(root));
const { pgEnv, startPostgres, stopPostgres, ensureDatabase } = await import('./lib/postgres.mjs');
const startedPostgres = await step('db', async () => {
  const started = startPostgres();
  await ensureDatabase('osmolane');
  return started;
});
const stopDatabase = () => startedPostgres && stopPostgres();
if (process.env.SKIP_BUILD !== '1') {
  const code = step('build', () => run('npx', ['ng', 'build'], { cwd: root, env: { NG_CLI_ANALYTICS: 'false' } }));
  if (code !== 0) {
    console.error('[build] the app did not build; see the messages above');
    process.exit(code);
  }
}

const server = startChild('npx', ['tsx', '--tsconfig', 'tsconfig.server.json', 'server/main.ts'], {
  cwd: root,
  env: { ...pgEnv('osmolane'), PORT: port, SEED_DEMO: '1', DEMO_PASSWORD: demoPassword, START_WORKER: process.env.START_WORKER ?? '1' },
});

const address = `http://127.0.0.1:${port}`;
const ready = async () => {
  for (let i = 0; i < 240; i++) {
    try {
      const r = await fetch(`${address}/api/health`);
      if (r.ok) return true;
    } catch {
      /* not yet listening */
    }
    if (server.exitCode !== null) return false;
    await new Promise((r) => setTimeout(r, 250));
  }
  return false;
};
if (await ready()) {
  const seconds = ((performance.now() - t0) / 1000).toFixed(1);
  console.log(`\n  Osmolane is running at ${address}  (ready in ${seconds} s)`);
  console.log(`  Demo sign-in: mira.okafor@example.test (owner), jonas.lindqvist@example.test (editor),`);
  console.log(`                priya.raman@example.test (reviewer), tom.beck@example.test (viewer)`);
  console.log(`  Demo password: ${demoPassword}`);
  console.log('  Press Ctrl-C to stop.\n');
} else {
  console.error('[start] the server did not become healthy; see its messages above');
}

let stopping = false;
const shutdown = () => {
  if (stopping) return;
  stopping = true;
  stopChild(server);
  const wait = setInterval(() => {
    if (server.exitCode !== null || server.signalCode !== null) {
      clearInterval(wait);
      stopDatabase();
      process.exit(0);
    }
  }, 100);
  setTimeout(() => {
    stopChild(server, 'SIGKILL');
    stopDatabase();
    process.exit(0);
  }, 12_000).unref();
};
process.on('SIGINT', shutdown);
process.on('SIGTERM', shutdown);
server.on('exit', (code) => {
  if (!stopping) {
    console.error(`[start] the server stopped (exit code ${code})`);
    stopping = true;
    stopDatabase();
    process.exit(code ?? 1);
  }
});
