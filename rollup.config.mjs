// Builds the static site into public/: the page (app.js, with the figure elements as chunks it imports
// on start: chunk-*.js beside it, same origin, so the page's CSP holds) and the audit worker
// (audit.worker.js, self-contained), plus the stylesheets. esbuild transpiles TypeScript (decorators from tsconfig.json);
// `npm run typecheck` does the type check.
import commonjs from '@rollup/plugin-commonjs';
import { nodeResolve } from '@rollup/plugin-node-resolve';
import { readFileSync } from 'node:fs';
import esbuild from 'rollup-plugin-esbuild';

/**
 * @stdlib's math functions reach Object.defineProperty through a module that picks the builtin when the engine
 * has it and otherwise a polyfill, which drags in @stdlib's whole string-formatting package for its error
 * messages. Every engine the page runs on (ES2022 modules in workers) has the builtin, so the bundles use it
 * directly: the same function the module would pick, without the unreachable polyfill (−3 kB gzipped a bundle).
 */
const nativeDefineProperty = {
  name: 'native-define-property',
  resolveId: (id) => (id === '@stdlib/utils-define-property' ? '\0native-define-property' : null),
  load: (id) => (id === '\0native-define-property' ? 'export default Object.defineProperty;' : null),
};

const plugins = () => [nativeDefineProperty, nodeResolve({ browser: true }), commonjs(), esbuild({ target: 'es2022', minify: true, sourceMap: true, tsconfig: 'tsconfig.json' })];

const copyAssets = {
  name: 'copy-assets',
  generateBundle() {
    this.emitFile({ type: 'asset', fileName: 'uPlot.min.css', source: readFileSync('node_modules/uplot/dist/uPlot.min.css') });
    this.emitFile({ type: 'asset', fileName: 'app.css', source: readFileSync('src/ui/app.css') });
  },
};

// The page reads CSV itself (src/ui/csv-text.ts); papaparse, which core modules it imports for their
// tables import too, has no side effects the page needs, so it is left out of app.js when unused. The same
// holds for @stdlib's math functions (erfc is imported with the adaptive rule's text, used in the worker).
const pageTreeshake = { moduleSideEffects: (id) => !/node_modules[\\/](papaparse|@stdlib)[\\/]/.test(id) };

export default [
  { input: 'src/main.ts', output: { dir: 'public', entryFileNames: 'app.js', chunkFileNames: 'chunk-[name].js', format: 'es', sourcemap: true }, treeshake: pageTreeshake, plugins: [...plugins(), copyAssets] },
  { input: 'workers/audit.worker.ts', output: { file: 'public/audit.worker.js', format: 'es', sourcemap: true }, plugins: plugins() },
];
