export type { ResultKind, ShowOptions } from './format.js';
export { show, resultKind, unitOfField } from './format.js';
export { INSPECT_SYMBOL, restoreDisplay } from './attach.js';
export { resultFromJSON } from './json.js';
