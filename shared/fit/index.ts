export { fitPolynomial } from './fit-polynomial.js';
export type { PolynomialFit, PolynomialFitOptions } from './polynomial-fit-types.js';
export { predictValue, predictInterval } from './predict-interval.js';
export type { FitInterval } from './predict-interval.js';
export { inverseLine, invertFit, fitInversePolynomial } from './invert-polynomial.js';
export type { InverseLine } from './invert-polynomial.js';
export { householderLeastSquares, solveUpper, solveUpperTransposed } from './householder-qr.js';
export type { QrLeastSquares } from './householder-qr.js';
