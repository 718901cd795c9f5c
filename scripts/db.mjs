#!/usr/bin/env node
// npm run db:start | db:stop, and `node scripts/db.mjs ensure NAME [--fresh]` for tests.
import { ensureDatabase, startPostgres, stopPostgres } from './lib/postgres.mjs';

const [command, name, flag] = process.argv.slice(2);
try {
  if (command === 'start') startPostgres();
  else if (command === 'stop') stopPostgres();
  else if (command === 'ensure' && name) {
    startPostgres();
    await ensureDatabase(name, { fresh: flag === '--fresh' });
  } else {
    console.error('usage: node scripts/db.mjs start | stop | ensure NAME [--fresh]');
    process.exit(2);
  }
} catch (err) {
  console.error(`[db] ${err instanceof Error ? err.message : err}`);
  process.exit(1);
}
