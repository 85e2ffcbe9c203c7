/** The run simulator (see lib/sim/MODEL.md) and its adapter from the joint library. */
export { SimInputError } from './errors';
export { createRng, type Rng } from './random';
export { circularOrder, crossPatternOrder, validatePassOrder, type PassOrderCheck } from './patterns';
export * from './simulate-run';
export * from './from-library';
