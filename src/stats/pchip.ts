/**
 * Monotone piecewise-cubic Hermite interpolation (PCHIP): Fritsch, F. N. & Carlson, R. E. (1980),
 * "Monotone piecewise cubic interpolation", SIAM Journal on Numerical Analysis 17(2): 238–246,
 * with the derivative rule of Fritsch & Butland (1984) at interior knots (a weighted harmonic mean
 * of the neighbouring secants, zero where they differ in sign or one is zero) and the three-point
 * end rule, as in scipy.interpolate.PchipInterpolator (checked against it to 1e-12 in
 * test/stats/pchip.test.ts). On data that do not decrease, the interpolant does not decrease
 * either, so an area–volume curve interpolated this way never loses volume as area grows.
 */

/** The derivative at every knot; `x` strictly increasing, at least two knots. */
export function pchipSlopes(x: ArrayLike<number>, y: ArrayLike<number>): Float64Array {
  const n = x.length;
  const d = new Float64Array(n);
  const h = new Float64Array(n - 1);
  const m = new Float64Array(n - 1);
  for (let k = 0; k < n - 1; k++) {
    h[k] = (x[k + 1] as number) - (x[k] as number);
    m[k] = ((y[k + 1] as number) - (y[k] as number)) / (h[k] as number);
  }
  if (n === 2) {
    d[0] = m[0] as number;
    d[1] = m[0] as number;
    return d;
  }
  for (let k = 1; k < n - 1; k++) {
    const before = m[k - 1] as number;
    const after = m[k] as number;
    if (Math.sign(before) !== Math.sign(after) || before === 0 || after === 0) {
      d[k] = 0;
      continue;
    }
    const w1 = 2 * (h[k] as number) + (h[k - 1] as number);
    const w2 = (h[k] as number) + 2 * (h[k - 1] as number);
    d[k] = (w1 + w2) / (w1 / before + w2 / after);
  }
  d[0] = endSlope(h[0] as number, h[1] as number, m[0] as number, m[1] as number);
  d[n - 1] = endSlope(h[n - 2] as number, h[n - 3] as number, m[n - 2] as number, m[n - 3] as number);
  return d;
}

/** The one-sided three-point estimate at an end, kept from overshooting (shape preserving). */
function endSlope(h0: number, h1: number, m0: number, m1: number): number {
  const d = ((2 * h0 + h1) * m0 - h0 * m1) / (h0 + h1);
  if (Math.sign(d) !== Math.sign(m0)) return 0;
  if (Math.sign(m0) !== Math.sign(m1) && Math.abs(d) > 3 * Math.abs(m0)) return 3 * m0;
  return d;
}

const BELOW = -1;
const ABOVE = -2;

/**
 * For knot values that do not decrease: the first segment k with y_k < target ≤ y_k+1 (the lowest
 * one where the values stay flat), or BELOW / ABOVE when the target lies at or beyond an end.
 */
function risingSegment(y: Float64Array, target: number): number {
  const last = y.length - 1;
  if (target <= (y[0] as number)) return BELOW;
  if (target >= (y[last] as number)) return ABOVE;
  let k = 0;
  while (k < last - 1 && (y[k + 1] as number) < target) k++;
  return k;
}

/** A PCHIP interpolant through (x, y): `at` inside [x₀, xₙ₋₁], clamped outside (callers say when they clamp). */
export class Pchip {
  readonly x: Float64Array;
  readonly y: Float64Array;
  readonly d: Float64Array;

  constructor(x: ArrayLike<number>, y: ArrayLike<number>) {
    if (x.length !== y.length || x.length < 2) throw new RangeError('PCHIP needs at least two knots, as many x as y');
    for (let k = 1; k < x.length; k++)
      if (!((x[k] as number) > (x[k - 1] as number))) throw new RangeError('PCHIP knots must be strictly increasing');
    this.x = Float64Array.from(x);
    this.y = Float64Array.from(y);
    this.d = pchipSlopes(this.x, this.y);
  }

  /** Index k of the segment [x_k, x_k+1] that holds `value` (the last for the top knot). */
  segment(value: number): number {
    let low = 0;
    let high = this.x.length - 2;
    while (low < high) {
      const mid = (low + high + 1) >> 1;
      if ((this.x[mid] as number) <= value) low = mid;
      else high = mid - 1;
    }
    return low;
  }

  at(value: number): number {
    const x = this.x;
    const last = x.length - 1;
    if (value <= (x[0] as number)) return this.y[0] as number;
    if (value >= (x[last] as number)) return this.y[last] as number;
    return this.hermite(this.segment(value), value);
  }

  private hermite(k: number, value: number): number {
    const x0 = this.x[k] as number;
    const h = (this.x[k + 1] as number) - x0;
    const t = (value - x0) / h;
    const u = 1 - t;
    return (
      (1 + 2 * t) * u * u * (this.y[k] as number) +
      t * u * u * h * (this.d[k] as number) +
      t * t * (3 - 2 * t) * (this.y[k + 1] as number) +
      t * t * (t - 1) * h * (this.d[k + 1] as number)
    );
  }

  /**
   * The x at which the interpolant reaches `target`, for y that do not decrease: the lowest such x
   * (where the curve is flat, as a basin with straight walls, area alone cannot tell the level).
   * Clamped to the ends outside [y₀, yₙ₋₁]. Bisection on the segment to the last bit of precision.
   */
  inverse(target: number): number {
    const { x } = this;
    const k = risingSegment(this.y, target);
    if (k < 0) return x[k === BELOW ? 0 : x.length - 1] as number;
    // Segment k holds the target (y_k < target ≤ y_k+1); the interpolant rises on it.
    let low = x[k] as number;
    let high = x[k + 1] as number;
    for (let step = 0; step < 200; step++) {
      const mid = 0.5 * (low + high);
      if (mid <= low || mid >= high) break;
      if (this.hermite(k, mid) < target) low = mid;
      else high = mid;
    }
    return high;
  }
}

/** Straight-line interpolation through the same knots (the documented alternative to PCHIP). */
export class Linear {
  readonly x: Float64Array;
  readonly y: Float64Array;

  constructor(x: ArrayLike<number>, y: ArrayLike<number>) {
    if (x.length !== y.length || x.length < 2) throw new RangeError('interpolation needs at least two knots, as many x as y');
    this.x = Float64Array.from(x);
    this.y = Float64Array.from(y);
  }

  at(value: number): number {
    const { x, y } = this;
    const last = x.length - 1;
    if (value <= (x[0] as number)) return y[0] as number;
    if (value >= (x[last] as number)) return y[last] as number;
    let k = 0;
    while ((x[k + 1] as number) < value) k++;
    const t = (value - (x[k] as number)) / ((x[k + 1] as number) - (x[k] as number));
    return (y[k] as number) + t * ((y[k + 1] as number) - (y[k] as number));
  }

  inverse(target: number): number {
    const { x, y } = this;
    const k = risingSegment(y, target);
    if (k < 0) return x[k === BELOW ? 0 : x.length - 1] as number;
    const t = (target - (y[k] as number)) / ((y[k + 1] as number) - (y[k] as number));
    return (x[k] as number) + t * ((x[k + 1] as number) - (x[k] as number));
  }
}
