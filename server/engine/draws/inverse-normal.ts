/** Φ⁻¹ lives in shared/ so that the browser's share intervals use the same one. */
export { inverseNormal } from '../../../shared/engine/random/inverse-normal';
