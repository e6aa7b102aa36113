/**
 * The package version (kept equal to package.json's by a test).
 * @category Design
 */
export const VERSION = '0.1.0';
