/**
 * Node-only entry point (`phasewise/node`): readers that use the file system.
 * The browser-safe core (`phasewise`) never imports this module.
 * @module
 */
export { readYFactorCsv, readOnOffCsv } from './measure/node.js';
