export { steeringVector, steeringVectorInto, steeringMatrix, steeringMatrixInto } from './steering.js';
export { arrayFactor, arrayFactorInto, arrayFactorMagnitude, magnitudesInto } from './arrayFactor.js';
export type { ElementFactor } from './element.js';
export { elementFactorValues, totalPattern } from './element.js';
