/** The run simulator and the invented demo data: see lib/sim/MODEL.md. */
export { SimInputError } from './errors';
export { createRng, type Rng } from './random';
export { circularOrder, crossPatternOrder, validatePassOrder, type PassOrderCheck } from './patterns';
export * from './simulate-run';
export * from './demo-scenario';
