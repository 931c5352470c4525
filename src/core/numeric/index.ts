export { gaussLegendre, integrate } from './gauss-legendre.js';
export type { GaussRule } from './gauss-legendre.js';
export { cubicSpline, splineEval, splineDeriv } from './cubic-spline.js';
export type { CubicSpline } from './cubic-spline.js';
export { findRoot } from './root-find.js';
export { quantileSorted } from './quantile.js';
export { selectKth, quantilesBySelection, quantilesByBuckets } from './select.js';
export { isStrictNumber, parseStrictNumber } from './strict-number.js';
