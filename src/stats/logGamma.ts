/**
 * ln Γ(x) by the Lanczos approximation (g = 7, n = 9; Lanczos 1964, with the widely published
 * coefficients of Godfrey), and the reflection formula below 1/2. About 15 significant digits.
 */
const LANCZOS = [
  0.99999999999980993, 676.5203681218851, -1259.1392167224028, 771.32342877765313, -176.61502916214059, 12.507343278686905,
  -0.13857109526572012, 9.9843695780195716e-6, 1.5056327351493116e-7,
];

export function logGamma(value: number): number {
  if (value < 0.5) return Math.log(Math.PI / Math.sin(Math.PI * value)) - logGamma(1 - value);
  const x = value - 1;
  let sum = LANCZOS[0] as number;
  for (let k = 1; k < 9; k++) sum += (LANCZOS[k] as number) / (x + k);
  const t = x + 7.5;
  return 0.5 * Math.log(2 * Math.PI) + (x + 0.5) * Math.log(t) - t + Math.log(sum);
}
