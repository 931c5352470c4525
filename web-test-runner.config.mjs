// web-test-runner in Debian's headless Chromium (no downloaded browser). Component tests run the TS
// sources through esbuild (with our tsconfig, so lit decorators compile); the end-to-end tests load the
// rollup bundle from public/ (run `npm run build` first; `npm test` does). A small reporter writes the
// pass/fail counts for test/run-all.mjs.
import { mkdirSync, writeFileSync } from 'node:fs';
import { esbuildPlugin } from '@web/dev-server-esbuild';
import { fromRollup } from '@web/dev-server-rollup';
import rollupCommonjs from '@rollup/plugin-commonjs';
import * as esbuild from 'esbuild';
import { chromeLauncher } from '@web/test-runner-chrome';

const commonjs = fromRollup(rollupCommonjs);

/**
 * @stdlib's math functions (erf, erfc, gamma) are CommonJS spread over many small packages, which a
 * file-by-file conversion gets wrong; source-mode modules get each function as one ES module bundled by
 * esbuild instead, with @stdlib's define-property module as the engine's own (as in rollup.config.mjs).
 */
const stdlibAsModules = {
  name: 'stdlib-as-modules',
  async serve(ctx) {
    const m = /\/node_modules\/(@stdlib\/math-base-special-[a-z]+)\/lib\/index\.js$/.exec(ctx.path);
    if (!m) return undefined;
    const nativeDefineProperty = {
      name: 'native-define-property',
      setup: (b) => {
        b.onResolve({ filter: /^@stdlib\/utils-define-property$/ }, () => ({ path: 'native-define-property', namespace: 'native' }));
        b.onLoad({ filter: /.*/, namespace: 'native' }, () => ({ contents: 'module.exports = Object.defineProperty;', loader: 'js' }));
      },
    };
    const out = await esbuild.build({ entryPoints: [`node_modules/${m[1]}/lib/index.js`], bundle: true, format: 'esm', platform: 'browser', write: false, plugins: [nativeDefineProperty] });
    return { body: out.outputFiles[0].text, type: 'js' };
  },
};

function countsReporter() {
  return {
    onTestRunFinished({ sessions }) {
      let passed = 0;
      let failed = 0;
      const walk = (suite) => {
        if (!suite) return;
        for (const t of suite.tests ?? []) t.passed ? passed++ : t.skipped ? 0 : failed++;
        for (const s of suite.suites ?? []) walk(s);
      };
      for (const s of sessions) {
        walk(s.testResults);
        if (!s.passed && (s.errors?.length ?? 0) > 0) failed += s.errors.length;
      }
      mkdirSync('test-results', { recursive: true });
      writeFileSync('test-results/wtr.json', JSON.stringify({ passed, failed }));
    },
  };
}

export default {
  files: ['test/browser/**/*.test.ts'],
  nodeResolve: { browser: true },
  concurrency: 1,
  testFramework: { config: { timeout: 60000 } },
  testsFinishTimeout: 600000,
  browserStartTimeout: 60000,
  middleware: [
    // Source-mode components link uPlot's stylesheet next to their module; serve it from the package.
    (ctx, next) => {
      if (ctx.url.endsWith('/src/ui/uPlot.min.css')) ctx.url = '/node_modules/uplot/dist/uPlot.min.css';
      return next();
    },
  ],
  plugins: [
    // papaparse, a CommonJS package that source-mode modules import, converted file by file.
    stdlibAsModules,
    commonjs({ include: ['**/node_modules/papaparse/**'], strictRequires: false }),
    esbuildPlugin({ ts: true, tsconfig: './tsconfig.json', target: 'es2022' }),
  ],
  browsers: [
    chromeLauncher({
      launchOptions: {
        executablePath: '/usr/bin/chromium',
        headless: true,
        args: ['--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
      },
    }),
  ],
  reporters: [(await import('@web/test-runner')).defaultReporter(), countsReporter()],
};
