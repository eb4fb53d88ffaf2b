import { logGamma } from './logGamma.ts';

/**
 * Upper tail of the chi-square distribution with k degrees of freedom, P(X > x) = Q(k/2, x/2), the
 * regularized upper incomplete gamma function. Q is computed by its series for x < a + 1 and by
 * its continued fraction (modified Lentz) otherwise (Press et al. 2007, Numerical Recipes, §6.2,
 * gser and gcf), with ln Γ from the Lanczos approximation (g = 7, n = 9; Lanczos 1964, with the
 * widely published coefficients of Godfrey). Cost O(1): at most a few hundred terms.
 */
export function chiSquareSurvival(x: number, degreesOfFreedom: number): number {
  if (!(degreesOfFreedom > 0)) throw new RangeError('chiSquareSurvival requires positive degrees of freedom');
  if (Number.isNaN(x)) return Number.NaN;
  if (x <= 0) return 1;
  const a = degreesOfFreedom / 2;
  const z = x / 2;
  return z < a + 1 ? 1 - lowerSeries(a, z) : upperFraction(a, z);
}

/** P(a, z) by its series Σ zⁿ/(a(a+1)…(a+n)). */
function lowerSeries(a: number, z: number): number {
  let term = 1 / a;
  let sum = term;
  for (let n = 1; n < 1000; n++) {
    term *= z / (a + n);
    sum += term;
    if (Math.abs(term) < Math.abs(sum) * 1e-16) break;
  }
  return sum * Math.exp(-z + a * Math.log(z) - logGamma(a));
}

/** Q(a, z) by its continued fraction, modified Lentz. */
function upperFraction(a: number, z: number): number {
  const tiny = 1e-300;
  let b = z + 1 - a;
  let c = 1 / tiny;
  let d = 1 / b;
  let h = d;
  for (let n = 1; n < 1000; n++) {
    const an = -n * (n - a);
    b += 2;
    d = an * d + b;
    if (Math.abs(d) < tiny) d = tiny;
    c = b + an / c;
    if (Math.abs(c) < tiny) c = tiny;
    d = 1 / d;
    const delta = d * c;
    h *= delta;
    if (Math.abs(delta - 1) < 1e-16) break;
  }
  return Math.exp(-z + a * Math.log(z) - logGamma(a)) * h;
}
