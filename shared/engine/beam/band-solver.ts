/*
 * Symmetric positive-definite banded solver (Cholesky, upper band stored by rows). Beam elements
 * with two degrees of freedom per node couple each unknown only with the next three, so factoring
 * costs O(n·b²) with b = 3: a few microseconds for a shaft, where a dense general-purpose
 * linear-algebra package would do O(n³) work and pull a large bundle into the browser.
 */
export class BandMatrix {
  readonly n: number;
  readonly b: number;
  readonly a: Float64Array;

  constructor(n: number, b: number) {
    this.n = n;
    this.b = b;
    this.a = new Float64Array(n * (b + 1));
  }

  /** Adds v at (i, j); only the upper band (i ≤ j ≤ i + b) is stored, so callers add each pair once. */
  add(i: number, j: number, v: number): void {
    if (j >= i) this.a[i * (this.b + 1) + j - i] += v;
  }

  get(i: number, j: number): number {
    const [r, c] = i <= j ? [i, j] : [j, i];
    return c - r > this.b ? 0 : this.a[r * (this.b + 1) + c - r];
  }

  /** Replaces row and column i by the identity, for a prescribed zero (a rigid support). */
  fix(i: number): void {
    const w = this.b + 1;
    for (let k = Math.max(0, i - this.b); k < i; k++) this.a[k * w + i - k] = 0;
    for (let d = 1; d <= this.b; d++) this.a[i * w + d] = 0;
    this.a[i * w] = 1;
  }

  /** y = A·x for the symmetric matrix. */
  multiply(x: Float64Array, y: Float64Array): void {
    const { n, b, a } = this;
    const w = b + 1;
    y.fill(0);
    for (let i = 0; i < n; i++) {
      y[i] += a[i * w] * x[i];
      for (let d = 1; d <= b && i + d < n; d++) {
        const v = a[i * w + d];
        y[i] += v * x[i + d];
        y[i + d] += v * x[i];
      }
    }
  }
}

/** In-place Cholesky factor U (A = UᵀU) of a band matrix; false when A is not positive definite. */
export function factor(m: BandMatrix): boolean {
  const { n, b, a } = m;
  const w = b + 1;
  for (let i = 0; i < n; i++) {
    for (let j = i; j <= Math.min(n - 1, i + b); j++) {
      let sum = a[i * w + j - i];
      for (let k = Math.max(0, j - b); k < i; k++) sum -= a[k * w + i - k] * a[k * w + j - k];
      if (j === i) {
        if (!(sum > 0) || !Number.isFinite(sum)) return false;
        a[i * w] = Math.sqrt(sum);
      } else {
        a[i * w + j - i] = sum / a[i * w];
      }
    }
  }
  return true;
}

/** Solves UᵀU·x = f with a factored matrix; x may be f. */
export function solve(u: BandMatrix, f: Float64Array, x: Float64Array): void {
  const { n, b, a } = u;
  const w = b + 1;
  for (let i = 0; i < n; i++) {
    let s = f[i];
    for (let k = Math.max(0, i - b); k < i; k++) s -= a[k * w + i - k] * x[k];
    x[i] = s / a[i * w];
  }
  for (let i = n - 1; i >= 0; i--) {
    let s = x[i];
    for (let d = 1; d <= b && i + d < n; d++) s -= a[i * w + d] * x[i + d];
    x[i] = s / a[i * w];
  }
}
