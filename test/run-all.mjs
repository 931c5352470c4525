#!/usr/bin/env node
// The project's whole test suite: type checks, vitest (numeric core, CLI, property tests) and
// web-test-runner (components and the end-to-end app in headless Chromium). Prints one closing
// line "N passed, N failed" and exits non-zero if anything failed.
import { spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, readFileSync, rmSync } from 'node:fs';

mkdirSync('test-results', { recursive: true });
let passed = 0;
let failed = 0;
let broken = [];

function run(label, cmd, args) {
  console.log(`\n=== ${label}: ${cmd} ${args.join(' ')}`);
  const r = spawnSync(cmd, args, { stdio: 'inherit', env: { ...process.env, FORCE_COLOR: '0' } });
  if (r.status !== 0) broken.push(`${label} exited with ${r.status ?? r.signal}`);
  return r.status === 0;
}

// 1. Type checks: the whole project, and the core alone without the DOM library.
if (run('typecheck', 'npx', ['tsc', '--noEmit', '-p', 'tsconfig.json'])) passed++;
else failed++;
if (run('typecheck core (no DOM)', 'npx', ['tsc', '--noEmit', '-p', 'src/core/tsconfig.json'])) passed++;
else failed++;

// 2. vitest
rmSync('test-results/vitest.json', { force: true });
run('vitest', 'npx', ['vitest', 'run', '--reporter=default', '--reporter=json', '--outputFile.json=test-results/vitest.json']);
if (existsSync('test-results/vitest.json')) {
  const j = JSON.parse(readFileSync('test-results/vitest.json', 'utf8'));
  passed += j.numPassedTests;
  failed += j.numFailedTests + (j.numRuntimeErrorTestSuites ?? 0);
} else {
  failed++;
  broken.push('vitest wrote no results');
}

// 3. browser tests (build first: the end-to-end tests load the bundle)
if (existsSync('web-test-runner.config.mjs')) {
  rmSync('test-results/wtr.json', { force: true });
  if (run('build', 'npx', ['rollup', '-c', '--silent'])) {
    run('web-test-runner', 'npx', ['web-test-runner']);
    if (existsSync('test-results/wtr.json')) {
      const j = JSON.parse(readFileSync('test-results/wtr.json', 'utf8'));
      passed += j.passed;
      failed += j.failed;
    } else {
      failed++;
      broken.push('web-test-runner wrote no results');
    }
  } else failed++;
}

if (broken.length) console.log(`\nproblems: ${broken.join('; ')}`);
console.log(`\n${passed} passed, ${failed} failed`);
process.exit(failed === 0 && broken.length === 0 ? 0 : 1);
