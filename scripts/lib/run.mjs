// Small helpers for the start and test scripts: run a step, time it, and stop children on Ctrl-C.
import { spawn, spawnSync } from 'node:child_process';

export function step(label, fn) {
  const t0 = performance.now();
  const out = fn();
  const done = (v) => (console.log(`[${label}] done in ${((performance.now() - t0) / 1000).toFixed(1)} s`), v);
  return out instanceof Promise ? out.then(done) : done(out);
}

/** Runs a command to completion with inherited output; returns its exit code. */
export function run(cmd, args, { cwd, env } = {}) {
  const r = spawnSync(cmd, args, { cwd, stdio: 'inherit', env: { ...process.env, ...env } });
  return r.status ?? 1;
}

/** Starts a long-running child process in its own process group so that it can be stopped with everything it spawned. */
export function startChild(cmd, args, { cwd, env } = {}) {
  return spawn(cmd, args, { cwd, stdio: 'inherit', env: { ...process.env, ...env }, detached: true });
}

export function stopChild(child, signal = 'SIGTERM') {
  if (child.exitCode !== null || child.pid === undefined) return;
  try {
    process.kill(-child.pid, signal);
  } catch {
    /* already gone */
  }
}
