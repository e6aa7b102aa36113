import { defineConfig } from 'tsup';

export default defineConfig({
  entry: { index: 'src/index.ts', plot: 'src/plot/index.ts', node: 'src/node.ts', cli: 'src/cli/main.ts' },
  format: ['esm', 'cjs'],
  dts: true,
  sourcemap: true,
  clean: true,
  target: 'es2022',
  platform: 'neutral',
  splitting: true,
  treeshake: true,
  // The d3 modules ship as ESM only; bundle them so that the CJS build works everywhere.
  noExternal: [/^d3-/, 'internmap'],
});
