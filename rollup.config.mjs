// Builds the static site into public/: the page (app.js) and the audit worker (audit.worker.js), each
// self-contained, plus the stylesheets. esbuild transpiles TypeScript (decorators from tsconfig.json);
// `npm run typecheck` does the type check.
import commonjs from '@rollup/plugin-commonjs';
import { nodeResolve } from '@rollup/plugin-node-resolve';
import { readFileSync } from 'node:fs';
import esbuild from 'rollup-plugin-esbuild';

const plugins = () => [nodeResolve({ browser: true }), commonjs(), esbuild({ target: 'es2022', minify: true, sourceMap: true, tsconfig: 'tsconfig.json' })];

const copyAssets = {
  name: 'copy-assets',
  generateBundle() {
    this.emitFile({ type: 'asset', fileName: 'uPlot.min.css', source: readFileSync('node_modules/uplot/dist/uPlot.min.css') });
    this.emitFile({ type: 'asset', fileName: 'app.css', source: readFileSync('src/ui/app.css') });
  },
};

// The page reads CSV itself (src/ui/csv-text.ts); papaparse, which core modules it imports for their
// tables import too, has no side effects the page needs, so it is left out of app.js when unused.
const pageTreeshake = { moduleSideEffects: (id) => !/node_modules[\\/]papaparse[\\/]/.test(id) };

export default [
  { input: 'src/main.ts', output: { file: 'public/app.js', format: 'es', sourcemap: true }, treeshake: pageTreeshake, plugins: [...plugins(), copyAssets] },
  { input: 'workers/audit.worker.ts', output: { file: 'public/audit.worker.js', format: 'es', sourcemap: true }, plugins: plugins() },
];
