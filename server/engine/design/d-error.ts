/**
 * D-error of a choice design (Huber & Zwerina 1996, JMR 33(3):307-317):
 * D-error = det(I(X, β))^(−1/K); D₀ at β = 0, D_p at a point prior. Bayesian D-error
 * (Sándor & Wedel 2001, JMR 38(4):430-444): D_B = ∫ det(I(X, β))^(−1/K) π(β) dβ, the average
 * over prior draws that computeDesignCriterion (design-criteria.ts) takes. A singular
 * information matrix gives Infinity.
 */

/** Maps log det I to det(I)^(−1/K), Infinity when singular. */
export function getDErrorFromLogDet(K: number, logDet: number): number {
  return logDet === -Infinity ? Infinity : Math.exp(-logDet / K);
}
