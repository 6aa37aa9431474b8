import { ddAdd, ddDiv, ddMul, ddSqrt } from './double-double';
import type { LeastSquaresCore } from './types';

/**
 * Least squares min ‖y − Xb‖ by Householder QR with relative-norm column pivoting carried
 * out entirely in double-double arithmetic (about 32 digits), for designs so ill
 * conditioned that a double-precision QR cannot give the digits the data hold (NIST's
 * Filip degree-10 polynomial: κ(X) ≈ 1.8e15, column-scaled κ ≈ 5e9).
 *
 * Formula: as in qr.ts (pivot on ‖a_c(j:n)‖/‖a_c‖, reflector β = −sign(a_jj)‖x‖,
 * τ = (β − a_jj)/β), then R·z = (Qᵀy)(0:k), b = P·z, e = y − X·b, (XᵀX)⁻¹ = P·R⁻¹R⁻ᵀ·Pᵀ,
 * all in double-double; results rounded to double at the end. Q₁ is formed in
 * double-double and rounded (it feeds the robust covariances and diagnostics).
 * Reference: Businger & Golub (1965), Numerische Mathematik 7(3), 269–276; the arithmetic
 * as in double-double.ts (Dekker 1971; Hida, Li & Bailey 2001).
 *
 * `xLo` (optional) holds the low-order parts of a double-double design (x + xLo exactly).
 *
 * Throws: nothing; a rank-deficient design is reported through `rank` < k and the caller
 * (ols.ts) raises the error naming the columns.
 *
 * Example: on NIST Filip (82 × 11) the coefficients agree with the certified values to
 * about 14 significant digits (see tests/reference/nist.test.ts), where a double QR gives ~7.
 */
