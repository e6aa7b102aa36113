/**
 * Vite configuration of the playground page. The page imports the BUILT library
 * (dist/index.js and dist/plot.js, written by `npm run build`), so building it proves
 * the published browser entries work without Node built-ins.
 */
import { defineConfig } from 'vite';
import { fileURLToPath } from 'node:url';

const here = fileURLToPath(new URL('.', import.meta.url));
const dist = fileURLToPath(new URL('../dist/', import.meta.url));

export default defineConfig({
  root: here,
  base: './',
  publicDir: false,
  resolve: {
    alias: [
      { find: /^phasewise\/plot$/, replacement: `${dist}plot.js` },
      { find: /^phasewise$/, replacement: `${dist}index.js` },
    ],
  },
  build: {
    outDir: 'dist',
    emptyOutDir: true,
    target: 'es2022',
    // One self-contained bundle: no preload helper fetching anything else.
    modulePreload: false,
    chunkSizeWarningLimit: 2000,
  },
  server: { host: '127.0.0.1' },
});
