#!/usr/bin/env node
/**
 * The `phasewise` executable (package.json "bin" → dist/cli.js): runs the
 * command line unconditionally, so it works under the npm bin symlink, npx and
 * `node dist/cli.js` alike.
 * @internal
 * @module
 */
import { runCli } from './main.js';

runCli(process.argv.slice(2)).then((code) => { process.exitCode = code; }, () => { process.exitCode = 1; });
