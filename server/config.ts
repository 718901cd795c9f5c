import { randomBytes } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';

export interface ServerConfig {
  port: number;
  host: string;
  version: string;
  /** Folder with the built Angular app (index.html). */
  webRoot: string;
  jsonLimit: string;
  tokenSecret: string;
  logRequests: boolean;
  database: { host: string; port: number; user: string; password: string; dbName: string };
}

const root = join(__dirname, '..');

function packageVersion(): string {
  return (JSON.parse(readFileSync(join(root, 'package.json'), 'utf8')) as { version: string }).version;
}

/** Reads the server's settings from the environment; a token secret is generated for local use when none is set. */
export function loadConfig(env: NodeJS.ProcessEnv = process.env): ServerConfig {
  return {
    port: Number(env['PORT'] ?? 4300),
    host: env['HOST'] ?? '127.0.0.1',
    version: packageVersion(),
    webRoot: env['WEB_ROOT'] ?? join(root, 'dist', 'web', 'browser'),
    jsonLimit: env['JSON_LIMIT'] ?? '16mb',
    tokenSecret: env['TOKEN_SECRET'] ?? randomBytes(32).toString('hex'),
    logRequests: env['LOG_REQUESTS'] !== '0',
    database: {
      host: env['PGHOST'] ?? '127.0.0.1',
      port: Number(env['PGPORT'] ?? 55432),
      user: env['PGUSER'] ?? 'postgres',
      password: env['PGPASSWORD'] ?? '',
      dbName: env['PGDATABASE'] ?? 'osmolane',
    },
  };
}
