import { normalSurvival } from './normalSurvival.ts';

/**
 * Quantile of the standard normal distribution: the z with P(Z ≤ z) = p. A starting value from
 * Abramowitz & Stegun (1964) eq. 26.2.23 (error below 4.5e-4) is refined by Newton steps on the
 * tail probability computed by normalSurvival, which converge to full double precision in a few
 * steps. Cost O(1). Returns −∞ at p = 0, +∞ at p = 1.
 */
export function normalQuantile(probability: number): number {
  if (!(probability >= 0 && probability <= 1)) throw new RangeError('normalQuantile requires a probability from 0 to 1');
  if (probability === 0) return Number.NEGATIVE_INFINITY;
  if (probability === 1) return Number.POSITIVE_INFINITY;
  if (probability === 0.5) return 0;
  // Work in the upper tail, where small probabilities keep their precision.
  const tail = probability < 0.5 ? probability : 1 - probability;
  const sign = probability < 0.5 ? -1 : 1;
  const t = Math.sqrt(-2 * Math.log(tail));
  let z = t - (2.515517 + 0.802853 * t + 0.010328 * t * t) / (1 + 1.432788 * t + 0.189269 * t * t + 0.001308 * t * t * t);
  for (let step = 0; step < 50; step++) {
    const density = Math.exp(-0.5 * z * z) / Math.sqrt(2 * Math.PI);
    const change = (normalSurvival(z) - tail) / density;
    z += change;
    if (Math.abs(change) < 1e-15 * Math.max(1, Math.abs(z))) break;
  }
  return sign * z;
}
