/** The seeded generator lives in shared/ so that the browser's share intervals use the same one. */
export { createPrng, type Prng } from '../../../shared/engine/random/prng';
