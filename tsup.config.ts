import { defineConfig } from 'tsup';

// The d3 modules ship as ESM only; bundle them so that the CJS build works everywhere.
const noExternal = [/^d3-/, 'internmap'];

export default defineConfig([
  {
    // The library: ESM + CJS + declarations, shared chunks so the error classes are one family across entries.
    entry: { index: 'src/index.ts', plot: 'src/plot/index.ts', node: 'src/node.ts' },
    format: ['esm', 'cjs'],
    dts: true,
    sourcemap: true,
    clean: false,
    target: 'es2022',
    platform: 'neutral',
    splitting: true,
    treeshake: true,
    noExternal,
  },
  {
    // The command line and its worker thread: ESM only (the bin is dist/cli.js), Node.
    entry: { cli: 'src/cli/bin.ts', 'cli-worker': 'src/cli/worker.ts' },
    format: ['esm'],
    dts: false,
    sourcemap: true,
    clean: false,
    target: 'es2022',
    platform: 'node',
    splitting: true,
    treeshake: true,
    noExternal,
  },
]);
