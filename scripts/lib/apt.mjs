// Installs Debian packages the project needs (PostgreSQL server, chromium) when they are missing.
import { spawnSync } from 'node:child_process';

let updated = false;

export function ensureAptPackages(packages) {
  const sudo = process.getuid?.() === 0 ? [] : ['sudo'];
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  const run = (args) => {
    const [cmd, ...rest] = [...sudo, ...args];
    const r = spawnSync(cmd, rest, { stdio: 'inherit', env });
    if (r.status !== 0) throw new Error(`${args.join(' ')} failed with exit code ${r.status}`);
  };
  if (!updated) {
    run(['apt-get', 'update', '-q']);
    updated = true;
  }
  run(['apt-get', 'install', '-y', '-q', '--no-install-recommends', ...packages]);
}
