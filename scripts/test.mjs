#!/usr/bin/env node
// npm test: from a fresh clone, self-sufficient. Dependencies, chromium, PostgreSQL with fresh test databases,
// type checks, jest (unit, verification, integration), a production build, then Playwright in Debian's chromium.
// Ends with one line: "N passed, N failed".
import { existsSync, mkdirSync, readFileSync, rmSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { ensureAptPackages } from './lib/apt.mjs';
import { ensureDependencies } from './lib/deps.mjs';
import { run, step } from './lib/run.mjs';

const root = resolve(import.meta.dirname, '..');
const results = join(root, 'test-results');
rmSync(results, { recursive: true, force: true });
mkdirSync(results, { recursive: true });
const t0 = performance.now();
let passed = 0;
let failed = 0;
const failures = [];

step('setup', () => ensureDependencies(root));
if (!existsSync('/usr/bin/chromium')) step('chromium', () => ensureAptPackages(['chromium']));
const { pgEnv, startPostgres, stopPostgres, ensureDatabase } = await import('./lib/postgres.mjs');
const startedPostgres = await step('db', async () => {
  const started = startPostgres();
  await ensureDatabase('osmolane_test', { fresh: true });
  await ensureDatabase('osmolane_e2e', { fresh: true });
  return started;
});

try {
  for (const project of ['tsconfig.server.json', 'tsconfig.app.json', 'tsconfig.spec.json', 'tsconfig.worker.json']) {
    const code = step(`typecheck ${project}`, () => run('npx', ['tsc', '-p', project, '--noEmit'], { cwd: root }));
    if (code === 0) passed += 1;
    else (failed += 1), failures.push(`type check of ${project}`);
  }

  const jestJson = join(results, 'jest.json');
  step('jest', () =>
    run('npx', ['jest', '--ci', '--json', `--outputFile=${jestJson}`], { cwd: root, env: { ...pgEnv('osmolane_test'), LOG_REQUESTS: '0' } }),
  );
  if (existsSync(jestJson)) {
    const j = JSON.parse(readFileSync(jestJson, 'utf8'));
    passed += j.numPassedTests;
    failed += j.numFailedTests;
    if (j.numRuntimeErrorTestSuites > 0) (failed += j.numRuntimeErrorTestSuites), failures.push(`${j.numRuntimeErrorTestSuites} jest suite(s) failed to run`);
    for (const suite of j.testResults)
      for (const t of suite.assertionResults) if (t.status === 'failed') failures.push(`jest: ${t.fullName}`);
  } else {
    failed += 1;
    failures.push('jest did not report results');
  }

  const built = step('build', () => run('npx', ['ng', 'build'], { cwd: root, env: { NG_CLI_ANALYTICS: 'false' } }));
  if (built !== 0) {
    failed += 1;
    failures.push('production build of the app');
  } else {
    const pwJson = join(results, 'playwright.json');
    step('playwright', () =>
      run('npx', ['playwright', 'test', '--reporter=list,json'], {
        cwd: root,
        env: { PLAYWRIGHT_JSON_OUTPUT_NAME: pwJson, PLAYWRIGHT_SKIP_BROWSER_DOWNLOAD: '1', ...pgEnv('osmolane_e2e') },
      }),
    );
    if (existsSync(pwJson)) {
      const s = JSON.parse(readFileSync(pwJson, 'utf8')).stats;
      passed += s.expected + (s.flaky ?? 0);
      failed += s.unexpected;
      if (s.unexpected > 0) failures.push(`${s.unexpected} browser test(s); see test-results/`);
    } else {
      failed += 1;
      failures.push('playwright did not report results');
    }
  }
} finally {
  if (startedPostgres) stopPostgres();
}

const minutes = ((performance.now() - t0) / 60000).toFixed(1);
if (failures.length) console.log(`\nFailed:\n  ${failures.join('\n  ')}`);
console.log(`\nnpm test took ${minutes} min`);
console.log(`${passed} passed, ${failed} failed`);
process.exit(failed === 0 ? 0 : 1);
