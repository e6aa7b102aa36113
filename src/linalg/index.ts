export type { CMatrix, ComplexLike, ComplexParts, CMatrixJSON } from './cmatrix.js';
export {
  matrixView, zeros, identity, complexParts, fromRows, fromParts, columnVector, diagonal, clone,
  entry, setEntry, realPart, imagPart, toRows, matrixToJSON, matrixFromJSON, formatMatrix,
} from './cmatrix.js';
export {
  add, subtract, scale, hadamard, multiply, multiplyInto, adjoint, transpose, conjugate, trace,
  frobeniusNorm, norm1, normInf, hermitianDeviation, isHermitian, hermitianPart, block, pick, setBlock,
  column, innerProduct, vectorNorm, quadraticForm, maxAbsDifference, concatColumns, concatRows,
} from './ops.js';
export type { LuResult, LogDeterminantResult } from './lu.js';
export { luFactor, luSolve, luSolveAdjoint, solve, inverse, determinant, logDeterminant } from './lu.js';
export type { CholeskyResult, CholeskyOptions } from './cholesky.js';
export { choleskyFactor, choleskySolve, solveLowerTriangular, solveLowerAdjoint } from './cholesky.js';
export type { HermitianEigenOptions, HermitianEigenResult, GeneralizedEigenResult } from './eigen.js';
export { hermitianEigen, generalizedHermitianEigen } from './eigen.js';
export type { SvdResult, RankOptions } from './svd.js';
export { svd, conditionNumber, pseudoInverse, matrixRank } from './svd.js';
export type { PolynomialRootsOptions } from './roots.js';
export { polynomialRoots, polynomialFromRoots } from './roots.js';
export type { SimdStatus } from './simd.js';
export { setKernelThreads, simdStatus } from './simd.js';
