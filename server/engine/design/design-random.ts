/**
 * The design engine draws from the one seeded generator (draws/prng.ts, xoshiro128**) and the
 * one scrambled Halton sequence (draws/halton.ts). A design's seed picks its streams, and
 * every generated design stores the generator version (DESIGN_GENERATOR_VERSION in
 * shared/schemas/design-spec.ts), so it can be told apart from a design made by an earlier
 * generator with the same seed (docs/methods.md "Design generator versions").
 */

/** xoshiro stream of the design search (level picks, swaps, blocking), apart from the draws'. */
export const DESIGN_STREAM = 0xd351;
