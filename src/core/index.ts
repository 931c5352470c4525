export * from './constants.js';
export * from './cosmology/index.js';
export * from './numeric/index.js';
export * from './power/index.js';
export * from './halos/index.js';
export * from './stars/index.js';
export * from './audit/index.js';