export function leastSquaresDoubleDouble(
  x: Float64Array,
  y: Float64Array,
  n: number,
  k: number,
  rankTolerance: number,
  xLo?: Float64Array,
): LeastSquaresCore {
  const ah = Float64Array.from(x);
  const al = xLo ? Float64Array.from(xLo) : new Float64Array(n * k);
  if (xLo)
    for (let i = 0; i < n * k; i++) {
      const t = ah[i] + al[i];
      al[i] = al[i] - (t - ah[i]);
      ah[i] = t;
    }
  const yh = Float64Array.from(y);
  const yl = new Float64Array(n);
  const tauH = new Float64Array(k),
    tauL = new Float64Array(k);
  const perm = new Int32Array(k);
  const orig = new Float64Array(k);
  const rel = new Float64Array(k);
  const sumSq = (c: number, from: number): [number, number] => {
    let sh = 0,
      sl = 0;
    const off = c * n;
    for (let i = from; i < n; i++) {
      const [ph, pl] = ddMul(ah[off + i], al[off + i], ah[off + i], al[off + i]);
      [sh, sl] = ddAdd(sh, sl, ph, pl);
    }
    return [sh, sl];
  };
  for (let j = 0; j < k; j++) {
    perm[j] = j;
    orig[j] = Math.sqrt(sumSq(j, 0)[0]);
  }
  let rank = Math.min(n, k);
  for (let j = 0; j < Math.min(n, k); j++) {
    let best = -1,
      bestRel = -1;
    for (let c = j; c < k; c++) {
      const r = orig[c] > 0 ? Math.sqrt(sumSq(c, j)[0]) / orig[c] : 0;
      if (r > bestRel) {
        bestRel = r;
        best = c;
      }
    }
    if (best !== j) {
      const oj = j * n,
        ob = best * n;
      for (let i = 0; i < n; i++) {
        let t = ah[oj + i];
        ah[oj + i] = ah[ob + i];
        ah[ob + i] = t;
        t = al[oj + i];
        al[oj + i] = al[ob + i];
        al[ob + i] = t;
      }
      const t = orig[j];
      orig[j] = orig[best];
      orig[best] = t;
      const p = perm[j];
      perm[j] = perm[best];
      perm[best] = p;
    }
    rel[j] = bestRel;
    if (!(bestRel > rankTolerance)) {
      rank = j;
      break;
    }
    const oj = j * n;
    const alH = ah[oj + j],
      alL = al[oj + j];
    const [xh, xl] = sumSq(j, j + 1);
    if (xh === 0) {
      tauH[j] = 0;
      tauL[j] = 0;
      continue;
    }
    const [a2h, a2l] = ddMul(alH, alL, alH, alL);
    const [t2h, t2l] = ddAdd(a2h, a2l, xh, xl);
    let [bh, bl] = ddSqrt(t2h, t2l);
    if (alH >= 0) {
      bh = -bh;
      bl = -bl;
    }
    const [dh, dl] = ddAdd(bh, bl, -alH, -alL);
    [tauH[j], tauL[j]] = ddDiv(dh, dl, bh, bl);
    const [sh, sl] = ddDiv(1, 0, -dh, -dl); // 1 / (alpha − beta)
    for (let i = j + 1; i < n; i++) [ah[oj + i], al[oj + i]] = ddMul(ah[oj + i], al[oj + i], sh, sl);
    ah[oj + j] = bh;
    al[oj + j] = bl;
    const reflect = (vh: Float64Array, vl: Float64Array, oc: number): void => {
      let [wh, wl] = [vh[oc + j], vl[oc + j]];
      for (let i = j + 1; i < n; i++) {
        const [ph, pl] = ddMul(ah[oj + i], al[oj + i], vh[oc + i], vl[oc + i]);
        [wh, wl] = ddAdd(wh, wl, ph, pl);
      }
      [wh, wl] = ddMul(wh, wl, tauH[j], tauL[j]);
      [vh[oc + j], vl[oc + j]] = ddAdd(vh[oc + j], vl[oc + j], -wh, -wl);
      for (let i = j + 1; i < n; i++) {
        const [ph, pl] = ddMul(wh, wl, ah[oj + i], al[oj + i]);
        [vh[oc + i], vl[oc + i]] = ddAdd(vh[oc + i], vl[oc + i], -ph, -pl);
      }
    };
    for (let c = j + 1; c < k; c++) reflect(ah, al, c * n);
    reflect(yh, yl, 0);
  }
  const core: LeastSquaresCore = {
    n,
    k,
    rank,
    perm,
    columnNorms: orig,
    relativePivots: rel,
    precision: 'double-double',
    refinementSteps: 0,
    coefficients: new Float64Array(k),
    residuals: new Float64Array(n),
    q1: new Float64Array(0),
    rinv: new Float64Array(0),
    xtxInv: new Float64Array(0),
    rDiagonal: new Float64Array(rank),
    r: new Float64Array(0),
  };
  for (let j = 0; j < rank; j++) core.rDiagonal[j] = ah[j * n + j];
  // R (rounded) for condition estimates and dependency reports
  const rr = new Float64Array(k * k);
  for (let c = 0; c < k; c++) for (let i = 0; i <= Math.min(c, rank - 1); i++) rr[c * k + i] = ah[c * n + i];
  core.r = rr;
  if (rank < k) return core;
  // R⁻¹ in double-double (column-major k × k)
  const ih = new Float64Array(k * k),
    il = new Float64Array(k * k);
  for (let j = 0; j < k; j++) {
    [ih[j * k + j], il[j * k + j]] = ddDiv(1, 0, ah[j * n + j], al[j * n + j]);
    for (let i = j - 1; i >= 0; i--) {
      let sh = 0,
        sl = 0;
      for (let m = i + 1; m <= j; m++) {
        const [ph, pl] = ddMul(ah[m * n + i], al[m * n + i], ih[j * k + m], il[j * k + m]);
        [sh, sl] = ddAdd(sh, sl, ph, pl);
      }
      [ih[j * k + i], il[j * k + i]] = ddDiv(-sh, -sl, ah[i * n + i], al[i * n + i]);
    }
  }
  // z = R⁻¹ (Qᵀy)(0:k), b = P z
  for (let i = 0; i < k; i++) {
    let sh = 0,
      sl = 0;
    for (let m = i; m < k; m++) {
      const [ph, pl] = ddMul(ih[m * k + i], il[m * k + i], yh[m], yl[m]);
      [sh, sl] = ddAdd(sh, sl, ph, pl);
    }
    core.coefficients[perm[i]] = sh + sl;
    yh[i] = sh;
    yl[i] = sl; // keep z in DD for the residuals
  }
  const zH = new Float64Array(k),
    zL = new Float64Array(k);
  for (let i = 0; i < k; i++) {
    zH[perm[i]] = yh[i];
    zL[perm[i]] = yl[i];
  }
  for (let i = 0; i < n; i++) {
    let [sh, sl] = [y[i], 0];
    for (let c = 0; c < k; c++) {
      const [ph, pl] = ddMul(x[c * n + i], xLo ? xLo[c * n + i] : 0, zH[c], zL[c]);
      [sh, sl] = ddAdd(sh, sl, -ph, -pl);
    }
    core.residuals[i] = sh + sl;
  }
  // (XᵀX)⁻¹ = P R⁻¹ R⁻ᵀ Pᵀ in the original column order
  const xtx = new Float64Array(k * k);
  for (let a = 0; a < k; a++) {
    for (let b = a; b < k; b++) {
      let sh = 0,
        sl = 0;
      for (let m = b; m < k; m++) {
        const [ph, pl] = ddMul(ih[m * k + a], il[m * k + a], ih[m * k + b], il[m * k + b]);
        [sh, sl] = ddAdd(sh, sl, ph, pl);
      }
      const v = sh + sl;
      xtx[perm[a] * k + perm[b]] = v;
      xtx[perm[b] * k + perm[a]] = v;
    }
  }
  core.xtxInv = xtx;
  const rinv = new Float64Array(k * k);
  for (let i = 0; i < k * k; i++) rinv[i] = ih[i] + il[i];
  core.rinv = rinv;
  // Q₁ in double-double, rounded
  const qh = new Float64Array(n * k),
    ql = new Float64Array(n * k);
  for (let c = 0; c < k; c++) qh[c * n + c] = 1;
  for (let j = k - 1; j >= 0; j--) {
    if (tauH[j] === 0 && tauL[j] === 0) continue;
    const oj = j * n;
    for (let c = j; c < k; c++) {
      const oc = c * n;
      let [wh, wl] = [qh[oc + j], ql[oc + j]];
      for (let i = j + 1; i < n; i++) {
        const [ph, pl] = ddMul(ah[oj + i], al[oj + i], qh[oc + i], ql[oc + i]);
        [wh, wl] = ddAdd(wh, wl, ph, pl);
      }
      [wh, wl] = ddMul(wh, wl, tauH[j], tauL[j]);
      [qh[oc + j], ql[oc + j]] = ddAdd(qh[oc + j], ql[oc + j], -wh, -wl);
      for (let i = j + 1; i < n; i++) {
        const [ph, pl] = ddMul(wh, wl, ah[oj + i], al[oj + i]);
        [qh[oc + i], ql[oc + i]] = ddAdd(qh[oc + i], ql[oc + i], -ph, -pl);
      }
    }
  }
  const q1 = new Float64Array(n * k);
  for (let i = 0; i < n * k; i++) q1[i] = qh[i] + ql[i];
  core.q1 = q1;
  return core;
}
