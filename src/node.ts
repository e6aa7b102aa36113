/**
 * Node-only entry point (`phasewise/node`): readers that use the file system.
 * The browser-safe core (`phasewise`) never imports this module.
 * @module
 */
export { readYFactorCsv, readOnOffCsv, readCorrelationMatrixFile } from './measure/node.js';
export { readTouchstoneFile, writeTouchstoneFile } from './network/node.js';
export { readPatternFile, writePatternFile } from './element/node.js';
export { writeFigure } from './plot/node.js';
