export * from './complex.js';
export * from './polynomial.js';
export { polynomialRoots } from './polynomial-roots.js';
export { brentRoot } from './brent-root.js';
export { brentMaximum, type Maximum } from './brent-maximum.js';
export { unwrapDegrees, wrapDegrees } from './unwrap.js';
export { logGrid } from './log-grid.js';
export { complexDeterminant } from './complex-determinant.js';
