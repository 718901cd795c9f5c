import { execFileSync } from 'node:child_process';
import { join } from 'node:path';

/**
 * Jest global setup: make sure the project's PostgreSQL runs and the test database exists.
 * `npm test` already created it fresh; when jest is run alone this creates it (fresh) on first use.
 */
export default function globalSetup(): void {
  const name = process.env['PGDATABASE'] ?? 'osmolane_test';
  process.env['PGDATABASE'] = name;
  process.env['PGPORT'] ??= '55432';
  process.env['PGHOST'] ??= '127.0.0.1';
  process.env['LOG_REQUESTS'] ??= '0';
  const root = join(__dirname, '..', '..');
  execFileSync('node', [join(root, 'scripts', 'db.mjs'), 'ensure', name], { stdio: 'inherit' });
}
