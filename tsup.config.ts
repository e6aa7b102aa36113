import { defineConfig } from 'tsup';

// The d3 modules ship as ESM only; bundle them so that the CJS build works everywhere.
const noExternal = [/^d3-/, 'internmap'];

export default defineConfig([
  {
    // The library: ESM + CJS + declarations, shared chunks so the error classes are one family across entries.
    // One entry per module besides the root: `phasewise/linalg`, `phasewise/network`, … (the root barrel
    // exports everything; the subpaths give generic names such as add or trace an unambiguous home).
    entry: { index: 'src/index.ts', plot: 'src/plot/index.ts', node: 'src/node.ts', units: 'src/units/index.ts', linalg: 'src/linalg/index.ts', geometry: 'src/geometry/index.ts', pattern: 'src/pattern/index.ts', taper: 'src/taper/index.ts', network: 'src/network/index.ts', element: 'src/element/index.ts', floquet: 'src/floquet/index.ts', reception: 'src/reception/index.ts', beamform: 'src/beamform/index.ts', measure: 'src/measure/index.ts', reflector: 'src/reflector/index.ts', wire: 'src/wire/index.ts', imperfect: 'src/imperfect/index.ts', design: 'src/design/index.ts' },
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
