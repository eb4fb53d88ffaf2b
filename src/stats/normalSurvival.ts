/**
 * Upper tail of the standard normal distribution, Q(z) = P(Z > z) = ½·erfc(z/√2), accurate to a
 * few units in the last place over the whole line (so p-values of 1e-20 keep their digits).
 *
 * erfc is computed two ways. For |x| < 2.5 from the everywhere-positive series
 * erf(x) = (2/√π)·e^(−x²)·Σₙ 2ⁿx^(2n+1)/(1·3·…·(2n+1)) (Abramowitz & Stegun 1964, eq. 7.1.6),
 * which has no cancellation; for x ≥ 2.5 from the continued fraction
 * erfc(x) = (e^(−x²)/√π)·1/(x + ½/(x + 1/(x + (3/2)/(x + …)))) (A&S eq. 7.1.14), evaluated by the
 * modified Lentz method (Press et al. 2007, Numerical Recipes §5.2). Cost O(1): at most a few
 * hundred terms.
 */
export function normalSurvival(z: number): number {
  if (Number.isNaN(z)) return Number.NaN;
  return 0.5 * erfc(z / Math.SQRT2);
}

const TWO_OVER_ROOT_PI = 2 / Math.sqrt(Math.PI);
const ONE_OVER_ROOT_PI = 1 / Math.sqrt(Math.PI);

function erfc(x: number): number {
  if (x < 0) return 2 - erfc(-x);
  if (x < 2.5) return 1 - erfSeries(x);
  return erfcContinuedFraction(x);
}

function erfSeries(x: number): number {
  const twoXSquared = 2 * x * x;
  let term = x;
  let sum = x;
  for (let n = 1; n < 200; n++) {
    term *= twoXSquared / (2 * n + 1);
    sum += term;
    if (term < sum * 1e-17) break;
  }
  return TWO_OVER_ROOT_PI * Math.exp(-x * x) * sum;
}

function erfcContinuedFraction(x: number): number {
  if (x > 27.3) return 0; // e^(−x²) underflows below the smallest double
  // f = x + a1/(x + a2/(x + …)) with a_k = k/2, by modified Lentz.
  const tiny = 1e-300;
  let f = x;
  let c = x;
  let d = 0;
  for (let k = 1; k < 500; k++) {
    const a = k / 2;
    d = x + a * d;
    d = Math.abs(d) < tiny ? tiny : d;
    c = x + a / c;
    c = Math.abs(c) < tiny ? tiny : c;
    d = 1 / d;
    const delta = c * d;
    f *= delta;
    if (Math.abs(delta - 1) < 1e-16) break;
  }
  return (ONE_OVER_ROOT_PI * Math.exp(-x * x)) / f;
}
