// Builds the browser bundles into public/: the audit worker (self-contained: comlink, papaparse and the
// numeric core inside). esbuild transpiles TypeScript (no type check here: `npm run typecheck` does that).
import commonjs from '@rollup/plugin-commonjs';
import { nodeResolve } from '@rollup/plugin-node-resolve';
import esbuild from 'rollup-plugin-esbuild';

const plugins = () => [nodeResolve({ browser: true }), commonjs(), esbuild({ target: 'es2022', minify: true, sourceMap: true, tsconfig: 'tsconfig.json' })];

export default [
  {
    input: 'workers/audit.worker.ts',
    output: { file: 'public/audit.worker.js', format: 'es', sourcemap: true },
    plugins: plugins(),
  },
];
