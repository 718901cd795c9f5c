// Installs the project's npm dependencies when they are missing or older than package-lock.json.
import { spawnSync } from 'node:child_process';
import { existsSync, statSync } from 'node:fs';
import { join } from 'node:path';

export function ensureDependencies(root) {
  const marker = join(root, 'node_modules', '.package-lock.json');
  const lock = join(root, 'package-lock.json');
  const fresh = existsSync(marker) && (!existsSync(lock) || statSync(marker).mtimeMs >= statSync(lock).mtimeMs);
  if (fresh) return;
  console.log('[setup] installing npm dependencies');
  const args = existsSync(lock) ? ['ci', '--no-audit', '--no-fund'] : ['install', '--no-audit', '--no-fund'];
  const r = spawnSync('npm', args, { cwd: root, stdio: 'inherit', env: { ...process.env, PLAYWRIGHT_SKIP_BROWSER_DOWNLOAD: '1' } });
  if (r.status !== 0) throw new Error(`npm ${args[0]} failed with exit code ${r.status}`);
}
