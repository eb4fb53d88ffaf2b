import { logGamma } from './logGamma.ts';

/**
 * Two-sided tail of Student's t distribution with ν degrees of freedom (ν > 0, not necessarily
 * whole): P(|T| > t) = I_{ν/(ν+t²)}(ν/2, 1/2), the regularized incomplete beta function, computed
 * by its continued fraction (modified Lentz) on the side where it converges fast (Press et al.
 * 2007, Numerical Recipes, §6.4, betai and betacf), with ln Γ from logGamma. Cost O(1): at most a
 * few hundred terms.
 */
export function studentTTwoSided(t: number, degreesOfFreedom: number): number {
  if (!(degreesOfFreedom > 0)) throw new RangeError('studentTTwoSided requires positive degrees of freedom');
  if (Number.isNaN(t)) return Number.NaN;
  if (!Number.isFinite(t)) return 0;
  return regularizedBeta(degreesOfFreedom / (degreesOfFreedom + t * t), degreesOfFreedom / 2, 0.5);
}

/** I_x(a, b). */
function regularizedBeta(x: number, a: number, b: number): number {
  if (x <= 0) return 0;
  if (x >= 1) return 1;
  const front = Math.exp(logGamma(a + b) - logGamma(a) - logGamma(b) + a * Math.log(x) + b * Math.log(1 - x));
  return x < (a + 1) / (a + b + 2) ? (front * betaFraction(x, a, b)) / a : 1 - (front * betaFraction(1 - x, b, a)) / b;
}

const TINY = 1e-300;

/** The continued fraction of I_x(a, b), modified Lentz. */
function betaFraction(x: number, a: number, b: number): number {
  const sum = a + b;
  let c = 1;
  let d = 1 - (sum * x) / (a + 1);
  if (Math.abs(d) < TINY) d = TINY;
  d = 1 / d;
  let h = d;
  for (let m = 1; m <= 500; m++) {
    const m2 = 2 * m;
    let step = (m * (b - m) * x) / ((a - 1 + m2) * (a + m2));
    d = 1 + step * d;
    if (Math.abs(d) < TINY) d = TINY;
    c = 1 + step / c;
    if (Math.abs(c) < TINY) c = TINY;
    d = 1 / d;
    h *= d * c;
    step = (-(a + m) * (sum + m) * x) / ((a + m2) * (a + 1 + m2));
    d = 1 + step * d;
    if (Math.abs(d) < TINY) d = TINY;
    c = 1 + step / c;
    if (Math.abs(c) < TINY) c = TINY;
    d = 1 / d;
    const delta = d * c;
    h *= delta;
    if (Math.abs(delta - 1) < 1e-15) break;
  }
  return h;
}
