import { take, type Workspace } from './workspace';

/**
 * The cluster-robust "meat" in Q₁ coordinates: M = Σ_g u_g u_gᵀ with
 * u_g = Σ_{i in cluster g} e_i·q_i (q_i the i-th row of thin Q).
 *
 * Formula: the Arellano / Liang–Zeger sandwich; the small-sample factor is applied by the
 * caller (robust-covariance.ts).
 * Reference: Arellano, M. (1987), "Computing robust standard errors for within-groups
 * estimators", Oxford Bulletin of Economics and Statistics 49(4), 431–434; Liang, K.-Y. and
 * Zeger, S. L. (1986), "Longitudinal data analysis using generalized linear models",
 * Biometrika 73(1), 13–22.
 *
 * Throws: nothing; `groups[i]` must be an integer in [0, G).
 *
 * Example: n = 2, k = 1, q = (1/√2, 1/√2), e = (1, 1), one cluster:
 *   clusterMeat(q, e, 2, 1, Int32Array.from([0, 0]), 1)   // → [2.0000000000000004]   ((1/√2 + 1/√2)²)
 */
export function clusterMeat(
  q1: Float64Array,
  e: ArrayLike<number>,
  n: number,
  k: number,
  groups: Int32Array,
  nGroups: number,
  ws?: Workspace,
): Float64Array {
  const u = new Float64Array(nGroups * k);
  for (let i = 0; i < n; i++) {
    const g = groups[i];
    for (let a = 0; a < k; a++) u[g * k + a] += e[i] * q1[a * n + i];
  }
  const m = take(ws, k * k);
  for (let g = 0; g < nGroups; g++) {
    for (let a = 0; a < k; a++) {
      const ua = u[g * k + a];
      for (let b = a; b < k; b++) m[b * k + a] += ua * u[g * k + b];
    }
  }
  for (let a = 0; a < k; a++) for (let b = a + 1; b < k; b++) m[a * k + b] = m[b * k + a];
  return m;
}
