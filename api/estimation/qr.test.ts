import { applyQt, pivotedQr, symmetricEigenvalues, thinQ, upperTriangularInverse } from './index';

// Expected values here follow from the definitions (A·P = Q·R with Q orthonormal), checked
// to explicit absolute bounds; no external reference is needed.

function design(n: number, k: number, f: (i: number, j: number) => number): Float64Array {
  const a = new Float64Array(n * k);
  for (let j = 0; j < k; j++) for (let i = 0; i < n; i++) a[j * n + i] = f(i, j);
  return a;
}

describe('pivotedQr', () => {
  test('reproduces A·P = Q·R with orthonormal Q (definition)', () => {
    const n = 12,
      k = 4;
    const a = design(n, k, (i, j) => Math.cos(i * (j + 1)) + (j === 3 ? 100 * i : 0));
    const f = pivotedQr(Float64Array.from(a), n, k);
    expect(f.rank).toBe(4);
    const q = thinQ(f);
    for (let c = 0; c < k; c++) {
      for (let d = 0; d < k; d++) {
        let s = 0;
        for (let i = 0; i < n; i++) s += q[c * n + i] * q[d * n + i];
        expect(Math.abs(s - (c === d ? 1 : 0))).toBeLessThan(1e-14); // QᵀQ = I
      }
    }
    for (let c = 0; c < k; c++) {
      const orig = f.perm[c];
      for (let i = 0; i < n; i++) {
        let s = 0;
        for (let m = 0; m <= c; m++) s += q[m * n + i] * f.qr[c * n + m];
        expect(Math.abs(s - a[orig * n + i])).toBeLessThan(1e-12 * (1 + Math.abs(a[orig * n + i]))); // (QR)_ic = (AP)_ic
      }
    }
  });

  test('pivots by relative remaining norm, so column scaling does not change the order (definition)', () => {
    const n = 10;
    const base = design(n, 3, (i, j) => [1, i, i * i + Math.sin(i)][j]);
    const scaled = design(n, 3, (i, j) => [1, i, i * i + Math.sin(i)][j] * [1e-6, 1, 1e6][j]);
    expect(Array.from(pivotedQr(base, n, 3).perm)).toEqual(Array.from(pivotedQr(scaled, n, 3).perm));
  });

  test('reports rank deficiency for a duplicated column and for a zero column', () => {
    const dup = design(6, 3, (i, j) => [1, i, 2 * i][j]);
    expect(pivotedQr(dup, 6, 3).rank).toBe(2);
    const zero = design(6, 3, (i, j) => [1, i, 0][j]);
    const f = pivotedQr(zero, 6, 3);
    expect(f.rank).toBe(2);
    expect(f.perm[2]).toBe(2);
  });

  test('applyQt preserves the norm and zeroes the part outside span(A)', () => {
    const a = design(3, 2, (i, j) => [1, i + 1][j]);
    const f = pivotedQr(Float64Array.from(a), 3, 2);
    const v = Float64Array.from([1, 2, 3]); // = second column, inside the span
    applyQt(f, v);
    expect(Math.hypot(v[0], v[1], v[2])).toBeCloseTo(Math.sqrt(14), 14);
    expect(Math.abs(v[2])).toBeLessThan(1e-15);
  });
});

describe('upperTriangularInverse', () => {
  test('inverts [[2, 1], [0, 4]] exactly (arithmetic)', () => {
    expect(Array.from(upperTriangularInverse(Float64Array.from([2, 0, 1, 4]), 2, 2))).toEqual([0.5, 0, -0.125, 0.25]);
  });
});

describe('symmetricEigenvalues', () => {
  test('known spectra (arithmetic): [[2,1],[1,2]] → 1, 3; the DW matrix of order 3 → 0, 1, 3', () => {
    const two = symmetricEigenvalues(Float64Array.from([2, 1, 1, 2]), 2);
    expect(two[0]).toBeCloseTo(1, 14);
    expect(two[1]).toBeCloseTo(3, 14);
    // A = [[1,−1,0],[−1,2,−1],[0,−1,1]]: eigenvalues 0, 1, 3
    const dw = symmetricEigenvalues(Float64Array.from([1, -1, 0, -1, 2, -1, 0, -1, 1]), 3);
    [0, 1, 3].forEach((v, i) => expect(Math.abs(dw[i] - v)).toBeLessThan(1e-14));
  });
  test('the trace and the sum of squares are preserved for a 20 × 20 matrix (invariants)', () => {
    const n = 20;
    const a = new Float64Array(n * n);
    for (let i = 0; i < n; i++)
      for (let j = 0; j <= i; j++) {
        const v = Math.sin(i * 7 + j * 3);
        a[j * n + i] = v;
        a[i * n + j] = v;
      }
    const ev = symmetricEigenvalues(a, n);
    let tr = 0,
      fro = 0;
    for (let i = 0; i < n; i++) {
      tr += a[i * n + i];
      for (let j = 0; j < n; j++) fro += a[j * n + i] ** 2;
    }
    expect(ev.reduce((s, v) => s + v, 0)).toBeCloseTo(tr, 12);
    expect(ev.reduce((s, v) => s + v * v, 0)).toBeCloseTo(fro, 11);
  });
});
