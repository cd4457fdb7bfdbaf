/**
 * Minimizers that know nothing of chemistry: a strong-Wolfe line search and
 * L-BFGS, conjugate gradients, steepest descent and FIRE over any
 * `(x, gradient) => f`.
 * @module
 */
export { maxAtomNorm, rmsAtomNorm } from './forces.js';
export { lineSearch } from './line-search.js';
export type { LineSearchOptions, LineSearchReason, LineSearchResult } from './line-search.js';
export { minimize } from './minimize.js';
export type { IterationInfo, MinimizeMethod, MinimizeOptions, MinimizeReason, MinimizeResult } from './minimize.js';
export type { ObjectiveFunction, Preconditioner, Projection } from './types.js';
export { createInitialMatrix } from './initial-matrix.js';
export type { InitialMatrix, InitialMatrixForm } from './initial-matrix.js';
